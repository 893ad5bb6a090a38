// Sweeps: one parameter of a SIF varied over a range, each point verified as check would.
#include <array>
#include <cmath>
#include <utility>

#include "analysis/whatif_parts.hpp"
#include "sifter/analysis/whatif.hpp"
#include "sifter/model/format.hpp"

namespace sifter {
namespace {

constexpr std::array<std::pair<SweepParameter, const char*>, 5> kParameterNames{{
    {SweepParameter::kProofTestInterval, "proof_test_interval"},
    {SweepParameter::kBeta, "beta"},
    {SweepParameter::kMttr, "mttr"},
    {SweepParameter::kProofTestCoverage, "proof_test_coverage"},
    {SweepParameter::kLambdaDuFactor, "lambda_du_factor"},
}};

constexpr int kMaxSteps = 1000;
constexpr double kMaxRateFactor = 1000.0;
constexpr double kMinIntervalHours = 24.0;
constexpr double kMaxDurationHours = 100.0 * kHoursPerYear;

bool is_fraction(SweepParameter p) { return p == SweepParameter::kBeta || p == SweepParameter::kProofTestCoverage; }

void check_value(SweepParameter p, double v, const char* end) {
  const std::string name = to_string(p);
  if (!std::isfinite(v)) throw UsageError("--" + std::string(end) + " must be a finite number");
  if (is_fraction(p) && (v < 0.0 || v > 1.0))
    throw UsageError(name + " is a fraction: --" + end + " must lie from 0 to 1 (or 0% to 100%), found " +
                     sifter::figure(v));
  if (p == SweepParameter::kLambdaDuFactor && v <= 0.0)
    throw UsageError("lambda_du_factor multiplies lambda_du: --" + std::string(end) + " must be above 0");
  if (p == SweepParameter::kProofTestInterval && v <= 0.0)
    throw UsageError("a proof-test interval must be above zero: --" + std::string(end));
  if (v < 0.0) throw UsageError("--" + std::string(end) + " must not be negative");
  // Bounds that keep every point a physical input and the work of the sweep bounded (README "Limits").
  if (p == SweepParameter::kLambdaDuFactor && v > kMaxRateFactor)
    throw UsageError("lambda_du_factor: --" + std::string(end) + " must be at most " + sifter::figure(kMaxRateFactor) +
                     ", found " + sifter::figure(v));
  if (p == SweepParameter::kProofTestInterval && (v < kMinIntervalHours || v > kMaxDurationHours))
    throw UsageError("a proof-test interval for a sweep lies from 1 d to 100 yr: --" + std::string(end) + " is " +
                     format_duration(Duration{v}));
  if (p == SweepParameter::kMttr && v > kMaxDurationHours)
    throw UsageError("an MTTR for a sweep is at most 100 yr: --" + std::string(end) + " is " +
                     format_duration(Duration{v}));
}

std::vector<double> sweep_values(const SweepRequest& r) {
  std::vector<double> values;
  for (int i = 0; i < r.steps; ++i) {
    const double t = static_cast<double>(i) / (r.steps - 1);
    values.push_back(r.log ? std::exp(std::log(r.from) + t * (std::log(r.to) - std::log(r.from)))
                           : r.from + t * (r.to - r.from));
  }
  // The ends are exactly the values asked, so that they can be compared with check.
  values.front() = r.from;
  values.back() = r.to;
  return values;
}

}  // namespace

std::string to_string(SweepParameter parameter) {
  for (const auto& [p, name] : kParameterNames)
    if (p == parameter) return name;
  return {};
}

std::optional<SweepParameter> parse_sweep_parameter(std::string_view name) {
  for (const auto& [p, n] : kParameterNames)
    if (name == n) return p;
  return std::nullopt;
}

std::string sweep_parameter_names() {
  std::string out;
  for (const auto& [p, name] : kParameterNames) out += (out.empty() ? "" : ", ") + std::string(name);
  return out;
}

bool is_duration(SweepParameter p) { return p == SweepParameter::kProofTestInterval || p == SweepParameter::kMttr; }

void apply_parameter(Project& project, std::size_t sif, const std::vector<std::size_t>& subsystems,
                     SweepParameter parameter, double value) {
  for (auto i : subsystems) {
    Subsystem& sub = project.sifs[sif].subsystems[i];
    switch (parameter) {
      case SweepParameter::kProofTestInterval:
        sub.proof_test_interval = Duration{value};
        break;
      case SweepParameter::kBeta:
        if (sub.beta_d_defaulted) sub.beta_d = value;
        sub.beta = value;
        break;
      case SweepParameter::kMttr:
        if (sub.mrt_defaulted) sub.mrt = Duration{value};
        sub.mttr = Duration{value};
        break;
      case SweepParameter::kProofTestCoverage:
        sub.proof_test_coverage = value;
        break;
      case SweepParameter::kLambdaDuFactor:
        detail::copy_components_of(project, sub);
        for (const auto& channel : sub.channels)
          for (auto c : channel.components) project.components[c].rates.lambda_du.per_hour *= value;
        break;
    }
  }
}

SweepResult sweep(const WhatIf& what_if, const SweepRequest& request) {
  const Project& base = what_if.project();
  const Sif& s = base.sifs.at(request.sif);
  check_value(request.parameter, request.from, "from");
  check_value(request.parameter, request.to, "to");
  if (request.steps < 2 || request.steps > kMaxSteps)
    throw UsageError("--steps must be from 2 to " + std::to_string(kMaxSteps) + ", found " +
                     std::to_string(request.steps));
  if (request.log && (request.from <= 0.0 || request.to <= 0.0)) throw UsageError("--log needs both ends above zero");
  const std::vector<std::size_t> vary = detail::subsystems_to_vary(s, request.subsystem, to_string(request.parameter));

  SweepResult out;
  out.sif = s.id;
  if (request.subsystem) out.subsystem = s.subsystems[*request.subsystem].name;
  for (auto i : vary) out.varied.push_back(s.subsystems[i].name);
  out.parameter = request.parameter;
  for (double v : sweep_values(request)) {
    Project p = base;
    apply_parameter(p, request.sif, vary, request.parameter, v);
    out.points.push_back({v, what_if.verify(p, request.sif)});
  }
  out.mode = out.points.front().result.demand_mode;
  for (auto i : vary) {
    const Subsystem& sub = s.subsystems[i];
    if (request.parameter == SweepParameter::kMttr && sub.mrt_defaulted)
      out.notes.push_back(detail::quoted_name(sub.name) + ": MRT follows MTTR (it was not given)");
    if (request.parameter == SweepParameter::kBeta && sub.beta_d_defaulted)
      out.notes.push_back(detail::quoted_name(sub.name) + ": beta_D follows beta (it was not given)");
    if (request.parameter == SweepParameter::kBeta && !vote_is_redundant(sub.vote))
      out.notes.push_back(detail::quoted_name(sub.name) + " (" + sub.vote.text() + ") has no common-cause term");
  }
  if (request.parameter == SweepParameter::kLambdaDuFactor)
    out.notes.push_back("lambda_du_factor multiplies the lambda_du of every component in the subsystems varied");
  return out;
}

}  // namespace sifter
