// The plant in service: pooled rates, re-verification as check does it, counts and schedule.
#include "sifter/analysis/service.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>
#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>

#include "sifter/engines/lopa.hpp"
#include "sifter/model/format.hpp"
#include "sifter/report/service.hpp"
#include "sifter/report/text_table.hpp"

namespace sifter {
namespace {

constexpr double kExactRelTol = 1e-12;
const CivilDate kAsOf{2025, 6, 30};
// 2018-07-01 to 2025-06-30: seven years with the leap days of 2020 and 2024, less one day.
constexpr double kDaysInService = 7 * 365 + 2 - 1;

struct Example {
  LoadedProject loaded;
  ServiceRecords records;
  ServiceResult result;
};

const Example& example() {
  static const Example e = [] {
    Example x;
    x.loaded = load_project_file(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json");
    x.records =
        load_records_file(std::string(SIFTER_SOURCE_DIR) + "/examples/records/unit40.json", x.loaded.project, kAsOf);
    x.result = assess_service(x.loaded, x.records, ServiceOptions{});
    return x;
  }();
  return e;
}

const ModelService& model(const std::string& name) {
  for (const auto& m : example().result.models)
    if (m.model == name) return m;
  throw std::runtime_error("no model " + name);
}

const SifService& sif(const std::string& id) {
  for (const auto& s : example().result.sifs)
    if (s.id == id) return s;
  throw std::runtime_error("no SIF " + id);
}

const ScheduleRow& row(const std::string& component) {
  for (const auto& r : example().result.schedule)
    if (r.component == component) return r;
  throw std::runtime_error("no row " + component);
}

TEST(Service, TheSolenoidModelPoolsItsThreeDevicesAndExceedsItsDesignRate) {
  const ModelService& m = model("solenoid-valve-3way");
  EXPECT_EQ(m.devices, (std::vector<std::string>{"SOV-401", "SOV-402A", "SOV-402B"}));
  EXPECT_EQ(m.estimate.failures, 4);  // the example's four pilot valves stuck at proof tests
  EXPECT_DOUBLE_EQ(m.estimate.service_hours, 3 * 24 * kDaysInService);
  // Design: SOV-401 states 3.0e-7/h, the model 250 FIT; equal service times weight them equally.
  EXPECT_NEAR(m.estimate.design_per_hour, (3.0e-7 + 2 * 2.5e-7) / 3, 1e-20);
  EXPECT_TRUE(m.estimate.exceeds_design_at_70);
  EXPECT_TRUE(m.estimate.exceeds_design_at_90);
  const double a = m.estimate.design_per_hour * kDefaultPriorHours, b = kDefaultPriorHours;
  EXPECT_NEAR(m.estimate.posterior_mean_per_hour, (a + 4) / (b + m.estimate.service_hours),
              kExactRelTol * m.estimate.posterior_mean_per_hour);
}

TEST(Service, AModelWithoutFailuresStaysBelowItsDesignRate) {
  const ModelService& m = model("level-transmitter-radar");
  EXPECT_EQ(m.estimate.failures, 0);
  EXPECT_FALSE(m.estimate.exceeds_design_at_70);
  EXPECT_FALSE(m.estimate.ci90_low_per_hour);
  EXPECT_LT(m.estimate.posterior_mean_per_hour, m.estimate.design_per_hour);
}

TEST(Service, Sif401MeetsItsTargetOnDesignRatesAndFallsShortWithTheServiceRates) {
  const SifService& s = sif("SIF-401");
  EXPECT_EQ(s.meets_design, true);
  EXPECT_EQ(s.meets_judged, false);
  EXPECT_TRUE(s.verdict_changed);
  ASSERT_TRUE(s.restore);
  ASSERT_EQ(s.restore->outcome, IntervalOutcome::kFound);
  EXPECT_LT(s.restore->longest.hours, 4380.0);  // shorter than the outlet valves' six months
  EXPECT_GT(*s.measure_judged, *s.measure_design);
}

// The re-verification must be `check` itself: the example project with every component's
// lambda_DU written in by hand (as a person would edit the file) gives the same figures.
TEST(Service, ReverificationEqualsCheckOnTheProjectEditedByHandWithThePosteriorRates) {
  const Example& x = example();
  std::ifstream in(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json");
  nlohmann::json doc = nlohmann::json::parse(in);
  auto rate = [](double per_hour) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.17g/h", per_hour);
    return std::string(buf);
  };
  for (auto& c : doc["components"]) {
    const std::string id = c["id"];
    std::size_t i = 0;
    while (x.loaded.project.components[i].id != id) ++i;
    const FailureRates& design = x.loaded.project.components[i].rates;
    for (const char* total : {"lambda_d", "dc", "lambda_s"}) c.erase(total);
    c["lambda_du"] = rate(x.result.components[i].lambda_du_judged);
    c["lambda_dd"] = rate(design.lambda_dd.per_hour);
    c["lambda_su"] = rate(design.lambda_su.per_hour);
    c["lambda_sd"] = rate(design.lambda_sd.per_hour);
  }
  const LoadedProject edited =
      load_project_text(doc.dump(2), "edited.json", std::string(SIFTER_SOURCE_DIR) + "/examples");
  const ProjectResult checked = verify_project(edited);
  ASSERT_EQ(checked.sifs.size(), x.result.sifs.size());
  for (std::size_t i = 0; i < checked.sifs.size(); ++i) {
    const SifResult& c = checked.sifs[i];
    const SifService& s = x.result.sifs[i];
    const double measure = c.demand_mode == DemandMode::kLow ? *c.pfd_avg : *c.pfh_per_hour;
    EXPECT_NEAR(*s.measure_judged, measure, 1e-12 * measure) << s.id;
    EXPECT_EQ(s.meets_judged, c.meets_target) << s.id;
  }
}

TEST(Service, TheSkippedTestOfPt402bIsOverdueAndMarksItsSif) {
  const ScheduleRow& r = row("PT-402B");
  EXPECT_EQ(r.last_test, (CivilDate{2023, 9, 20}));
  EXPECT_DOUBLE_EQ(r.interval_hours, 8760.0);
  EXPECT_EQ(r.next_due, (CivilDate{2024, 9, 20}));
  EXPECT_TRUE(r.overdue);
  EXPECT_TRUE(sif("SIF-402").any_overdue);
  EXPECT_EQ(sif("SIF-402").earliest_due, (CivilDate{2024, 9, 20}));
  EXPECT_EQ(sif("SIF-402").earliest_due_component, "PT-402B");
}

// The service section of the report draws its tables as every HTML table is drawn
// (report::html_table): the overdue test of PT-402B in a cell marked bad, the rates in
// right-aligned cells, every text escaped (common practice of the report's style).
TEST(Service, TheReportsServiceTablesAreDrawnAsEveryTableWithTheOverdueTestMarkedBad) {
  const std::string html = report::service_html(example().result);
  EXPECT_NE(html.find("<tr><td>PT-402B</td><td>2023-09-20</td><td>1 yr</td><td class=\"bad\">2024-09-20</td>"
                      "<td class=\"bad\">overdue</td></tr>"),
            std::string::npos)
      << html;
  EXPECT_NE(html.find("<th class=\"num\">posterior mean</th>"), std::string::npos);
  EXPECT_EQ(html.find("<td class=\"key"), std::string::npos);  // no column kept on one line here
  for (std::size_t at = html.find("<table>"); at != std::string::npos; at = html.find("<table>", at + 1))
    EXPECT_EQ(html.substr(at, html.find("</table>", at) - at).find('!'), std::string::npos)
        << "the mark of a bad cell never shows";
}

TEST(Service, ASixMonthTestInJanuaryIsDueInJuly) {
  const ScheduleRow& r = row("SOV-401");
  EXPECT_EQ(r.last_test, (CivilDate{2025, 1, 15}));
  EXPECT_EQ(r.next_due, (CivilDate{2025, 7, 15}));
  EXPECT_FALSE(r.overdue);
}

TEST(Service, LogicSolverSharedByTwoSifsIsScheduledOnceForBoth) {
  const ScheduleRow& r = row("LS-40");
  EXPECT_EQ(r.sifs, (std::vector<std::string>{"SIF-401", "SIF-403"}));
}

// The expected count is the LOPA's demand rate on the SIF (as check reports it) times the
// years since the first of its devices went into service.
TEST(Service, DemandsOnSif401AreComparedWithTheLopasDemandRate) {
  const SifService& s = sif("SIF-401");
  EXPECT_EQ(s.demands.observed, 2);  // two dates; five devices saw each
  const Project& project = example().loaded.project;
  double rate = 0.0;
  for (const auto& req : sif_requirements(evaluate_scenarios(project, lopa_context_from_project(project))))
    if (req.sif == "SIF-401") rate = req.demand_rate_per_yr;
  const double m = rate * 24.0 * kDaysInService / 8760.0;
  ASSERT_TRUE(s.demands.expected);
  EXPECT_NEAR(*s.demands.expected, m, 1e-12 * m);
  // P(N >= 2 | m) = 1 - e^-m (1 + m), by hand.
  EXPECT_NEAR(*s.demands.probability_at_least, 1.0 - std::exp(-m) * (1.0 + m), 1e-12);
  EXPECT_EQ(s.demands.flagged, *s.demands.probability_at_least < 0.05);
}

TEST(Service, SpuriousTripsAreComparedWithThePredictedRate) {
  const SifService& s = sif("SIF-403");
  EXPECT_EQ(s.spurious_trips.observed, 2);
  ASSERT_TRUE(s.spurious_trips.expected);
  EXPECT_GT(*s.spurious_trips.expected, 0.0);
}

TEST(Service, JsonCarriesTheContractsKeys) {
  const nlohmann::json j = report::service_json(example().result);
  EXPECT_EQ(j["format"], "sifter-service/1");
  for (const char* k : {"model", "devices", "failures", "service_hours", "observed_rate_per_h", "ci90_low_per_h",
                        "ci90_high_per_h", "posterior_mean_per_h", "posterior_upper90_per_h", "design_rate_per_h",
                        "exceeds_design_at_70", "exceeds_design_at_90", "posterior_upper90_below_mean"})
    EXPECT_TRUE(j["models"][0].contains(k)) << k;
  for (const char* k : {"id", "pfd_avg_judged", "meets_target", "verdict_changed", "demands", "expected_demands",
                        "spurious_trips", "expected_spurious_trips"})
    EXPECT_TRUE(j["sifs"][0].contains(k)) << k;
  for (const char* k : {"component", "last_test", "interval_h", "next_due", "overdue"})
    EXPECT_TRUE(j["schedule"][0].contains(k)) << k;
}

// A model with a very low design rate and no failures has a posterior of tiny shape, whose
// upper 90 % lies below its mean: right (Boost.Math's quantile, tests/engines), and read by a
// reviewer as an error, so every writer marks it and says why (the text within 80 columns).
// In the example, LS-40 and the interposing relay (2e-8/h, no failure) weigh 0.02 failures.
TEST(Service, AnUpperBoundBelowThePosteriorMeanIsMarkedAndExplainedInEveryWriter) {
  const ServiceResult& r = example().result;
  const std::string text = report::render_service(r);
  const nlohmann::json j = report::service_json(r);
  std::string flagged;
  for (std::size_t i = 0; i < r.models.size(); ++i) {
    const RateEstimate& e = r.models[i].estimate;
    if (r.models[i].devices.empty()) continue;
    EXPECT_EQ(j["models"][i]["posterior_upper90_below_mean"], e.posterior_bound_below_mean());
    EXPECT_EQ(text.find(sci(e.posterior_upper90_per_hour) + "*") != std::string::npos, e.posterior_bound_below_mean())
        << r.models[i].model;
    if (e.posterior_bound_below_mean()) flagged += (flagged.empty() ? "" : ", ") + r.models[i].model;
  }
  EXPECT_EQ(flagged, "LS-40, interposing-relay");
  EXPECT_NE(text.find("* " + flagged + ": the upper 90% lies below the posterior mean."), std::string::npos) << text;
  std::istringstream lines(text);
  for (std::string line; std::getline(lines, line);) EXPECT_LE(report::display_width(line), 80u) << line;
  EXPECT_NE(report::service_html(r).find(flagged + ": the posterior 90% lies below the posterior mean."),
            std::string::npos);
}

// RFC 5545 3.1: at most 75 octets a line; a continuation starts with one space.
TEST(Service, ICalendarLinesAreFoldedAt75OctetsAndUnfoldToTheOriginal) {
  std::string text = "DESCRIPTION:";
  for (int i = 0; i < 40; ++i) text += "Prüfung, ";  // two-octet characters near every cut
  const std::string folded = report::fold_ical_line(text);
  std::string unfolded;
  std::size_t start = 0;
  while (start < folded.size()) {
    const std::size_t end = folded.find("\r\n", start);
    ASSERT_NE(end, std::string::npos);
    const std::string line = folded.substr(start, end - start);
    EXPECT_LE(line.size(), 75u);
    EXPECT_NE(static_cast<unsigned char>(line.back()) & 0xC0, 0xC0) << "a UTF-8 character was split";
    unfolded += start == 0 ? line : line.substr(1);
    if (start > 0) {
      EXPECT_EQ(line[0], ' ');
    }
    start = end + 2;
  }
  EXPECT_EQ(unfolded, text);
  EXPECT_EQ(report::fold_ical_line("SHORT"), "SHORT\r\n");
}

// RFC 5545 3.3.11: backslash, semicolon, comma and newline are escaped in TEXT.
TEST(Service, ICalendarTextEscapesItsSeparators) {
  EXPECT_EQ(report::escape_ical_text("a,b;c\\d\ne"), "a\\,b\\;c\\\\d\\ne");
}

TEST(Service, TheICalendarHasOneEventPerScheduledComponent) {
  const std::string ics = report::service_ics(example().result);
  std::size_t events = 0;
  for (std::size_t at = ics.find("BEGIN:VEVENT"); at != std::string::npos; at = ics.find("BEGIN:VEVENT", at + 1))
    ++events;
  EXPECT_EQ(events, example().result.schedule.size());
  EXPECT_NE(ics.find("DTSTART;VALUE=DATE:20240920\r\n"), std::string::npos);
  EXPECT_NE(ics.find("SUMMARY:OVERDUE: proof test of PT-402B (SIF-402)\r\n"), std::string::npos);
}

}  // namespace
}  // namespace sifter
