// Specification of the IEC 61508-6 Annex B simplified equations.
#include "sifter/simplified.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <string>

namespace sifter {
namespace {

// The printed cells of Table B.3 carry two significant digits.
constexpr double kTableDigits = 0.05;
// Hand-computed values are compared to machine precision, relatively.
constexpr double kExactRelTol = 1e-12;

constexpr double kOneYear = 8760.0;

// Table B.3 conventions (IEC 61508-6:2010 B.3.2.2): T1 = 1 yr, MTTR = MRT = 8 h, the channel's
// total failure rate lambda splits evenly into safe and dangerous (lD = lambda/2), beta_D = beta/2.
GroupData table_b3_group(const std::string& vote, double lambda, double beta, double dc) {
  GroupData g;
  g.vote.k = vote[0] - '0';
  g.vote.n = vote[3] - '0';
  const double ld = lambda / 2.0;
  g.channel.lambda_dd.per_hour = dc * ld;
  g.channel.lambda_du.per_hour = (1.0 - dc) * ld;
  g.beta = beta;
  g.beta_d = beta / 2.0;
  g.tests = {{1.0, Duration{kOneYear}}};
  g.mttr = Duration{8.0};
  g.mrt = Duration{8.0};
  return g;
}

void expect_relative(double actual, double expected, double rel_tol) {
  EXPECT_NEAR(actual, expected, std::fabs(expected) * rel_tol) << "expected " << expected;
}

struct TableB3Cell {
  const char* vote;
  double lambda_per_hour;
  double beta;
  double dc;
  double printed_pfd;
};

class TableB3 : public ::testing::TestWithParam<TableB3Cell> {};

// IEC 61508-6:2010 Table B.3 (T1 = 1 yr, MTTR = MRT = 8 h); cells from memory of the printed
// table, as collected in ../shared/REFERENCES.md §8.
TEST_P(TableB3, CellMatchesPrintedTwoDigits) {
  const auto& c = GetParam();
  const auto r = group_pfd_avg(table_b3_group(c.vote, c.lambda_per_hour, c.beta, c.dc));
  expect_relative(r.pfd_avg, c.printed_pfd, kTableDigits);
}

INSTANTIATE_TEST_SUITE_P(
    Iec61508Part6, TableB3,
    ::testing::Values(TableB3Cell{"1oo1", 1e-7, 0.0, 0.0, 2.2e-4}, TableB3Cell{"1oo1", 1e-7, 0.0, 0.6, 8.8e-5},
                      TableB3Cell{"1oo1", 1e-7, 0.0, 0.9, 2.2e-5}, TableB3Cell{"1oo1", 1e-7, 0.0, 0.99, 2.6e-6},
                      TableB3Cell{"1oo1", 1e-6, 0.0, 0.0, 2.2e-3}, TableB3Cell{"1oo1", 1e-6, 0.0, 0.6, 8.8e-4},
                      TableB3Cell{"1oo1", 1e-6, 0.0, 0.9, 2.2e-4}, TableB3Cell{"1oo1", 1e-6, 0.0, 0.99, 2.6e-5},
                      TableB3Cell{"1oo2", 1e-7, 0.02, 0.0, 4.4e-6}, TableB3Cell{"1oo2", 1e-7, 0.02, 0.6, 1.8e-6},
                      TableB3Cell{"1oo2", 1e-7, 0.02, 0.9, 4.4e-7}, TableB3Cell{"1oo2", 1e-7, 0.02, 0.99, 4.8e-8},
                      TableB3Cell{"1oo2", 1e-7, 0.10, 0.0, 2.2e-5}, TableB3Cell{"1oo2", 1e-7, 0.10, 0.6, 8.8e-6},
                      TableB3Cell{"1oo2", 1e-7, 0.10, 0.9, 2.2e-6}, TableB3Cell{"1oo2", 1e-7, 0.10, 0.99, 2.4e-7},
                      TableB3Cell{"2oo3", 1e-7, 0.02, 0.0, 4.6e-6}, TableB3Cell{"2oo3", 1e-7, 0.02, 0.6, 1.8e-6},
                      TableB3Cell{"2oo3", 1e-7, 0.02, 0.9, 4.4e-7}, TableB3Cell{"2oo3", 1e-7, 0.02, 0.99, 4.8e-8}));

}  // namespace
}  // namespace sifter
