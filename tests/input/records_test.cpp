// In-service records: the two formats agree, and every bad record is refused with its place.
#include "sifter/model/records.hpp"

#include <gtest/gtest.h>

#include <algorithm>
#include <cctype>
#include <filesystem>

#include "sifter/input/load.hpp"
#include "support/catalogue_support.hpp"

namespace sifter {
namespace {

namespace fs = std::filesystem;
const fs::path kCatalogue = fs::path(SIFTER_TEST_DATA) / "bad_records";
const CivilDate kAsOf{2025, 6, 30};

const Project& unit40() {
  static const LoadedProject loaded = load_project_file(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json");
  return loaded.project;
}

std::vector<std::string> catalogue_files() {
  std::vector<std::string> names;
  for (const auto& e : fs::directory_iterator(kCatalogue))
    if (e.path().extension() == ".json" || e.path().extension() == ".csv")
      names.push_back(e.path().filename().string());
  std::sort(names.begin(), names.end());
  return names;
}

// The message for one file, read from inside the catalogue so that it names the file as typed.
std::string message_for(const std::string& file) {
  const auto previous = fs::current_path();
  fs::current_path(kCatalogue);
  std::string message = "no error";
  try {
    load_records_file(file, unit40(), kAsOf);
  } catch (const InputError& e) {
    message = e.what();
  }
  fs::current_path(previous);
  return message;
}

class BadRecords : public ::testing::TestWithParam<std::string> {};

TEST_P(BadRecords, AreRefusedWithTheCataloguedMessageWordForWord) {
  const std::string file = GetParam();
  const std::string actual = message_for(file);
  EXPECT_EQ(actual, testing::catalogue_expected(kCatalogue, fs::path(file).stem().string(), actual));
}

INSTANTIATE_TEST_SUITE_P(Catalogue, BadRecords, ::testing::ValuesIn(catalogue_files()),
                         [](const ::testing::TestParamInfo<std::string>& param_info) {
                           std::string name = param_info.param;
                           for (char& c : name)
                             if (!std::isalnum(static_cast<unsigned char>(c))) c = '_';
                           return name;
                         });

TEST(Records, TheJsonAndCsvFormsOfTheExampleHoldTheSameEvents) {
  const auto json =
      load_records_file(std::string(SIFTER_SOURCE_DIR) + "/examples/records/unit40.json", unit40(), kAsOf);
  const auto csv = load_records_file(std::string(SIFTER_TEST_DATA) + "/service/unit40_records.csv", unit40(), kAsOf);
  ASSERT_EQ(json.events.size(), csv.events.size());
  EXPECT_EQ(json.in_service_since, csv.in_service_since);
  for (std::size_t i = 0; i < json.events.size(); ++i) {
    EXPECT_EQ(json.events[i].date, csv.events[i].date);
    EXPECT_EQ(json.events[i].component, csv.events[i].component);
    EXPECT_EQ(json.events[i].kind, csv.events[i].kind);
    EXPECT_EQ(json.events[i].result, csv.events[i].result);
    EXPECT_EQ(json.events[i].found_by, csv.events[i].found_by);
    EXPECT_EQ(json.events[i].note, csv.events[i].note);
  }
}

TEST(Records, FailuresTheDiagnosticsFoundDoNotCountAsUndetected) {
  const std::string text = R"({"format": "sifter-records/1", "in_service_since": {"PT-402A": "2019-01-01"},
    "events": [
      {"date": "2020-01-01", "component": "PT-402A", "event": "proof_test", "result": "fail_dangerous"},
      {"date": "2020-02-01", "component": "PT-402A", "event": "proof_test", "result": "fail_dangerous", "found_by": "diagnostics"},
      {"date": "2020-03-01", "component": "PT-402A", "event": "demand", "result": "fail_dangerous"},
      {"date": "2020-04-01", "component": "PT-402A", "event": "spurious_trip"}]})";
  const auto r = load_records_text(text, "inline.json", unit40(), kAsOf);
  ASSERT_EQ(r.events.size(), 4u);
  EXPECT_TRUE(r.events[0].counts_as_undetected_failure());
  EXPECT_FALSE(r.events[1].counts_as_undetected_failure());
  EXPECT_TRUE(r.events[2].counts_as_undetected_failure());
  EXPECT_EQ(r.events[3].result, EventResult::kFailSafe);
}

// A records file is parsed as a project file is (one parse for every JSON input): comments
// are allowed, a byte-order mark is refused at line 1, column 1, and a syntax error is placed.
TEST(Records, AreParsedAsProjectsAreCommentsAndAllAndRefusedAsTheyAre) {
  const std::string text = R"({"format": "sifter-records/1", // tests of the last turnaround
    "in_service_since": {"PT-402A": "2019-01-01"},
    /* one proof test */ "events": [
      {"date": "2020-01-01", "component": "PT-402A", "event": "proof_test", "result": "pass"}]})";
  EXPECT_EQ(load_records_text(text, "commented.json", unit40(), kAsOf).events.size(), 1u);
  auto refusal = [](const std::string& bad) {
    try {
      load_records_text(bad, "bad.json", unit40(), kAsOf);
    } catch (const InputError& e) {
      return std::string(e.what());
    }
    return std::string("accepted");
  };
  EXPECT_NE(refusal("\xEF\xBB\xBF" + text).find("bad.json:1:1: expected JSON text without a byte-order mark"),
            std::string::npos)
      << refusal("\xEF\xBB\xBF" + text);
  EXPECT_NE(refusal(R"({"format": "sifter-records/1",
    "events": [}])")
                .find("bad.json:2:16: expected valid JSON"),
            std::string::npos)
      << refusal(R"({"format": "sifter-records/1",
    "events": [}])");
}

TEST(Records, InServiceDatesMayComeFromTheProject) {
  Project project = unit40();
  project.components[0].in_service_since = "2019-05-01";  // LT-401A
  const std::string text = R"({"format": "sifter-records/1", "events": [
      {"date": "2020-01-01", "component": "LT-401A", "event": "proof_test", "result": "pass"}]})";
  const auto r = load_records_text(text, "inline.json", project, kAsOf);
  EXPECT_EQ(r.in_service_since.at(0), (CivilDate{2019, 5, 1}));
}

TEST(Records, TheProjectRefusesAnInServiceDateThatIsNoCalendarDay) {
  const std::string text = R"({"format": "sifter-project/1",
    "components": [{"id": "PT-1", "lambda_du": "100 FIT", "in_service_since": "2023-02-29"}]})";
  try {
    load_project_text(text, "p.json", ".");
    FAIL() << "accepted";
  } catch (const InputError& e) {
    EXPECT_EQ(std::string(e.what()),
              "p.json:2:59: /components/0/in_service_since: expected a date written YYYY-MM-DD (ISO 8601), found "
              "\"2023-02-29\"\n  hint: a real calendar day between 1900 and 2999, e.g. 2024-02-29\n"
              "1 problem in the input; nothing was computed or written");
  }
}

}  // namespace
}  // namespace sifter
