// Every input that once broke sifter (tests/fuzz/crashes/) replayed through the whole check path.
#include <gtest/gtest.h>

#include <algorithm>
#include <cctype>
#include <filesystem>

#include "fuzz/check_path.hpp"
#include "support/cli_support.hpp"

namespace sifter {
namespace {

namespace fs = std::filesystem;

std::vector<std::string> kept_inputs() {
  std::vector<std::string> names;
  for (const auto& e : fs::directory_iterator(fs::path(SIFTER_SOURCE_DIR) / "tests/fuzz/crashes"))
    if (e.path().filename() != "README.md") names.push_back(e.path().filename().string());
  std::sort(names.begin(), names.end());
  return names;
}

fuzzing::Outcome replay(const std::string& name) {
  const auto text = testing::slurp(fs::path(SIFTER_SOURCE_DIR) / "tests/fuzz/crashes" / name);
  return fuzzing::run_check_path(text, std::string(SIFTER_SOURCE_DIR) + "/examples");
}

class FuzzCrash : public ::testing::TestWithParam<std::string> {};

// Load, verify and every writer, as the fuzz target runs them: a refused input is fine, an
// escaped exception (an internal error, a broken invariant) or a sanitizer report is not.
TEST_P(FuzzCrash, GoesThroughTheWholeCheckPathWithoutAnInternalError) { EXPECT_NO_THROW(replay(GetParam())); }

INSTANTIATE_TEST_SUITE_P(FuzzCrashes, FuzzCrash, ::testing::ValuesIn(kept_inputs()), [](const auto& param_info) {
  std::string name = param_info.param;
  std::replace_if(
      name.begin(), name.end(), [](char c) { return !std::isalnum(static_cast<unsigned char>(c)); }, '_');
  return name;
});

TEST(FuzzCrashes, AreKeptAndReplayed) { EXPECT_GE(kept_inputs().size(), 6u); }

TEST(FuzzCrashes, TheInputsFoundSoFarAreNowRefused) {
  // Each once computed (or reported an internal error) where it must be refused as bad input.
  for (const char* name :
       {"fuzz-vote-0oo2-5fbcfa0e.json", "review-vote-k-zero.json", "review-vote-n-zero.json",
        "review-overflow-rate-times-interval.json", "review-underflow-rrf.json", "review-overflow-scenario-rrf.json"})
    EXPECT_EQ(replay(name), fuzzing::Outcome::kRejected) << name;
}

// The fuzz invariants look at what is written too: a PFD above 1 or a negative frequency in
// the results JSON, however deep, is a finding; the shipped example passes them.
TEST(FuzzInvariants, AWrittenPfdAboveOneOrANegativeFrequencyIsAFinding) {
  EXPECT_THROW(fuzzing::check_written(nlohmann::json::parse(R"({"sifs": [{"pfd_avg": 4.39}]})")), std::logic_error);
  EXPECT_THROW(fuzzing::check_written(nlohmann::json::parse(R"({"scenarios": [{"required_pfd": 10}]})")),
               std::logic_error);
  EXPECT_THROW(fuzzing::check_written(nlohmann::json::parse(R"({"s": [{"mitigated_frequency_per_yr": -1e-9}]})")),
               std::logic_error);
  EXPECT_NO_THROW(fuzzing::check_written(nlohmann::json::parse(R"({"sifs": [{"pfd_avg": 1, "rrf": 4.4e33}]})")));
  const auto text = testing::slurp(fs::path(SIFTER_SOURCE_DIR) / "examples/unit40.json");
  EXPECT_EQ(fuzzing::run_check_path(text, std::string(SIFTER_SOURCE_DIR) + "/examples"), fuzzing::Outcome::kComputed);
}

}  // namespace
}  // namespace sifter
