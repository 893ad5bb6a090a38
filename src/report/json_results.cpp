// The sifter-results/1 JSON writer: every number finite, absent values as null.
#include "sifter/report/json_results.hpp"

#include "sifter/report/format.hpp"

namespace sifter::report {
namespace {

using nlohmann::json;

// Every number of a tree must be finite: this catches the fields not passed one by one
// through checked(), so that no NaN (which a JSON dump would print as null) reaches an output.
void refuse_non_finite(const json& j) {
  if (j.is_number_float()) checked(j.get<double>(), "number");
  if (j.is_structured())
    for (const auto& e : j) refuse_non_finite(e);
}

json all_finite(json j) {
  refuse_non_finite(j);
  return j;
}

json opt(const std::optional<double>& v, const char* what) { return v ? json(checked(*v, what)) : json(nullptr); }
json opt(const std::optional<int>& v) { return v ? json(*v) : json(nullptr); }
json opt(const std::optional<bool>& v) { return v ? json(*v) : json(nullptr); }

json subsystem_json(const SubsystemResult& s) {
  json j;
  j["name"] = s.name;
  j["role"] = to_string(s.role);
  j["vote"] = s.vote;
  j["channels"] = s.channels;
  j["pfd_avg"] = opt(s.pfd_avg, "pfd_avg");
  j["pfh"] = opt(s.pfh_per_hour, "pfh");
  j["share"] = checked(s.share, "share");
  j["terms"] = {{"independent_undetected", checked(s.independent_undetected, "term")},
                {"independent_detected", checked(s.independent_detected, "term")},
                {"common_cause", checked(s.common_cause, "term")}};
  j["beta_effective"] = s.beta_effective;
  j["beta_d_effective"] = s.beta_d_effective;
  j["equation"] = s.equation;
  j["hft"] = opt(s.hft);
  j["sff"] = opt(s.sff, "sff");
  j["sil_architecture"] = s.sil_architecture;
  j["systematic_capability"] = opt(s.systematic_capability);
  j["constraint_notes"] = s.constraint_notes;
  j["pfd_avg_exact"] = opt(s.pfd_avg_exact, "pfd_avg_exact");
  j["pfh_exact"] = opt(s.pfh_exact_per_hour, "pfh_exact");
  j["pfd_avg_simplified"] = opt(s.pfd_avg_simplified, "pfd_avg_simplified");
  j["pfh_simplified"] = opt(s.pfh_simplified_per_hour, "pfh_simplified");
  j["pfd_avg_judged"] = opt(s.pfd_avg, "pfd_avg_judged");
  j["pfh_judged"] = opt(s.pfh_per_hour, "pfh_judged");
  j["judged_on"] = to_string(s.judged_on);
  j["test_duration_term"] = checked(s.test_duration_term, "test duration term");
  j["spurious_trip_rate_per_yr"] = checked(s.spurious_trip_rate_per_yr, "spurious trip rate");
  j["mttf_spurious_yr"] = opt(s.mttf_spurious_yr, "mttf_spurious_yr");
  return j;
}

json scenario_json(const ScenarioResult& s) {
  json j;
  j["id"] = s.id;
  j["title"] = s.title;
  j["sif"] = s.sif ? json(*s.sif) : json(nullptr);
  j["target_frequency_per_yr"] = checked(s.target_frequency_per_yr, "target frequency");
  j["frequency_without_sif_per_yr"] = checked(s.frequency_without_sif_per_yr, "frequency");
  j["required_pfd"] = checked(s.required_pfd, "required_pfd");
  j["required_rrf"] = checked(s.required_rrf, "required_rrf");
  j["required_sil"] = s.required_sil;
  // Without a SIF the demand is the one on the first layer: the causes with their enabling conditions.
  double demand = 0.0;
  for (const auto& c : s.causes) demand += c.frequency_per_yr * c.enabling_product;
  j["demand_rate_per_yr"] = checked(s.demand_rate_per_yr.value_or(demand), "demand rate");
  j["demand_mode"] = to_string(s.demand_mode.value_or(demand > 1.0 ? DemandMode::kHigh : DemandMode::kLow));
  j["required_pfh"] = opt(s.required_pfh_per_hour, "required_pfh");
  j["mitigated_frequency_per_yr"] = opt(s.mitigated_frequency_per_yr, "mitigated frequency");
  j["sif_credit_pfd"] = opt(s.sif_credit_pfd, "sif_credit_pfd");
  j["sif_credit_capped"] = opt(s.sif_credit_capped);
  j["meets_target"] = opt(s.meets_target);
  j["consequences"] = json::array();
  for (const auto& c : s.consequences)
    j["consequences"].push_back({{"category", c.category},
                                 {"severity", c.severity},
                                 {"target_frequency_per_yr", checked(c.target_frequency_per_yr, "target")},
                                 {"modifier_product", checked(c.modifier_product, "modifiers")},
                                 {"frequency_without_sif_per_yr", checked(c.frequency_without_sif_per_yr, "frequency")},
                                 {"required_pfd", checked(c.required_pfd, "required_pfd")},
                                 {"required_rrf", checked(c.required_rrf, "required_rrf")},
                                 {"required_sil", c.required_sil},
                                 {"required_pfh", opt(c.required_pfh_per_hour, "required_pfh")},
                                 {"mitigated_frequency_per_yr", opt(c.mitigated_frequency_per_yr, "mitigated")},
                                 {"meets_target", opt(c.meets_target)}});
  j["causes"] = json::array();
  for (const auto& c : s.causes)
    j["causes"].push_back({{"id", c.id},
                           {"frequency_per_yr", checked(c.frequency_per_yr, "frequency")},
                           {"enabling_product", checked(c.enabling_product, "enabling")},
                           {"demand_rate_per_yr", checked(c.demand_rate_per_yr, "demand")},
                           {"frequency_without_sif_per_yr", checked(c.frequency_without_sif_per_yr, "frequency")},
                           {"sif_credited", c.sif_credited}});
  j["findings"] = json::array();
  for (const auto& f : s.findings) j["findings"].push_back({{"kind", to_string(f.kind)}, {"message", f.message}});
  j["assumptions"] = s.assumptions;
  return all_finite(std::move(j));
}

}  // namespace

json sif_json(const SifResult& s) {
  json j;
  j["id"] = s.id;
  j["title"] = s.title;
  j["demand_mode"] = to_string(s.demand_mode);
  j["demand_mode_basis"] = s.demand_mode_basis;
  j["pfd_avg"] = opt(s.pfd_avg, "pfd_avg");
  j["pfh"] = opt(s.pfh_per_hour, "pfh");
  j["rrf"] = opt(s.rrf, "rrf");
  j["sil_probability"] = s.sil_probability;
  j["sil_required"] = opt(s.sil_required);
  j["required_rrf"] = opt(s.required_rrf, "required_rrf");
  j["required_pfd"] = opt(s.required_pfd, "required_pfd");
  j["required_pfh"] = opt(s.required_pfh_per_hour, "required_pfh");
  j["target"] = s.target_text;
  j["meets_target"] = opt(s.meets_target);
  j["sil_architecture"] = s.sil_architecture;
  j["sil_systematic"] = s.sil_systematic;
  j["sil_achieved"] = s.sil_achieved;
  j["constraints"] = to_string(s.constraints);
  j["limits"] = json::array();
  for (const auto& l : s.limits)
    j["limits"].push_back({{"kind", l.kind},
                           {"subsystem", l.subsystem ? json(*l.subsystem) : json(nullptr)},
                           {"element", l.element ? json(*l.element) : json(nullptr)},
                           {"sil", l.sil},
                           {"message", l.message}});
  j["subsystems"] = json::array();
  for (const auto& sub : s.subsystems) j["subsystems"].push_back(subsystem_json(sub));
  j["assumptions"] = s.assumptions;
  j["scenarios"] = s.scenarios;
  j["pfd_avg_exact"] = opt(s.pfd_avg_exact, "pfd_avg_exact");
  j["pfh_exact"] = opt(s.pfh_exact_per_hour, "pfh_exact");
  j["simplified_over_exact"] = opt(s.simplified_over_exact, "ratio");
  j["pfd_avg_simplified"] = opt(s.pfd_avg_simplified, "pfd_avg_simplified");
  j["pfh_simplified"] = opt(s.pfh_simplified_per_hour, "pfh_simplified");
  j["pfd_avg_judged"] = opt(s.pfd_avg, "pfd_avg_judged");
  j["pfh_judged"] = opt(s.pfh_per_hour, "pfh_judged");
  j["judged_on"] = (s.pfd_avg || s.pfh_per_hour) ? json(to_string(s.judged_on)) : json(nullptr);
  j["judged_why"] = to_string(s.judged_why);
  j["demand_mode_raised"] = s.demand_mode_raised;
  j["credit_pfd"] = opt(s.credit_pfd, "credit_pfd");
  j["credit_capped"] = s.credit_capped;
  j["spurious_trip_rate_per_yr"] = checked(s.spurious_trip_rate_per_yr, "spurious trip rate");
  j["mttf_spurious_yr"] = opt(s.mttf_spurious_yr, "mttf_spurious_yr");
  if (s.uncertainty) {
    const auto& u = *s.uncertainty;
    j["uncertainty"] = {{"mean", checked(u.mean, "mean")},
                        {"p05", checked(u.p05, "p05")},
                        {"p50", checked(u.p50, "p50")},
                        {"p95", checked(u.p95, "p95")},
                        {"probability_meets_target", checked(u.probability_meets_target, "probability")},
                        {"samples", u.samples},
                        {"method", u.method}};
  } else {
    j["uncertainty"] = nullptr;
  }
  return all_finite(std::move(j));
}

namespace {

// Everything but the SIFs and the scenarios.
json results_head(const ProjectResult& r) {
  json j;
  j["format"] = kResultsFormat;
  j["tool"] = {{"name", "sifter"}, {"version", SIFTER_VERSION}};
  j["project"] = {{"title", r.title}, {"file", r.file}, {"sha256", r.sha256}};
  j["risk_criteria"] = json::object();
  for (const auto& [category, levels] : r.risk_criteria)
    for (const auto& [severity, rate] : levels) j["risk_criteria"][category][severity] = rate.per_year();
  j["shared_devices"] = json::array();
  for (const auto& d : r.shared_devices) j["shared_devices"].push_back({{"device", d.tag}, {"users", d.users}});
  j["shared_components"] = json::array();
  for (const auto& s : r.shared_components) j["shared_components"].push_back({{"component", s.component}, {"sifs", s.sifs}});
  j["warnings"] = json::array();
  for (const auto& w : r.warnings) j["warnings"].push_back({{"where", w.where}, {"message", w.message}});
  j["caution"] = kCaution;
  return all_finite(std::move(j));
}

// A value as dump(2) writes it `depth` levels down: JSON strings hold no raw line breaks, so
// every line break of the text is structural and takes the deeper indentation.
void write_indented(std::ostream& out, const json& value, int depth) {
  const std::string text = value.dump(2);
  const std::size_t indent = static_cast<std::size_t>(2 * depth);
  std::string shifted;
  shifted.reserve(text.size() + text.size() / 8);
  for (char c : text) {
    shifted += c;
    if (c == '\n') shifted.append(indent, ' ');
  }
  out << shifted;
}

template <typename Items, typename ToJson>
void write_array(std::ostream& out, const Items& items, ToJson to_json) {
  if (items.empty()) {
    out << "[]";
    return;
  }
  out << "[\n";
  for (std::size_t i = 0; i < items.size(); ++i) {
    out << "    ";
    write_indented(out, to_json(items[i]), 2);
    out << (i + 1 < items.size() ? ",\n" : "\n");
  }
  out << "  ]";
}

}  // namespace

json results_json(const ProjectResult& r) {
  json j = results_head(r);
  j["sifs"] = json::array();
  for (const auto& s : r.sifs) j["sifs"].push_back(sif_json(s));
  j["scenarios"] = json::array();
  for (const auto& s : r.scenarios) j["scenarios"].push_back(scenario_json(s));
  return j;
}

void write_results_json(const ProjectResult& r, std::ostream& out) {
  json head = results_head(r);
  head["sifs"] = json::array();  // placeholders keep the order of the keys
  head["scenarios"] = json::array();
  out << "{\n";
  bool first = true;
  for (auto it = head.begin(); it != head.end(); ++it) {
    out << (first ? "" : ",\n") << "  " << json(it.key()).dump() << ": ";
    first = false;
    if (it.key() == "sifs")
      write_array(out, r.sifs, [](const SifResult& s) { return sif_json(s); });
    else if (it.key() == "scenarios")
      write_array(out, r.scenarios, [](const ScenarioResult& s) { return scenario_json(s); });
    else
      write_indented(out, it.value(), 1);
  }
  out << "\n}";
}

}  // namespace sifter::report
