// Specification of quantities written with units in the project file.
#include "sifter/model/quantity.hpp"

#include <gtest/gtest.h>

namespace sifter {
namespace {

constexpr double kRelTol = 1e-12;

double rate(const char* text) { return parse_rate(text).value.value().per_hour; }
double hours(const char* text) { return parse_duration(text).value.value().hours; }

// 1 FIT = 1e-9 per hour (IEC 61508-4 3.6.? usage; common practice).
TEST(Quantity, FitIsOneFailurePerBillionHours) { EXPECT_NEAR(rate("250 FIT"), 2.5e-7, 2.5e-7 * kRelTol); }

TEST(Quantity, RatesPerHourYearMonthAndDayResolveToPerHour) {
  EXPECT_NEAR(rate("2.5e-7/h"), 2.5e-7, 2.5e-7 * kRelTol);
  EXPECT_NEAR(rate("0.02/yr"), 0.02 / 8760.0, 1e-20);
  EXPECT_NEAR(rate("1/mo"), 1.0 / 730.0, 1e-15);
  EXPECT_NEAR(rate("2 /d"), 2.0 / 24.0, 1e-15);
}

// The project file defines 1 yr = 8760 h and 1 mo = 730 h.
TEST(Quantity, DurationsUseTheFileConventionForYearsAndMonths) {
  EXPECT_DOUBLE_EQ(hours("8 h"), 8.0);
  EXPECT_DOUBLE_EQ(hours("3 d"), 72.0);
  EXPECT_DOUBLE_EQ(hours("6 mo"), 4380.0);
  EXPECT_DOUBLE_EQ(hours("2 yr"), 17520.0);
  EXPECT_DOUBLE_EQ(hours("30 min"), 0.5);
}

TEST(Quantity, PercentIsAFraction) { EXPECT_DOUBLE_EQ(parse_percent("5%").value.value(), 0.05); }

TEST(Quantity, MissingUnitIsRejectedWithTheAcceptedForms) {
  const auto r = parse_rate("2.5e-7");
  EXPECT_FALSE(r.value);
  EXPECT_EQ(r.problem, "the unit is missing");
  EXPECT_EQ(r.hint, "write a rate with its unit, for example \"2.5e-7/h\", \"250 FIT\" or \"0.02/yr\"");
  const auto d = parse_duration("12");
  EXPECT_FALSE(d.value);
  EXPECT_EQ(d.problem, "the unit is missing");
}

TEST(Quantity, UnknownUnitsAndNegativeOrInfiniteValuesAreRejected) {
  EXPECT_EQ(parse_rate("3/fortnight").problem, "unknown time unit \"/fortnight\"");
  EXPECT_EQ(parse_duration("8 hrz").problem, "unknown unit \"hrz\"");
  EXPECT_FALSE(parse_rate("-1/h").value);
  EXPECT_FALSE(parse_rate("1e400/h").value);
  EXPECT_FALSE(parse_duration("nan h").value);
}

TEST(Quantity, DurationsPrintInTheirNaturalUnit) {
  EXPECT_EQ(format_duration(Duration{8760.0}), "1 yr");
  EXPECT_EQ(format_duration(Duration{4380.0}), "6 mo");
  EXPECT_EQ(format_duration(Duration{8.0}), "8 h");
}

}  // namespace
}  // namespace sifter
