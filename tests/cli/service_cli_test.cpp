// `sifter service` as a user runs it: outputs, exit statuses, and nothing written on bad input.
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include "support/cli_support.hpp"

namespace sifter {
namespace {

using testing::fresh_folder;
using testing::run_sifter;
using testing::slurp;

const std::string kExample = "examples/unit40.json examples/records/unit40.json --as-of 2025-06-30";

TEST(ServiceCli, TheExampleShowsTheFailingModelTheOverdueTestAndTheChangedVerdict) {
  const auto r = run_sifter("service " + kExample);
  EXPECT_EQ(r.exit_code, 1) << r.err;
  EXPECT_NE(r.out.find("solenoid-valve-3way"), std::string::npos);
  EXPECT_NE(r.out.find("OVERDUE"), std::string::npos);
  EXPECT_NE(r.out.find("yes, was meets"), std::string::npos);
  EXPECT_NE(r.out.find("calculation aid"), std::string::npos);
  for (std::size_t start = 0, end; (end = r.out.find('\n', start)) != std::string::npos; start = end + 1)
    EXPECT_LE(end - start, 80u) << r.out.substr(start, end - start);
}

TEST(ServiceCli, WritesJsonCsvAndICalendarTogether) {
  const auto dir = fresh_folder("service_outputs");
  const auto r = run_sifter("service " + kExample + " --json " + (dir / "s.json").string() + " --csv " +
                            (dir / "s.csv").string() + " --ics " + (dir / "s.ics").string());
  EXPECT_EQ(r.exit_code, 1) << r.err;
  const auto j = nlohmann::json::parse(slurp(dir / "s.json"));
  EXPECT_EQ(j["format"], "sifter-service/1");
  EXPECT_EQ(j["as_of"], "2025-06-30");
  const std::string csv = slurp(dir / "s.csv");
  EXPECT_EQ(csv.substr(0, csv.find("\r\n")),
            "model,devices,failures,service_hours,observed_rate_per_h,ci90_low_per_h,ci90_high_per_h,"
            "posterior_mean_per_h,posterior_upper90_per_h,design_rate_per_h,exceeds_design_at_70,exceeds_design_at_90,"
            "posterior_upper90_below_mean");
  EXPECT_EQ(slurp(dir / "s.ics").substr(0, 17), "BEGIN:VCALENDAR\r\n");
}

TEST(ServiceCli, BadRecordsWriteNothingAndExitWithTwo) {
  const auto dir = fresh_folder("service_bad");
  const auto r = run_sifter(
      "service examples/unit40.json tests/data/bad_records/unknown_component.json --as-of "
      "2025-06-30 --json " +
      (dir / "s.json").string() + " --ics " + (dir / "s.ics").string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("/events/0/component: expected a component of the project, found \"LT-401X\""),
            std::string::npos)
      << r.err;
  EXPECT_FALSE(std::filesystem::exists(dir / "s.json"));
  EXPECT_FALSE(std::filesystem::exists(dir / "s.ics"));
}

TEST(ServiceCli, AnAsOfDateThatIsNoCalendarDayIsAUsageError) {
  const auto r = run_sifter("service examples/unit40.json examples/records/unit40.json --as-of 2025-02-29");
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_EQ(r.err, "sifter: --as-of: expected a date written YYYY-MM-DD (ISO 8601), found \"2025-02-29\"\n");
}

TEST(ServiceCli, RecordsBeforeTheirReviewDateAreRefused) {
  const auto r = run_sifter("service examples/unit40.json examples/records/unit40.json --as-of 2024-01-01");
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("expected a date on or before the as-of date 2024-01-01"), std::string::npos);
}

TEST(ServiceCli, TheReportGainsAServiceSectionWithRecords) {
  const auto dir = fresh_folder("service_report");
  const auto r = run_sifter("report examples/unit40.json -o " + (dir / "r.html").string() +
                            " --records examples/records/unit40.json --as-of 2025-06-30");
  EXPECT_EQ(r.exit_code, 0) << r.err;
  const std::string html = slurp(dir / "r.html");
  EXPECT_NE(html.find("<section class=\"service\" id=\"service\">"), std::string::npos);
  EXPECT_NE(html.find("solenoid-valve-3way"), std::string::npos);
  EXPECT_NE(html.find("overdue"), std::string::npos);
}

}  // namespace
}  // namespace sifter
