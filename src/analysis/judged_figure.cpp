// Which figure a verdict rests on, per subsystem and per SIF.
#include "sifter/analysis/judged_figure.hpp"

#include <algorithm>

#include "sifter/engines/group_model.hpp"

namespace sifter {
namespace {

struct Choice {
  double value = 0.0;
  JudgedOn on = JudgedOn::kSimplified;
  JudgedWhy why = JudgedWhy::kOnlyFigure;
};

// Whether the simplified figure of a group stands outside its validity. The lDU T1 limit is
// that of the PFD linearisation; a PFH (high demand) is a rate, not linearised in T1 (1oo1 PFH
// = lDU whatever the interval, IEC 61508-6:2010 B.3.3.2, from memory), so in high demand the
// default rule (the more conservative) stands.
bool beyond_simplified(const Project& project, const Subsystem& sub, double simplified, bool low) {
  if (!low) return false;
  if (simplified > 1.0) return true;
  const GroupData g = group_data_for(project, sub);
  for (int i = 0; i < g.vote.n; ++i)
    if (g.rates_of(i).lambda_du.per_hour * sub.proof_test_interval.hours > kSimplifiedLimitLambdaT) return true;
  return false;
}

Choice choose(JudgeOn rule, double simplified, const std::optional<double>& exact, bool forced, JudgedWhy forced_why) {
  if (!exact) return {simplified, JudgedOn::kSimplified, JudgedWhy::kOnlyFigure};
  if (forced) return {*exact, JudgedOn::kExact, forced_why};
  switch (rule) {
    case JudgeOn::kSimplified:
      return {simplified, JudgedOn::kSimplified, JudgedWhy::kProjectChoice};
    case JudgeOn::kExact:
      return {*exact, JudgedOn::kExact, JudgedWhy::kProjectChoice};
    case JudgeOn::kConservative:
      break;
  }
  return *exact > simplified ? Choice{*exact, JudgedOn::kExact, JudgedWhy::kMoreConservative}
                             : Choice{simplified, JudgedOn::kSimplified, JudgedWhy::kMoreConservative};
}

}  // namespace

void choose_judged_figures(const Project& project, const Sif& sif, SifResult& r) {
  const bool low = r.demand_mode == DemandMode::kLow;
  bool any_forced = false;
  JudgedWhy sif_forced_why = JudgedWhy::kChannelsDiffer;
  for (std::size_t i = 0; i < r.subsystems.size() && i < sif.subsystems.size(); ++i) {
    SubsystemResult& s = r.subsystems[i];
    const Subsystem& sub = sif.subsystems[i];
    const std::optional<double> simplified = low ? s.pfd_avg_simplified : s.pfh_simplified_per_hour;
    if (!simplified || sub.is_vendor()) continue;  // vendor figures stand as given
    const std::optional<double> exact = low ? s.pfd_avg_exact : s.pfh_exact_per_hour;
    const bool differ = !group_data_for(project, sub).channels_identical();
    const bool beyond = beyond_simplified(project, sub, *simplified, low);
    const Choice c = choose(project.judge_on, *simplified, exact, differ || beyond,
                            differ ? JudgedWhy::kChannelsDiffer : JudgedWhy::kBeyondSimplified);
    if (exact && (differ || beyond)) {
      any_forced = true;
      sif_forced_why = c.why;
    }
    (low ? s.pfd_avg : s.pfh_per_hour) = c.value;
    s.judged_on = c.on;
    if (c.on == JudgedOn::kExact && differ)
      s.equation += "; judged on the exact multi-phase Markov model (channels differ)";
  }
  const std::optional<double> simplified = low ? r.pfd_avg_simplified : r.pfh_simplified_per_hour;
  if (!simplified) return;
  // The SIF's judged figure is the sum of its subsystems' judged figures (series, IEC
  // 61508-6:2010 B.2.2): never below either engine's figure for any subsystem.
  double total = 0.0;
  Choice c{0.0, JudgedOn::kSimplified, JudgedWhy::kOnlyFigure};
  for (const auto& s : r.subsystems) {
    total += (low ? s.pfd_avg : s.pfh_per_hour).value_or(0.0);
    if (s.judged_on == JudgedOn::kExact) c.on = JudgedOn::kExact;
  }
  const bool exact_ran = (low ? r.pfd_avg_exact : r.pfh_exact_per_hour).has_value();
  c.why = !exact_ran                                   ? JudgedWhy::kOnlyFigure
          : any_forced                                 ? sif_forced_why
          : project.judge_on == JudgeOn::kConservative ? JudgedWhy::kMoreConservative
                                                       : JudgedWhy::kProjectChoice;
  c.value = total;
  (low ? r.pfd_avg : r.pfh_per_hour) = c.value;
  r.judged_on = c.on;
  r.judged_why = c.why;
  for (auto& s : r.subsystems) s.share = total > 0.0 ? (low ? s.pfd_avg : s.pfh_per_hour).value_or(0.0) / total : 0.0;
  r.assumptions.push_back(std::string("verdict on the ") + to_string(c.on) + " " + (low ? "PFDavg" : "PFH") + ": " +
                          to_string(c.why));
}

std::string to_string(JudgedOn on) { return on == JudgedOn::kExact ? "exact" : "simplified"; }

std::string to_string(JudgedWhy why) {
  switch (why) {
    case JudgedWhy::kOnlyFigure:
      return "the only figure (no exact cross-check)";
    case JudgedWhy::kMoreConservative:
      return "the more conservative of the simplified and exact figures";
    case JudgedWhy::kProjectChoice:
      return "the project's \"judge_on\" asks for it";
    case JudgedWhy::kChannelsDiffer:
      return "a group's channels differ, and the Annex B forms need identical channels";
    case JudgedWhy::kBeyondSimplified:
      return "a group's simplified figure is outside its validity (lDU T1 above 0.1 or a PFD above 1)";
  }
  return {};
}

}  // namespace sifter
