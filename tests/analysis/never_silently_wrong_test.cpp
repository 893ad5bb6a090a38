// Specification of "never silently wrong": what loading refuses or warns about beyond the
// catalogue (tests/data/bad), what the writers may print, whole outputs, hostile text, and
// exit status 2 (never 3) for every argument out of range.
#include <gtest/gtest.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cmath>
#include <csignal>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <functional>
#include <nlohmann/json.hpp>
#include <random>

#include "sifter/analysis/verify.hpp"
#include "sifter/analysis/whatif.hpp"
#include "sifter/input/load.hpp"
#include "sifter/model/printable.hpp"
#include "sifter/report/json_results.hpp"
#include "sifter/report/output_file.hpp"
#include "support/cli_support.hpp"

namespace sifter {
namespace {

namespace fs = std::filesystem;
using nlohmann::json;
using testing::fresh_folder;
using testing::run_sifter;
using testing::slurp;

// An invented one-SIF project with a scenario; tests change what they need.
json project() {
  return json::parse(R"({
    "format": "sifter-project/1", "title": "invented test unit",
    "defaults": {"proof_test_interval": "1 yr", "mttr": "8 h"},
    "components": [
      {"id": "TT-1", "lambda_du": "120 FIT", "lambda_dd": "380 FIT"},
      {"id": "PLC-1", "lambda_du": "20 FIT", "lambda_dd": "980 FIT"},
      {"id": "XV-1", "lambda_du": "900 FIT"}],
    "risk_criteria": {"people": {"B": "1e-4/yr"}},
    "sifs": [{"id": "SIF-1", "title": "invented trip", "demand_mode": "low", "target": {"sil": 1}, "subsystems": [
      {"name": "sensor", "role": "sensor", "vote": "1oo1", "channels": ["TT-1"]},
      {"name": "logic", "role": "logic", "vote": "1oo1", "channels": ["PLC-1"]},
      {"name": "valve", "role": "final", "vote": "1oo1", "channels": ["XV-1"]}]}],
    "scenarios": [{"id": "S-1", "consequences": [{"category": "people", "severity": "B"}],
      "causes": [{"id": "C-1", "frequency": "0.1/yr"}],
      "layers": [{"id": "PSV-1", "kind": "relief_device", "pfd": 0.01}, {"sif": "SIF-1"}]}]})");
}

fs::path write_project(const fs::path& dir, const json& p, const std::string& name = "p.json") {
  std::ofstream(dir / name) << p.dump(2);
  return dir / name;
}

ProjectResult checked(const json& p) { return verify_project(load_project_text(p.dump(), "p.json", ".")); }

std::string load_error(const json& p) {
  try {
    load_project_text(p.dump(), "p.json", ".");
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

bool temp_files_in(const fs::path& dir) {
  for (const auto& e : fs::directory_iterator(dir))
    if (e.path().filename().string().find(".tmp-") != std::string::npos) return true;
  return false;
}

// --- The signal path ----------------------------------------------------------------------

TEST(SignalPath, ASifWithoutAFinalElementIsWarnedInItsBlockAndInWarnings) {
  json p = project();
  p["sifs"][0]["subsystems"].erase(2);
  const ProjectResult r = checked(p);
  const std::string expected =
      "the SIF has no final-element subsystem; its figure leaves that part out (state why under "
      "\"path_exception\" if this is intended)";
  ASSERT_FALSE(r.sifs[0].warnings.empty());
  EXPECT_EQ(r.sifs[0].warnings[0], expected);
  bool listed = false;
  for (const auto& w : r.warnings) listed = listed || (w.where == "/sifs/0" && w.message == expected);
  EXPECT_TRUE(listed);
}

TEST(SignalPath, TwoLogicSubsystemsAndNoSensorAreWarned) {
  json p = project();
  p["sifs"][0]["subsystems"][0]["role"] = "logic";
  const ProjectResult r = checked(p);
  ASSERT_FALSE(r.sifs[0].warnings.empty());
  EXPECT_EQ(r.sifs[0].warnings[0].rfind("the SIF has no sensor subsystem; ", 0), 0u);
}

TEST(SignalPath, ASifOfOneFinalElementAloneIsWarnedThatItHasNoSensor) {
  json p = project();
  p["sifs"][0]["subsystems"].erase(0);
  p["sifs"][0]["subsystems"].erase(0);
  const ProjectResult r = checked(p);
  ASSERT_FALSE(r.sifs[0].warnings.empty());
  EXPECT_EQ(r.sifs[0].warnings[0],
            "the SIF has no sensor subsystem; its figure leaves that part out (state why under "
            "\"path_exception\" if this is intended)");
}

TEST(SignalPath, AStatedExceptionIsQuotedBack) {
  json p = project();
  p["sifs"][0]["subsystems"].erase(0);
  p["sifs"][0]["path_exception"] = "the trip comes from a hard-wired pressure switch outside this SIF";
  const ProjectResult r = checked(p);
  ASSERT_FALSE(r.sifs[0].warnings.empty());
  EXPECT_EQ(r.sifs[0].warnings[0],
            "the SIF has no sensor subsystem; stated exception: \"the trip comes from a hard-wired pressure switch "
            "outside this SIF\"");
}

TEST(SignalPath, TheTerminalShowsTheWarningInTheSifsBlock) {
  const auto dir = fresh_folder("nsw_block");
  json p = project();
  p["sifs"][0]["subsystems"].erase(2);
  const auto r = run_sifter("check " + write_project(dir, p).string());
  const auto block = r.out.find("SIF-1  invented trip");
  const auto warning = r.out.find("! the SIF has no final-element subsystem", block);
  ASSERT_NE(block, std::string::npos) << r.out;
  EXPECT_NE(warning, std::string::npos) << r.out;
  EXPECT_LT(warning, r.out.find("Warnings\n")) << "the warning comes first in the SIF's own block";
}

// --- Layers -------------------------------------------------------------------------------

TEST(LayerCredit, AReliefDeviceClaimingOneInABillionIsAFinding) {
  json p = project();
  p["scenarios"][0]["layers"][0]["pfd"] = 1e-9;
  const ProjectResult r = checked(p);
  bool found = false;
  for (const auto& f : r.scenarios[0].findings)
    found = found || (f.kind == FindingKind::kImplausiblyLowPfd &&
                      f.message ==
                          "Layer PSV-1 claims PFD 1e-9, below the 1e-5 that any single protection layer is credited "
                          "with in practice; justify it or use a higher PFD.");
  EXPECT_TRUE(found);
}

TEST(LayerCredit, APfdOfOneInAHundredThousandIsNotQuestioned) {
  json p = project();
  p["scenarios"][0]["layers"][0]["pfd"] = 1e-5;
  const ProjectResult r = checked(p);  // the result outlives the loop over its findings
  for (const auto& f : r.scenarios[0].findings) EXPECT_NE(f.kind, FindingKind::kImplausiblyLowPfd);
}

// --- Probabilities ------------------------------------------------------------------------

TEST(RequiredPfd, IsCappedAtOneAndSaysNoSifIsNeeded) {
  json p = project();
  p["scenarios"][0]["causes"][0]["frequency"] = "1e-5/yr";  // ten times below the tolerable 1e-4/yr
  const ProjectResult r = checked(p);
  ASSERT_TRUE(r.sifs[0].required_pfd);
  EXPECT_EQ(*r.sifs[0].required_pfd, 1.0);
  EXPECT_NE(r.sifs[0].target_text.find("no SIF needed"), std::string::npos) << r.sifs[0].target_text;
  EXPECT_LE(r.scenarios[0].required_pfd, 1.0);
}

// The simplified sum leaves the equations' validity: the verdict rests on the exact figure
// (issue "one truth": judged figure), and no printed probability exceeds 1.
TEST(Probabilities, ASimplifiedSumAboveOneIsShownAsOneAndSaysWhy) {
  const auto dir = fresh_folder("nsw_above_one");
  json p = project();
  p["components"][2]["lambda_du"] = "5e-4/h";  // lDU T1 = 4.4 over ten years
  p["sifs"][0]["subsystems"][2]["proof_test_interval"] = "10 yr";
  const auto r = run_sifter("check " + write_project(dir, p).string() + " --json - -q");
  ASSERT_EQ(r.exit_code, 1) << r.err;
  const json out = json::parse(r.out);
  const json& sif = out["sifs"][0];
  EXPECT_LE(sif["pfd_avg"].get<double>(), 1.0);
  EXPECT_EQ(sif["pfd_avg_simplified"].get<double>(), 1.0);
  EXPECT_EQ(sif["judged_on"].get<std::string>(), "exact");
  for (const auto& sub : sif["subsystems"]) EXPECT_LE(sub["pfd_avg"].get<double>(), 1.0);
  EXPECT_FALSE(sif["meets_target"].get<bool>());
  bool said = false;
  for (const auto& w : sif["warnings"])
    said = said ||
           w.get<std::string>().find("outside the validity of the IEC 61508-6 Annex B equations") != std::string::npos;
  EXPECT_TRUE(said) << sif.dump(2);
  for (const auto& s : out["scenarios"])
    EXPECT_LE(s["mitigated_frequency_per_yr"].get<double>(), s["frequency_without_sif_per_yr"].get<double>());
}

// The simplified sum above 1 is shown as 1, and a PFDavg of 1 would meet the required PFD of 1
// of a scenario that needs no SIF: the judge never passes a sum outside the equations'
// validity, on the simplified figure alone (no exact cross-check) and whatever the target.
TEST(Probabilities, AJudgedSumShownAsOneNeverPassesEvenWhereNoSifIsNeeded) {
  json p = project();
  p["scenarios"][0]["causes"][0]["frequency"] = "1e-5/yr";  // no SIF needed: required PFD 1
  p["sifs"][0].erase("target");
  p["components"][2]["lambda_du"] = "5e-4/h";  // lDU T1 = 43.8 over ten years
  p["sifs"][0]["subsystems"][2]["proof_test_interval"] = "10 yr";
  VerifyOptions simplified_only;
  simplified_only.exact = false;
  const ProjectResult r = verify_project(load_project_text(p.dump(), "p.json", "."), simplified_only);
  const SifResult& sif = r.sifs[0];
  ASSERT_TRUE(sif.required_pfd);
  EXPECT_EQ(*sif.required_pfd, 1.0);
  ASSERT_TRUE(sif.pfd_avg);
  EXPECT_EQ(*sif.pfd_avg, 1.0) << "shown as at most 1";
  ASSERT_TRUE(sif.judged_sum_above_one);
  EXPECT_GT(*sif.judged_sum_above_one, 1.0);
  EXPECT_EQ(sif.meets_target, false) << "1 <= 1 would pass; a sum outside the equations never does";
  bool said = false;
  for (const auto& w : sif.warnings) said = said || w.find("judged short whatever its target") != std::string::npos;
  EXPECT_TRUE(said) << "the SIF's block says why it falls short";
}

// Two supplier figures whose sum exceeds 1, where no SIF is needed: check finds the SIF short,
// and so does the longest-interval solver, which measures the sum, not the 1 it is shown as
// (no interval of the valve can bring it down).
TEST(Probabilities, TheIntervalSolverAgreesThatASumAboveOneFallsShort) {
  json p = project();
  p["scenarios"][0]["causes"][0]["frequency"] = "1e-5/yr";  // no SIF needed: required PFD 1
  p["sifs"][0].erase("target");
  for (int i : {0, 1})
    p["sifs"][0]["subsystems"][i] = {{"name", i == 0 ? "sensor" : "logic"},
                                     {"role", i == 0 ? "sensor" : "logic"},
                                     {"pfd_avg", 0.6},
                                     {"hft", 0},
                                     {"systematic_capability", 3}};
  const LoadedProject loaded = load_project_text(p.dump(), "p.json", ".");
  const ProjectResult checked_result = verify_project(loaded);
  ASSERT_TRUE(checked_result.sifs[0].judged_sum_above_one);
  EXPECT_EQ(checked_result.sifs[0].meets_target, false);
  const WhatIf what_if(loaded.project);
  const IntervalResult interval = longest_proof_test_interval(what_if, 0, std::nullopt, 0.0);
  EXPECT_EQ(interval.outcome, IntervalOutcome::kNone) << "not 'every interval meets it'";
  EXPECT_EQ(interval.measure_at_zero, 1.0) << "never a probability above 1 in what is shown";
  EXPECT_LE(interval.measure_now, 1.0);
  ASSERT_FALSE(interval.notes.empty());
  EXPECT_NE(interval.notes[0].find("judged short whatever the interval"), std::string::npos) << interval.notes[0];
}

TEST(CrossCheck, TheRatioIsWrittenWholeNeverCutToFiveCharacters) {
  const auto dir = fresh_folder("nsw_ratio");
  json p = project();
  p["components"][2]["lambda_du"] = "5e-4/h";
  p["sifs"][0]["subsystems"][2]["proof_test_interval"] = "10 yr";
  const auto r = run_sifter("check " + write_project(dir, p).string());
  const auto at = r.out.find("simplified/exact = ");
  ASSERT_NE(at, std::string::npos) << r.out;
  const std::string figure = r.out.substr(at + 19, r.out.find_first_of(" \n", at + 19) - at - 19);
  EXPECT_EQ(figure.find_first_not_of("0123456789.e+-"), std::string::npos) << figure;
  EXPECT_GT(std::stod(figure), 1.0) << figure;  // the simplified sum exceeds the exact figure
}

// --- The demand mode decided by the LOPA ---------------------------------------------------

TEST(DemandMode, ASupplierPfhOnASifTheLopaMakesLowDemandIsRefusedWithExitTwo) {
  const auto dir = fresh_folder("nsw_mode_lopa");
  json p = project();
  p["sifs"][0].erase("demand_mode");
  p["sifs"][0]["subsystems"][1] = json::parse(R"({"name": "logic", "role": "logic", "pfh": "20 FIT"})");
  const auto r = run_sifter("check " + write_project(dir, p).string() + " --json " + (dir / "o.json").string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("/sifs/0/subsystems/1/pfh: expected the supplier's \"pfd_avg\" for this low-demand SIF "
                       "(demand rate "),
            std::string::npos)
      << r.err;
  EXPECT_FALSE(fs::exists(dir / "o.json"));
}

// --- Outputs, all or nothing ---------------------------------------------------------------

TEST(Outputs, TwoOutputsToTheSameFileAreRefused) {
  const auto dir = fresh_folder("nsw_same_out");
  const auto file = write_project(dir, project());
  const auto r =
      run_sifter("check " + file.string() + " --json " + (dir / "x").string() + " --csv " + (dir / "." / "x").string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("two outputs of this run name the same file"), std::string::npos) << r.err;
  EXPECT_FALSE(fs::exists(dir / "x"));
}

TEST(Outputs, TheProjectsLibraryIsNeverOverwritten) {
  const auto dir = fresh_folder("nsw_library_out");
  std::ofstream(dir / "lib.json") << R"({"format": "sifter-library/1", "models": [{"id": "m", "lambda_du": "1 FIT"}]})";
  json p = project();
  p["libraries"] = {"lib.json"};
  const auto file = write_project(dir, p);
  const std::string before = slurp(dir / "lib.json");
  const auto r = run_sifter("check " + file.string() + " --json " + (dir / "lib.json").string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("it is an input of this run"), std::string::npos) << r.err;
  EXPECT_EQ(slurp(dir / "lib.json"), before);
}

TEST(Outputs, AFailingSecondOutputLeavesNoFirstOutput) {
  if (!fs::exists("/dev/full")) GTEST_SKIP() << "no /dev/full";
  const auto dir = fresh_folder("nsw_dev_full");
  const auto file = write_project(dir, project());
  const auto r = run_sifter("check " + file.string() + " --json " + (dir / "ok.json").string() + " --csv /dev/full");
  EXPECT_EQ(r.exit_code, 2) << r.err;
  EXPECT_FALSE(fs::exists(dir / "ok.json"));
  EXPECT_FALSE(temp_files_in(dir));
}

// A child writes a large output and is sent `sig` before committing: the handler removes
// the temporary file, and the old output stays as it was.
void interrupted_write_leaves_old_output(int sig, const std::string& name) {
  const auto dir = fresh_folder(name);
  std::ofstream(dir / "r.json") << "old results";
  int ready[2];
  ASSERT_EQ(::pipe(ready), 0);
  const pid_t child = ::fork();
  ASSERT_GE(child, 0);
  if (child == 0) {
    report::AtomicOutput out((dir / "r.json").string());
    for (int i = 0; i < 64; ++i) out.stream() << std::string(1 << 20, 'x');
    out.stream().flush();
    const char byte = 1;
    (void)!::write(ready[1], &byte, 1);
    ::pause();  // the signal arrives while the output is still being written
    ::_exit(0);
  }
  char byte = 0;
  ASSERT_EQ(::read(ready[0], &byte, 1), 1);
  EXPECT_TRUE(temp_files_in(dir));  // the temporary file exists while writing
  ::kill(child, sig);
  int status = 0;
  ::waitpid(child, &status, 0);
  ::close(ready[0]);
  ::close(ready[1]);
  ASSERT_TRUE(WIFSIGNALED(status));
  EXPECT_EQ(WTERMSIG(status), sig);
  EXPECT_FALSE(temp_files_in(dir));
  EXPECT_EQ(slurp(dir / "r.json"), "old results");
}

TEST(Outputs, SigintDuringALargeWriteLeavesNoTemporaryFileAndTheOldOutput) {
  interrupted_write_leaves_old_output(SIGINT, "nsw_sigint");
}

TEST(Outputs, SigtermDuringALargeWriteLeavesNoTemporaryFileAndTheOldOutput) {
  interrupted_write_leaves_old_output(SIGTERM, "nsw_sigterm");
}

// --- Hostile text ---------------------------------------------------------------------------

TEST(HostileText, FormulaLikeCsvCellsAreNeutralisedAndNumbersKept) {
  EXPECT_EQ(neutralise_formula("=HYPERLINK(\"x\")"), "'=HYPERLINK(\"x\")");
  EXPECT_EQ(neutralise_formula("+cmd"), "'+cmd");
  EXPECT_EQ(neutralise_formula("-2+3"), "'-2+3");
  EXPECT_EQ(neutralise_formula("@SUM(A1)"), "'@SUM(A1)");
  EXPECT_EQ(neutralise_formula("\tx"), "'\tx");
  EXPECT_EQ(neutralise_formula("\rx"), "'\rx");
  EXPECT_EQ(neutralise_formula("-1.5e-3"), "-1.5e-3");
  EXPECT_EQ(neutralise_formula("+7"), "+7");
  EXPECT_EQ(neutralise_formula("SIF-1"), "SIF-1");
}

TEST(HostileText, ASifTitleThatIsAFormulaReachesTheCsvNeutralised) {
  const auto dir = fresh_folder("nsw_csv");
  json p = project();
  p["sifs"][0]["title"] = "=1+1";
  const auto r = run_sifter("check " + write_project(dir, p).string() + " -q --csv " + (dir / "s.csv").string());
  ASSERT_NE(r.exit_code, 2) << r.err;
  EXPECT_NE(slurp(dir / "s.csv").find(",'=1+1,"), std::string::npos) << slurp(dir / "s.csv");
}

TEST(HostileText, ControlCharactersAreShownEscaped) {
  EXPECT_EQ(escape_controls("a\x1b[2Kb"), "a\\x1b[2Kb");
  EXPECT_EQ(escape_controls("line\rover"), "line\\x0dover");
  EXPECT_EQ(escape_controls("del\x7f"), "del\\x7f");
  EXPECT_EQ(escape_controls("csi\xc2\x9b"
                            "31m"),
            "csi\\u009b31m");
  EXPECT_EQ(escape_controls("keeps\ttab\nand newline, \xc3\xa9 too"), "keeps\ttab\nand newline, \xc3\xa9 too");
}

bool has_control(const std::string& s) {
  for (unsigned char c : s)
    if ((c < 0x20 && c != '\n' && c != '\t') || c == 0x7f) return true;
  return s.find("\xc2\x9b") != std::string::npos;
}

TEST(HostileText, AFakeVerdictInATitleCannotRewriteTheTerminal) {
  const auto dir = fresh_folder("nsw_terminal");
  json p = project();
  p["sifs"][0]["title"] = "x\r\x1b[2K  verdict  MEETS TARGET\x1b]0;owned\x07";
  p["sifs"][0]["target"] = {{"sil", 3}};  // falls short
  const auto file = write_project(dir, p);
  const auto r = run_sifter("check " + file.string());
  EXPECT_EQ(r.exit_code, 1);
  EXPECT_FALSE(has_control(r.out));
  EXPECT_NE(r.out.find("x\\x0d\\x1b[2K  verdict  MEETS TARGET\\x1b]0;owned\\x07"), std::string::npos);
  const auto md = run_sifter("report " + file.string() + " --no-exact -o " + (dir / "r.md").string());
  EXPECT_NE(md.exit_code, 2) << md.err;
  EXPECT_FALSE(has_control(slurp(dir / "r.md")));
  EXPECT_NE(slurp(dir / "r.md").find("\\x1b"), std::string::npos);
}

TEST(HostileText, AnEscapeSequenceInAnUnknownIdIsEscapedInTheErrorMessage) {
  const auto dir = fresh_folder("nsw_error_text");
  json p = project();
  p["sifs"][0]["subsystems"][0]["channels"] = {"TT-\x1b[31m9"};
  const auto r = run_sifter("check " + write_project(dir, p).string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_FALSE(has_control(r.err));
  EXPECT_NE(r.err.find("TT-\\x1b[31m9"), std::string::npos) << r.err;
}

// --- Exit 2, never 3 --------------------------------------------------------------------------

struct BadArguments {
  const char* name;
  const char* args;  ///< after "PROJECT --sif SIF-1"
  const char* message;
};

class OutOfRange : public ::testing::TestWithParam<BadArguments> {};

TEST_P(OutOfRange, IsExitTwoWithAMessage) {
  const auto dir = fresh_folder(std::string("nsw_args_") + GetParam().name);
  const auto file = write_project(dir, project());
  const std::string args = GetParam().args;
  const std::string command = args.substr(0, args.find(' '));
  const auto r = run_sifter(command + " " + file.string() + " --sif SIF-1" + args.substr(args.find(' ')));
  EXPECT_EQ(r.exit_code, 2) << r.err;
  EXPECT_NE(r.err.find(GetParam().message), std::string::npos) << r.err;
}

INSTANTIATE_TEST_SUITE_P(
    WhatIfs, OutOfRange,
    ::testing::Values(BadArguments{"factor_1e200", "sensitivity --factor 1e200",
                                   "the factor must be a number above 1 and at most 10"},
                      BadArguments{"factor_inf", "sensitivity --factor 1e999", "--factor: expected a number"},
                      BadArguments{"sweep_factor_1e300", "sweep --vary lambda_du_factor --from 1 --to 1e300",
                                   "lambda_du_factor: --to must be at most 1000"},
                      BadArguments{"sweep_interval_huge",
                                   "sweep --vary proof_test_interval --from '1 yr' --to '1e300 yr'",
                                   "a proof-test interval for a sweep lies from 1 d to 100 yr"},
                      BadArguments{"sweep_interval_minute",
                                   "sweep --vary proof_test_interval --from '1 min' --to '1 yr'",
                                   "a proof-test interval for a sweep lies from 1 d to 100 yr"},
                      BadArguments{"sweep_mttr_huge", "sweep --vary mttr --from '8 h' --to '1e300 h'",
                                   "an MTTR for a sweep is at most 100 yr"},
                      BadArguments{"sweep_steps_zero", "sweep --vary beta --from 1% --to 5% --steps 0",
                                   "--steps must be from 2 to 1000"},
                      BadArguments{"sweep_steps_huge", "sweep --vary beta --from 1% --to 5% --steps 1000000",
                                   "--steps must be from 2 to 1000"}),
    [](const ::testing::TestParamInfo<BadArguments>& p) { return std::string(p.param.name); });

TEST(ExitCodes, ALibraryThatIsASymbolicLinkLoopIsExitTwo) {
  const auto dir = fresh_folder("nsw_symlink_loop");
  fs::create_symlink(dir / "loop.json", dir / "loop.json");
  json p = project();
  p["libraries"] = {"loop.json"};
  const auto r = run_sifter("check " + write_project(dir, p).string());
  EXPECT_EQ(r.exit_code, 2) << r.err;
  EXPECT_NE(r.err.find("/libraries/0"), std::string::npos) << r.err;
}

#if defined(__SANITIZE_ADDRESS__) || defined(__SANITIZE_THREAD__)
constexpr double kSanitizerSlowdown = 20.0;
#else
constexpr double kSanitizerSlowdown = 1.0;
#endif

// The whole program on a one-minute (one-second) proof test over the 20-year mission: a verdict
// (exit 0 or 1), JSON written, in well under a second; the old engine took 67 s and 6 GB (and
// a one-second interval ended in std::bad_alloc, exit 3).
void answered_quickly(const std::string& interval, const std::string& name) {
  const auto dir = fresh_folder("nsw_" + name);
  json p = project();
  p["sifs"][0]["subsystems"][2]["proof_test_interval"] = interval;
  const auto file = write_project(dir, p);
  const auto start = std::chrono::steady_clock::now();
  const auto r = run_sifter("check " + file.string() + " --json " + (dir / "out.json").string());
  const double seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  EXPECT_TRUE(r.exit_code == 0 || r.exit_code == 1) << r.exit_code << r.err;
  EXPECT_LT(seconds, 1.0 * kSanitizerSlowdown);
  const json out = json::parse(slurp(dir / "out.json"));
  const double pfd = out["sifs"][0]["pfd_avg"].get<double>();
  const double exact = out["sifs"][0]["pfd_avg_exact"].get<double>();
  // The valve is tested so often it hardly counts: about the sensor's and the logic solver's
  // lambda_du T1 / 2 plus their lambda_dd MTTR (M1): 5.26e-4 + 3.0e-6 + 8.8e-5 + 7.8e-6 =
  // 6.25e-4, and 1.6e-7 for the valve.
  EXPECT_GT(exact, 6.0e-4);
  EXPECT_LT(exact, 6.5e-4);
  EXPECT_NEAR(pfd, exact, 0.01 * exact);
}

TEST(BoundedWork, AOneMinuteProofTestOverTwentyYearsIsAnsweredInUnderASecond) {
  answered_quickly("1 min", "one_minute");
}

TEST(BoundedWork, AOneSecondProofTestIsNeitherRefusedNorACrash) { answered_quickly("1 s", "one_second"); }

TEST(BoundedWork, APartialStrokeThatSharesNoCycleWithTheProofTestIsRefusedBeyondTwentyThousandTests) {
  json p = project();
  p["sifs"][0]["subsystems"][2]["partial_stroke"] = {{"interval", "7 min"}, {"coverage", "60%"}};
  EXPECT_NE(load_error(p).find("(at most 20000 tests over the mission of 20 yr)"), std::string::npos) << load_error(p);
  EXPECT_NE(load_error(p).find("choose a partial stroke interval that divides the proof-test interval"),
            std::string::npos);
}

// --- Property: generated projects ------------------------------------------------------------

// Random small projects from invented parts: every printed probability lies in [0, 1], every
// frequency is finite and not negative, and no SIF with a component lacking failure data is
// ever judged (the loader refuses it).
TEST(Property, GeneratedProjectsPrintOnlyProbabilitiesWithinZeroAndOne) {
  std::mt19937 rng(12345);
  auto pick = [&](double lo_exp, double hi_exp) {
    return std::pow(10.0, std::uniform_real_distribution<double>(lo_exp, hi_exp)(rng));
  };
  auto text = [](double v) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.6g", v);
    return std::string(buf);
  };
  int computed = 0, refused_without_data = 0;
  for (int trial = 0; trial < 60; ++trial) {
    json p = project();
    for (auto& c : p["components"]) c["lambda_du"] = text(pick(-9, -3)) + "/h";
    p["sifs"][0]["subsystems"][2]["proof_test_interval"] = text(pick(-1, 1.3)) + " yr";
    p["scenarios"][0]["causes"][0]["frequency"] = text(pick(-6, 1)) + "/yr";
    p["scenarios"][0]["layers"][0]["pfd"] = pick(-6, 0);
    const bool without_data = trial % 5 == 0;
    if (without_data) p["components"][1] = {{"id", "PLC-1"}};
    ProjectResult r;
    try {
      r = checked(p);
    } catch (const InputError& e) {
      EXPECT_TRUE(without_data) << e.what();
      refused_without_data += without_data ? 1 : 0;
      continue;
    }
    ASSERT_FALSE(without_data) << "a component without rates was computed";
    ++computed;
    const json out = report::results_json(r);
    std::function<void(const json&, const std::string&)> walk = [&](const json& j, const std::string& key) {
      if (j.is_object()) {
        for (auto it = j.begin(); it != j.end(); ++it) walk(it.value(), it.key());
      } else if (j.is_array()) {
        for (const auto& e : j) walk(e, key);
      } else if (j.is_number()) {
        const double v = j.get<double>();
        EXPECT_TRUE(std::isfinite(v)) << key;
        if (key.find("pfd") != std::string::npos || key == "share" || key == "modifier_product") {
          EXPECT_TRUE(v >= 0.0 && v <= 1.0) << key << " = " << v;
        }
        if (key.find("frequency") != std::string::npos || key.find("rate") != std::string::npos) {
          EXPECT_GE(v, 0.0) << key;
        }
      }
    };
    walk(out, "");
  }
  EXPECT_GT(computed, 30);
  EXPECT_EQ(refused_without_data, 12);
}

}  // namespace
}  // namespace sifter
