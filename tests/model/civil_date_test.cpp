// Civil dates: day counts, leap years, month ends and the proof-test due dates built on them.
#include "sifter/model/civil_date.hpp"

#include <gtest/gtest.h>

namespace sifter {
namespace {

CivilDate date(const char* text) { return parse_iso_date(text).value(); }

// Day counts since 1970-01-01 computed with Python's datetime.date (an independent calendar).
TEST(CivilDate, DayCountsMatchAnIndependentCalendar) {
  EXPECT_EQ(days_from_civil(date("1970-01-01")), 0);
  EXPECT_EQ(days_from_civil(date("2000-03-01")), 11017);
  EXPECT_EQ(days_from_civil(date("2024-02-29")), 19782);
  EXPECT_EQ(days_from_civil(date("1900-01-01")), -25567);
  EXPECT_EQ(days_from_civil(date("2999-12-31")), 376199);
  EXPECT_EQ(days_from_civil(date("2100-03-01")), 47541);
}

TEST(CivilDate, EveryDayFrom1900To2999FollowsTheDayBefore) {
  CivilDate previous = date("1900-01-01");
  for (std::int64_t d = days_from_civil(previous) + 1; d <= days_from_civil(date("2999-12-31")); ++d) {
    const CivilDate next = civil_from_days(d);
    ASSERT_EQ(days_from_civil(next), d);
    const bool same_month = next.year == previous.year && next.month == previous.month && next.day == previous.day + 1;
    const bool new_month = next.day == 1 && previous.day == days_in_month(previous.year, previous.month) &&
                           ((next.year == previous.year && next.month == previous.month + 1) ||
                            (next.year == previous.year + 1 && next.month == 1 && previous.month == 12));
    ASSERT_TRUE(same_month || new_month) << to_iso(previous) << " then " << to_iso(next);
    previous = next;
  }
}

// Gregorian rule (common practice): centuries are leap years only when divisible by 400.
TEST(CivilDate, LeapYearsFollowTheGregorianRule) {
  EXPECT_FALSE(is_leap_year(1900));
  EXPECT_TRUE(is_leap_year(2000));
  EXPECT_TRUE(is_leap_year(2024));
  EXPECT_FALSE(is_leap_year(2023));
  EXPECT_FALSE(is_leap_year(2100));
  EXPECT_EQ(days_between(date("2024-01-01"), date("2025-01-01")), 366);
  EXPECT_EQ(days_between(date("2023-01-01"), date("2024-01-01")), 365);
}

TEST(CivilDate, OnlyRealCalendarDaysInTheIsoFormParse) {
  EXPECT_TRUE(parse_iso_date("2024-02-29"));
  EXPECT_FALSE(parse_iso_date("2023-02-29"));
  EXPECT_FALSE(parse_iso_date("2100-02-29"));
  EXPECT_FALSE(parse_iso_date("2024-04-31"));
  EXPECT_FALSE(parse_iso_date("2024-13-01"));
  EXPECT_FALSE(parse_iso_date("2024-1-01"));
  EXPECT_FALSE(parse_iso_date("2024/01/01"));
  EXPECT_FALSE(parse_iso_date("1899-12-31"));
  EXPECT_FALSE(parse_iso_date("2024-01-01T00:00"));
  EXPECT_EQ(to_iso(date("2024-02-29")), "2024-02-29");
  EXPECT_EQ(to_basic_iso(date("2024-02-29")), "20240229");
}

TEST(CivilDate, AddingMonthsKeepsTheDayOrTakesTheMonthsLastDay) {
  EXPECT_EQ(add_months(date("2024-01-31"), 1), date("2024-02-29"));
  EXPECT_EQ(add_months(date("2023-01-31"), 1), date("2023-02-28"));
  EXPECT_EQ(add_months(date("2024-02-29"), 12), date("2025-02-28"));
  EXPECT_EQ(add_months(date("2023-12-15"), 1), date("2024-01-15"));
  EXPECT_EQ(add_months(date("2024-08-31"), 6), date("2025-02-28"));
  EXPECT_EQ(add_months(date("2024-03-31"), -1), date("2024-02-29"));
}

// Intervals in the project's units: 1 yr = 8760 h = 12 months, 6 mo = 4380 h; others in days.
TEST(CivilDate, DueDatesCrossMonthEndsAndLeapYears) {
  EXPECT_EQ(add_interval(date("2024-02-29"), 8760.0), date("2025-02-28"));
  EXPECT_EQ(add_interval(date("2023-03-01"), 8760.0), date("2024-03-01"));
  EXPECT_EQ(add_interval(date("2024-08-31"), 4380.0), date("2025-02-28"));
  EXPECT_EQ(add_interval(date("2022-10-05"), 2.0 * 8760.0), date("2024-10-05"));
  // 2000 h is 83 whole days (rounded down): 2024-02-01 + 83 d = 2024-04-24 (Python's datetime).
  EXPECT_EQ(add_interval(date("2024-02-01"), 2000.0), date("2024-04-24"));
  EXPECT_EQ(add_interval(date("2023-12-31"), 24.0), date("2024-01-01"));
}

}  // namespace
}  // namespace sifter
