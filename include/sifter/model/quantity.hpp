#pragma once
/// Physical quantities with their units resolved: rates per hour, durations in hours.
#include <optional>
#include <string>
#include <string_view>

namespace sifter {

/// Hours in one year and one month, as the project file defines them (1 yr = 8760 h, 1 mo = 730 h).
inline constexpr double kHoursPerYear = 8760.0;
inline constexpr double kHoursPerMonth = 730.0;
/// Seconds in one hour, for response times and process safety times stated in seconds.
inline constexpr double kSecondsPerHour = 3600.0;
/// One FIT is one failure in 1e9 device-hours.
inline constexpr double kPerHourPerFit = 1e-9;

/// A failure or event rate, always stored per hour.
struct Rate {
  double per_hour = 0.0;
  /// The same rate per year (8760 h).
  [[nodiscard]] double per_year() const { return per_hour * kHoursPerYear; }
  static Rate from_per_year(double per_year) { return Rate{per_year / kHoursPerYear}; }
};

/// A length of time, always stored in hours.
struct Duration {
  double hours = 0.0;
  [[nodiscard]] double years() const { return hours / kHoursPerYear; }
};

/// The outcome of parsing a quantity: the value, or what went wrong and how to write it.
template <typename T>
struct Parsed {
  std::optional<T> value;
  std::string problem;  ///< what was wrong, empty on success
  std::string hint;     ///< the accepted forms
};

/// Parses "2.5e-7/h", "250 FIT", "0.02/yr", "3/mo", "1e-4 /d" into a rate per hour.
Parsed<Rate> parse_rate(std::string_view text);

/// Parses "8 h", "30 min", "3 d", "2 wk", "6 mo", "2 yr" into hours.
Parsed<Duration> parse_duration(std::string_view text);

/// Parses "5%" (or "5 %") into 0.05; plain numbers are handled by the loader.
Parsed<double> parse_percent(std::string_view text);

/// The accepted forms of a rate, for hints.
inline constexpr std::string_view kRateForms = "\"2.5e-7/h\", \"250 FIT\" or \"0.02/yr\"";
/// The accepted forms of a duration, for hints.
inline constexpr std::string_view kDurationForms = "\"45 s\", \"8 h\", \"30 min\", \"3 d\", \"6 mo\" or \"2 yr\"";

/// Formats a rate per hour for people, e.g. "2.50e-07/h".
std::string format_rate(Rate rate);
/// Formats a duration for people in the most natural unit, e.g. "8 h", "2 yr", "18 mo".
std::string format_duration(Duration duration);

}  // namespace sifter
