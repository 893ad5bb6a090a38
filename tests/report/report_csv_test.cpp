// Specification of the per-SIF CSV of `sifter check --csv`.
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>

#include "sifter/report/csv.hpp"
#include "support/cli_support.hpp"

namespace sifter {
namespace {

using nlohmann::json;
using testing::fresh_folder;
using testing::run_sifter;
using testing::slurp;

// Six significant digits in the CSV.
constexpr double kCsvRelTol = 1e-5;

// RFC 4180: fields split on commas outside quotes; "" inside quotes is one quote.
std::vector<std::vector<std::string>> parse_csv(const std::string& text) {
  std::vector<std::vector<std::string>> rows(1);
  std::string field;
  bool quoted = false;
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    if (quoted) {
      if (c == '"' && i + 1 < text.size() && text[i + 1] == '"')
        field += text[++i];
      else if (c == '"')
        quoted = false;
      else
        field += c;
    } else if (c == '"') {
      quoted = true;
    } else if (c == ',') {
      rows.back().push_back(field);
      field.clear();
    } else if (c == '\r' && i + 1 < text.size() && text[i + 1] == '\n') {
      rows.back().push_back(field);
      field.clear();
      rows.emplace_back();
      ++i;
    } else {
      field += c;
    }
  }
  if (rows.back().empty()) rows.pop_back();
  return rows;
}

TEST(SifCsv, HasOneRowPerSifWithTheJsonFigures) {
  const auto dir = fresh_folder("sif_csv");
  const auto r = run_sifter("check examples/unit40.json --quiet --csv " + (dir / "sifs.csv").string() + " --json " +
                            (dir / "r.json").string());
  ASSERT_EQ(r.exit_code, 0) << r.err;
  const auto rows = parse_csv(slurp(dir / "sifs.csv"));
  const json j = json::parse(slurp(dir / "r.json"));
  ASSERT_EQ(rows.size(), 1 + j["sifs"].size());
  EXPECT_EQ(rows[0][0], "sif");
  EXPECT_EQ(rows[0][3], "pfd_avg");
  EXPECT_EQ(rows[0][12], "sil_achieved");
  EXPECT_EQ(rows[0][13], "meets_target");
  for (std::size_t i = 1; i < rows.size(); ++i) {
    const json& s = j["sifs"][i - 1];
    ASSERT_EQ(rows[i].size(), rows[0].size());
    EXPECT_EQ(rows[i][0], s["id"].get<std::string>());
    EXPECT_EQ(rows[i][1], s["title"].get<std::string>());
    EXPECT_NEAR(std::stod(rows[i][3]), s["pfd_avg"].get<double>(), s["pfd_avg"].get<double>() * kCsvRelTol);
    EXPECT_EQ(rows[i][4], "");  // no PFH in low demand
    EXPECT_NEAR(std::stod(rows[i][5]), s["rrf"].get<double>(), s["rrf"].get<double>() * kCsvRelTol);
    EXPECT_EQ(rows[i][12], std::to_string(s["sil_achieved"].get<int>()));
    EXPECT_EQ(rows[i][13], s["meets_target"].get<bool>() ? "true" : "false");
  }
}

TEST(SifCsv, QuotesCommasQuotesAndLineBreaksPerRfc4180) {
  ProjectResult result;
  SifResult s;
  s.id = "S,1";
  s.title = "closes \"XV-1\", then\nstops the pump";
  result.sifs.push_back(s);
  const std::string csv = report::sif_csv(result);
  EXPECT_NE(csv.find("\r\n\"S,1\",\"closes \"\"XV-1\"\", then\nstops the pump\",low,"), std::string::npos);
  const auto rows = parse_csv(csv);
  ASSERT_EQ(rows.size(), 2u);
  EXPECT_EQ(rows[1][0], "S,1");
  EXPECT_EQ(rows[1][1], "closes \"XV-1\", then\nstops the pump");
  EXPECT_EQ(rows[1][13], "");  // not judged: empty, and the verdict in words beside it
  EXPECT_EQ(rows[1][14], "not judged");
}

TEST(SifCsv, NamesWhatKeepsAFunctionBelowItsTarget) {
  const auto dir = fresh_folder("sif_csv_short");
  const auto r = run_sifter("check examples/unit50_shortfall.json --quiet --csv " + (dir / "s.csv").string());
  EXPECT_EQ(r.exit_code, 1) << r.err;
  const auto rows = parse_csv(slurp(dir / "s.csv"));
  ASSERT_GE(rows.size(), 2u);
  EXPECT_EQ(rows[1][13], "false");
  EXPECT_EQ(rows[1][14], "falls short");
  EXPECT_FALSE(rows[1][15].empty());
}

}  // namespace
}  // namespace sifter
