// Specification of the terminal summary: fitted to the terminal's width, filtered, summarised.
#include "sifter/report/terminal.hpp"

#include <gtest/gtest.h>

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "sifter/report/text_table.hpp"
#include "support/cli_support.hpp"

namespace sifter {
namespace {

using testing::run_sifter;
using testing::slurp;

const char* const kExamples[] = {"unit40", "unit50_shortfall", "unit60_existing_logic_solver"};

// `sifter check` as a user at a terminal of `columns` columns runs it (COLUMNS, stdout a pipe).
testing::RunResult check_at(const std::string& args, std::size_t columns) {
  ::setenv("COLUMNS", std::to_string(columns).c_str(), 1);
  auto r = run_sifter("check " + args);
  ::unsetenv("COLUMNS");
  return r;
}

// Every line longer than the width is one unbreakable token (after its indent).
std::string lines_too_wide(const std::string& text, std::size_t width) {
  std::istringstream in(text);
  std::string bad;
  for (std::string line; std::getline(in, line);) {
    if (report::display_width(line) <= width) continue;
    const auto start = line.find_first_not_of(' ');
    if (line.find(' ', start) != std::string::npos) bad += line + "\n";
  }
  return bad;
}

// Golden outputs: reviewed by eye once, then kept. SIFTER_UPDATE_GOLDEN=1 rewrites them after
// an intended change (and the diff is reviewed before it is committed).
void expect_golden(const std::string& output, const std::string& name) {
  const std::filesystem::path file = std::filesystem::path(SIFTER_TEST_DATA) / "terminal" / name;
  if (std::getenv("SIFTER_UPDATE_GOLDEN")) {
    std::ofstream(file, std::ios::binary) << output;
    return;
  }
  ASSERT_TRUE(std::filesystem::exists(file)) << file << " is missing; SIFTER_UPDATE_GOLDEN=1 writes it";
  EXPECT_EQ(output, slurp(file)) << "terminal output differs from " << file;
}

class TerminalGolden : public ::testing::TestWithParam<std::tuple<const char*, std::size_t>> {};

TEST_P(TerminalGolden, ExampleAtThisWidthMatchesItsReviewedOutput) {
  const auto [example, width] = GetParam();
  const auto r = check_at(std::string("examples/") + example + ".json", width);
  ASSERT_TRUE(r.exit_code == 0 || r.exit_code == 1) << r.err;
  expect_golden(r.out, std::string(example) + "_" + std::to_string(width) + ".txt");
}

TEST_P(TerminalGolden, NoLineIsWiderThanTheTerminalExceptOneUnbreakableToken) {
  const auto [example, width] = GetParam();
  for (const char* mode : {"", " --summary"}) {
    const auto r = check_at(std::string("examples/") + example + ".json" + mode, width);
    EXPECT_EQ(lines_too_wide(r.out, width), "") << example << mode << " at " << width;
  }
}

INSTANTIATE_TEST_SUITE_P(ExamplesAt80And120, TerminalGolden,
                         ::testing::Combine(::testing::ValuesIn(kExamples), ::testing::Values(80, 120)));

TEST(TerminalWidth, EvenFortyColumnsHoldEveryLineOfTheExamplesButUnbreakableTokens) {
  for (const char* example : kExamples) {
    const auto r = check_at(std::string("examples/") + example + ".json", 40);
    EXPECT_EQ(lines_too_wide(r.out, 40), "") << example;
    EXPECT_NE(r.out.find("CAUTION: sifter is a calculation aid"), std::string::npos);
  }
}

TEST(TerminalWidth, WithoutATerminalOrColumnsTheSummaryIsFittedToOneHundred) {
  ::unsetenv("COLUMNS");
  const auto r = run_sifter("check examples/unit40.json");
  EXPECT_EQ(lines_too_wide(r.out, 100), "");
  EXPECT_NE(lines_too_wide(r.out, 80), "");  // the worksheet uses the room it has
}

// Every line of `text`, without its indent, is at most `width` wide.
bool every_line_fits(const std::string& text, std::size_t indent, std::size_t width) {
  std::istringstream lines(text);
  std::string line;
  while (std::getline(lines, line))
    if (report::display_width(line) > indent + width) return false;
  return true;
}

TEST(ProseWrap, AnItemThatHangsUnderItsDashStillFitsTheWidth) {
  // Four-letter words fill a plain line of 29 exactly: a hanging line that held as much would be
  // 31 wide after the indent (as wrap wrote it before).
  std::string item = "-";
  for (int i = 0; i < 24; ++i) item += " word";
  const std::string out = report::wrap(item, 29, "    ");
  EXPECT_TRUE(every_line_fits(out, 4, 29)) << out;
  EXPECT_EQ(out.substr(0, 6), "    - ");
  EXPECT_NE(out.find("\n      "), std::string::npos) << "later lines hang under the text:\n" << out;
}

TEST(ProseWrap, PlainTextFillsEachLineToTheWidth) {
  EXPECT_EQ(report::wrap("one two three four", 9, ""), "one two\nthree\nfour\n");
  EXPECT_EQ(report::wrap("one two three four", 13, "  "), "  one two three\n  four\n");
}

TEST(ProseWidth, ProseStopsAtNinetySixColumnsOrAtANarrowerTerminal) {
  EXPECT_EQ(report::prose_width(200), 96u);
  EXPECT_EQ(report::prose_width(80), 80u);
}

TEST(TextTable, ANarrowTableBreaksItsWrappingColumnBetweenWordsNeverInsideOne) {
  report::TextTable t({"tag", "title", "value"}, {false, false, true});
  t.set_fit({report::Fit::kKeep, report::Fit::kWrap, report::Fit::kKeep});
  t.add_row({"XV-1", "outlet isolation valve on the liquid line", "4.4e-03"});
  EXPECT_EQ(t.render("", 30),
            "tag   title              value\n"
            "XV-1  outlet           4.4e-03\n"
            "      isolation valve\n"
            "      on the liquid\n"
            "      line\n");
}

TEST(TextTable, AColumnMarkedBelowGoesUnderItsRowWhenTheTableIsTooWide) {
  report::TextTable t({"step", "frequency", "note"}, {false, true, false});
  t.set_fit({report::Fit::kKeep, report::Fit::kKeep, report::Fit::kBelow});
  t.add_row({"cause C1", "1.00e-01", "shares device DCS-4 with the cause"});
  EXPECT_EQ(t.render("  ", 30),
            "  step      frequency\n"
            "  cause C1   1.00e-01\n"
            "      note: shares device\n"
            "        DCS-4 with the cause\n");
}

TEST(TextTable, ATableThatCannotFitIsStackedAsHeaderAndValueLines) {
  report::TextTable t({"component", "rate"}, {false, true});
  t.add_row({"pressure-transmitter-PT-4001A", "2.50e-07/h"});
  EXPECT_EQ(t.render("", 20), "pressure-transmitter-PT-4001A\n  rate: 2.50e-07/h\n");
}

TEST(TextTable, ATableThatFitsIsLaidOutAsWithoutALimit) {
  report::TextTable t({"a", "b"});
  t.add_row({"x", "y"});
  EXPECT_EQ(t.render("  ", 80), t.render("  "));
}

TEST(CheckFilter, OnlyTheChosenSifAndTheScenariosThatFeedItAreShownInFull) {
  const auto r = check_at("examples/unit40.json --sif SIF-401", 100);
  EXPECT_EQ(r.exit_code, 0) << r.err;
  EXPECT_NE(r.out.find("\nSIF-401  "), std::string::npos);
  EXPECT_EQ(r.out.find("\nSIF-402  "), std::string::npos);
  EXPECT_NE(r.out.find("Scenario LOPA-401-1"), std::string::npos);
  EXPECT_EQ(r.out.find("Scenario LOPA-402"), std::string::npos);
}

TEST(CheckFilter, TheOptionRepeatsAndAnUnknownIdIsAUsageError) {
  const auto two = check_at("examples/unit40.json --sif SIF-401 --sif SIF-403", 100);
  EXPECT_NE(two.out.find("\nSIF-401  "), std::string::npos);
  EXPECT_NE(two.out.find("\nSIF-403  "), std::string::npos);
  EXPECT_EQ(two.out.find("\nSIF-402  "), std::string::npos);
  const auto before = check_at("--sif SIF-402 examples/unit40.json", 100);  // one id per --sif
  EXPECT_EQ(before.exit_code, 0) << before.err;
  EXPECT_NE(before.out.find("\nSIF-402  "), std::string::npos);
  const auto bad = check_at("examples/unit40.json --sif SIF-999", 100);
  EXPECT_EQ(bad.exit_code, 2);
  EXPECT_NE(bad.err.find("SIF-999"), std::string::npos);
}

TEST(CheckEnding, TheSifsAndScenariosThatFallShortAreListedByIdAtTheEnd) {
  const auto r = check_at("examples/unit50_shortfall.json", 100);
  EXPECT_EQ(r.exit_code, 1);
  const auto list = r.out.find("Falling short\n");
  ASSERT_NE(list, std::string::npos) << r.out;
  EXPECT_LT(list, r.out.find("CAUTION:"));
  EXPECT_NE(r.out.find("- SIF ", list), std::string::npos);
}

TEST(CheckEnding, AProjectWhereEverythingMeetsItsTargetHasNoShortfallList) {
  const auto r = check_at("examples/unit40.json", 100);
  EXPECT_EQ(r.out.find("Falling short"), std::string::npos);
}

TEST(CheckQuiet, QuietPrintsNoSummaryButStillTheWarningsOnStderr) {
  const auto full = check_at("examples/unit40.json", 100);
  const auto quiet = check_at("examples/unit40.json --quiet", 100);
  EXPECT_EQ(quiet.out, "");
  EXPECT_EQ(quiet.exit_code, full.exit_code);
  ASSERT_NE(full.out.find("Warnings\n"), std::string::npos) << "the example should carry a warning";
  EXPECT_NE(quiet.err.find("sifter: warning: "), std::string::npos) << quiet.err;
}

// A register of `n` copies of one SIF, ids S1..Sn.
ProjectResult register_of(std::size_t n) {
  ProjectResult r;
  r.file = "register.json";
  for (std::size_t i = 1; i <= n; ++i) {
    SifResult s;
    s.id = "S" + std::to_string(i);
    s.title = "copy";
    s.pfd_avg = 2e-3;
    s.rrf = 500.0;
    s.sil_probability = 2;
    s.sil_architecture = 2;
    s.sil_systematic = 3;
    s.sil_achieved = 2;
    s.sil_required = i == n ? 3 : 2;
    s.meets_target = i != n;
    s.limits.push_back({"probability", std::nullopt, std::nullopt, 2, "PFDavg above the SIL 3 band"});
    r.sifs.push_back(s);
  }
  return r;
}

TEST(CheckSummary, AboveTheThresholdEachSifTakesOneLineAndTheFailingOnesCloseTheRun) {
  const std::string small = report::render_terminal(register_of(report::kSummaryAboveSifs));
  EXPECT_NE(small.find("  demand mode  "), std::string::npos);  // full blocks
  const std::string large = report::render_terminal(register_of(report::kSummaryAboveSifs + 1));
  EXPECT_EQ(large.find("  demand mode  "), std::string::npos);
  EXPECT_NE(large.find("SIFs (one line each"), std::string::npos);
  EXPECT_NE(large.find("  S21  low"), std::string::npos) << large;
  EXPECT_NE(large.find("- SIF S21: achieved SIL 2, required SIL 3; probability: SIL 2"), std::string::npos) << large;
}

TEST(CheckSummary, TheSummaryFlagGivesOneLinePerSifOnASmallProjectAndSifGivesFullBlocks) {
  report::TerminalOptions o;
  o.summary = true;
  EXPECT_NE(report::render_terminal(register_of(2), o).find("SIFs (one line each"), std::string::npos);
  report::TerminalOptions chosen;
  chosen.sifs = {"S30"};
  const std::string one = report::render_terminal(register_of(40), chosen);
  EXPECT_NE(one.find("\nS30  copy\n  demand mode"), std::string::npos) << one;
  EXPECT_EQ(one.find("\nS29  "), std::string::npos);
}

}  // namespace
}  // namespace sifter
