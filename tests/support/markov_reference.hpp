#pragma once
// An independent reference for the exact engine: the unavailability of a KooN group written in
// closed form from the channels' survival probabilities, integrated by Boost.Math adaptive
// Gauss-Kronrod quadrature. It shares no code with the engine: no states, no matrices.
// Scope: undetected failures only, repairs instantaneous (MTTR = MRT = 0).
#include <algorithm>
#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <cmath>
#include <functional>
#include <numeric>
#include <vector>

namespace sifter::reference {

/// One channel: its independent undetected rate and the instant of its first proof test.
struct Channel {
  double lambda_per_hour = 0.0;
  double first_test_hours = 0.0;
};

/// A KooN group: common cause is a shock that fails every working channel at once; a proof
/// test reveals the share ptc of every failure, the rest stays until the end of the mission.
struct Group {
  int k = 1;
  std::vector<Channel> channels;
  double shock_per_hour = 0.0;
  double ptc = 1.0;
  double interval_hours = 0.0;
};

/// Instant of channel c's last proof test at or before t (0 before the first one).
inline double last_test(const Group& g, const Channel& c, double t) {
  if (t < c.first_test_hours) return 0.0;
  return c.first_test_hours + std::floor((t - c.first_test_hours) / g.interval_hours) * g.interval_hours;
}

/// P(at least k of independent events with probabilities p happen), by the Poisson-binomial
/// recursion.
inline double at_least(int k, const std::vector<double>& p) {
  std::vector<double> dist(p.size() + 1, 0.0);
  dist[0] = 1.0;
  for (std::size_t i = 0; i < p.size(); ++i)
    for (std::size_t j = i + 1; j-- > 0;) {
      dist[j + 1] += dist[j] * p[i];
      dist[j] *= 1.0 - p[i];
    }
  return std::accumulate(dist.begin() + std::min<std::ptrdiff_t>(k, static_cast<std::ptrdiff_t>(dist.size())),
                         dist.end(), 0.0);
}

/// PFD(t) of the group. A channel works when no failure of its own and no covered shock has
/// struck since its last test and no uncovered one ever. The channels spared by the covered
/// shocks are those tested since the last shock: condition on where that shock fell among
/// the channels' last tests, then count the working channels binomially.
inline double pfd(const Group& g, double t) {
  const std::size_t n = g.channels.size();
  std::vector<std::pair<double, double>> since;  // (time since last test, survival)
  for (const auto& c : g.channels) {
    const double tau = last_test(g, c, t);
    const double survival = std::exp(-c.lambda_per_hour * (g.ptc * (t - tau) + (1.0 - g.ptc) * t));
    since.emplace_back(t - tau, survival);
  }
  std::sort(since.begin(), since.end());  // most recently tested first
  const double covered = g.shock_per_hour * g.ptc;
  double works = 0.0;
  std::vector<double> spared;
  double no_shock_before = 1.0;  // P(no covered shock within the last d_m)
  for (std::size_t m = 0; m <= n; ++m) {
    const double next = m < n ? std::exp(-covered * since[m].first) : 0.0;
    works += (no_shock_before - next) * at_least(g.k, spared);
    if (m < n) spared.push_back(since[m].second);
    no_shock_before = next;
  }
  works *= std::exp(-g.shock_per_hour * (1.0 - g.ptc) * t);
  return 1.0 - works;
}

/// Every proof-test instant of the groups within (0, mission), with 0 and the mission time.
inline std::vector<double> test_instants(const std::vector<Group>& groups, double mission) {
  std::vector<double> t{0.0, mission};
  for (const auto& g : groups)
    for (const auto& c : g.channels)
      for (double s = c.first_test_hours; s < mission; s += g.interval_hours) t.push_back(s);
  std::sort(t.begin(), t.end());
  t.erase(std::unique(t.begin(), t.end()), t.end());
  return t;
}

/// Time average over [0, mission] of f, integrated piecewise between the breaks.
inline double average(const std::function<double(double)>& f, const std::vector<double>& breaks) {
  double sum = 0.0;
  for (std::size_t i = 0; i + 1 < breaks.size(); ++i)
    sum += boost::math::quadrature::gauss_kronrod<double, 61>::integrate(f, breaks[i], breaks[i + 1], 15, 1e-13);
  return sum / (breaks.back() - breaks.front());
}

/// PFDavg of one group over the mission.
inline double pfd_avg(const Group& g, double mission) {
  return average([&](double t) { return pfd(g, t); }, test_instants({g}, mission));
}

/// PFDavg of groups in series: the average of 1 - prod(1 - PFD_i(t)).
inline double series_pfd_avg(const std::vector<Group>& groups, double mission) {
  return average(
      [&](double t) {
        double works = 1.0;
        for (const auto& g : groups) works *= 1.0 - pfd(g, t);
        return 1.0 - works;
      },
      test_instants(groups, mission));
}

}  // namespace sifter::reference
