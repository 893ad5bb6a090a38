// Specification of the writers' last line of defence: no NaN or infinity ever reaches an output.
#include <gtest/gtest.h>

#include <limits>
#include <sstream>

#include "sifter/model/format.hpp"
#include "sifter/model/pressure_units.hpp"
#include "sifter/model/quantity.hpp"
#include "sifter/report/json_results.hpp"
#include "sifter/report/terminal.hpp"
#include "sifter/report/worksheet.hpp"
#include "sifter/results/sif.hpp"

namespace sifter {
namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();
constexpr double kInf = std::numeric_limits<double>::infinity();

// An internal error (exit 3): a defect reached a writer, which refuses to print it.
template <typename Fn>
bool refused_as_internal(Fn fn) {
  try {
    fn();
  } catch (const Error& e) {
    return e.exit_code() == ExitCode::kInternal;
  }
  return false;
}

ProjectResult one_sif() {
  ProjectResult r;
  r.title = "writer test";
  SifResult s;
  s.id = "S1";
  s.pfd_avg = 1e-3;
  s.rrf = 1000.0;
  s.sil_probability = 2;
  SubsystemResult sub;
  sub.name = "valve";
  sub.vote = "1oo1";
  sub.pfd_avg = 1e-3;
  sub.share = 1.0;
  s.subsystems.push_back(sub);
  r.sifs.push_back(s);
  return r;
}

ProjectResult one_scenario() {
  ProjectResult r = one_sif();
  ScenarioResult sc;
  sc.id = "L1";
  sc.target_frequency_per_yr = 1e-5;
  sc.frequency_without_sif_per_yr = 1e-2;
  sc.required_pfd = 1e-3;
  sc.required_rrf = 1000.0;
  CauseResult c;
  c.id = "C1";
  c.frequency_per_yr = 0.1;
  c.frequency_without_sif_per_yr = 1e-2;
  sc.causes.push_back(c);
  WorksheetRow row;
  row.step = WorksheetStep::kCause;
  row.item = "C1";
  row.value = 0.1;
  row.frequency_per_yr = 0.1;
  sc.worksheet.push_back(row);
  r.scenarios.push_back(sc);
  return r;
}

TEST(WriterFormat, FiniteNumbersPassAndNonFiniteOnesAreRefused) {
  EXPECT_EQ(sifter::checked(0.5, "x"), 0.5);
  EXPECT_EQ(sifter::sci(4.1e-5), "4.10e-05");
  for (double bad : {kNaN, kInf, -kInf}) {
    EXPECT_TRUE(refused_as_internal([&] { sifter::checked(bad, "x"); }));
    EXPECT_TRUE(refused_as_internal([&] { sifter::sci(bad); }));
    EXPECT_TRUE(refused_as_internal([&] { sifter::plain(bad); }));
    EXPECT_TRUE(refused_as_internal([&] { sifter::percent(bad); }));
  }
}

TEST(WriterFormat, TheTestResultsArePrintableAsTheyAre) {
  // The fixtures themselves are fine: each refusal below comes from the one value made non-finite.
  EXPECT_NO_THROW(report::results_json(one_scenario()));
  EXPECT_NO_THROW(report::render_terminal(one_scenario()));
  EXPECT_NO_THROW(report::worksheet_csv(one_scenario()));
}

TEST(WriterFormat, TheJsonWriterRefusesANonFinitePfd) {
  ProjectResult r = one_sif();
  r.sifs[0].pfd_avg = kNaN;
  EXPECT_TRUE(refused_as_internal([&] { report::results_json(r); }));
  std::ostringstream out;
  EXPECT_TRUE(refused_as_internal([&] { report::write_results_json(r, out); }));
}

TEST(WriterFormat, TheJsonWriterRefusesAFieldNotCheckedOneByOne) {
  // beta_effective is written without its own check; the walk over the whole tree catches it,
  // where a JSON dump would silently print null.
  ProjectResult r = one_sif();
  r.sifs[0].subsystems[0].beta_effective = kInf;
  EXPECT_TRUE(refused_as_internal([&] { report::sif_json(r.sifs[0]); }));
  EXPECT_TRUE(refused_as_internal([&] { report::results_json(r); }));
}

TEST(WriterFormat, TheJsonWriterRefusesANonFiniteScenarioFrequency) {
  ProjectResult r = one_scenario();
  r.scenarios[0].causes[0].frequency_per_yr = kInf;
  EXPECT_TRUE(refused_as_internal([&] { report::results_json(r); }));
}

TEST(WriterFormat, TheTerminalWriterRefusesANonFinitePfd) {
  ProjectResult r = one_sif();
  r.sifs[0].subsystems[0].pfd_avg = kNaN;
  EXPECT_TRUE(refused_as_internal([&] { report::render_terminal(r); }));
  r = one_sif();
  r.sifs[0].rrf = kInf;
  EXPECT_TRUE(refused_as_internal([&] { report::render_terminal(r); }));
}

TEST(WriterFormat, TheWorksheetRefusesANonFiniteFrequency) {
  ProjectResult r = one_scenario();
  r.scenarios[0].worksheet[0].frequency_per_yr = kNaN;
  EXPECT_TRUE(refused_as_internal([&] { report::worksheet_csv(r); }));
}

}  // namespace
}  // namespace sifter

namespace sifter {
namespace {

// One formatter per kind of quantity (include/sifter/report/format.hpp): the helpers that
// other rooms kept (the rate of a component, a pressure) give the very text of the one
// formatter, so one figure never reads differently in two places.
TEST(ReportFormat, EveryKindOfQuantityHasOneFormatter) {
  EXPECT_EQ(sifter::probability(4.1e-5), "4.10e-05");
  EXPECT_EQ(sifter::per_year(1e-4), "1.00e-04/yr");
  EXPECT_EQ(sifter::per_hour(2.5e-7), "2.50e-07/h");
  EXPECT_EQ(sifter::rrf(833.3), "833.3");
  EXPECT_EQ(sifter::ratio(1.0035001), "1.004");
  EXPECT_EQ(sifter::percent(0.034), "3.4%");
  EXPECT_EQ(sifter::figure(0.513449), "0.5134");
  EXPECT_EQ(format_pressure(12.5), "12.50 barg");
  EXPECT_EQ(format_duration(Duration{6 * kHoursPerMonth}), "6 mo");
  for (double v : {2.5e-7, 1e-30, 3.3e5}) EXPECT_EQ(format_rate(Rate{v}), sifter::per_hour(v));
}

TEST(ReportFormat, TheKindFormattersRefuseNonFiniteNumbers) {
  for (double bad : {std::numeric_limits<double>::quiet_NaN(), std::numeric_limits<double>::infinity()}) {
    EXPECT_THROW(sifter::ratio(bad), Error);
    EXPECT_THROW(sifter::figure(bad), Error);
    EXPECT_THROW(sifter::per_hour(bad), Error);
    EXPECT_THROW(sifter::per_year(bad), Error);
  }
}

}  // namespace
}  // namespace sifter
