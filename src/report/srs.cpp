// The content of the safety requirements specification, one SIF at a time, as blocks that the
// HTML and Markdown writers render alike.
#include "sifter/report/srs.hpp"

#include <algorithm>

#include "sifter/model/format.hpp"
#include "sifter/model/vocabulary.hpp"
#include "sifter/report/deliverable_tables.hpp"

namespace sifter::report {
namespace {

using Kind = SrsBlock::Kind;

struct Blocks {
  std::vector<SrsBlock> out;
  void heading(std::string t) { out.push_back({Kind::kHeading, std::move(t), {}, {}}); }
  void para(std::string t) { out.push_back({Kind::kParagraph, std::move(t), {}, {}}); }
  void table(Table t) { out.push_back({Kind::kTable, {}, std::move(t), {}}); }
  void list(std::vector<std::string> items) {
    if (!items.empty()) out.push_back({Kind::kList, {}, {}, std::move(items)});
  }
};

std::string stated(const std::string& text, const std::string& what) {
  return text.empty() ? "OPEN: " + what + " not stated." : text;
}

void hazard(Blocks& b, const ProjectResult& r, const SifResult& s) {
  b.heading("Hazard and scenarios");
  std::vector<std::string> items;
  for (const auto& sc : r.scenarios) {
    if (!sc.sif || *sc.sif != s.id) continue;
    std::string line = sc.id + (sc.title.empty() ? "" : ": " + sc.title) + ". ";
    for (const auto& c : sc.consequences)
      if (!c.category.empty())
        line += c.category + " " + c.severity + " (tolerable " + sci(c.target_frequency_per_yr) + "/yr); ";
    line += "frequency without the SIF " + sci(sc.frequency_without_sif_per_yr) + "/yr against a tolerable " +
            sci(sc.target_frequency_per_yr) + "/yr, so the SIF must reduce it by " + plain(sc.required_rrf) + " (PFD " +
            sci(sc.required_pfd) + ")";
    if (sc.demand_rate_per_yr) line += "; demand on the SIF " + sci(*sc.demand_rate_per_yr) + "/yr";
    items.push_back(line + ".");
  }
  if (items.empty())
    b.para("OPEN: no LOPA scenario of this project names the SIF; state the hazardous event it protects against.");
  b.list(std::move(items));
}

void integrity(Blocks& b, const SifResult& s) {
  b.heading("Integrity required");
  std::string t = "Demand mode " + to_string(s.demand_mode) + " (" + s.demand_mode_basis + "). ";
  if (s.sil_required) {
    t += "Required " + sil_words(*s.sil_required);
    if (s.required_rrf) t += ", RRF at least " + plain(*s.required_rrf);
    if (s.required_pfd) t += ", PFDavg at most " + sci(*s.required_pfd);
    if (s.required_pfh_per_hour) t += ", PFH at most " + sci(*s.required_pfh_per_hour) + "/h";
    t += ". Derived from: " + s.target_text + "; the stricter applies.";
  } else {
    t += "OPEN: no target and no scenario gives the SIL required.";
  }
  b.para(t);
  b.para("Verified at the time of writing: achieved " + sil_words(s.sil_achieved) +
         (s.pfd_avg ? ", PFDavg " + sci(*s.pfd_avg) : "") +
         (s.pfh_per_hour ? ", PFH " + sci(*s.pfh_per_hour) + "/h" : "") + " (" + sif_verdict(s.meets_target).text +
         ").");
}

void function(Blocks& b, const SifRequirements& q) {
  b.heading("Function");
  b.list({"Safe state: " + stated(q.safe_state, "the safe state"),
          "Process measurement and trip set point: " + stated(q.trip_setpoint, "the trip set point"),
          "Output action and criterion of success: " + stated(q.action, "the action"),
          "Relation of inputs to outputs: " + stated(q.functional_relation, "the functional relation"),
          "Energise or de-energise to trip: " + stated(q.energize_to_trip, "the trip direction")});
}

void timing(Blocks& b, const SifResult& s, const SifRequirements& q) {
  b.heading("Process safety time and response time");
  if (!q.process_safety_time) {
    b.para("OPEN: the process safety time is not stated, so the response time cannot be judged.");
  } else {
    b.para("Process safety time " + format_seconds(q.process_safety_time->hours * 3600.0) +
           "; the SIF must act within " + plain(100.0 * q.response_time_fraction) + "% of it" +
           (q.response_time_fraction_stated ? "" : " (common practice when the project states no share)") +
           (s.response_time_limit_s ? ", " + format_seconds(*s.response_time_limit_s) : "") + ".");
  }
  if (!s.response_budget.empty()) b.table(response_budget_table(s));
  for (const auto& c : s.requirement_checks)
    if (c.check == "response_time_s") b.para(std::string(c.ok ? "✔ " : "✘ ") + c.message + ".");
}

void proof_test(Blocks& b, const SifResult& s, const SifDeliverable& d, const SifRequirements& q) {
  b.heading("Proof test");
  std::vector<std::string> items;
  for (const auto& p : d.subsystems)
    items.push_back(
        p.name + ": " +
        (p.vendor
             ? std::string("as the supplier's safety manual states")
             : "every " + format_duration(p.proof_test_interval) + ", coverage " + percent(p.proof_test_coverage) +
                   (p.partial_stroke ? "; partial stroke every " + format_duration(p.partial_stroke->interval) : "")));
  b.list(std::move(items));
  b.para("Required interval: " +
         (q.proof_test_interval ? format_duration(*q.proof_test_interval) : std::string("OPEN: not stated.")));
  b.para("What the test must cover: " + stated(q.proof_test_coverage, "the coverage of the test"));
  for (const auto& c : s.requirement_checks)
    if (c.check == "proof_test_interval_h") b.para(std::string(c.ok ? "✔ " : "✘ ") + c.message + ".");
}

void spurious(Blocks& b, const SifResult& s, const SifRequirements& q) {
  b.heading("Spurious trips");
  std::string t = "Computed " + sci(s.spurious_trip_rate_per_yr) + "/yr. ";
  t += q.max_spurious_trip_rate ? "Limit " + sci(q.max_spurious_trip_rate->per_year()) + "/yr."
                                : std::string("OPEN: no maximum spurious trip rate stated.");
  b.para(t);
  for (const auto& c : s.requirement_checks)
    if (c.check == "spurious_trip_rate_per_yr") b.para(std::string(c.ok ? "✔ " : "✘ ") + c.message + ".");
}

void operation(Blocks& b, const SifRequirements& q) {
  b.heading("Operation and maintenance");
  const std::string reset = q.reset ? (*q.reset == ResetKind::kManual ? "manual" : "automatic") : "";
  std::vector<std::string> items{"Reset after a trip: " + stated(reset, "the reset"),
                                 "Manual shutdown: " + stated(q.manual_shutdown, "the manual shutdown"),
                                 "Bypasses and overrides: " + stated(q.bypass, "the bypass arrangements"),
                                 "Start-up and restart: " + stated(q.startup_restart, "start-up and restart"),
                                 "Response to detected faults: " + stated(q.fault_response, "the fault response"),
                                 "Interfaces with the BPCS and operators: " + stated(q.interfaces, "the interfaces"),
                                 "Environmental extremes: " + stated(q.environment, "the environment"),
                                 "Modes of operation: " + stated(q.operating_modes, "the modes of operation")};
  if (!q.notes.empty()) items.push_back("Notes: " + q.notes);
  b.list(std::move(items));
}

void devices(Blocks& b, const SifResult& s, const ComponentRows& rows) {
  b.heading("Devices and their data");
  Table t;
  t.caption = "Devices in signal order, with the source of their failure data";
  t.header = {"subsystem", "vote", "device", "model", "SC or prior use", "data source"};
  t.keys = {true, true, true, false, false, false};
  for (const auto& sub : s.subsystems) {
    bool first = true;
    std::vector<std::string> seen;
    for (const auto& ch : sub.channels)
      for (const auto& tag : ch) {
        if (std::find(seen.begin(), seen.end(), tag) != seen.end()) continue;
        seen.push_back(tag);
        const ComponentDataRow* row = rows.find(tag);
        t.rows.push_back({{first ? sub.name : ""},
                          {first ? sub.vote : ""},
                          {tag},
                          {row && !row->model.empty() ? row->model : "-"},
                          {row ? systematic_words(*row) : "-"},
                          row && !row->source.empty() ? Cell{row->source} : Cell{"✘ none given", Tone::kBad}});
        first = false;
      }
    if (sub.channels.empty())
      t.rows.push_back({{sub.name}, {sub.vote}, {"-"}, {"-"}, {"-"}, {"the supplier's safety manual"}});
  }
  b.table(std::move(t));
}

}  // namespace

ComponentRows::ComponentRows(const std::vector<ComponentDataRow>& rows) : rows_(rows) {
  index_.reserve(rows.size());
  for (std::size_t i = 0; i < rows.size(); ++i) index_.insert_or_assign(rows[i].id, i);
}

const ComponentDataRow* ComponentRows::find(const std::string& id) const {
  auto it = index_.find(id);
  return it == index_.end() ? nullptr : &rows_[it->second];
}

std::vector<SrsBlock> srs_sif_blocks(const ProjectResult& result, const DeliverableData& data,
                                     const ComponentRows& rows, std::size_t i) {
  const SifResult& s = result.sifs.at(i);
  const SifDeliverable& d = data.sifs.at(i);
  const SifRequirements q = d.requirements.value_or(SifRequirements{});
  Blocks b;
  hazard(b, result, s);
  integrity(b, s);
  function(b, q);
  timing(b, s, q);
  proof_test(b, s, d, q);
  spurious(b, s, q);
  operation(b, q);
  devices(b, s, rows);
  b.heading("Checklist and open items");
  b.table(requirement_items_table(d));
  auto open = d.open_items();
  if (open.empty()) {
    b.para("No open items: every item of the checklist is stated.");
  } else {
    b.para(std::to_string(open.size()) + " open item" + (open.size() == 1 ? "" : "s") +
           " to be stated before this specification is approved:");
    b.out.push_back({Kind::kOpenItems, {}, {}, std::move(open)});
  }
  return b.out;
}

}  // namespace sifter::report
