// Specification of the command line: exit statuses, outputs written whole, the examples.
#include <gtest/gtest.h>

#include <cstdlib>
#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>
#include <vector>

#include "sifter/report/text_table.hpp"
#include "support/cli_support.hpp"

namespace sifter {
namespace {

using nlohmann::json;
using report::display_width;
using testing::fresh_folder;
using testing::run_sifter;
using testing::slurp;

TEST(Cli, VersionAndHelpExitZero) {
  const auto v = run_sifter("--version");
  EXPECT_EQ(v.exit_code, 0);
  EXPECT_EQ(v.out, "sifter " SIFTER_VERSION "\n");
  const auto h = run_sifter("check --help");
  EXPECT_EQ(h.exit_code, 0);
  EXPECT_NE(h.out.find("--json"), std::string::npos);
}

// Common practice: help is read in an 80-column terminal, so no line of any command's help is
// wider (CLI11 does not wrap descriptions; sifter's formatter does).
TEST(Cli, EveryCommandsHelpFitsEightyColumns) {
  for (const char* command : {"", "check", "curve", "interval", "sweep", "compare", "sensitivity", "diff", "report",
                              "init", "import", "export", "srs", "service", "options"}) {
    const auto h = run_sifter(std::string(command) + (*command ? " " : "") + "--help");
    EXPECT_EQ(h.exit_code, 0) << command;
    EXPECT_NE(h.out.find("Usage:"), std::string::npos) << command;
    std::istringstream lines(h.out);
    std::string line;
    while (std::getline(lines, line)) EXPECT_LE(line.size(), 80u) << "sifter " << command << " --help: " << line;
  }
  // The caution survives the wrapping, word for word.
  const auto top = run_sifter("--help");
  EXPECT_NE(top.out.find("sifter is a calculation aid: results must be reviewed by a competent\n"
                         "functional-safety practitioner."),
            std::string::npos)
      << top.out;
}

// Common practice, as for the help: what each command prints on the shipped examples fits the
// 80-column terminal it was run in (COLUMNS=80, stdout a pipe), tables and prose alike.
TEST(Cli, EveryCommandsTextOnTheExamplesFitsEightyColumns) {
  const std::vector<std::string> runs = {
      "check examples/unit40.json",
      "check examples/unit50_shortfall.json",
      "check examples/unit60_existing_logic_solver.json",
      "check examples/unit70_booster.json",
      "check examples/unit70_booster_estimate.json",
      "check examples/unit70_requirements.json",
      "interval examples/unit40.json --sif SIF-401",
      "sensitivity examples/unit40.json --sif SIF-401",
      // notes whose items hang under their dash: these had a line of 82 columns before wrap
      // counted the hanging indent
      "sensitivity examples/unit40.json --sif SIF-403",
      "sensitivity examples/unit70_booster.json --sif SIF-701",
      "sweep examples/unit40.json --sif SIF-401 --vary proof_test_interval --from '6 mo' --to '4 yr' --steps 4",
      "compare examples/unit40.json --sif SIF-401 --subsystem 'level sensing' --votes 1oo1,1oo2,2oo3",
      "curve examples/unit40.json --sif SIF-401",
      "diff examples/unit40.json examples/unit50_shortfall.json",
      "service examples/unit40.json examples/records/unit40.json --as-of 2026-06-01",
      "options examples/unit70_booster.json --scenario OP-M-702-by-P-701",
  };
  ::setenv("COLUMNS", "80", 1);
  for (const auto& args : runs) {
    const auto r = run_sifter(args);
    EXPECT_NE(r.exit_code, 2) << args << "\n" << r.err;
    EXPECT_FALSE(r.out.empty()) << args;
    std::istringstream lines(r.out);
    std::string line;
    int number = 0;
    while (std::getline(lines, line)) {
      ++number;
      EXPECT_LE(display_width(line), 80u) << "sifter " << args << ", line " << number << ": " << line;
    }
  }
  ::unsetenv("COLUMNS");
}

TEST(Cli, UnknownOptionIsAUsageErrorWithStatusTwo) {
  const auto r = run_sifter("check examples/unit40.json --jsn out.json");
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("--jsn"), std::string::npos);
}

TEST(Cli, TheShippedExampleMeetsEveryTargetAndExitsZero) {
  const auto r = run_sifter("check examples/unit40.json");
  EXPECT_EQ(r.exit_code, 0) << r.err;
  EXPECT_NE(r.out.find("SIF-401"), std::string::npos);
  EXPECT_NE(r.out.find("MEETS TARGET"), std::string::npos);
  EXPECT_NE(r.out.find("CAUTION: sifter is a calculation aid"), std::string::npos);
  EXPECT_NE(r.out.find("LS-40: SIF-401, SIF-403"), std::string::npos);  // a shared logic solver
}

// The program restarts itself under glibc's heap tunables for speed (src/cli/process_heap.hpp):
// huge pages, heaps grown 64 MiB at a time. An allocator's settings must never change a
// result: every example's results and warnings, on two threads, are the same byte for byte
// with the setup and with SIFTER_PLAIN_HEAP=1.
TEST(Cli, TheHeapSetupChangesNoResult) {
  std::vector<std::string> examples;
  for (const auto& entry : std::filesystem::directory_iterator(std::string(SIFTER_SOURCE_DIR) + "/examples"))
    if (entry.path().extension() == ".json") examples.push_back("examples/" + entry.path().filename().string());
  ASSERT_GE(examples.size(), 6u);
  for (const auto& example : examples) {
    const std::string args = "check " + example + " --threads 2 --json -";
    const auto tuned = run_sifter(args, "env -u GLIBC_TUNABLES -u SIFTER_HEAP_RESTARTED -u SIFTER_PLAIN_HEAP");
    const auto plain = run_sifter(args, "env -u GLIBC_TUNABLES SIFTER_PLAIN_HEAP=1");
    EXPECT_EQ(tuned.exit_code, plain.exit_code) << example;
    EXPECT_EQ(tuned.out, plain.out) << example;
    EXPECT_EQ(tuned.err, plain.err) << example;
    EXPECT_NE(tuned.out.find("\"sifs\""), std::string::npos) << example << ": no results to compare";
  }
}

// Started through its loader (`ld.so sifter ...`, as some packaged installs do), /proc/self/exe
// is the loader: the program must not restart that (the loader would take the subcommand for a
// program to run) but run as usual. A sanitizer's build never restarts: nothing to check.
TEST(Cli, StartedThroughItsLoaderTheProgramRunsAsUsual) {
#if defined(__SANITIZE_ADDRESS__)
  GTEST_SKIP() << "a sanitizer's build does not restart";
#endif
  const std::string loader = "/lib64/ld-linux-x86-64.so.2";  // x86-64's (System V ABI)
  if (!std::filesystem::exists(loader)) GTEST_SKIP() << "no " << loader << " here";
  const std::string args = "check examples/unit40.json --json -";
  const auto usual = run_sifter(args);
  const auto loaded = run_sifter(args, "env -u GLIBC_TUNABLES -u SIFTER_HEAP_RESTARTED " + loader);
  EXPECT_EQ(loaded.exit_code, usual.exit_code) << loaded.err;
  EXPECT_EQ(loaded.out, usual.out);
  EXPECT_NE(loaded.out.find("\"sifs\""), std::string::npos);
}

TEST(Cli, JsonResultsCarryTheContractKeys) {
  const auto r = run_sifter("check examples/unit40.json --json -");
  ASSERT_EQ(r.exit_code, 0) << r.err;
  const json j = json::parse(r.out);
  EXPECT_EQ(j["format"], "sifter-results/1");
  ASSERT_EQ(j["sifs"].size(), 3u);
  const json& s = j["sifs"][0];
  EXPECT_EQ(s["id"], "SIF-401");
  EXPECT_EQ(s["demand_mode"], "low");
  EXPECT_TRUE(s["pfd_avg"].is_number());
  EXPECT_TRUE(s["pfh"].is_null());
  EXPECT_NEAR(s["rrf"].get<double>(), 1.0 / s["pfd_avg"].get<double>(), 1e-9 * s["rrf"].get<double>());
  EXPECT_EQ(s["sil_required"], 2);
  // LOPA-401-1 feeds SIF-401 (CCPS 2001 arithmetic): (0.1 x 0.9 [IPL-1 no credit: shares DCS-4]
  // + 0.3 x 0.9 x 0.1) x 0.01 x 0.5 = 5.85e-4 /yr against 1e-5 /yr: RRF 58.5.
  EXPECT_NEAR(s["required_rrf"].get<double>(), 58.5, 58.5 * 1e-9);
  EXPECT_EQ(s["meets_target"], true);
  ASSERT_EQ(s["subsystems"].size(), 3u);
  double shares = 0.0, sum = 0.0;
  for (const auto& sub : s["subsystems"]) {
    shares += sub["share"].get<double>();
    sum += sub["pfd_avg"].get<double>();
  }
  EXPECT_NEAR(shares, 1.0, 1e-12);
  EXPECT_NEAR(sum, s["pfd_avg"].get<double>(), 1e-15);  // the SIF is the sum of its subsystems
  EXPECT_EQ(s["subsystems"][0]["vote"], "2oo3");
  EXPECT_FALSE(s["assumptions"].empty());
  EXPECT_TRUE(j["warnings"].is_array());
  EXPECT_NE(j["caution"].get<std::string>().find("competent functional-safety practitioner"), std::string::npos);
  // SIF-402's own target is RRF 300; LOPA-402-1 asks 0.1 x 0.1 x 0.2 x 0.3 / 1e-6 = 600: the stricter applies.
  EXPECT_NEAR(j["sifs"][1]["required_rrf"].get<double>(), 600.0, 600.0 * 1e-9);
  ASSERT_EQ(j["scenarios"].size(), 3u);
  EXPECT_EQ(j["scenarios"][0]["sif"], "SIF-401");
  EXPECT_EQ(j["scenarios"][0]["demand_mode"], "low");
  EXPECT_EQ(j["scenarios"][0]["findings"][0]["kind"], "not_independent");
  EXPECT_EQ(j["scenarios"][1]["findings"][0]["kind"], "bpcs_credit_capped");
  EXPECT_EQ(j["scenarios"][2]["findings"][0]["kind"], "response_time");
  EXPECT_NEAR(j["scenarios"][0]["mitigated_frequency_per_yr"].get<double>(),
              5.85e-4 * j["sifs"][0]["pfd_avg"].get<double>(), 1e-15);
}

TEST(Cli, WorksheetCsvHasOneRowPerStep) {
  const auto dir = fresh_folder("worksheet");
  const auto out = dir / "ws.csv";
  const auto r = run_sifter("check examples/unit40.json --quiet --worksheet-csv " + out.string());
  ASSERT_EQ(r.exit_code, 0) << r.err;
  const std::string csv = slurp(out);
  EXPECT_EQ(
      csv.rfind("scenario,consequence,step,cause,item,title,value,credited,frequency_per_yr,required_rrf,note\r\n", 0),
      0u);
  // A title with a comma is quoted (RFC 4180).
  EXPECT_NE(csv.find("\"high level alarm, operator closes the inlet\""), std::string::npos);
}

// On a register (more than 20 SIFs) check prints one line per SIF and builds no worksheet rows;
// a SIF chosen with --sif still gets its scenarios' full worksheets, row for row as on the small
// project.
TEST(Cli, ASifChosenOnARegisterShowsItsScenariosWorksheetsInFull) {
  json big = json::parse(slurp(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json"));
  big["libraries"] = {std::string(SIFTER_SOURCE_DIR) + "/data/components/illustrative.json"};
  const json last = big["sifs"].back();
  for (int k = 0; big["sifs"].size() <= 20; ++k) {  // copies no scenario credits
    json copy = last;
    copy["id"] = "COPY-" + std::to_string(k);
    big["sifs"].push_back(copy);
  }
  const auto dir = fresh_folder("register_sif");
  const auto file = dir / "register.json";
  std::ofstream(file) << big.dump();
  auto worksheet_of = [](const std::string& text) {  // from the first scenario to the SIF's block
    const auto from = text.find("\nScenario ");
    const auto to = text.find("\nSIF-401 ", from);
    return from == std::string::npos ? std::string() : text.substr(from, to - from);
  };
  const auto chosen = run_sifter("check " + file.string() + " --sif SIF-401");
  const auto small = run_sifter("check examples/unit40.json --sif SIF-401");
  ASSERT_EQ(chosen.exit_code, small.exit_code) << chosen.err;
  const std::string rows = worksheet_of(small.out);
  ASSERT_NE(rows.find("cause C1"), std::string::npos) << small.out;
  EXPECT_EQ(worksheet_of(chosen.out), rows);
  const auto lines = run_sifter("check " + file.string());
  EXPECT_EQ(worksheet_of(lines.out), "") << "one line per scenario on a register";
}

TEST(Cli, AFunctionThatFallsShortExitsOne) {
  const auto r = run_sifter("check examples/unit50_shortfall.json --json -");
  EXPECT_EQ(r.exit_code, 1);
  const json j = json::parse(r.out);
  EXPECT_EQ(j["sifs"][0]["meets_target"], false);
  EXPECT_EQ(j["sifs"][1]["meets_target"], true);
}

TEST(Cli, BadInputExitsTwoAndWritesNothing) {
  const auto dir = fresh_folder("bad_input");
  const auto out = dir / "results.json";
  const auto r = run_sifter("check tests/data/bad/typo_in_key.json --json " + out.string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("proof_test_intervall"), std::string::npos);
  EXPECT_FALSE(std::filesystem::exists(out));
  EXPECT_TRUE(std::filesystem::is_empty(dir));  // no temporary file left behind either
}

TEST(Cli, BadInputLeavesAnEarlierResultsFileUntouched) {
  const auto dir = fresh_folder("keep_old");
  const auto out = dir / "results.json";
  std::ofstream(out) << "earlier results";
  run_sifter("check tests/data/bad/unknown_component.json --json " + out.string());
  EXPECT_EQ(slurp(out), "earlier results");
}

TEST(Cli, ResultsFileIsWrittenWhole) {
  const auto dir = fresh_folder("whole");
  const auto out = dir / "results.json";
  const auto r = run_sifter("check examples/unit40.json --quiet --json " + out.string());
  EXPECT_EQ(r.exit_code, 0) << r.err;
  EXPECT_TRUE(r.out.empty());
  EXPECT_EQ(json::parse(slurp(out))["sifs"].size(), 3u);
}

TEST(Cli, RefusesToOverwriteItsOwnInput) {
  const auto dir = fresh_folder("self");
  const auto project = dir / "p.json";
  std::filesystem::copy_file(std::string(SIFTER_SOURCE_DIR) + "/tests/data/bad/typo_in_key.json", project);
  const std::string before = slurp(project);
  const auto r = run_sifter("check " + project.string() + " --json " + project.string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("refusing to write"), std::string::npos);
  EXPECT_EQ(slurp(project), before);
}

TEST(Cli, AMissingProjectFileIsNamed) {
  const auto r = run_sifter("check no/such/file.json");
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_EQ(r.err,
            "sifter: no/such/file.json: expected a readable file, found no file at \"no/such/file.json\"\n"
            "  hint: check the path\n1 problem in the input; nothing was computed or written\n");
}

}  // namespace
}  // namespace sifter

namespace sifter {
namespace {

TEST(CliCurve, WritesTheExactSawtoothWithEveryTestInstant) {
  const auto r = run_sifter("curve examples/unit40.json --sif SIF-401 --points 20 --json -");
  ASSERT_EQ(r.exit_code, 0) << r.err;
  const auto j = nlohmann::json::parse(r.out);
  const auto& t = j["time_h"];
  ASSERT_GT(t.size(), 20u);
  EXPECT_DOUBLE_EQ(t.front().get<double>(), 0.0);
  EXPECT_DOUBLE_EQ(t.back().get<double>(), 20 * 8760.0);
  // The outlet valve is tested every 6 mo (4380 h): the curve holds that instant (twice: before and after).
  int at_first_test = 0;
  for (const auto& v : t) at_first_test += v.get<double>() == 4380.0 ? 1 : 0;
  EXPECT_EQ(at_first_test, 2);
  EXPECT_EQ(j["subsystems"].size(), 3u);
  // The average of the curve's engine is the check's pfd_avg_exact.
  const auto check = nlohmann::json::parse(run_sifter("check examples/unit40.json --json -").out);
  EXPECT_NEAR(j["pfd_avg_exact"].get<double>(), check["sifs"][0]["pfd_avg_exact"].get<double>(), 1e-12);
}

TEST(CliCurve, AnUnknownSifIsAUsageErrorListingTheKnownOnes) {
  const auto r = run_sifter("curve examples/unit40.json --sif SIF-9");
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_EQ(r.err, "sifter: no SIF \"SIF-9\" in examples/unit40.json; its SIFs are: SIF-401, SIF-402, SIF-403\n");
}

TEST(CliCheck, NoExactSkipsTheCrossCheck) {
  const auto j = nlohmann::json::parse(run_sifter("check examples/unit40.json --no-exact --json -").out);
  EXPECT_TRUE(j["sifs"][0]["pfd_avg_exact"].is_null());
  const auto k = nlohmann::json::parse(run_sifter("check examples/unit40.json --json -").out);
  EXPECT_TRUE(k["sifs"][0]["pfd_avg_exact"].is_number());
}

TEST(CliCheck, TheSameSeedGivesTheSameUncertaintyWhateverTheThreads) {
  const auto one =
      nlohmann::json::parse(run_sifter("check examples/unit40.json --samples 4000 --seed 7 --threads 1 --json -").out);
  const auto two =
      nlohmann::json::parse(run_sifter("check examples/unit40.json --samples 4000 --seed 7 --threads 2 --json -").out);
  EXPECT_EQ(one["sifs"][1]["uncertainty"], two["sifs"][1]["uncertainty"]);
  EXPECT_EQ(one["sifs"][1]["uncertainty"]["samples"], 4000);
}

}  // namespace
}  // namespace sifter

namespace sifter {
namespace {

// One function limited by each of the three results: the right limit, exit status 1.
struct LimitedCase {
  const char* project;
  const char* sif;
  const char* kind;
  const char* subsystem;  // "" when the limit names no subsystem
};

class LimitedBy : public ::testing::TestWithParam<LimitedCase> {};

TEST_P(LimitedBy, TheLimitIsNamedAndTheExitStatusIsOne) {
  const auto& c = GetParam();
  const auto r = run_sifter(std::string("check ") + c.project + " --json -");
  ASSERT_EQ(r.exit_code, 1) << r.err;
  const auto j = nlohmann::json::parse(r.out);
  const nlohmann::json* sif = nullptr;
  for (const auto& s : j["sifs"])
    if (s["id"] == c.sif) sif = &s;
  ASSERT_NE(sif, nullptr);
  EXPECT_EQ((*sif)["meets_target"], false);
  bool found = false;
  for (const auto& l : (*sif)["limits"])
    if (l["kind"] == c.kind && (std::string(c.subsystem).empty() || l["subsystem"] == c.subsystem)) found = true;
  EXPECT_TRUE(found) << (*sif)["limits"].dump(2);
  EXPECT_LT((*sif)["sil_achieved"].get<int>(), (*sif)["sil_required"].get<int>());
}

INSTANTIATE_TEST_SUITE_P(ThreeResults, LimitedBy,
                         ::testing::Values(LimitedCase{"examples/unit50_shortfall.json", "SIF-501", "probability", ""},
                                           LimitedCase{"tests/data/good/architecture_limited.json", "S-ARCH",
                                                       "architecture", "valve"},
                                           LimitedCase{"examples/unit60_existing_logic_solver.json", "SIF-601",
                                                       "systematic", "existing shutdown logic solver"}));

TEST(CliLimits, TheExistingLogicSolverExampleSaysWhatWouldLiftIt) {
  const auto r = run_sifter("check examples/unit60_existing_logic_solver.json");
  EXPECT_EQ(r.exit_code, 1);
  EXPECT_NE(
      r.out.find("SIL  probability SIL 3 | architecture SIL 3 | systematic SIL 2  ->  achieved SIL 2, required SIL 3"),
      std::string::npos)
      << r.out;
  EXPECT_NE(r.out.find("To lift it: use equipment of SC 3 or"), std::string::npos);
}

}  // namespace
}  // namespace sifter
