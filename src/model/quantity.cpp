// Parsing of quantities written with their units in the project file.
#include "sifter/model/quantity.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <utility>

namespace sifter {
namespace {

std::string_view trim(std::string_view s) {
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.front()))) s.remove_prefix(1);
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.back()))) s.remove_suffix(1);
  return s;
}

// Splits "2.5e-7/h" into the number and the unit text after it. std::from_chars keeps this
// independent of the locale, so "0,5" is never read as 0.
struct NumberAndUnit {
  bool ok = false;
  bool out_of_range = false;
  double number = 0.0;
  std::string_view unit;
};

NumberAndUnit split_number(std::string_view text) {
  text = trim(text);
  double value = 0.0;
  const char* first = text.data();
  const char* last = text.data() + text.size();
  if (first != last && *first == '+') ++first;
  auto [ptr, ec] = std::from_chars(first, last, value);
  if (ec == std::errc::result_out_of_range) return {false, true, 0.0, {}};
  if (ec != std::errc() || ptr == first) return {};
  if (value == 0.0) value = 0.0;  // "-0" reads as zero, so that no "-0" reaches an output
  return {true, false, value, trim(std::string_view(ptr, static_cast<std::size_t>(last - ptr)))};
}

struct UnitFactor {
  std::string_view name;
  double hours;
};

// Durations in hours; also the denominators of rates.
constexpr std::array<UnitFactor, 17> kTimeUnits{{
    {"h", 1.0},
    {"hr", 1.0},
    {"hrs", 1.0},
    {"hour", 1.0},
    {"hours", 1.0},
    {"min", 1.0 / 60.0},
    {"s", 1.0 / 3600.0},
    {"d", 24.0},
    {"day", 24.0},
    {"days", 24.0},
    {"wk", 168.0},
    {"week", 168.0},
    {"mo", kHoursPerMonth},
    {"month", kHoursPerMonth},
    {"months", kHoursPerMonth},
    {"yr", kHoursPerYear},
    {"years", kHoursPerYear},
}};

std::optional<double> hours_of_unit(std::string_view unit) {
  for (const auto& u : kTimeUnits)
    if (u.name == unit) return u.hours;
  if (unit == "y" || unit == "year" || unit == "a") return kHoursPerYear;
  return std::nullopt;
}

bool finite_non_negative(double v) { return std::isfinite(v) && v >= 0.0; }

}  // namespace

Parsed<Rate> parse_rate(std::string_view text) {
  const std::string hint = "write a rate with its unit, for example " + std::string(kRateForms);
  auto nu = split_number(text);
  if (nu.out_of_range) return {std::nullopt, "a number beyond the range of finite values", hint};
  if (!nu.ok) return {std::nullopt, "no number at the start", hint};
  if (!finite_non_negative(nu.number)) return {std::nullopt, "a rate must be a finite number of zero or more", hint};
  if (nu.unit == "FIT" || nu.unit == "fit") return {Rate{nu.number * kPerHourPerFit}, {}, {}};
  if (nu.unit.empty()) return {std::nullopt, "the unit is missing", hint};
  std::string_view per = nu.unit;
  if (per.front() != '/') return {std::nullopt, "unknown unit \"" + std::string(per) + "\"", hint};
  per = trim(per.substr(1));
  auto hours = hours_of_unit(per);
  if (!hours) return {std::nullopt, "unknown time unit \"/" + std::string(per) + "\"", hint};
  return {Rate{nu.number / *hours}, {}, {}};
}

Parsed<Duration> parse_duration(std::string_view text) {
  const std::string hint = "write a duration with its unit, for example " + std::string(kDurationForms);
  auto nu = split_number(text);
  if (nu.out_of_range) return {std::nullopt, "a number beyond the range of finite values", hint};
  if (!nu.ok) return {std::nullopt, "no number at the start", hint};
  if (!finite_non_negative(nu.number))
    return {std::nullopt, "a duration must be a finite number of zero or more", hint};
  if (nu.unit.empty()) return {std::nullopt, "the unit is missing", hint};
  auto hours = hours_of_unit(nu.unit);
  if (!hours) return {std::nullopt, "unknown unit \"" + std::string(nu.unit) + "\"", hint};
  return {Duration{nu.number * *hours}, {}, {}};
}

Parsed<double> parse_percent(std::string_view text) {
  const std::string hint = "write a fraction as 0.05 or as \"5%\"";
  auto nu = split_number(text);
  if (!nu.ok || nu.unit != "%") return {std::nullopt, "not a percentage", hint};
  if (!std::isfinite(nu.number)) return {std::nullopt, "not a finite number", hint};
  return {nu.number / 100.0, {}, {}};
}

std::string format_rate(Rate rate) {
  std::array<char, 32> buf{};
  std::snprintf(buf.data(), buf.size(), "%.2e/h", rate.per_hour);
  return buf.data();
}

std::string format_duration(Duration duration) {
  const double h = duration.hours;
  std::array<char, 32> buf{};
  auto whole = [](double v) { return std::fabs(v - std::round(v)) < 1e-9 * std::max(1.0, v); };
  if (h >= kHoursPerYear && whole(h / kHoursPerYear))
    std::snprintf(buf.data(), buf.size(), "%g yr", h / kHoursPerYear);
  else if (h >= kHoursPerMonth && whole(h / kHoursPerMonth))
    std::snprintf(buf.data(), buf.size(), "%g mo", h / kHoursPerMonth);
  else if (h >= kHoursPerYear)
    std::snprintf(buf.data(), buf.size(), "%.3g yr", h / kHoursPerYear);
  else
    std::snprintf(buf.data(), buf.size(), "%g h", h);
  return buf.data();
}

}  // namespace sifter
