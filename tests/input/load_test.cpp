// Specification of the project loader: units, strict keys, libraries and every error for people.
#include "sifter/input/load.hpp"

#include <gtest/gtest.h>
#include <unistd.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <memory>
#include <sstream>
#include <string>
#include <vector>

#include "sifter/graph/plant_graph.hpp"
#include "sifter/input/sha256.hpp"
#include "support/catalogue_support.hpp"

namespace sifter {
namespace {

namespace fs = std::filesystem;
constexpr double kRelTol = 1e-12;

// Loads inline JSON as if it were a file in examples/, so that library paths resolve.
LoadedProject load_inline(const std::string& text) {
  return load_project_text(text, "inline.json", std::string(SIFTER_SOURCE_DIR) + "/examples");
}

std::string error_of(const std::string& text) {
  try {
    load_inline(text);
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

// --- The catalogue of malformed projects: tests/data/bad/NAME.json with NAME.expected -------

class BadInput : public ::testing::TestWithParam<std::string> {};

// Each file's message is checked word for word: place, expectation, finding and hint.
TEST_P(BadInput, IsRejectedWithItsExactMessage) {
  const fs::path dir = fs::path(SIFTER_TEST_DATA) / "bad";
  const std::string message = testing::catalogue_message(dir, GetParam());
  EXPECT_EQ(message, testing::catalogue_expected(dir, GetParam(), message));
}

std::vector<std::string> catalogue() { return testing::catalogue_names(fs::path(SIFTER_TEST_DATA) / "bad"); }

INSTANTIATE_TEST_SUITE_P(Catalogue, BadInput, ::testing::ValuesIn(catalogue()),
                         [](const auto& param_info) { return param_info.param; });

TEST(BadInputCatalogue, HoldsAtLeastFortyDistinctProjects) { EXPECT_GE(catalogue().size(), 40u); }

// --- Good input --------------------------------------------------------------------------

constexpr const char* kMinimal = R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h" },
  "libraries": ["../data/components/illustrative.json"],
  "components": [
    { "id": "LT-1", "model": "level-transmitter-radar" },
    { "id": "LT-2", "model": "level-transmitter-radar", "lambda_du": "120 FIT" },
    { "id": "XV-1", "lambda_d": "0.015/yr", "dc": 0.2, "lambda_s": "0.01/yr" }
  ],
  "sifs": [ { "id": "S1", "target": { "sil": 1 }, "subsystems": [
    { "name": "sensing", "role": "sensor", "vote": "1oo1", "channels": ["LT-1"] },
    { "name": "valve", "role": "final", "vote": "1oo1", "channels": ["XV-1"], "mrt": "3 d" } ] } ]
})";

TEST(Load, LibraryModelsGiveTheirFieldsAndComponentsOverrideThem) {
  const auto p = load_inline(kMinimal).project;
  ASSERT_EQ(p.components.size(), 3u);
  // level-transmitter-radar in data/components/illustrative.json: 90 FIT undetected, 560 FIT detected.
  EXPECT_NEAR(p.components[0].rates.lambda_du.per_hour, 90e-9, 90e-9 * kRelTol);
  EXPECT_NEAR(p.components[0].rates.lambda_dd.per_hour, 560e-9, 560e-9 * kRelTol);
  EXPECT_NEAR(p.components[1].rates.lambda_du.per_hour, 120e-9, 120e-9 * kRelTol);
  EXPECT_NEAR(p.components[1].rates.lambda_dd.per_hour, 560e-9, 560e-9 * kRelTol);
  EXPECT_EQ(p.components[0].element_type, ElementType::kB);
  EXPECT_EQ(p.components[0].systematic_capability, 3);
}

// Issue 11: "diverse" needs channels that differ. Two components of one library model pass
// when a field differs (here LT-2's own lambda_du) or when a manufacturer is named apart; the
// identical pairs are refused in the catalogue (tests/data/bad/diverse_identical_channels,
// diverse_same_library_model).
TEST(Load, DiverseChannelsOfOneModelPassWhenAFieldOrTheManufacturerDiffers) {
  std::string text = kMinimal;
  const std::string vote = R"("vote": "1oo1", "channels": ["LT-1"] })";
  text.replace(text.find(vote), vote.size(),
               R"("vote": "1oo2", "channels": ["LT-1", "LT-2"], "beta": 0.05, "diverse": true,
                  "diversity_note": "invented" })");
  EXPECT_NO_THROW(load_inline(text.c_str()));
  std::string same = text;
  const std::string own = R"("model": "level-transmitter-radar", "lambda_du": "120 FIT" })";
  same.replace(same.find(own), own.size(), R"("model": "level-transmitter-radar" })");
  EXPECT_THROW(load_inline(same.c_str()), InputError);
  std::string made = same;
  const std::string plain = R"({ "id": "LT-2", "model": "level-transmitter-radar" })";
  made.replace(made.find(plain), plain.size(),
               R"({ "id": "LT-2", "model": "level-transmitter-radar", "manufacturer": "invented maker B" })");
  EXPECT_NO_THROW(load_inline(made.c_str()));
}

TEST(Load, LambdaDWithDcSplitsIntoDetectedAndUndetected) {
  const auto p = load_inline(kMinimal).project;
  const auto& xv = p.components[2].rates;
  EXPECT_NEAR(xv.lambda_dd.per_hour, 0.2 * 0.015 / 8760, 1e-20);
  EXPECT_NEAR(xv.lambda_du.per_hour, 0.8 * 0.015 / 8760, 1e-20);
  EXPECT_NEAR(xv.lambda_su.per_hour, 0.01 / 8760, 1e-20);  // lambda_s is taken as undetected
}

TEST(Load, DefaultsFillWhatSubsystemsLeaveOutAndSayWhich) {
  const auto p = load_inline(kMinimal).project;
  const auto& sensing = p.sifs[0].subsystems[0];
  EXPECT_DOUBLE_EQ(sensing.proof_test_interval.hours, 8760.0);
  EXPECT_TRUE(sensing.interval_defaulted);
  EXPECT_TRUE(sensing.mrt_defaulted);
  EXPECT_DOUBLE_EQ(sensing.mrt.hours, 8.0);
  const auto& valve = p.sifs[0].subsystems[1];
  EXPECT_DOUBLE_EQ(valve.mrt.hours, 72.0);
  EXPECT_FALSE(valve.mrt_defaulted);
  EXPECT_DOUBLE_EQ(p.defaults.mission_time.hours, 20 * 8760.0);  // 20 yr when not given
}

TEST(Load, ChannelsResolveToComponentIndices) {
  const auto p = load_inline(kMinimal).project;
  ASSERT_EQ(p.sifs[0].subsystems[1].channels.size(), 1u);
  EXPECT_EQ(p.sifs[0].subsystems[1].channels[0].components, std::vector<std::size_t>{2});
}

// The loader keeps what verification asks of the graph it validated (the components several
// SIFs share), not the graph: the example's logic solver LS-40 serves SIF-401 and SIF-403, and
// the list is the one a graph built again from the loaded project finds.
TEST(Load, TheComponentsSeveralSifsShareAreFoundOnceWhileLoading) {
  const LoadedProject loaded = load_project_file(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json");
  ASSERT_TRUE(loaded.shared_components.has_value());
  const auto again = PlantGraph(loaded.project).shared_components();
  ASSERT_EQ(loaded.shared_components->size(), again.size());
  bool ls40 = false;
  for (std::size_t i = 0; i < again.size(); ++i) {
    EXPECT_EQ((*loaded.shared_components)[i].component, again[i].component);
    EXPECT_EQ((*loaded.shared_components)[i].sifs, again[i].sifs);
    ls40 = ls40 || (again[i].component == "LS-40" && again[i].sifs == std::vector<std::string>{"SIF-401", "SIF-403"});
  }
  EXPECT_TRUE(ls40);
  EXPECT_TRUE(load_inline(kMinimal).shared_components.value().empty()) << "one SIF shares nothing";
}

TEST(Load, ImplausibleValuesAreWarningsNotErrors) {
  std::string text = kMinimal;
  text.replace(text.find("\"120 FIT\""), 9, "\"0.12/h\"");
  const auto loaded = load_inline(text);
  ASSERT_EQ(loaded.warnings.size(), 1u);
  EXPECT_EQ(loaded.warnings[0].where, "/components/1");
  EXPECT_EQ(loaded.warnings[0].message,
            "lambda_du = 1.20e-01/h lies outside the usual 1e-10..1e-3 per hour; check the unit");
}

// The sections read and released while loading ("components", "sifs") are still known keys
// of a project when its unknown keys are reported, and named in the hint.
TEST(Load, AnUnknownTopLevelKeyIsReportedWithEveryKeyOfAProjectAsItsHint) {
  std::string text = kMinimal;
  text.replace(text.find("\"sifs\""), 6, "\"note\": \"kept\", \"sifz\": 1, \"sifs\"");
  const std::string message = error_of(text);
  EXPECT_NE(message.find("expected a key of a project, found unknown key \"sifz\""), std::string::npos) << message;
  const auto keys = message.find("the keys of a project are: ");
  ASSERT_NE(keys, std::string::npos) << message;
  const std::string list = message.substr(keys);
  EXPECT_NE(list.find(" components, "), std::string::npos) << list;
  EXPECT_NE(list.find(", sifs"), std::string::npos) << list;
  EXPECT_NE(message.find("did you mean \"sifs\"?"), std::string::npos) << message;
  EXPECT_EQ(message.find("unknown key \"note\""), std::string::npos) << message;
}

// A register has thousands of components of a few library models: those that take their data
// source from one model hold that one source, not a copy each (a component overriding a rate
// still does).
TEST(Load, TheComponentsOfOneModelShareItsDataSource) {
  const auto p = load_inline(kMinimal).project;
  ASSERT_TRUE(p.components[0].source && p.components[1].source);
  EXPECT_EQ(p.components[0].source.get(), p.components[1].source.get());
  EXPECT_EQ(p.components[0].data_source_line(), p.components[1].data_source_line());
  EXPECT_FALSE(p.components[0].data_source_line().empty());
  EXPECT_FALSE(p.components[2].source) << "XV-1 names no model and no source";
}

// A component's data source is "untold" exactly when its one line would be empty, whatever form
// the source takes: the requirements engine asks the first, the documents print the second.
TEST(Load, AComponentsDataSourceIsUntoldExactlyWhenItsLineIsEmpty) {
  auto with = [](DataSource s) {
    Component c;
    c.source = std::make_shared<const DataSource>(std::move(s));
    return c;
  };
  const std::vector<Component> cases = {
      Component{},  // no source stated
      with({}),     // a source of no words
      with({.kind = "", .document = "", .revision = "", .date = "", .text = "vendor letter"}),
      with({.kind = "fmeda", .document = "", .revision = "", .date = "", .text = ""}),
      with({.kind = "certificate", .document = "C-9", .revision = "2", .date = "2024-05-01", .text = ""}),
      with({.kind = "", .document = "R-1", .revision = "", .date = "", .text = ""}),  // a document, no kind
  };
  const std::vector<bool> untold = {true, true, false, false, false, true};
  ASSERT_EQ(cases.size(), untold.size());
  for (std::size_t i = 0; i < cases.size(); ++i) {
    EXPECT_EQ(cases[i].data_source_untold(), untold[i]) << "case " << i;
    EXPECT_EQ(cases[i].data_source_untold(), cases[i].data_source_line().empty())
        << "case " << i << ": \"" << cases[i].data_source_line() << '"';
  }
  EXPECT_EQ(cases[3].data_source_line(), "FMEDA");
  EXPECT_EQ(cases[4].data_source_line(), "certificate: C-9 rev 2, 2024-05-01");
}

// The digest in the results is of the file's bytes as read: a text with comments (blanked in
// place before the parse) and one without (hashed where it lies while it is parsed) alike. The
// expected digests come from sha256_hex, whose own vectors are in sha256_test.cpp.
TEST(Load, TheDigestIsOfTheFilesBytesAsReadWithOrWithoutComments) {
  const fs::path dir = fs::temp_directory_path() / ("sifter_load_test_digest_" + std::to_string(::getpid()));
  fs::create_directories(dir);
  std::string plain = kMinimal;  // its library named by its full path, the file being elsewhere
  plain.replace(plain.find("../data"), 2, SIFTER_SOURCE_DIR);
  std::string commented = plain;
  commented.replace(commented.find("\"sifs\""), 6, "// the functions\n  \"sifs\"");
  for (const std::string& text : {plain, commented}) {
    const fs::path file = dir / "p.json";
    std::ofstream(file, std::ios::binary) << text;
    const LoadedProject loaded = load_project_file(file.string());
    EXPECT_EQ(loaded.sha256, sha256_hex(text)) << text.substr(0, 60);
    EXPECT_EQ(loaded.project.sifs.size(), 1u);
  }
  EXPECT_NE(sha256_hex(commented), sha256_hex(plain));
  fs::remove_all(dir);
}

TEST(Load, EveryProblemIsReportedAtOnceNotOnlyTheFirst) {
  std::string text = kMinimal;
  text.replace(text.find("\"1oo1\""), 6, "\"1o1\"");
  text.replace(text.find("\"3 d\""), 5, "\"3 days later\"");
  const std::string message = error_of(text);
  EXPECT_NE(message.find("/sifs/0/subsystems/0/vote"), std::string::npos);
  EXPECT_NE(message.find("/sifs/0/subsystems/1/mrt"), std::string::npos);
  EXPECT_NE(message.find("2 problems in the input"), std::string::npos);
}

TEST(Load, ALibraryThatIncludesItselfIsACycleNamedByItsPath) {
  const fs::path dir = fs::temp_directory_path() / "sifter_load_test_cycle";
  fs::create_directories(dir);
  std::ofstream(dir / "a.json") << R"({"format": "sifter-library/1", "libraries": ["b.json"], "models": []})";
  std::ofstream(dir / "b.json") << R"({"format": "sifter-library/1", "libraries": ["a.json"], "models": []})";
  const std::string text = R"({"format": "sifter-project/1", "libraries": ["a.json"], "sifs": []})";
  std::string message;
  try {
    load_project_text(text, "p.json", dir.string());
  } catch (const InputError& e) {
    message = e.what();
  }
  EXPECT_NE(message.find("found the cycle p.json -> a.json -> b.json -> a.json"), std::string::npos) << message;
  fs::remove_all(dir);
}

TEST(Load, ALibraryPathThatIsADirectoryIsRefused) {
  const std::string text = R"({"format": "sifter-project/1", "libraries": ["."], "sifs": []})";
  EXPECT_NE(error_of(text).find("expected a file, found a directory"), std::string::npos);
}

TEST(Load, HostileNumbersAndStringsAreRejectedCleanly) {
  EXPECT_NE(error_of(R"({"format": "sifter-project/1", "defaults": {"mission_time": "1e400 h"}})")
                .find("beyond the range of finite values"),
            std::string::npos);
  EXPECT_NE(error_of(R"({"format": "sifter-project/1", "components": [{"id": "A", "lambda_du": "NaN/h"}]})")
                .find("/components/0/lambda_du"),
            std::string::npos);
  const std::string big(10 * 1024 * 1024, 'x');
  EXPECT_NE(error_of("{\"format\": \"sifter-project/1\", \"title\": 5, \"note\": \"" + big + "\"}").find("/title"),
            std::string::npos);
}

TEST(Load, ANumberBeyondDoubleRangeIsNotReadAsInfinity) {
  EXPECT_NE(error_of(R"({"format": "sifter-project/1", "components": [{"id": "A", "systematic_capability": 1e400}]})")
                .find("inline.json:1:84: expected numbers within the range of finite values, found the number 1e400"),
            std::string::npos);
}

// Components and SIFs are read side by side; the messages still come as one reader going
// through the file would give them: every component's problem before any SIF's, and the cap of
// 100 problems kept counts the rest, whichever section they are in.
std::string project_with_bad_components_and_sifs(int components, int sifs) {
  std::string text = R"({"format": "sifter-project/1", "defaults": {"proof_test_interval": "1 yr", "mttr": "8 h"},
  "components": [)";
  for (int i = 0; i < components; ++i)
    text += std::string(i ? "," : "") + R"({"id": "C)" + std::to_string(i) + R"(", "lambda_du": "often"})";
  text += "], \"sifs\": [";
  for (int i = 0; i < sifs; ++i)
    text +=
        std::string(i ? "," : "") + R"({"id": "S)" + std::to_string(i) +
        R"(", "target": {"sil": 1}, "subsystems": [{"name": "a", "role": "sensor", "vote": "1o1", "channels": ["C0"]}]})";
  return text + "]}";
}

TEST(Load, ComponentProblemsComeBeforeSifProblemsAsInTheFile) {
  const std::string message = error_of(project_with_bad_components_and_sifs(3, 3));
  const auto last_component = message.rfind("/components/2/lambda_du");
  const auto first_sif = message.find("/sifs/0/subsystems/0/vote");
  ASSERT_NE(last_component, std::string::npos) << message;
  ASSERT_NE(first_sif, std::string::npos) << message;
  EXPECT_LT(last_component, first_sif);
  EXPECT_LT(message.find("/sifs/0/"), message.find("/sifs/1/"));
  EXPECT_LT(message.find("/sifs/1/"), message.find("/sifs/2/"));
  EXPECT_NE(message.find("6 problems in the input"), std::string::npos) << message;
}

TEST(Load, TheCapOnProblemsKeptCountsThoseOfBothSections) {
  // 70 components and 50 SIFs, one problem each: the 70 and the first 30 SIFs are kept.
  const std::string message = error_of(project_with_bad_components_and_sifs(70, 50));
  EXPECT_NE(message.find("/components/69/lambda_du"), std::string::npos);
  EXPECT_NE(message.find("/sifs/29/subsystems/0/vote"), std::string::npos);
  EXPECT_EQ(message.find("/sifs/30/"), std::string::npos);
  EXPECT_NE(message.find("expected at most 100 problems reported at once, found 20 more"), std::string::npos)
      << message.substr(message.size() > 600 ? message.size() - 600 : 0);
}

TEST(Load, AByteOrderMarkIsRefusedWithAHint) {
  EXPECT_NE(error_of("\xEF\xBB\xBF{}").find("save the file as UTF-8 without BOM"), std::string::npos);
}

TEST(Load, InvalidUtf8IsRefusedWithItsPlace) {
  const std::string message = error_of("{\"format\": \"sifter-project/1\", \"title\": \"\xFF\xFE\"}");
  EXPECT_NE(message.find("inline.json:1:"), std::string::npos) << message;
  EXPECT_NE(message.find("expected valid JSON"), std::string::npos) << message;
}

}  // namespace
}  // namespace sifter
