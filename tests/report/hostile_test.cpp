// Specification of the limits that keep hostile input bounded: each input is refused with a
// clear message and exit status 2, quickly, and nothing is written.
#include <gtest/gtest.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <regex>

#include "sifter/input/json_source.hpp"
#include "sifter/input/load.hpp"
#include "support/catalogue_support.hpp"
#include "support/cli_support.hpp"

namespace sifter {
namespace {

namespace fs = std::filesystem;
using testing::fresh_folder;
using testing::run_sifter;
using testing::slurp;

// A refusal message stays short whatever the input: a few lines of a few hundred characters
// for one problem, and at most kMaxReportedProblems such problems.
constexpr std::size_t kMaxMessageBytes = 8 * 1024;
constexpr std::size_t kMaxManyProblemsBytes = (kMaxReportedProblems + 1) * 2 * 1024;

// Bytes read by this process so far (Linux /proc/self/io, "rchar"): counts every read() call.
std::size_t bytes_read_so_far() {
  std::ifstream io("/proc/self/io");
  std::string key;
  std::size_t value = 0;
  while (io >> key >> value)
    if (key == "rchar:") return value;
  return 0;
}

std::string refusal_of(const std::string& text) {
  try {
    load_project_text(text, "hostile.json", std::string(SIFTER_SOURCE_DIR) + "/examples");
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

// Writes the bytes to a file and runs `sifter check FILE --json OUT`.
struct Checked {
  testing::RunResult run;
  bool output_written = false;
  bool folder_holds_only_input = false;
};

Checked check_file(const std::string& name, const std::string& bytes) {
  const auto dir = fresh_folder("hostile_" + name);
  std::ofstream(dir / "in.json", std::ios::binary) << bytes;
  Checked c;
  c.run = run_sifter("check " + (dir / "in.json").string() + " --json " + (dir / "out.json").string());
  c.output_written = fs::exists(dir / "out.json");
  c.folder_holds_only_input = std::distance(fs::directory_iterator(dir), fs::directory_iterator()) == 1;
  return c;
}

// A valid one-SIF project whose pieces the tests replace.
std::string project_with(const std::string& lambda_du, const std::string& beta = "\"5%\"",
                         const std::string& vendor_pfd = "1e-4", const std::string& title = "\"hostile\"") {
  return R"({"format": "sifter-project/1", "title": )" + title + R"(,
    "defaults": {"proof_test_interval": "1 yr", "mttr": "8 h"},
    "components": [{"id": "A", "lambda_du": )" +
         lambda_du + R"(}, {"id": "B", "lambda_du": )" + lambda_du + R"(}],
    "sifs": [{"id": "S1", "target": {"sil": 1}, "subsystems": [
      {"name": "pair", "role": "sensor", "vote": "1oo2", "channels": ["A", "B"], "beta": )" +
         beta + R"(},
      {"name": "vendor", "role": "logic", "pfd_avg": )" +
         vendor_pfd + R"(}]}]})";
}

// --- Hostile texts through the whole program: exit 2, a short message, nothing written ------

struct HostileText {
  const char* name;
  std::string bytes;
  const char* message;  ///< a part of the refusal, word for word
  std::size_t max_message_bytes = kMaxMessageBytes;
};

void PrintTo(const HostileText& h, std::ostream* os) { *os << h.name; }

class HostileInput : public ::testing::TestWithParam<HostileText> {};

TEST_P(HostileInput, IsRefusedWithExitTwoAShortMessageAndNoOutput) {
  const auto& h = GetParam();
  const Checked c = check_file(h.name, h.bytes);
  EXPECT_EQ(c.run.exit_code, 2) << c.run.err;
  EXPECT_NE(c.run.err.find(h.message), std::string::npos) << c.run.err.substr(0, 2000);
  EXPECT_NE(c.run.err.find("nothing was computed or written"), std::string::npos);
  EXPECT_LE(c.run.err.size(), h.max_message_bytes);
  EXPECT_TRUE(c.run.out.empty());
  EXPECT_FALSE(c.output_written);
  EXPECT_TRUE(c.folder_holds_only_input);  // no temporary file left behind
}

std::string nested(std::size_t levels) {
  return R"({"format": "sifter-project/1", "note": )" + std::string(levels, '[') + std::string(levels, ']') + "}";
}

std::vector<HostileText> hostile_texts() {
  const std::string ten_mb(10 * 1024 * 1024, 'x');
  std::string many_keys = R"({"format": "sifter-project/1")";
  for (int i = 0; i < 200000; ++i) many_keys += ", \"k" + std::to_string(i) + "\": 0";
  many_keys += "}";
  return {
      {"NestingOneHundredThousandLevelsDeep", nested(100000), "expected nesting no deeper than 64 levels"},
      {"ATenMegabyteKey", "{\"format\": \"sifter-project/1\", \"" + ten_mb + "\": 1}", "... (10485761 bytes)"},
      {"ATenMegabyteUnknownId",
       project_with("\"100 FIT\"")
           .replace(project_with("\"100 FIT\"").find("[\"A\", \"B\"]"), 10, "[\"A\", \"" + ten_mb + "\"]"),
       "expected the id of a component, found \"xxxx"},
      {"TwoHundredThousandUnknownKeys", many_keys, "expected at most 100 problems reported at once, found 199900 more",
       kMaxManyProblemsBytes},
      {"ANumberBeyondDoubleRange", project_with("\"100 FIT\"", "1e400"),
       "expected numbers within the range of finite values, found the number 1e400"},
      {"ARateBeyondDoubleRange", project_with("\"1e400/h\""), "a number beyond the range of finite values"},
      {"NanSpelledAsARate", project_with("\"NaN/h\""), "a rate must be a finite number of zero or more"},
      {"InfinitySpelledAsARate", project_with("\"inf FIT\""), "a rate must be a finite number of zero or more"},
      {"NanSpelledAsAPercentage", project_with("\"100 FIT\"", "\"NaN%\""), "expected a fraction from 0 to 1"},
      {"NanAsAJsonLiteral", project_with("\"100 FIT\"", "NaN"), "expected valid JSON"},
      {"DuplicateKeys", R"({"format": "sifter-project/1", "title": "a", "title": "b"})",
       "found \"title\" a second time"},
      {"DuplicateKeysSpelledWithEscapes", R"({"format": "sifter-project/1", "title": "a", "t\u0069tle": "b"})",
       "found \"title\" a second time"},
      {"AByteOrderMark", "\xEF\xBB\xBF" + project_with("\"100 FIT\""), "expected JSON text without a byte-order mark"},
      {"InvalidUtf8Byte", project_with("\"100 FIT\"", "\"5%\"", "1e-4", "\"\xFF\""), "expected valid JSON"},
      {"AnOverlongUtf8Encoding", project_with("\"100 FIT\"", "\"5%\"", "1e-4", "\"\xC0\xAF\""), "expected valid JSON"},
      {"ATruncatedUtf8Sequence", project_with("\"100 FIT\"", "\"5%\"", "1e-4", "\"\xE2\x82\""), "expected valid JSON"},
      {"AUtf8EncodedSurrogate", project_with("\"100 FIT\"", "\"5%\"", "1e-4", "\"\xED\xA0\x80\""),
       "expected valid JSON"},
      {"ALoneSurrogateEscape", project_with("\"100 FIT\"", "\"5%\"", "1e-4", "\"\\ud800\""), "expected valid JSON"},
      {"ANulByte", std::string("{\"format\": \"sifter-project/1\"") + '\0' + "}", "expected valid JSON"},
      {"AnEmptyFile", "", "expected valid JSON"},
      {"OnlyWhitespace", std::string(1 << 20, ' '), "expected valid JSON"},
      {"ATruncatedProject", project_with("\"100 FIT\"").substr(0, 200), "expected valid JSON"},
      {"AnAbsurdlyHighRate", project_with("\"1e300/h\""), "expected failure rates of at most 1e5/h, found lambda_du"},
      {"ARateWhoseSquareUnderflows", project_with("\"1e-160/h\"", "\"0%\"", "5e-324"),
       "SIF S1 with its RRF beyond the range of finite numbers"},
      {"AScenarioWhoseRequirementOverflows", R"({"format": "sifter-project/1", "scenarios": [{"id": "L1",
         "target_frequency": "1e-300/yr", "causes": [{"id": "C1", "frequency": "1e300/yr"}]}]})",
       "scenario L1 with its required RRF beyond the range of finite numbers"},
      {"AVoteOfZeroChannels", project_with("\"100 FIT\"").replace(project_with("\"100 FIT\"").find("1oo2"), 4, "0oo2"),
       "expected a vote such as \"1oo1\""},
  };
}

INSTANTIATE_TEST_SUITE_P(Hostile, HostileInput, ::testing::ValuesIn(hostile_texts()),
                         [](const auto& param_info) { return std::string(param_info.param.name); });

// --- Size: refused from the file's size, before any byte is read ----------------------------

class BigFile : public ::testing::Test {
 protected:
  void SetUp() override {
    dir_ = fresh_folder("big_file");
    // 300 MiB without writing them: a sparse file, instant on every file system sifter runs on.
    std::ofstream(dir_ / "big.json").close();
    fs::resize_file(dir_ / "big.json", 300u * 1024u * 1024u);
  }
  void TearDown() override { fs::remove_all(dir_); }
  fs::path dir_;
};

TEST_F(BigFile, AProjectAboveTheSizeLimitIsRefusedBeforeAnyByteIsRead) {
  const std::size_t before = bytes_read_so_far();
  std::string message;
  try {
    load_project_file((dir_ / "big.json").string());
  } catch (const InputError& e) {
    message = e.what();
  }
  const std::size_t read = bytes_read_so_far() - before;
  EXPECT_NE(message.find("expected a file of at most 256 MiB, found 300 MiB"), std::string::npos) << message;
  EXPECT_NE(message.find("hint: split the register into several projects"), std::string::npos);
  EXPECT_LT(read, 64u * 1024u);  // not one block of the file: only what the test itself reads
}

TEST_F(BigFile, ALibraryAboveTheSizeLimitIsRefusedWithItsPlace) {
  std::ofstream(dir_ / "p.json") << R"({"format": "sifter-project/1", "libraries": ["big.json"]})";
  const auto r = run_sifter("check " + (dir_ / "p.json").string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("p.json:1:46: /libraries/0: expected a file of at most 256 MiB, found 300 MiB"),
            std::string::npos)
      << r.err;
}

TEST_F(BigFile, TheProgramRefusesItWithExitTwo) {
  const auto r = run_sifter("check " + (dir_ / "big.json").string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("expected a file of at most 256 MiB"), std::string::npos) << r.err;
}

// --- Numbers that must never be printed ------------------------------------------------------

// Every number of a JSON document, however deep.
void numbers_of(const nlohmann::json& j, std::vector<double>& out) {
  if (j.is_number()) out.push_back(j.get<double>());
  if (j.is_structured())
    for (const auto& e : j) numbers_of(e, out);
}

TEST(HostileNumbers, NegativeZeroIsReadAsZeroAndNeverPrinted) {
  const auto dir = fresh_folder("negative_zero");
  std::ofstream(dir / "p.json") << project_with("\"-0/h\"", "-0.0", "1e-4");
  const auto json_run = run_sifter("check " + (dir / "p.json").string() + " --json -");
  ASSERT_NE(json_run.exit_code, 2) << json_run.err;
  std::vector<double> numbers;
  numbers_of(nlohmann::json::parse(json_run.out), numbers);
  ASSERT_FALSE(numbers.empty());
  for (double v : numbers) EXPECT_FALSE(v == 0.0 && std::signbit(v)) << "a -0 in the results";
  const auto text_run = run_sifter("check " + (dir / "p.json").string());
  // "-0", "-0.0", "-0.00e+00" as a number of its own (not "1e-05" or "SIF-01").
  const std::regex negative_zero(R"((^|[^0-9A-Za-z.+-])-0(\.0*)?(e[+-]?0+)?($|[^0-9.]))");
  EXPECT_FALSE(std::regex_search(text_run.out, negative_zero)) << text_run.out;
}

TEST(HostileNumbers, NegativeZeroInTheQuantitiesIsZero) {
  // (A supplier's PFDavg of -0 is 0, which is refused: a probability lies in (0, 1].)
  const auto p = load_project_text(project_with("\"-0 FIT\"", "\"-0%\"", "1e-4"), "p.json", ".").project;
  EXPECT_FALSE(std::signbit(p.components[0].rates.lambda_du.per_hour));
  EXPECT_FALSE(std::signbit(p.sifs[0].subsystems[0].beta));
}

// --- Strings -----------------------------------------------------------------------------

TEST(HostileStrings, ATenMegabyteTitleIsAcceptedAsData) {
  const std::string title(10 * 1024 * 1024, 't');
  const auto loaded =
      load_project_text(project_with("\"100 FIT\"", "\"5%\"", "1e-4", "\"" + title + "\""), "p.json", ".");
  EXPECT_EQ(loaded.project.title.size(), title.size());
}

TEST(HostileStrings, AnUnknownTenMegabyteKeyIsNamedShortened) {
  const std::string key(10 * 1024 * 1024, 'k');
  const std::string message = refusal_of("{\"format\": \"sifter-project/1\", \"" + key + "\": 1}");
  EXPECT_LE(message.size(), kMaxMessageBytes);
  EXPECT_NE(message.find("hostile.json:1:32: /kkkk"), std::string::npos) << message.substr(0, 300);
  EXPECT_NE(message.find("... (10485761 bytes): expected a key of a project, found unknown key \"kkkk"),
            std::string::npos)
      << message.substr(0, 1000);
}

// --- Libraries -----------------------------------------------------------------------------

TEST(HostileLibraries, AProjectThatNamesItselfAsALibraryIsACycle) {
  const auto dir = fresh_folder("self_library");
  std::ofstream(dir / "p.json") << R"({"format": "sifter-project/1", "libraries": ["p.json"]})";
  const auto r = run_sifter("check " + (dir / "p.json").string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("/libraries/0: expected libraries that do not include each other in a cycle, found the cycle "
                       "p.json -> p.json"),
            std::string::npos)
      << r.err;
}

TEST(HostileLibraries, ALibraryPathThatIsADirectoryIsRefused) {
  const auto dir = fresh_folder("dir_library");
  fs::create_directories(dir / "lib");
  std::ofstream(dir / "p.json") << R"({"format": "sifter-project/1", "libraries": ["lib"]})";
  const auto r = run_sifter("check " + (dir / "p.json").string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("/libraries/0: expected a file, found a directory at"), std::string::npos) << r.err;
}

TEST(HostileLibraries, ALibraryPathThatIsADeviceIsRefused) {
  const auto dir = fresh_folder("device_library");
  std::ofstream(dir / "p.json") << R"({"format": "sifter-project/1", "libraries": ["/dev/zero"]})";
  const auto r = run_sifter("check " + (dir / "p.json").string());
  EXPECT_EQ(r.exit_code, 2);
  EXPECT_NE(r.err.find("/libraries/0: expected a regular file, found a special file at \"/dev/zero\""),
            std::string::npos)
      << r.err;
}

// --- The catalogue of bad library setups: tests/data/bad_libraries/NAME.json + NAME.expected ----

class BadLibraries : public ::testing::TestWithParam<std::string> {};

TEST_P(BadLibraries, AreRefusedWithTheirExactMessage) {
  const fs::path dir = fs::path(SIFTER_TEST_DATA) / "bad_libraries";
  const std::string message = testing::catalogue_message(dir, GetParam());
  EXPECT_EQ(message, testing::catalogue_expected(dir, GetParam(), message));
}

std::vector<std::string> library_catalogue() {
  return testing::catalogue_names(fs::path(SIFTER_TEST_DATA) / "bad_libraries");
}

INSTANTIATE_TEST_SUITE_P(LibraryCatalogue, BadLibraries, ::testing::ValuesIn(library_catalogue()),
                         [](const auto& param_info) { return param_info.param; });

// --- The limits themselves ---------------------------------------------------------------

TEST(HostileLimits, AreThoseTheDocumentationStates) {
  // README.md "Limits" and DEVELOPERS.md "Bounds on input" quote these values.
  EXPECT_EQ(kMaxInputBytes, 256u * 1024u * 1024u);
  EXPECT_EQ(kMaxNestingDepth, 64);
  EXPECT_EQ(kMaxReportedProblems, 100u);
}

}  // namespace
}  // namespace sifter
