// Refusing results that left the finite numbers: the input's problem, not the writers'.
#include <cmath>

#include "sifter/analysis/verify.hpp"

namespace sifter {
namespace {

constexpr std::size_t kMaxFiniteProblems = 100;

// The name of the first non-finite figure among the named ones, or empty.
struct FiniteCheck {
  std::string first;
  void operator()(const char* name, double v) {
    if (first.empty() && !std::isfinite(v)) first = name;
  }
  void operator()(const char* name, const std::optional<double>& v) {
    if (v) (*this)(name, *v);
  }
};

void check_sif(FiniteCheck& f, const SifResult& s) {
  f("PFDavg", s.pfd_avg);
  f("PFDavg", s.pfd_avg_simplified);
  f("PFH", s.pfh_per_hour);
  f("RRF", s.rrf);
  // The simplified figure is printed beside the judged one: its RRF must stay finite too, or
  // the input (rates far below physical values) is refused as before the judged figure existed.
  // A PFDavg of exactly zero (no dangerous rate) has no RRF, as for the judged figure.
  if (s.pfd_avg_simplified && *s.pfd_avg_simplified > 0.0) f("RRF", 1.0 / *s.pfd_avg_simplified);
  f("required RRF", s.required_rrf);
  f("required PFDavg", s.required_pfd);
  f("required PFH", s.required_pfh_per_hour);
  f("exact PFDavg", s.pfd_avg_exact);
  f("exact PFH", s.pfh_exact_per_hour);
  f("ratio", s.simplified_over_exact);
  f("spurious trip rate", s.spurious_trip_rate_per_yr);
  f("MTTF spurious", s.mttf_spurious_yr);
  for (const auto& sub : s.subsystems) {
    f("subsystem PFDavg", sub.pfd_avg);
    f("subsystem PFH", sub.pfh_per_hour);
    f("subsystem PFDavg", sub.pfd_avg_simplified);
    f("subsystem PFH", sub.pfh_simplified_per_hour);
    f("share", sub.share);
    f("independent term", sub.independent_undetected);
    f("independent term", sub.independent_detected);
    f("common-cause term", sub.common_cause);
    f("beta", sub.beta_effective);
    f("beta_D", sub.beta_d_effective);
    f("SFF", sub.sff);
    f("exact PFDavg", sub.pfd_avg_exact);
    f("exact PFH", sub.pfh_exact_per_hour);
    f("spurious trip rate", sub.spurious_trip_rate_per_yr);
    f("MTTF spurious", sub.mttf_spurious_yr);
  }
}

void check_scenario(FiniteCheck& f, const ScenarioResult& s) {
  f("target frequency", s.target_frequency_per_yr);
  f("frequency", s.frequency_without_sif_per_yr);
  f("required PFD", s.required_pfd);
  f("required RRF", s.required_rrf);
  f("demand rate", s.demand_rate_per_yr);
  f("required PFH", s.required_pfh_per_hour);
  f("mitigated frequency", s.mitigated_frequency_per_yr);
  for (const auto& c : s.consequences) {
    f("target frequency", c.target_frequency_per_yr);
    f("modifiers", c.modifier_product);
    f("frequency", c.frequency_without_sif_per_yr);
    f("required PFD", c.required_pfd);
    f("required RRF", c.required_rrf);
    f("required PFH", c.required_pfh_per_hour);
    f("mitigated frequency", c.mitigated_frequency_per_yr);
  }
  // The rows are built only where a writer prints them (VerifyOptions::worksheet_rows). Each of
  // their values is a figure checked above or below or bounded by one (a cause's frequency, a
  // probability in (0, 1], a running frequency that only falls, the causes' sum, the required
  // RRF), so whether an input is refused never depends on which files are asked for. A row value
  // computed on its own would have to be checked with the figures, not here.
  for (const auto& row : s.worksheet) {
    f("worksheet value", row.value);
    f("worksheet frequency", row.frequency_per_yr);
    f("worksheet gap", row.gap);
  }
  for (const auto& c : s.causes) {
    f("frequency", c.frequency_per_yr);
    f("enabling conditions", c.enabling_product);
    f("demand rate", c.demand_rate_per_yr);
    f("frequency", c.frequency_without_sif_per_yr);
  }
}

}  // namespace

// Rates and times far from any physical value (1e300/h over 1e300 h, or 1e-160/h squared into
// a PFDavg below the smallest double) take the arithmetic out of the finite numbers. That is
// the input's problem, reported as such (exit 2) before any writer sees a result; the writers'
// own refusal of non-finite numbers stays the last line of defence against defects.
void refuse_figures_beyond_finite(const Project& project, const ProjectResult& out) {
  std::vector<Diagnostic> problems;
  auto report = [&](const std::string& pointer, const std::string& what, const std::string& figure) {
    if (problems.size() >= kMaxFiniteProblems) return;
    problems.push_back({project.file, 0, 0, pointer, "rates and durations whose figures stay finite numbers",
                        what + " with its " + figure + " beyond the range of finite numbers",
                        "check the units: rates and intervals this far from physical values cannot be computed"});
  };
  for (std::size_t i = 0; i < out.sifs.size() && i < project.sifs.size(); ++i) {
    FiniteCheck f;
    check_sif(f, out.sifs[i]);
    if (!f.first.empty()) report(project.sifs[i].pointer, "SIF " + out.sifs[i].id, f.first);
  }
  for (std::size_t i = 0; i < out.scenarios.size() && i < project.scenarios.size(); ++i) {
    FiniteCheck f;
    check_scenario(f, out.scenarios[i]);
    if (!f.first.empty()) report(project.scenarios[i].pointer, "scenario " + out.scenarios[i].id, f.first);
  }
  if (!problems.empty()) throw InputError(problems);
}

}  // namespace sifter
