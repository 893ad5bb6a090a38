// The deliverable's tables as plain text cells, shared by the HTML and Markdown writers.
#include "sifter/report/deliverable_tables.hpp"

#include "sifter/model/format.hpp"
#include "sifter/model/vocabulary.hpp"

namespace sifter::report {
namespace {

std::string rate_text(const Rate& r) { return r.per_hour > 0.0 ? sci(r.per_hour) : "0"; }

std::string or_dash(const std::string& s) { return s.empty() ? "-" : s; }

std::string check_name(const std::string& check) {
  if (check == "response_time_s") return "response time";
  if (check == "spurious_trip_rate_per_yr") return "spurious trip rate";
  if (check == "proof_test_interval_h") return "proof-test interval";
  return check;
}

std::string check_value(const std::string& check, double v) {
  if (check == "response_time_s") return format_seconds(v);
  if (check == "spurious_trip_rate_per_yr") return sci(v) + "/yr";
  if (check == "proof_test_interval_h") return format_duration(Duration{v});
  return plain(v);
}

}  // namespace

std::string systematic_words(const ComponentDataRow& row) {
  std::string out = row.systematic_capability ? "SC " + std::to_string(*row.systematic_capability) : "";
  if (row.prior_use)
    out += (out.empty() ? "" : "; ") + std::string("prior use SIL ") + std::to_string(row.prior_use->sil) + ": " +
           row.prior_use->evidence;
  return out.empty() ? "none" : out;
}

Table component_data_table(const DeliverableData& data, bool only_used) {
  Table t;
  t.caption = "Component data: the failure rates (per hour) used, and where each comes from";
  t.header = {"component", "model", "λDU", "λDD", "λSU", "λSD", "SFF", "type", "SC or prior use", "data source"};
  t.numeric = {false, false, true, true, true, true, true, false, false, false};
  for (const auto& c : data.components) {
    if (only_used && c.sifs.empty()) continue;
    Cell source{c.source.empty() ? "✘ none given" : c.source, c.source.empty() ? Tone::kBad : Tone::kPlain};
    t.rows.push_back({{c.id},
                      {or_dash(c.model)},
                      {rate_text(c.rates.lambda_du)},
                      {rate_text(c.rates.lambda_dd)},
                      {rate_text(c.rates.lambda_su)},
                      {rate_text(c.rates.lambda_sd)},
                      {c.sff ? percent(*c.sff) + (c.sff_declared ? " (declared)" : "") : "-"},
                      {c.type ? (*c.type == ElementType::kA ? "A" : "B") : "-"},
                      {systematic_words(c)},
                      source});
  }
  return t;
}

Table subsystem_parameters_table(const SifResult& sif, const SifDeliverable& data) {
  Table t;
  t.caption = "Test, repair and common-cause parameters of each subsystem, and its spurious trips";
  t.header = {"subsystem", "T1", "coverage", "partial stroke", "test duration", "MTTR",
              "MRT",       "β",  "β_D",      "spurious trips"};
  t.numeric = {false, true, true, false, true, true, true, true, true, true};
  for (std::size_t i = 0; i < data.subsystems.size(); ++i) {
    const auto& p = data.subsystems[i];
    const double str = i < sif.subsystems.size() ? sif.subsystems[i].spurious_trip_rate_per_yr : 0.0;
    if (p.vendor) {
      t.rows.push_back({{p.name}, {"vendor"}, {"-"}, {"-"}, {"-"}, {"-"}, {"-"}, {"-"}, {"-"}, {"not given"}});
      continue;
    }
    const std::string stroke = p.partial_stroke ? "every " + format_duration(p.partial_stroke->interval) + ", " +
                                                      percent(p.partial_stroke->coverage) + " of λDU"
                                                : "none";
    t.rows.push_back({{p.name},
                      {format_duration(p.proof_test_interval)},
                      {percent(p.proof_test_coverage)},
                      {stroke},
                      {p.test_duration ? format_duration(*p.test_duration) + (p.staggered ? ", staggered" : "") : "-"},
                      {format_duration(p.mttr)},
                      {format_duration(p.mrt)},
                      {percent(p.beta)},
                      {percent(p.beta_d)},
                      {sci(str) + "/yr"}});
  }
  return t;
}

Table requirement_checks_table(const SifResult& sif) {
  Table t;
  t.caption = "The stated requirements, checked";
  t.header = {"check", "value", "limit", "result", "detail"};
  t.numeric = {false, true, true, false, false};
  for (const auto& c : sif.requirement_checks)
    t.rows.push_back({{check_name(c.check)},
                      {check_value(c.check, c.value)},
                      {check_value(c.check, c.limit)},
                      {c.ok ? "✔ met" : "✘ not met", c.ok ? Tone::kGood : Tone::kBad},
                      {c.message}});
  return t;
}

Table response_budget_table(const SifResult& sif) {
  Table t;
  t.caption = "Response time, element by element in signal order (a group takes its slowest channel)";
  t.header = {"subsystem", "element", "time", "subsystem total"};
  t.numeric = {false, false, true, true};
  for (const auto& step : sif.response_budget) {
    const std::string total = step.seconds ? format_seconds(*step.seconds) : "not stated";
    if (step.stated_on_subsystem || !step.seconds) {
      std::string what = step.stated_on_subsystem ? "stated for the subsystem" : "";
      if (!step.missing.empty()) {
        what = "no response time: ";
        for (std::size_t i = 0; i < step.missing.size(); ++i) what += (i ? ", " : "") + step.missing[i];
      }
      t.rows.push_back({{step.subsystem}, {what}, {"-"}, {total, step.seconds ? Tone::kPlain : Tone::kBad}});
      continue;
    }
    for (std::size_t i = 0; i < step.path.size(); ++i)
      t.rows.push_back({{i == 0 ? step.subsystem : ""},
                        {step.path[i]},
                        {format_seconds(step.path_seconds[i])},
                        {i + 1 == step.path.size() ? total : ""}});
  }
  if (sif.response_time_s)
    t.rows.push_back({{"SIF"},
                      {sif.response_time_limit_s ? "allowed " + format_seconds(*sif.response_time_limit_s) : ""},
                      {""},
                      {format_seconds(*sif.response_time_s)}});
  return t;
}

Table requirement_items_table(const SifDeliverable& data) {
  Table t;
  t.caption = "Safety requirements (IEC 61511-1:2016 10.3.2 items)";
  t.header = {"requirement", "as specified"};
  t.keys = {false, false};
  for (const auto& i : data.items)
    t.rows.push_back({{i.clause}, i.stated.empty() ? Cell{"OPEN: not stated", Tone::kBad} : Cell{i.stated}});
  return t;
}

Table signature_table(const DocumentControl& d) {
  Table t;
  t.caption = "Signatures";
  t.header = {"role", "name", "signature", "date"};
  t.keys = {true, false, false, false};
  t.rows.push_back({{"prepared by"}, {or_dash(d.prepared_by)}, {""}, {""}});
  t.rows.push_back({{"checked by"}, {or_dash(d.checked_by)}, {""}, {""}});
  t.rows.push_back({{"approved by"}, {or_dash(d.approved_by)}, {""}, {""}});
  return t;
}

Table revision_table(const DocumentControl& d) {
  Table t;
  t.caption = "Revision history";
  t.header = {"revision", "date", "by", "description"};
  for (const auto& h : d.history) t.rows.push_back({{h.revision}, {or_dash(h.date)}, {or_dash(h.by)}, {h.description}});
  return t;
}

}  // namespace sifter::report
