#pragma once
// The one home of the tests' numeric comparisons: relative tolerances and the helper that
// applies them, so that every test reads "within 1e-9 relative" the same way.
#include <gtest/gtest.h>

#include <cmath>

namespace sifter::testing {

// Figures that pass through Rate (stored per hour) and products of decimal factors: compare
// relatively, to well above the rounding of either.
inline constexpr double kExactRelTol = 1e-9;

inline void expect_relative(double actual, double expected, double rel_tol = kExactRelTol) {
  EXPECT_NEAR(actual, expected, std::fabs(expected) * rel_tol) << "expected " << expected << ", got " << actual;
}

}  // namespace sifter::testing
