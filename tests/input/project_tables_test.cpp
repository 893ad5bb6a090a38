// CSV tables in and out: import(export(P)) is P, and every problem in a table names its cell.
#include "sifter/input/project_tables.hpp"

#include <gtest/gtest.h>
#include <unistd.h>

#include <cctype>
#include <filesystem>
#include <fstream>

#include "sifter/input/csv_text.hpp"
#include "sifter/model/printable.hpp"
#include "support/results_support.hpp"

namespace sifter {
namespace {
namespace fs = std::filesystem;

fs::path fresh(const std::string& name) {
  const auto dir = fs::temp_directory_path() / ("sifter_tables_" + name + "_" + std::to_string(::getpid()));
  fs::remove_all(dir);
  fs::create_directories(dir);
  return dir;
}

void write(const fs::path& p, const std::string& text) {
  std::ofstream out(p, std::ios::binary);
  out << text;
}

// Exports the project, imports the tables into a new project file, and returns its path.
std::string round_trip(const std::string& project, const std::string& name) {
  const fs::path dir = fresh(name);
  for (const auto& t : export_project_tables(project, (dir / "tables").string())) {
    fs::create_directories(dir / "tables");
    write(dir / "tables" / t.file, t.text);
  }
  const std::string out = (dir / "again.json").string();
  write(out, import_project_tables((dir / "tables").string(), out));
  return out;
}

class RoundTrip : public ::testing::TestWithParam<std::string> {};

TEST_P(RoundTrip, ImportOfTheExportGivesTheSameCheckResults) {
  const std::string project = std::string(SIFTER_SOURCE_DIR) + "/" + GetParam();
  const std::string again = round_trip(project, fs::path(GetParam()).stem().string());
  EXPECT_EQ(testing::comparable_results(project).dump(2), testing::comparable_results(again).dump(2));
}

INSTANTIATE_TEST_SUITE_P(ShippedProjects, RoundTrip,
                         ::testing::Values("examples/unit40.json", "examples/unit50_shortfall.json",
                                           "examples/unit60_existing_logic_solver.json",
                                           "examples/unit70_requirements.json", "tests/data/good/every_key.json",
                                           "tests/data/unit40_rev_b.json", "tests/data/whatif_no_interval.json",
                                           "tests/data/good/architecture_limited.json",
                                           "tests/data/reuse/with_templates.json", "tests/data/reuse/expanded.json"),
                         [](const auto& param_info) {
                           std::string n = fs::path(param_info.param).stem().string();
                           for (auto& c : n)
                             if (!std::isalnum(static_cast<unsigned char>(c))) c = '_';
                           return n;
                         });

// The deliverable's keys do not all reach the check results (document control, the text of a
// source, the SRS's wording): they are compared member by member on the project files themselves.
TEST(ProjectTables, TheDeliverableKeysComeBackAsWritten) {
  const std::string project = std::string(SIFTER_TEST_DATA) + "/good/every_key.json";
  const auto before = nlohmann::json::parse(testing::slurp_text(project));
  const auto after = nlohmann::json::parse(testing::slurp_text(round_trip(project, "deliverable_keys")));
  ASSERT_TRUE(before.contains("document"));
  EXPECT_EQ(after.at("document"), before.at("document"));
  int stated = 0;
  ASSERT_EQ(after.at("sifs").size(), before.at("sifs").size());
  for (std::size_t i = 0; i < before.at("sifs").size(); ++i) {
    const auto& b = before["sifs"][i];
    const auto& a = after["sifs"][i];
    EXPECT_EQ(a.value("requirements", nlohmann::json()), b.value("requirements", nlohmann::json())) << b["id"];
    stated += b.contains("requirements");
    for (std::size_t k = 0; k < b.at("subsystems").size(); ++k)
      EXPECT_EQ(a["subsystems"][k].value("response_time", nlohmann::json()),
                b["subsystems"][k].value("response_time", nlohmann::json()))
          << b["id"] << " subsystem " << k;
  }
  EXPECT_GT(stated, 0);
  ASSERT_EQ(after.at("components").size(), before.at("components").size());
  for (std::size_t i = 0; i < before.at("components").size(); ++i)
    for (const char* key : {"prior_use", "data_source", "response_time"})
      EXPECT_EQ(after["components"][i].value(key, nlohmann::json()),
                before["components"][i].value(key, nlohmann::json()))
          << before["components"][i]["id"] << " " << key;
  int field_sources = 0;
  for (std::size_t i = 0; i < before.at("components").size(); ++i)
    if (before["components"][i].contains("field_data")) {
      EXPECT_EQ(after["components"][i]["field_data"].value("data_source", ""),
                before["components"][i]["field_data"].value("data_source", ""));
      ++field_sources;
    }
  EXPECT_GT(field_sources, 0);
}

TEST(ProjectTables, ASourceGivenBothAsTextAndStructuredIsRefusedAtItsCell) {
  const fs::path dir = fresh("both_sources");
  write(dir / "components.csv",
        "id,lambda_du,element_type,systematic_capability,data_source,data_source_kind,data_source_document\r\n"
        "XV-1,2.5e-7/h,A,3,a handbook,fmeda,F-1\r\n");
  std::string message = "accepted";
  try {
    (void)import_project_tables(dir.string(), (dir / "p.json").string());
  } catch (const InputError& e) {
    message = e.what();
  }
  EXPECT_NE(message.find("components.csv:2:6: column \"data_source_kind\""), std::string::npos) << message;
  EXPECT_NE(message.find("not both"), std::string::npos) << message;
}

TEST(ProjectTables, FormulaLikeTextIsNeutralisedOnExportAndRestoredOnImport) {
  EXPECT_EQ(neutralise_formula("=SUM(A1:A3)"), "'=SUM(A1:A3)");
  EXPECT_EQ(neutralise_formula("@cmd"), "'@cmd");
  EXPECT_EQ(neutralise_formula("-0.5"), "-0.5");  // a number stays a number
  EXPECT_EQ(neutralise_formula("+1e-3"), "+1e-3");
  EXPECT_EQ(neutralise_formula("-5 FIT"), "'-5 FIT");  // not a number: a spreadsheet would compute it
  EXPECT_EQ(restore_formula_text("'=SUM(A1:A3)"), "=SUM(A1:A3)");
  EXPECT_EQ(restore_formula_text("'plain"), "'plain");  // only the apostrophe sifter adds is removed
  EXPECT_EQ(csv_line({"a,b", "say \"hi\"", "=1+1"}), "\"a,b\",\"say \"\"hi\"\"\",'=1+1\r\n");
}

TEST(ProjectTables, ATitleThatLooksLikeAFormulaComesBackAsWritten) {
  const fs::path dir = fresh("formula");
  std::string text = testing::slurp_text(std::string(SIFTER_TEST_DATA) + "/reuse/expanded.json");
  text.replace(text.find("\"Reuse test"), 11, "\"=HYPERLINK(x) reuse test");
  write(dir / "p.json", text);
  const std::string again = round_trip((dir / "p.json").string(), "formula_again");
  EXPECT_NE(testing::slurp_text(again).find("\"title\": \"=HYPERLINK(x) reuse test"), std::string::npos);
}

TEST(ProjectTables, CsvReadsQuotesLineBreaksAndAByteOrderMark) {
  CsvRows rows;
  ASSERT_FALSE(parse_csv("\xEF\xBB\xBFid,note\r\nA,\"two\r\nlines, \"\"quoted\"\"\"\r\n\r\nB,\n", rows).has_value());
  ASSERT_EQ(rows.size(), 4u);
  EXPECT_EQ(rows[0], (std::vector<std::string>{"id", "note"}));
  EXPECT_EQ(rows[1], (std::vector<std::string>{"A", "two\r\nlines, \"quoted\""}));
  EXPECT_TRUE(rows[2].empty());  // kept, so that row numbers stay the spreadsheet's
  EXPECT_EQ(rows[3], (std::vector<std::string>{"B", ""}));
}

// The bad-input catalogue: each folder under tests/data/csv_bad holds tables with one mistake
// and expected.txt, the message word for word (the folder written as tests/data/csv_bad/NAME).
class BadTables : public ::testing::TestWithParam<std::string> {};

TEST_P(BadTables, AreRefusedWithTheFileRowColumnAndHeader) {
  const std::string rel = "tests/data/csv_bad/" + GetParam();
  const fs::path here = fs::current_path();
  fs::current_path(SIFTER_SOURCE_DIR);
  std::string message = "accepted";
  try {
    (void)import_project_tables(rel, "out/project.json");
  } catch (const InputError& e) {
    message = e.what();
  }
  fs::current_path(here);
  std::string expected = testing::slurp_text(std::string(SIFTER_SOURCE_DIR) + "/" + rel + "/expected.txt");
  while (!expected.empty() && expected.back() == '\n') expected.pop_back();
  EXPECT_EQ(message, expected);
}

INSTANTIATE_TEST_SUITE_P(Catalogue, BadTables,
                         ::testing::Values("missing_column", "unknown_header", "bad_unit", "bad_row_reference",
                                           "unknown_component", "scenario_cells_differ", "entry_column_not_used"));

}  // namespace
}  // namespace sifter
