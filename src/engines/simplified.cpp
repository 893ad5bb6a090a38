// IEC 61508-6:2010 Annex B simplified PFDavg and PFH (DEVELOPERS.md, Methods M1-M3).
#include "sifter/engines/simplified.hpp"

#include <array>
#include <cassert>
#include <cmath>
#include <vector>

namespace sifter {
namespace {

constexpr const char* kPfdSource = "IEC 61508-6:2010 B.3.2.2";
constexpr const char* kPfhSource = "IEC 61508-6:2010 B.3.3.2";

// Number of ordered ways to pick m failing channels of N: N!/(N-m)!.
double falling_factorial(int n, int m) {
  double v = 1.0;
  for (int i = 0; i < m; ++i) v *= static_cast<double>(n - i);
  return v;
}

// The undetected-failure term of a down time: sum over slices of share lDU (T/(j+1) + MRT).
double undetected_time_term(const GroupData& g, int j) {
  double sum = 0.0;
  for (const auto& s : g.tests)
    sum += s.share * g.channel.lambda_du.per_hour * (s.interval.hours / (j + 1) + g.mrt.hours);
  return sum;
}

// The common-cause term: beta_D lDD MTTR + beta sum(share lDU (T/2 + MRT)).
double ccf_term(const GroupData& g) {
  return g.beta_d * g.channel.lambda_dd.per_hour * g.mttr.hours + g.beta * undetected_time_term(g, 1);
}

std::string equation_name(const GroupData& g, const char* source) {
  const bool named = (g.vote.k == 1 && g.vote.n <= 3) || (g.vote.k == 2 && g.vote.n <= 3);
  std::string out = std::string(source) + ", " + g.vote.text();
  if (!named) out += " (general KooN form of the Annex B construction)";
  if (g.tests.size() > 1) out += "; imperfect or partial tests as weighted intervals (B.3.2.5 generalised)";
  return out;
}

GroupPfd one_oo_two_d(const GroupData& g) {
  // IEC 61508-6:2010 B.3.2.2.5.
  const double ldu = g.channel.lambda_du.per_hour;
  const double ldd = g.channel.lambda_dd.per_hour;
  const double lsd = g.channel.lambda_sd.per_hour;
  GroupPfd out;
  const double total = ldu + ldd + lsd;
  if (total <= 0.0) return out;
  const double t_ce = (undetected_time_term(g, 1) + (ldd + lsd) * g.mttr.hours) / total;
  double t_ge = g.mrt.hours;
  for (const auto& s : g.tests) t_ge += s.share * s.interval.hours / 3.0;
  const double independent =
      2.0 * (1.0 - g.beta) * ldu * ((1.0 - g.beta) * ldu + (1.0 - g.beta_d) * ldd + lsd) * t_ce * t_ge;
  out.common_cause = ccf_term(g);
  const double detected_share = (ldd + lsd) * g.mttr.hours / (total * t_ce);
  out.independent_detected = independent * detected_share;
  out.independent_undetected = independent - out.independent_detected;
  out.pfd_avg = independent + out.common_cause;
  return out;
}

}  // namespace

double binomial(int n, int k) {
  if (k < 0 || k > n) return 0.0;
  double v = 1.0;
  for (int i = 1; i <= k; ++i) v = v * static_cast<double>(n - k + i) / i;
  return v;
}

double mean_down_time_hours(const GroupData& g, int j) {
  const double ld = g.channel.lambda_d();
  if (ld <= 0.0) return 0.0;
  return (undetected_time_term(g, j) + g.channel.lambda_dd.per_hour * g.mttr.hours) / ld;
}

namespace {

GroupPfd pfd_terms(const GroupData& g);

// The proof test takes each channel out of service for TD (common practice; ISO/TR 12489
// models it exactly, from memory). One channel at a time: the group runs as Ko(N-1) for
// N TD per interval T1. Where N-1 < K (1oo1, NooN) the function is unprotected: N TD/T1;
// otherwise N (TD/T1) times the Ko(N-1) group's PFDavg over the window.
double test_duration_term(const GroupData& g) {
  if (!g.test_duration || !(g.test_duration->hours > 0.0) || !(g.proof_test_interval.hours > 0.0)) return 0.0;
  const int n = g.vote.diagnostic ? 2 : g.vote.n;
  const int k = g.vote.diagnostic ? 1 : g.vote.k;
  const double share = std::min(1.0, g.test_duration->hours / g.proof_test_interval.hours);
  if (n - 1 < k) return std::min(1.0, n * share);
  GroupData degraded = g;
  degraded.vote = Vote{k, n - 1, false};
  degraded.test_duration.reset();
  if (!degraded.channels.empty()) degraded.channels.resize(static_cast<std::size_t>(n - 1));
  return n * share * pfd_terms(degraded).pfd_avg;
}

// Independent term of m channel failures out of the channels `pick` (ordered ways m! times the
// product of their X), down times from their mean channel: the Annex B construction applied to
// channels that differ (common practice; it equals N!/(N-m)! X^m prod t_j for identical ones).
double independent_of_subsets(const GroupData& g, int m) {
  const int n = g.vote.n;
  double sum = 0.0;
  std::vector<int> pick(static_cast<std::size_t>(m));
  for (int i = 0; i < m; ++i) pick[static_cast<std::size_t>(i)] = i;
  GroupData mean = g;
  mean.channels.clear();
  while (true) {
    FailureRates avg;
    double product = 1.0;
    for (int i : pick) {
      const FailureRates& r = g.rates_of(i);
      avg += r;
      product *= (1.0 - g.beta_d) * r.lambda_dd.per_hour + (1.0 - g.beta) * r.lambda_du.per_hour;
    }
    mean.channel.lambda_du.per_hour = avg.lambda_du.per_hour / m;
    mean.channel.lambda_dd.per_hour = avg.lambda_dd.per_hour / m;
    double term = falling_factorial(m, m) * product;
    for (int j = 1; j <= m; ++j) term *= mean_down_time_hours(mean, j);
    sum += term;
    int i = m - 1;
    while (i >= 0 && pick[static_cast<std::size_t>(i)] == n - m + i) --i;
    if (i < 0) break;
    ++pick[static_cast<std::size_t>(i)];
    for (int k = i + 1; k < m; ++k) pick[static_cast<std::size_t>(k)] = pick[static_cast<std::size_t>(k - 1)] + 1;
  }
  return sum;
}

// The terms of group_pfd_avg without the equation text, so that Monte Carlo loops build no string.
GroupPfd pfd_terms(const GroupData& g) {
  assert(g.vote.k >= 1 && g.vote.k <= g.vote.n);
  if (g.vote.diagnostic) {
    GroupPfd d = one_oo_two_d(g);
    d.test_duration = test_duration_term(g);
    d.pfd_avg += d.test_duration;
    return d;
  }
  GroupPfd out;
  const double ld = g.channel.lambda_d();
  if (ld <= 0.0) return out;
  const int m = g.vote.failures_to_fail();
  const bool identical = g.channels.empty() || g.channels_identical();
  double independent = 0.0;
  if (m == 1) {
    // 1oo1, 2oo2, NooN: any one failure fails the group; no separate common-cause term.
    if (identical) {
      independent = g.vote.n * ld * mean_down_time_hours(g, 1);
    } else {
      GroupData one = g;
      one.channels.clear();
      for (int i = 0; i < g.vote.n; ++i) {
        one.channel = g.rates_of(i);
        independent += one.channel.lambda_d() * mean_down_time_hours(one, 1);
      }
    }
  } else {
    if (identical) {
      const double x = (1.0 - g.beta_d) * g.channel.lambda_dd.per_hour + (1.0 - g.beta) * g.channel.lambda_du.per_hour;
      independent = falling_factorial(g.vote.n, m) * std::pow(x, m);
      for (int j = 1; j <= m; ++j) independent *= mean_down_time_hours(g, j);
    } else {
      independent = independent_of_subsets(g, m);
    }
    out.common_cause = ccf_term(g);
  }
  // Attribute the independent term by the detected share of the first down time.
  const double detected_share = g.channel.lambda_dd.per_hour * g.mttr.hours / (ld * mean_down_time_hours(g, 1));
  out.independent_detected = std::isfinite(detected_share) ? independent * detected_share : 0.0;
  out.independent_undetected = independent - out.independent_detected;
  out.pfd_avg = independent + out.common_cause;
  out.test_duration = test_duration_term(g);
  out.pfd_avg += out.test_duration;
  return out;
}

}  // namespace

GroupPfd group_pfd_avg(const GroupData& g) {
  GroupPfd out = pfd_terms(g);
  out.equation = g.vote.diagnostic ? std::string(kPfdSource) + ", 1oo2D" : equation_name(g, kPfdSource);
  return out;
}

double group_pfd_avg_value(const GroupData& g) { return pfd_terms(g).pfd_avg; }

GroupPfh group_pfh(const GroupData& g) {
  GroupPfh out;
  out.equation = equation_name(g, kPfhSource);
  const double ldu = g.channel.lambda_du.per_hour;
  const double ldd = g.channel.lambda_dd.per_hour;
  const int m = g.vote.failures_to_fail();
  // IEC 61508-6:2010 B.3.3.2: a detected failure takes the system to its safe state, so only
  // undetected failures of the last channel fail it and common cause is beta lDU alone. With
  // "alarm_only" the detected failures stay dangerous: lDD counts too, and beta_D lDD.
  const bool alarm_only = !g.detected_to_safe_state;
  if (m == 1 && !g.vote.diagnostic) {
    for (int i = 0; i < g.vote.n; ++i)
      out.pfh_per_hour += g.rates_of(i).lambda_du.per_hour + (alarm_only ? g.rates_of(i).lambda_dd.per_hour : 0.0);
    return out;
  }
  out.common_cause_per_hour = g.beta * ldu + (alarm_only ? g.beta_d * ldd : 0.0);
  double independent = 0.0;
  if (g.vote.diagnostic) {
    // IEC 61508-6:2010 B.3.3.2.5, 1oo2D.
    const double lsd = g.channel.lambda_sd.per_hour;
    const double total = ldu + ldd + lsd;
    const double t_ce = total > 0.0 ? (undetected_time_term(g, 1) + (ldd + lsd) * g.mttr.hours) / total : 0.0;
    independent = 2.0 * (1.0 - g.beta) * ldu * ((1.0 - g.beta) * ldu + (1.0 - g.beta_d) * ldd + lsd) * t_ce;
    out.equation = std::string(kPfhSource) + ", 1oo2D";
  } else {
    const double x = (1.0 - g.beta_d) * ldd + (1.0 - g.beta) * ldu;
    const double last = (1.0 - g.beta) * ldu + (alarm_only ? (1.0 - g.beta_d) * ldd : 0.0);
    independent = falling_factorial(g.vote.n, m) * std::pow(x, m - 1) * last;
    for (int j = 1; j <= m - 1; ++j) independent *= mean_down_time_hours(g, j);
  }
  out.pfh_per_hour = independent + out.common_cause_per_hour;
  return out;
}

double ccf_multiplier_table_d5(int k, int n) {
  // IEC 61508-6:2010 Annex D, Table D.5 (DEVELOPERS.md, Methods M1, from memory); rows M = K, columns N.
  static constexpr std::array<std::array<double, 4>, 4> kTable{{
      {1.0, 0.5, 0.3, 0.2},   // M = 1: N = 2, 3, 4, 5
      {0.0, 1.5, 0.6, 0.4},   // M = 2
      {0.0, 0.0, 1.75, 0.8},  // M = 3
      {0.0, 0.0, 0.0, 2.0},   // M = 4
  }};
  assert(table_d5_covers(k, n));
  if (k == n) return 1.0;
  return kTable[static_cast<std::size_t>(k - 1)][static_cast<std::size_t>(n - 2)];
}

}  // namespace sifter
