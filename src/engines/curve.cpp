// PFD(t) sawtooth from the simplified group data: what the report draws until the exact engine is wired.
#include "sifter/engines/curve.hpp"

#include <algorithm>
#include <cmath>
#include <utility>

#include "sifter/engines/group_model.hpp"

namespace sifter {
namespace {

// Relative tolerance for "this instant is a test instant": products k*T of decimal intervals
// are not exact in binary floating point.
constexpr double kInstantRelTol = 1e-9;

// Time since the last test of a slice of interval T; at a test instant 0 (just after) or T
// (just before). An interval of zero means no periodic test.
double phase_hours(double t, double interval, bool just_before_test) {
  if (interval <= 0.0) return t;
  double r = std::fmod(t, interval);
  if (r > interval * (1.0 - kInstantRelTol)) r = 0.0;
  if (just_before_test && r < interval * kInstantRelTol && t > 0.0) r = interval;
  return r;
}

double clamp01(double v) { return std::clamp(v, 0.0, 1.0); }

// Every instant in (0, mission) at which some test renews a channel, sorted, without repeats.
std::vector<double> test_instants(const std::vector<CurveSubsystem>& subsystems, double mission) {
  std::vector<double> out;
  for (const auto& s : subsystems) {
    if (!s.group) continue;
    for (const auto& slice : s.group->tests) {
      const double T = slice.interval.hours;
      if (T <= 0.0 || T >= mission) continue;
      for (double k = 1.0; k * T < mission * (1.0 - kInstantRelTol); k += 1.0) {
        out.push_back(k * T);
        if (out.size() > kMaxCurveTestInstants) return {};
      }
    }
  }
  std::sort(out.begin(), out.end());
  out.erase(std::unique(out.begin(), out.end(),
                        [mission](double a, double b) { return std::fabs(a - b) < kInstantRelTol * mission; }),
            out.end());
  return out.size() > kMaxCurveTestInstants ? std::vector<double>{} : out;
}

// The sample instants: uniform points, and each test instant twice (just before, just after).
std::vector<std::pair<double, bool>> sample_instants(const std::vector<CurveSubsystem>& subsystems, double mission,
                                                     std::size_t uniform_samples) {
  const std::vector<double> instants = test_instants(subsystems, mission);
  std::vector<std::pair<double, bool>> out;
  const std::size_t n = std::max<std::size_t>(uniform_samples, 2);
  for (std::size_t i = 0; i < n; ++i) {
    const double t = mission * static_cast<double>(i) / static_cast<double>(n - 1);
    const auto near = std::lower_bound(instants.begin(), instants.end(), t - kInstantRelTol * mission);
    if (near != instants.end() && std::fabs(*near - t) < kInstantRelTol * mission) continue;
    out.emplace_back(t, true);
  }
  for (double t : instants) {
    out.emplace_back(t, true);
    out.emplace_back(t, false);
  }
  // In time order; at one instant the value just before the test comes first.
  std::sort(out.begin(), out.end(), [](const auto& a, const auto& b) {
    return a.first != b.first ? a.first < b.first : (a.second && !b.second);
  });
  return out;
}

}  // namespace

double channel_pfd_at(const GroupData& g, double t_hours, bool just_before_test, double undetected_factor,
                      double detected_factor) {
  double q = detected_factor * g.channel.lambda_dd.per_hour * g.mttr.hours;
  for (const auto& s : g.tests)
    q += undetected_factor * s.share * g.channel.lambda_du.per_hour *
         (phase_hours(t_hours, s.interval.hours, just_before_test) + g.mrt.hours);
  return q;
}

double group_pfd_at(const GroupData& g, double t_hours, bool just_before_test) {
  const int n = g.vote.n;
  const int m = g.vote.failures_to_fail();  // 1oo2D: drawn as 1oo2
  if (m == 1) return 1.0 - std::pow(1.0 - clamp01(channel_pfd_at(g, t_hours, just_before_test)), n);
  const double q = clamp01(channel_pfd_at(g, t_hours, just_before_test, 1.0 - g.beta, 1.0 - g.beta_d));
  double independent = 0.0;
  for (int j = m; j <= n; ++j) independent += binomial(n, j) * std::pow(q, j) * std::pow(1.0 - q, n - j);
  const double common_cause = channel_pfd_at(g, t_hours, just_before_test, g.beta, g.beta_d);
  return clamp01(independent + common_cause);
}

PfdPlot simplified_curve(const std::vector<CurveSubsystem>& subsystems, Duration mission, std::size_t uniform_samples) {
  PfdPlot curve;
  curve.engine =
      "simplified sawtooth: per-channel instantaneous PFD from the IEC 61508-6:2010 Annex B group data, "
      "binomial over the channels plus the common-cause term (sifter curve.hpp)";
  const auto instants = sample_instants(subsystems, mission.hours, uniform_samples);
  curve.pfd_subsystems.assign(subsystems.size(), {});
  for (const auto& [t, before] : instants) {
    curve.t_hours.push_back(t);
    double sum = 0.0;
    for (std::size_t i = 0; i < subsystems.size(); ++i) {
      const auto& s = subsystems[i];
      const double v = s.group ? group_pfd_at(*s.group, t, before) : s.flat_pfd;
      curve.pfd_subsystems[i].push_back(v);
      sum += v;
    }
    curve.pfd_sif.push_back(sum);
  }
  return curve;
}

PfdPlot simplified_curve(const Project& project, const Sif& sif, std::size_t uniform_samples) {
  std::vector<CurveSubsystem> subsystems;
  for (const auto& sub : sif.subsystems) {
    CurveSubsystem c;
    if (sub.is_vendor())
      c.flat_pfd = sub.vendor_pfd_avg.value_or(0.0);
    else
      c.group = group_data_for(project, sub);
    subsystems.push_back(std::move(c));
  }
  PfdPlot plot = simplified_curve(subsystems, project.defaults.mission_time, uniform_samples);
  for (const auto& sub : sif.subsystems) plot.subsystem_names.push_back(sub.name);
  return plot;
}

}  // namespace sifter
