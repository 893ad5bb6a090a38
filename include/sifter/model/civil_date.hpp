#pragma once
/// Calendar dates of the proleptic Gregorian calendar (ISO 8601 "YYYY-MM-DD") and the small
/// arithmetic the service records need: days between dates, adding days and months.
#include <cstdint>
#include <optional>
#include <string>
#include <string_view>

namespace sifter {

/// A calendar date; valid dates only once made by parse_iso_date or from_days.
struct CivilDate {
  int year = 1970;
  int month = 1;  ///< 1..12
  int day = 1;    ///< 1..days_in_month(year, month)

  friend bool operator==(const CivilDate&, const CivilDate&) = default;
  friend auto operator<=>(const CivilDate&, const CivilDate&) = default;
};

/// Gregorian leap year: divisible by 4, except centuries not divisible by 400.
bool is_leap_year(int year);
/// 28..31.
int days_in_month(int year, int month);

/// Days since 1970-01-01 (negative before it); exact for every Gregorian date.
std::int64_t days_from_civil(CivilDate date);
/// The date `days` after 1970-01-01; the inverse of days_from_civil.
CivilDate civil_from_days(std::int64_t days);

/// Reads exactly "YYYY-MM-DD" (years 1900..2999, a real day of that month); empty otherwise.
std::optional<CivilDate> parse_iso_date(std::string_view text);
/// "2024-02-29".
std::string to_iso(CivilDate date);
/// "20240229", the basic form iCalendar uses.
std::string to_basic_iso(CivilDate date);

/// Whole days from `from` to `to` (negative when `to` is earlier).
std::int64_t days_between(CivilDate from, CivilDate to);
/// The date `days` later.
CivilDate add_days(CivilDate date, std::int64_t days);
/// The same day `months` later; a day the target month lacks becomes its last day
/// (2024-01-31 + 1 month = 2024-02-29).
CivilDate add_months(CivilDate date, int months);

/// When a test done on `date` is next due after an interval of `hours`: a whole number of
/// months (730 h each, as the project file counts them) is added as calendar months, any other
/// interval as its whole days, rounded down so that the due date is never late.
CivilDate add_interval(CivilDate date, double hours);

}  // namespace sifter
