// Specification of the deliverables: the safety requirements specification and the report's
// document control, component data and requirements, read back from their HTML.
#include "sifter/report/srs.hpp"

#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include "sifter/analysis/report_data.hpp"
#include "sifter/input/load.hpp"
#include "sifter/report/html.hpp"
#include "sifter/report/html_deliverable.hpp"
#include "sifter/report/markdown.hpp"
#include "support/cli_support.hpp"
#include "support/report_support.hpp"

namespace sifter {
namespace {

using nlohmann::json;
using testing::count_of;
using testing::html_tables;
using testing::ParsedTable;

const char* kExample = "examples/unit70_requirements.json";

struct Deliverables {
  ProjectResult result;
  DeliverableData data;
  std::string srs;
  std::string srs_markdown;
  std::string report;
};

Deliverables render(const LoadedProject& loaded) {
  Deliverables d{verify_project(loaded), {}, {}, {}, {}};
  d.data = build_deliverable_data(loaded.project, d.result);
  report::SrsOptions o{"2026-12-01", "test", {}};
  for (std::size_t i = 0; i < d.result.sifs.size(); ++i) o.sifs.push_back(i);
  d.srs = report::render_srs_html(d.result, d.data, o);
  d.srs_markdown = report::render_srs_markdown(d.result, d.data, o);
  ReportOptions ro;
  ro.date = "2026-12-01";
  ro.curve_samples = 50;
  ro.sensitivity = false;
  d.report = report::render_html(d.result, build_report_data(loaded.project, d.result, ro));
  return d;
}

const Deliverables& example() {
  static const Deliverables d = render(load_project_file(std::string(SIFTER_SOURCE_DIR) + "/" + kExample));
  return d;
}

const ParsedTable* table_captioned(const std::vector<ParsedTable>& tables, const std::string& start) {
  for (const auto& t : tables)
    if (t.caption.rfind(start, 0) == 0) return &t;
  return nullptr;
}

// The text of one SIF's section of the SRS.
std::string section_of(const std::string& html, std::size_t i) {
  const std::string open = "<section class=\"sif\" id=\"srs-" + std::to_string(i + 1) + "\">";
  const auto from = html.find(open);
  if (from == std::string::npos) return "";
  return html.substr(from, html.find("</section>", from) - from);
}

TEST(Srs, HasOneSectionPerSifWithItsStatedRequirements) {
  const auto& d = example();
  EXPECT_EQ(count_of(d.srs, "<section class=\"sif\""), 2u);
  const std::string s1 = testing::html_unescape(section_of(d.srs, 0));
  for (const char* stated : {"Feed valve XV-701 closed; the drum isolated from the upstream feed",
                             "PT-701A/B at 9.0 barg (design pressure 10 barg), 1oo2", "Process safety time 30 s",
                             "Hard-wired push button in the control room, independent of the controller",
                             "Maintenance override per transmitter with a key switch, alarmed, removed after the test",
                             "Reset after a trip: manual", "Limit 2.00e-01/yr", "LOPA-701-1"})
    EXPECT_NE(s1.find(stated), std::string::npos) << stated;
  // The response budget element by element: 1 s + 0.5 s + (2 s + 8 s) = 11.5 s of 15 s allowed.
  const auto tables = html_tables(section_of(d.srs, 0));
  const ParsedTable* budget = table_captioned(tables, "Response time");
  ASSERT_NE(budget, nullptr);
  EXPECT_EQ(budget->rows.back()[0], "SIF");
  EXPECT_EQ(budget->rows.back()[1], "allowed 15 s");
  EXPECT_EQ(budget->rows.back()[3], "11.5 s");
  EXPECT_NE(s1.find("No open items"), std::string::npos);
}

TEST(Srs, ListsEveryRequirementNotStatedAsAnOpenItem) {
  const auto& d = example();
  const std::string s2 = section_of(d.srs, 1);
  const auto open_from = s2.find("<ul class=\"open-items\">");
  ASSERT_NE(open_from, std::string::npos);
  const std::string open = testing::html_unescape(s2.substr(open_from, s2.find("</ul>", open_from) - open_from));
  // SIF-702 states its safe state, set point, process safety time and reset, nothing else.
  for (const char* item :
       {"manual shutdown", "maximum spurious trip rate", "bypasses and overrides, and how they are cleared",
        "what the proof test must cover", "the hazardous event the SIF protects against and its scenarios"})
    EXPECT_NE(open.find(item), std::string::npos) << item;
  for (const char* stated : {"the safe state of the process", "reset after a trip"})
    EXPECT_EQ(open.find(std::string(">") + stated + "<"), std::string::npos) << stated;
  EXPECT_NE(d.srs_markdown.find("- [ ] manual shutdown"), std::string::npos);
}

TEST(Srs, PutsDocumentNumberRevisionAndSignaturesOnTheCover) {
  for (const std::string* html : {&example().srs, &example().report}) {
    const auto first_section = html->find("<section");
    const std::string cover = html->substr(0, first_section);
    EXPECT_NE(cover.find("Document DEMO-70-SRS-001, revision B, 2026-11-20"), std::string::npos);
    const auto tables = html_tables(cover);
    const ParsedTable* signatures = table_captioned(tables, "Signatures");
    ASSERT_NE(signatures, nullptr);
    EXPECT_EQ(signatures->rows.size(), 3u);
    EXPECT_EQ(signatures->rows[1][1], "B. Example (invented)");
    const ParsedTable* history = table_captioned(tables, "Revision history");
    ASSERT_NE(history, nullptr);
    EXPECT_EQ(history->rows.size(), 2u);
    EXPECT_NE(cover.find("<aside class=\"caution\">"), std::string::npos);
    // The print footer repeats number and revision on every printed page (a page-margin box;
    // tests/print_test.py reads it back from each printed page).
    EXPECT_NE(html->find("@bottom-left { content: \"" +
                         std::string(html == &example().srs ? "Safety requirements specification"
                                                            : "SIL verification report") +
                         " · document DEMO-70-SRS-001 revision B\""),
              std::string::npos);
  }
}

TEST(Srs, NamesEveryDeviceWithItsDataSource) {
  const auto tables = html_tables(section_of(example().srs, 0));
  const ParsedTable* devices = table_captioned(tables, "Devices");
  ASSERT_NE(devices, nullptr);
  ASSERT_EQ(devices->rows.size(), 5u);  // PT-701A, PT-701B, LS-70, SOV-701, XV-701
  EXPECT_EQ(devices->rows[4][2], "XV-701");
  EXPECT_EQ(devices->rows[4][5], "handbook: Invented generic valve handbook, table 4 rev 3, 2022");
  EXPECT_EQ(devices->rows[4][4].rfind("prior use SIL 2: invented record: 48 ball valves", 0), 0u);
}

TEST(Report, HasTheComponentDataTableWithEverySource) {
  const auto& d = example();
  const auto tables = html_tables(d.report);
  const ParsedTable* data = table_captioned(tables, "Component data");
  ASSERT_NE(data, nullptr);
  ASSERT_EQ(data->rows.size(), d.data.components.size());
  for (std::size_t i = 0; i < data->rows.size(); ++i) {
    EXPECT_EQ(data->rows[i][0], d.data.components[i].id);
    EXPECT_EQ(data->rows[i][9], d.data.components[i].source);
    EXPECT_FALSE(d.data.components[i].source.empty());
  }
  EXPECT_EQ(data->rows[0][9], "field: DEMO-70-REL-004 (invented) rev 2, 2025-12-01");
  EXPECT_EQ(data->rows[0][8].rfind("prior use SIL 2: invented record: 212 transmitters", 0), 0u);
}

TEST(Report, ShowsEachSubsystemsTestAndRepairParametersAndTheRequirementChecks) {
  const auto tables = html_tables(example().report);
  const ParsedTable* params = table_captioned(tables, "Test, repair and common-cause parameters");
  ASSERT_NE(params, nullptr);
  EXPECT_EQ(params->header, (std::vector<std::string>{"subsystem", "T1", "coverage", "partial stroke", "test duration",
                                                      "MTTR", "MRT", "β", "β_D", "spurious trips"}));
  EXPECT_EQ(params->rows[0][7], "5.0%");
  EXPECT_EQ(params->rows[0][8], "2.0%");
  EXPECT_EQ(params->rows[2][2], "99.0%");
  EXPECT_EQ(params->rows[2][4], "1 h");
  const ParsedTable* checks = table_captioned(tables, "The stated requirements, checked");
  ASSERT_NE(checks, nullptr);
  EXPECT_EQ(checks->rows.size(), 3u);  // response time, spurious trips, proof-test interval
  for (const auto& row : checks->rows) EXPECT_EQ(row[3], "✔ met") << row[0];
}

TEST(Report, NamesWarningsBySifAndSubsystemNotByPointer) {
  ProjectResult r;
  r.sifs.resize(1);
  r.sifs[0].id = "SIF-9";
  r.sifs[0].subsystems.resize(2);
  r.sifs[0].subsystems[1].name = "valves";
  DeliverableData d;
  EXPECT_EQ(report::place_name(r, d, "/sifs/0/target"), "SIF-9 (target)");
  EXPECT_EQ(report::place_name(r, d, "/sifs/0/subsystems/1"), "SIF-9, subsystem 'valves'");
  EXPECT_EQ(report::place_name(r, d, "/sifs/4"), "/sifs/4");  // no such SIF: left as written
}

// Every new field of the project carries markup and quotes; none of it reaches the HTML unescaped.
TEST(Deliverables, CssStringsEscapeWhatCouldEndThemAndKeepOtherText) {
  EXPECT_EQ(report::css_string("rev \"B\" \\ </style> & ·"), "rev \\22 B\\22  \\5C  \\3C /style\\3E  \\26  ·");
  EXPECT_EQ(report::css_string("a\nb"), "a\\A b");
}

TEST(Deliverables, HostileTextInEveryNewFieldStaysEscaped) {
  const std::string hostile = "<script>alert(1)</script><b onmouseover=\"x\">&'";
  json j = json::parse(testing::slurp(std::string(SIFTER_SOURCE_DIR) + "/" + kExample));
  for (const char* k : {"number", "revision", "date", "prepared_by", "checked_by", "approved_by"})
    j["document"][k] = hostile;
  j["document"]["history"][0] = {{"revision", hostile}, {"date", hostile}, {"by", hostile}, {"description", hostile}};
  for (auto& c : j["components"]) {
    if (c.contains("prior_use")) c["prior_use"]["evidence"] = hostile;
    c["data_source"] = {{"kind", "fmeda"}, {"document", hostile}, {"revision", hostile}, {"date", hostile}};
  }
  for (auto& [key, value] : j["sifs"][0]["requirements"].items())
    if (value.is_string() && key != "process_safety_time" && key != "max_spurious_trip_rate" &&
        key != "proof_test_interval" && key != "reset" && key != "response_time_fraction")
      value = hostile;
  const Deliverables d =
      render(load_project_text(j.dump(), "hostile.json", std::string(SIFTER_SOURCE_DIR) + "/examples"));
  for (const std::string* out : {&d.srs, &d.report}) {
    EXPECT_EQ(out->find("<script"), std::string::npos);
    EXPECT_EQ(out->find("<b onmouseover"), std::string::npos);
    EXPECT_NE(out->find("&lt;script&gt;alert(1)&lt;/script&gt;&lt;b onmouseover=&quot;x&quot;&gt;&amp;&#39;"),
              std::string::npos);
    // In the footer's CSS string no quote, bracket or ampersand stands bare: the sheet cannot be ended.
    EXPECT_NE(out->find("document \\3C script\\3E alert(1)\\3C /script\\3E \\3C b onmouseover=\\22 x\\22 \\3E \\26 '"),
              std::string::npos);
    EXPECT_EQ(out->find("</style", out->find("@bottom-left")), out->find("</style>\n</head>"));
  }
  // Markdown escapes markup characters with a backslash: no "<" stands bare.
  for (auto p = d.srs_markdown.find('<'); p != std::string::npos; p = d.srs_markdown.find('<', p + 1))
    ASSERT_TRUE(p > 0 && d.srs_markdown[p - 1] == '\\') << d.srs_markdown.substr(p, 40);
}

}  // namespace
}  // namespace sifter
