// Civil-date arithmetic on the proleptic Gregorian calendar.
#include "sifter/model/civil_date.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "sifter/model/quantity.hpp"

namespace sifter {

bool is_leap_year(int year) { return (year % 4 == 0 && year % 100 != 0) || year % 400 == 0; }

int days_in_month(int year, int month) {
  static constexpr int kDays[12] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
  if (month == 2 && is_leap_year(year)) return 29;
  return kDays[(month - 1) % 12];
}

// Days from civil: the year is counted from March, so that the leap day ends the year, and
// split into 400-year eras of 146097 days; the day of the March-based year follows from
// the month by (153 m + 2) / 5 (common practice; the standard derivation of the Gregorian
// day count, written here from memory and checked in tests against known dates).
std::int64_t days_from_civil(CivilDate date) {
  const std::int64_t y = date.year - (date.month <= 2 ? 1 : 0);
  const std::int64_t era = (y >= 0 ? y : y - 399) / 400;
  const std::int64_t year_of_era = y - era * 400;                           // 0..399
  const std::int64_t m = date.month > 2 ? date.month - 3 : date.month + 9;  // March = 0
  const std::int64_t day_of_year = (153 * m + 2) / 5 + date.day - 1;        // 0..365
  const std::int64_t day_of_era = year_of_era * 365 + year_of_era / 4 - year_of_era / 100 + day_of_year;
  return era * 146097 + day_of_era - 719468;  // 719468 days from 0000-03-01 to 1970-01-01
}

CivilDate civil_from_days(std::int64_t days) {
  const std::int64_t z = days + 719468;
  const std::int64_t era = (z >= 0 ? z : z - 146096) / 146097;
  const std::int64_t day_of_era = z - era * 146097;  // 0..146096
  const std::int64_t year_of_era = (day_of_era - day_of_era / 1460 + day_of_era / 36524 - day_of_era / 146096) / 365;
  const std::int64_t day_of_year = day_of_era - (365 * year_of_era + year_of_era / 4 - year_of_era / 100);
  const std::int64_t mp = (5 * day_of_year + 2) / 153;  // March = 0
  CivilDate out;
  out.day = static_cast<int>(day_of_year - (153 * mp + 2) / 5 + 1);
  out.month = static_cast<int>(mp < 10 ? mp + 3 : mp - 9);
  out.year = static_cast<int>(year_of_era + era * 400 + (out.month <= 2 ? 1 : 0));
  return out;
}

std::optional<CivilDate> parse_iso_date(std::string_view text) {
  if (text.size() != 10 || text[4] != '-' || text[7] != '-') return std::nullopt;
  auto digits = [&](std::size_t from, std::size_t count) -> std::optional<int> {
    int v = 0;
    for (std::size_t i = from; i < from + count; ++i) {
      if (text[i] < '0' || text[i] > '9') return std::nullopt;
      v = v * 10 + (text[i] - '0');
    }
    return v;
  };
  const auto y = digits(0, 4), m = digits(5, 2), d = digits(8, 2);
  if (!y || !m || !d) return std::nullopt;
  if (*y < 1900 || *y > 2999 || *m < 1 || *m > 12 || *d < 1 || *d > days_in_month(*y, *m)) return std::nullopt;
  return CivilDate{*y, *m, *d};
}

std::string to_iso(CivilDate date) {
  char buf[16];
  std::snprintf(buf, sizeof buf, "%04d-%02d-%02d", date.year, date.month, date.day);
  return buf;
}

std::string to_basic_iso(CivilDate date) {
  char buf[16];
  std::snprintf(buf, sizeof buf, "%04d%02d%02d", date.year, date.month, date.day);
  return buf;
}

std::int64_t days_between(CivilDate from, CivilDate to) { return days_from_civil(to) - days_from_civil(from); }

CivilDate add_days(CivilDate date, std::int64_t days) { return civil_from_days(days_from_civil(date) + days); }

CivilDate add_months(CivilDate date, int months) {
  const int index = date.year * 12 + (date.month - 1) + months;
  CivilDate out;
  out.year = index / 12;
  out.month = index % 12 + 1;
  out.day = std::min(date.day, days_in_month(out.year, out.month));
  return out;
}

CivilDate add_interval(CivilDate date, double hours) {
  const double months = hours / kHoursPerMonth;
  if (months >= 1.0 && months < 12000.0 && months == std::floor(months))
    return add_months(date, static_cast<int>(months));
  return add_days(date, static_cast<std::int64_t>(std::floor(hours / 24.0)));
}

}  // namespace sifter
