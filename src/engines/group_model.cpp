// The resolved model of a voting group: built once per subsystem from the project.
#include "sifter/engines/group_model.hpp"

#include <algorithm>
#include <cmath>

namespace sifter {

std::vector<TestSlice> test_slices(const Subsystem& sub, Duration mission) {
  std::vector<TestSlice> slices;
  double rest = 1.0;
  if (sub.partial_stroke) {
    slices.push_back({sub.partial_stroke->coverage, sub.partial_stroke->interval});
    rest -= sub.partial_stroke->coverage;
  }
  const double ptc = sub.proof_test_coverage;
  if (rest * ptc > 0.0) slices.push_back({rest * ptc, sub.proof_test_interval});
  if (rest * (1.0 - ptc) > 0.0) slices.push_back({rest * (1.0 - ptc), mission});
  if (slices.empty()) slices.push_back({1.0, sub.proof_test_interval});
  return slices;
}

FailureRates channel_rates(const Project& project, const Channel& channel) {
  FailureRates rates;
  for (auto c : channel.components) rates += project.components[c].rates;
  return rates;
}

bool GroupData::channels_identical() const {
  auto same = [](double a, double b) { return std::abs(a - b) <= 1e-12 * std::max(std::abs(a), std::abs(b)); };
  for (const auto& r : channels)
    if (!same(r.lambda_du.per_hour, channel.lambda_du.per_hour) ||
        !same(r.lambda_dd.per_hour, channel.lambda_dd.per_hour) ||
        !same(r.lambda_sd.per_hour, channel.lambda_sd.per_hour))
      return false;
  return true;
}

GroupData group_data_for(const Project& project, const Subsystem& sub) {
  GroupData g;
  g.vote = sub.vote;
  for (const auto& ch : sub.channels) g.channels.push_back(channel_rates(project, ch));
  if (!g.channels.empty()) {
    g.channel = g.channels.front();
    if (!g.channels_identical()) {
      // The mean channel: only the common-cause term reads it for a group of different channels.
      FailureRates mean;
      for (const auto& r : g.channels) mean += r;
      const double n = static_cast<double>(g.channels.size());
      mean.lambda_du.per_hour /= n;
      mean.lambda_dd.per_hour /= n;
      mean.lambda_su.per_hour /= n;
      mean.lambda_sd.per_hour /= n;
      g.channel = mean;
    } else {
      g.channels.clear();
    }
  }
  const double multiplier = sub.ccf_scaling == CcfScaling::kIec61508TableD5 && table_d5_covers(sub.vote.k, sub.vote.n)
                                ? ccf_multiplier_table_d5(sub.vote.k, sub.vote.n)
                                : 1.0;
  g.beta = std::min(1.0, sub.beta * multiplier);
  g.beta_d = std::min(1.0, sub.beta_d * multiplier);
  g.tests = test_slices(sub, project.defaults.mission_time);
  g.mttr = sub.mttr;
  g.mrt = sub.mrt;
  g.proof_test_interval = sub.proof_test_interval;
  g.test_duration = sub.test_duration;
  g.staggered = sub.staggered;
  g.detected_to_safe_state = !sub.alarm_only_on_detected;
  return g;
}

std::vector<std::vector<std::size_t>> channel_components(const Subsystem& sub) {
  std::vector<std::vector<std::size_t>> out;
  for (const auto& ch : sub.channels) out.push_back(ch.components);
  return out;
}

}  // namespace sifter
