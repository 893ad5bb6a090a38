// Specification of the HTML report: what it holds, that it fetches nothing, that it escapes user text.
#include <gtest/gtest.h>

#include <cstdlib>
#include <nlohmann/json.hpp>

#include "sifter/analysis/report_data.hpp"
#include "sifter/input/load.hpp"
#include "sifter/report/html.hpp"
#include "sifter/report/svg.hpp"
#include "support/cli_support.hpp"
#include "support/report_support.hpp"

namespace sifter {
namespace {

using nlohmann::json;
using testing::count_of;
using testing::fresh_folder;
using testing::html_tables;
using testing::run_sifter;
using testing::slurp;

// Numbers in the report carry three significant digits (sci) or four (plain).
constexpr double kPrintedRelTol = 5e-3;

struct Rendered {
  ProjectResult result;
  ReportData data;
  std::string html;
};

Rendered render(const std::string& path, const std::function<void(ProjectResult&, ReportData&)>& edit = {}) {
  const LoadedProject loaded = load_project_file(std::string(SIFTER_SOURCE_DIR) + "/" + path);
  Rendered r{verify_project(loaded), {}, {}};
  r.data = build_report_data(loaded.project, r.result, ReportOptions{"2025-01-31", true, 100});
  if (edit) edit(r.result, r.data);
  r.html = report::render_html(r.result, r.data);
  return r;
}

const Rendered& example() {
  static const Rendered r = render("examples/unit40.json");
  return r;
}

TEST(HtmlReport, DrawsOneArchitectureAndOnePfdCurvePerSif) {
  const auto& r = example();
  ASSERT_EQ(r.result.sifs.size(), 3u);
  EXPECT_EQ(count_of(r.html, "data-figure=\"architecture\""), 3u);
  EXPECT_EQ(count_of(r.html, "data-figure=\"pfd-curve\""), 3u);
  EXPECT_EQ(count_of(r.html, "data-figure=\"contributions\""), 3u);
  EXPECT_EQ(count_of(r.html, "data-figure=\"interval-sweep\""), 3u);
  EXPECT_EQ(count_of(r.html, "data-figure=\"staircase\""), r.result.scenarios.size());
  EXPECT_EQ(count_of(r.html, "<section class=\"sif\""), 3u);
  // The architecture names every channel's tags; SIF-401's final element is SOV-401 in series with XV-401.
  EXPECT_NE(r.html.find(">SOV-401</text>"), std::string::npos);
  EXPECT_NE(r.html.find(">XV-401</text>"), std::string::npos);
  EXPECT_NE(r.html.find(">2oo3</text>"), std::string::npos);
}

TEST(HtmlReport, FetchesNothingFromAnywhereAndNeedsNoScript) {
  const std::string& html = example().html;
  EXPECT_EQ(html.find("http://"), std::string::npos);
  EXPECT_EQ(html.find("https://"), std::string::npos);
  EXPECT_EQ(html.find("//"), std::string::npos);  // no protocol-relative reference either
  EXPECT_EQ(html.find("<script"), std::string::npos);
  EXPECT_EQ(html.find("<link"), std::string::npos);
  EXPECT_EQ(html.find("<img"), std::string::npos);
  EXPECT_EQ(html.find("url("), std::string::npos);
  EXPECT_EQ(html.find("@import"), std::string::npos);
  EXPECT_EQ(html.find(" src="), std::string::npos);
  for (auto p = html.find("href=\""); p != std::string::npos; p = html.find("href=\"", p + 1))
    EXPECT_EQ(html[p + 6], '#') << "only links inside the document";
}

TEST(HtmlReport, PutsTheCautionInABoxOnTheFirstPage) {
  const std::string& html = example().html;
  const auto caution = html.find("<aside class=\"caution\">");
  ASSERT_NE(caution, std::string::npos);
  EXPECT_LT(caution, html.find("id=\"summary\""));
  EXPECT_NE(html.find(report::escape_html(kCaution), caution), std::string::npos);
}

TEST(HtmlReport, StartsEveryFunctionOnANewPageWhenPrintedOnA4) {
  const std::string& html = example().html;
  EXPECT_NE(html.find("@page { size: A4;"), std::string::npos);
  EXPECT_NE(html.find("section.sif, section.scenario, section.closing { break-before: page; }"), std::string::npos);
}

TEST(HtmlReport, NamesTheInputItsDigestTheDateAndTheTool) {
  const auto& r = example();
  EXPECT_NE(r.html.find(r.result.sha256), std::string::npos);
  EXPECT_EQ(r.result.sha256.size(), 64u);
  EXPECT_NE(r.html.find("2025-01-31"), std::string::npos);
  EXPECT_NE(r.html.find("sifter " SIFTER_VERSION), std::string::npos);
  EXPECT_NE(r.html.find("unit40.json"), std::string::npos);
}

TEST(HtmlReport, EscapesEveryPieceOfUserText) {
  const auto r = render("tests/data/report/hostile_text.json");
  EXPECT_EQ(r.html.find("<script"), std::string::npos);
  EXPECT_EQ(r.html.find("<img"), std::string::npos);
  EXPECT_EQ(r.html.find("<b>"), std::string::npos);
  EXPECT_EQ(r.html.find("</section><script"), std::string::npos);
  EXPECT_NE(r.html.find("&lt;script&gt;alert(1)&lt;/script&gt; plant | unit &#39;A&#39; &amp; &quot;B&quot;"),
            std::string::npos);
  EXPECT_NE(r.html.find(">PT-&lt;1&gt;</text>"), std::string::npos);  // a tag in the drawing
  EXPECT_NE(r.html.find(">PT-&quot;2&quot;</text>"), std::string::npos);
  EXPECT_NE(r.html.find("aria-label=\"Architecture of S&lt;1&gt;\""), std::string::npos);  // and in attributes
  // Read back as text, the title is what the author wrote.
  EXPECT_NE(testing::text_of(r.html).find("<script>alert(1)</script> plant"), std::string::npos);
}

TEST(HtmlReport, EscapeHtmlReplacesTheFiveMarkupCharacters) {
  EXPECT_EQ(report::escape_html("a<b>&\"c\"'d'"), "a&lt;b&gt;&amp;&quot;c&quot;&#39;d&#39;");
  EXPECT_EQ(report::escape_html("plain words"), "plain words");
}

// The summary table against `sifter check --json`: the same SIFs, SILs, figures and verdicts.
TEST(HtmlReport, SummaryRowsMatchTheJsonResults) {
  const auto dir = fresh_folder("report_summary");
  const auto out = dir / "unit40.html";
  const auto check = run_sifter("check examples/unit40.json --json -");
  ASSERT_EQ(check.exit_code, 0) << check.err;
  const json j = json::parse(check.out);
  const auto rep = run_sifter("report examples/unit40.json -o " + out.string());
  ASSERT_EQ(rep.exit_code, 0) << rep.err;
  const auto tables = html_tables(slurp(out));
  ASSERT_FALSE(tables.empty());
  const auto& summary = tables.front();
  EXPECT_EQ(summary.caption, "Safety instrumented functions");
  ASSERT_EQ(summary.rows.size(), j["sifs"].size());
  for (std::size_t i = 0; i < summary.rows.size(); ++i) {
    const auto& row = summary.rows[i];
    const json& s = j["sifs"][i];
    ASSERT_EQ(row.size(), summary.header.size());
    EXPECT_EQ(row[0], s["id"].get<std::string>());
    EXPECT_EQ(row[1], s["title"].get<std::string>());
    EXPECT_EQ(row[2], s["demand_mode"].get<std::string>());
    EXPECT_EQ(row[3], std::to_string(s["sil_required"].get<int>()));
    EXPECT_EQ(row[4], std::to_string(s["sil_achieved"].get<int>()));
    EXPECT_NEAR(std::stod(row[5]), s["pfd_avg"].get<double>(), s["pfd_avg"].get<double>() * kPrintedRelTol);
    EXPECT_NEAR(std::stod(row[6]), s["rrf"].get<double>(), s["rrf"].get<double>() * kPrintedRelTol);
    EXPECT_NEAR(std::stod(row[7]), s["required_rrf"].get<double>(), s["required_rrf"].get<double>() * kPrintedRelTol);
    EXPECT_EQ(row[8], s["meets_target"].get<bool>() ? "✔ meets target" : "✘ falls short");
  }
  const auto& scenarios = tables[1];
  ASSERT_EQ(scenarios.rows.size(), j["scenarios"].size());
  for (std::size_t i = 0; i < scenarios.rows.size(); ++i) {
    EXPECT_EQ(scenarios.rows[i][0], j["scenarios"][i]["id"].get<std::string>());
    const double rrf = j["scenarios"][i]["required_rrf"].get<double>();
    EXPECT_NEAR(std::stod(scenarios.rows[i][5]), rrf, rrf * kPrintedRelTol);
  }
}

TEST(HtmlReport, DrawsTheUncertaintyBandOnlyWhereItWasRun) {
  EXPECT_EQ(example().html.find("class=\"band\""), std::string::npos);
  const auto r = render("examples/unit40.json", [](ProjectResult& result, ReportData&) {
    result.sifs[0].uncertainty = UncertaintyResult{4.6e-3, 2.1e-3, 4.2e-3, 8.9e-3, 0.93, 1000, "invented for a test"};
  });
  EXPECT_EQ(count_of(r.html, "class=\"band\""), 1u);
  EXPECT_NE(r.html.find("<caption>Uncertainty of the result (Monte Carlo)</caption>"), std::string::npos);
  EXPECT_NE(r.html.find("invented for a test"), std::string::npos);
}

TEST(HtmlReport, DrawsTheSensitivityRankingWhereRowsAreGivenAndSaysSoWhereNot) {
  EXPECT_EQ(count_of(example().html, "data-figure=\"sensitivity\""), 3u);
  const auto r = render("examples/unit40.json", [](ProjectResult&, ReportData& data) {
    for (auto& s : data.sifs) s.sensitivity.clear();
    data.sifs[0].sensitivity = {{"outlet isolation: lambda_DU", 2.3e-3, 8.9e-3},
                                {"outlet isolation: MTTR", 4.5e-3, 4.6e-3}};
  });
  EXPECT_EQ(count_of(r.html, "data-figure=\"sensitivity\""), 1u);
  EXPECT_EQ(count_of(r.html, "Sensitivity ranking: not computed in this run."), 2u);
}

TEST(HtmlReport, StatesTheLongestIntervalOfTheWhatIfEngineAndNamesTheCurveEngine) {
  const auto& r = example();
  // The answer of `sifter interval` for every tested subsystem, in words under each of three sweeps
  // (a plot of all intervals scaled together cannot mark it).
  EXPECT_EQ(count_of(r.html, "longest interval (all tested subsystems): "), 3u);
  EXPECT_NE(r.html.find("drawn by the exact multi-phase Markov model of every group"), std::string::npos);
}

TEST(ReportCommand, WritesMarkdownForAnMdNameAndRefusesOtherExtensions) {
  const auto dir = fresh_folder("report_formats");
  const auto md = run_sifter("report examples/unit40.json -o " + (dir / "r.md").string());
  EXPECT_EQ(md.exit_code, 0) << md.err;
  EXPECT_EQ(slurp(dir / "r.md").rfind("# Demonstration plant, unit 40", 0), 0u);
  const auto pdf = run_sifter("report examples/unit40.json -o " + (dir / "r.pdf").string());
  EXPECT_EQ(pdf.exit_code, 2);
  EXPECT_EQ(pdf.err, "sifter: cannot tell the format of " + (dir / "r.pdf").string() +
                         ": expected a name ending in .html or .md, found \".pdf\"\n");
  EXPECT_FALSE(std::filesystem::exists(dir / "r.pdf"));
}

TEST(ReportCommand, RefusesToOverwriteItsInput) {
  const auto dir = fresh_folder("report_self");
  const auto project = dir / "p.html";
  std::filesystem::copy_file(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json", project);
  const std::string before = slurp(project);
  const auto r = run_sifter("report " + project.string() + " -o " + project.string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("refusing to write"), std::string::npos);
  EXPECT_EQ(slurp(project), before);
}

TEST(ReportCommand, ExitsOneWhenAFunctionFallsShortAndStillWritesTheReport) {
  const auto dir = fresh_folder("report_short");
  const auto r = run_sifter("report examples/unit50_shortfall.json -o " + (dir / "r.html").string());
  EXPECT_EQ(r.exit_code, 1) << r.err;
  EXPECT_NE(slurp(dir / "r.html").find("✘ falls short"), std::string::npos);
}

}  // namespace
}  // namespace sifter
