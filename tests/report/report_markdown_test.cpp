// Specification of the Markdown report: the HTML report's tables, cell for cell, and safe escaping.
#include <gtest/gtest.h>

#include "sifter/analysis/report_data.hpp"
#include "sifter/input/load.hpp"
#include "sifter/report/html.hpp"
#include "sifter/report/markdown.hpp"
#include "support/report_support.hpp"

namespace sifter {
namespace {

using testing::html_tables;
using testing::markdown_tables;

struct Both {
  std::string html, markdown;
};

Both render_both(const std::string& path) {
  const LoadedProject loaded = load_project_file(std::string(SIFTER_SOURCE_DIR) + "/" + path);
  const ProjectResult result = verify_project(loaded);
  const ReportData data = build_report_data(loaded.project, result, ReportOptions{"2025-01-31", true, 50});
  return {report::render_html(result, data), report::render_markdown(result, data)};
}

void expect_same_tables(const Both& both) {
  const auto from_html = html_tables(both.html);
  const auto from_md = markdown_tables(both.markdown);
  ASSERT_EQ(from_md.size(), from_html.size());
  for (std::size_t t = 0; t < from_html.size(); ++t) {
    SCOPED_TRACE("table " + std::to_string(t) + ": " + from_html[t].caption);
    EXPECT_EQ(from_md[t].caption, from_html[t].caption);
    EXPECT_EQ(from_md[t].header, from_html[t].header);
    EXPECT_EQ(from_md[t].rows, from_html[t].rows);
  }
}

TEST(MarkdownReport, HoldsTheSameTablesAsTheHtmlReportCellForCell) {
  const Both both = render_both("examples/unit40.json");
  expect_same_tables(both);
  EXPECT_GE(html_tables(both.html).size(), 15u);  // summaries, three SIFs, three worksheets, the closing tables
}

TEST(MarkdownReport, KeepsTablesIntactWhenUserTextHoldsPipesAndMarkup) {
  const Both both = render_both("tests/data/report/hostile_text.json");
  expect_same_tables(both);
  // CommonMark passes raw HTML through, so every '<' of user text must be backslash-escaped.
  for (auto p = both.markdown.find('<'); p != std::string::npos; p = both.markdown.find('<', p + 1))
    EXPECT_EQ(both.markdown[p - 1], '\\') << both.markdown.substr(p, 20);
  EXPECT_NE(both.markdown.find("# \\<script\\>alert(1)\\</script\\> plant \\| unit 'A' \\& \"B\""), std::string::npos);
}

TEST(MarkdownReport, CarriesTheCaution) {
  EXPECT_NE(render_both("examples/unit40.json").markdown.find("> **Caution.** " + report::escape_markdown(kCaution)),
            std::string::npos);
}

TEST(MarkdownReport, EscapeMarkdownBackslashesMarkupAndFlattensLineBreaks) {
  EXPECT_EQ(report::escape_markdown("a|b *c* _d_ <e> [f] #g `h` ~i & \\"),
            "a\\|b \\*c\\* \\_d\\_ \\<e\\> \\[f\\] \\#g \\`h\\` \\~i \\& \\\\");
  EXPECT_EQ(report::escape_markdown("two\nlines"), "two lines");
  EXPECT_EQ(report::escape_markdown("SIF-401 4.56e-03"), "SIF-401 4.56e-03");
}

}  // namespace
}  // namespace sifter
