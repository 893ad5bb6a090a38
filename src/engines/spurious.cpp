// Spurious trip rates of voting groups and SIFs (DEVELOPERS.md, Methods M7, Gruhn & Cheddie, from memory).
#include "sifter/engines/spurious.hpp"

#include <cassert>
#include <cmath>

#include "sifter/engines/simplified.hpp"

namespace sifter {

double channel_trip_rate_per_hour(const FailureRates& channel, bool trip_on_detected) {
  return channel.lambda_s() + (trip_on_detected ? channel.lambda_dd.per_hour : 0.0);
}

double group_spurious_trip_rate_per_hour(const SpuriousGroupData& g) {
  assert(g.vote.k >= 1 && g.vote.k <= g.vote.n);
  const double ls = g.lambda_trip_per_hour;
  const int k = g.vote.k;
  const int n = g.vote.n;
  if (n == 1) return ls;
  // K safe failures must overlap for K trip votes; a common-cause safe failure trips every
  // channel at once, whatever the vote.
  const double ls_independent = k == 1 ? (1.0 - g.beta) * ls : ls;
  const double independent = k * binomial(n, k) * std::pow(ls_independent, k) * std::pow(g.mttr.hours, k - 1);
  return independent + g.beta * ls;
}

std::string spurious_trip_equation(const Vote& vote) {
  const bool named = (vote.k == 1 && vote.n <= 2) || (vote.k == 2 && vote.n <= 3);
  std::string out = std::string(kSpuriousTripSource) + ", " + vote.text();
  if (vote.diagnostic)
    out += " taken as 1oo2";
  else if (!named)
    out += " (general KooN form: K C(N,K) lS^K MTTR^(K-1) + beta lS)";
  return out;
}

SpuriousGroupData spurious_data_for(const Project& project, const Subsystem& sub) {
  SpuriousGroupData g;
  g.vote = sub.vote;
  g.vote.diagnostic = false;
  FailureRates channel;
  if (!sub.channels.empty())
    for (auto c : sub.channels.front().components) channel += project.components[c].rates;
  g.lambda_trip_per_hour = channel_trip_rate_per_hour(channel, sub.trip_on_detected);
  g.beta = sub.beta;
  g.mttr = sub.mttr;
  return g;
}

std::optional<double> mttf_spurious_years(double rate_per_year) {
  if (!(rate_per_year > 0.0)) return std::nullopt;
  return 1.0 / rate_per_year;
}

void add_spurious_trips(const Project& project, const Sif& sif, SifResult& result) {
  assert(result.subsystems.size() == sif.subsystems.size());
  double total_per_hour = 0.0;
  std::string vendors;
  std::string on_detected;
  for (std::size_t i = 0; i < sif.subsystems.size(); ++i) {
    const Subsystem& sub = sif.subsystems[i];
    SubsystemResult& r = result.subsystems[i];
    if (sub.is_vendor()) {
      vendors += (vendors.empty() ? "" : ", ") + sub.name;
      r.spurious_trip_rate_per_yr = 0.0;
      r.mttf_spurious_yr = std::nullopt;
      continue;
    }
    if (sub.trip_on_detected) on_detected += (on_detected.empty() ? "" : ", ") + sub.name;
    const double per_hour = group_spurious_trip_rate_per_hour(spurious_data_for(project, sub));
    total_per_hour += per_hour;
    r.spurious_trip_rate_per_yr = Rate{per_hour}.per_year();
    r.mttf_spurious_yr = mttf_spurious_years(r.spurious_trip_rate_per_yr);
  }
  result.spurious_trip_rate_per_yr = Rate{total_per_hour}.per_year();
  result.mttf_spurious_yr = mttf_spurious_years(result.spurious_trip_rate_per_yr);
  std::string text = "spurious trip rate from the safe failure rates (lambda_su + lambda_sd";
  text += on_detected.empty() ? ")" : "; plus lambda_dd where detected failures trip: " + on_detected + ")";
  text += ", summed over the subsystems; ";
  text += kSpuriousTripSource;
  text += "; beta as entered, MTTR as the restoration time";
  if (!vendors.empty()) text += "; not counted for the supplier figures: " + vendors;
  result.assumptions.push_back(text);
}

}  // namespace sifter
