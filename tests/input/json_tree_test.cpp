// Specification of the loader's first parse: simdjson builds the tree, and it is always the tree
// nlohmann's parser builds; wherever the two could differ it declines and nlohmann decides (and
// its messages are the ones reported).
#include "input/json_tree.hpp"

#include <gtest/gtest.h>

#include <filesystem>
#include <fstream>
#include <memory>
#include <random>
#include <sstream>
#include <string>
#include <vector>

#include "sifter/analysis/verify.hpp"
#include "sifter/input/json_source.hpp"
#include "sifter/input/load.hpp"
#include "sifter/report/json_results.hpp"

namespace sifter {
namespace {

namespace fs = std::filesystem;
using nlohmann::json;

std::string read_text(const fs::path& p) {
  std::ifstream in(p, std::ios::binary);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

// Every JSON file of the shipped examples and the test data, good and bad: the projects the
// parses are compared on.
std::vector<fs::path> every_project_file() {
  std::vector<fs::path> files;
  for (const fs::path& root : {fs::path(SIFTER_SOURCE_DIR) / "examples", fs::path(SIFTER_TEST_DATA)})
    for (const auto& entry : fs::recursive_directory_iterator(root))
      if (entry.path().extension() == ".json") files.push_back(entry.path());
  return files;
}

// Whether `file` must take the fast parse: a shipped example (at any depth), or a test project
// meant to load.
bool meant_to_load(const fs::path& file) {
  const std::string examples = (fs::path(SIFTER_SOURCE_DIR) / "examples").string() + "/";
  return file.parent_path().filename() == "good" || file.string().rfind(examples, 0) == 0;
}

// nlohmann's tree of `text`, or nullopt where it refuses the text.
std::optional<json> nlohmann_tree(const std::string& text) {
  try {
    return json::parse(text);
  } catch (const json::exception&) {
    return std::nullopt;
  }
}

// The same value types at every place of two trees (dump alone writes 7 for a signed and an
// unsigned integer alike).
bool same_types(const json& a, const json& b) {
  if (a.type() != b.type() || a.size() != b.size()) return false;
  if (a.is_object()) {
    for (auto it = a.begin(); it != a.end(); ++it)
      if (!b.contains(it.key()) || !same_types(it.value(), b.at(it.key()))) return false;
  } else if (a.is_array()) {
    for (std::size_t i = 0; i < a.size(); ++i)
      if (!same_types(a[i], b[i])) return false;
  }
  return true;
}

// The property: a tree from the fast parse is nlohmann's: the same value type at every place
// (signed, unsigned or double) and the same text (dump writes 1.0 for a double and the exact
// bits of each double).
void expect_same_or_declined(const std::string& text) {
  const auto fast = detail::fast_json_tree(text, kMaxNestingDepth);
  if (!fast) return;
  const auto slow = nlohmann_tree(text);
  ASSERT_TRUE(slow) << "simdjson accepted what nlohmann refuses: " << text.substr(0, 200);
  EXPECT_EQ(fast->dump(), slow->dump()) << text.substr(0, 200);
  EXPECT_TRUE(same_types(*fast, *slow)) << "another number type: " << text.substr(0, 200);
}

// A text read by the loader carries the parser's padding in its buffer and is parsed where it
// lies; the tree is the one parsed from a padded copy, and padding never changes the text.
TEST(FastJsonTree, ATextWithItsPaddingIsParsedWhereItLiesToTheSameTree) {
  const std::string text = read_text(fs::path(SIFTER_SOURCE_DIR) / "examples" / "unit40.json");
  ASSERT_GT(text.size(), 1000u);
  std::string padded = text;
  detail::reserve_parser_padding(padded);
  EXPECT_EQ(padded, text);
  const std::size_t spare = padded.capacity() - padded.size();
  ASSERT_GE(spare, detail::kParserPadding);
  const auto in_place = detail::fast_json_tree(padded, kMaxNestingDepth, spare);
  const auto copied = detail::fast_json_tree(text, kMaxNestingDepth);
  ASSERT_TRUE(in_place && copied);
  EXPECT_EQ(in_place->dump(), copied->dump());
}

TEST(FastJsonTree, EveryShippedAndTestProjectGivesNlohmannsTreeAndTheGoodOnesTakeTheFastPath) {
  std::size_t files = 0, fast = 0, meant = 0;
  for (const fs::path& file : every_project_file()) {
    const std::string text = read_text(file);
    SCOPED_TRACE(file.string());
    expect_same_or_declined(text);
    ++files;
    if (detail::fast_json_tree(text, kMaxNestingDepth)) ++fast;
    if (meant_to_load(file)) {
      ++meant;
      EXPECT_TRUE(detail::fast_json_tree(text, kMaxNestingDepth)) << "a valid project should not need the slow parse";
    }
  }
  EXPECT_GT(files, 100u);
  EXPECT_GE(meant, 10u) << "the examples (one in a subfolder) and the good test projects";
  EXPECT_GT(fast, files / 2);
}

TEST(FastJsonTree, NumbersKeepNlohmannsTypesAndValues) {
  for (const char* number : {"0",
                             "-0",
                             "7",
                             "-7",
                             "1.0",
                             "-0.0",
                             "1E5",
                             "1e-5",
                             "2.5e+3",
                             "0.1",
                             "1e-400",
                             "-1e-400",
                             "4.9e-324",
                             "2.2250738585072011e-308",
                             "1.7976931348623157e308",
                             "9007199254740993",
                             "9223372036854775807",
                             "-9223372036854775808",
                             "9223372036854775808",
                             "18446744073709551615",
                             "18446744073709551616",
                             "-9223372036854775809",
                             "123456789012345678901234567890",
                             "0.30000000000000004",
                             "1e308",
                             "1e309",
                             "3.14159265358979323846264338327950288",
                             "00",
                             "01",
                             "1.",
                             ".5",
                             "+1",
                             "-",
                             "1e",
                             "1e+",
                             "0x10",
                             "NaN",
                             "Infinity"}) {
    SCOPED_TRACE(number);
    expect_same_or_declined(number);
    expect_same_or_declined(std::string("{\"x\": [") + number + "]}");
  }
  EXPECT_FALSE(detail::fast_json_tree("[-0]", kMaxNestingDepth)) << "an integer -0 is nlohmann's to type";
  EXPECT_TRUE(detail::fast_json_tree("[-0.0, -0e1, 10, -10]", kMaxNestingDepth)) << "other numbers near it stay fast";
  EXPECT_EQ(detail::fast_json_tree("1E5", kMaxNestingDepth)->dump(), "100000.0");
  EXPECT_EQ(detail::fast_json_tree("18446744073709551615", kMaxNestingDepth)->dump(), "18446744073709551615");
  EXPECT_TRUE(detail::fast_json_tree("7", kMaxNestingDepth)->is_number_unsigned()) << "as nlohmann keeps it";
  EXPECT_TRUE(detail::fast_json_tree("-7", kMaxNestingDepth)->is_number_integer() &&
              !detail::fast_json_tree("-7", kMaxNestingDepth)->is_number_unsigned());
}

TEST(FastJsonTree, RandomNumbersParseToTheSameBitsAsNlohmanns) {
  std::mt19937_64 rng(20261202);
  std::uniform_int_distribution<int> digits(1, 20), exponent(-330, 330), coin(0, 3);
  for (int i = 0; i < 20000; ++i) {
    std::string n = coin(rng) == 0 ? "-" : "";
    const int d = digits(rng);
    for (int k = 0; k < d; ++k) n += static_cast<char>('0' + (k == 0 ? 1 + rng() % 9 : rng() % 10));
    if (coin(rng) != 0) n += "." + std::to_string(rng() % 1000000);
    if (coin(rng) == 1) n += "e" + std::to_string(exponent(rng));
    expect_same_or_declined("[" + n + "]");
  }
}

TEST(FastJsonTree, StringsAndKeysDecodeAsNlohmannDecodesThem) {
  for (const char* text :
       {R"({"b\u0065ta": "5%"})",
        R"(["\u00e9\u20ac", "caf\u00e9", "tab\tescaped", "quote\"", "slash\/", "\u0001\u001f"])", "[\"caf\xc3\xa9\"]",
        R"({"a": {"b": [true, false, null]}})", R"([])", R"({})", R"("just a string")", "  [1]  "}) {
    SCOPED_TRACE(text);
    EXPECT_TRUE(detail::fast_json_tree(text, kMaxNestingDepth)) << "valid text takes the fast path";
    expect_same_or_declined(text);
  }
}

// The fast parse stands in for the structure scan: it declines exactly where the scan would
// report, so that the loader can run the scan only then.
TEST(FastJsonTree, AKeyGivenTwiceOrNestingTooDeepDeclinesSoTheScanReportsIt) {
  for (const char* text :
       {R"({"a": 1, "a": 2})", R"({"x": [{"b\u0065ta": 1, "beta": 2}]})", R"([{"k": {}, "k": {}}])"}) {
    SCOPED_TRACE(text);
    EXPECT_FALSE(detail::fast_json_tree(text, kMaxNestingDepth));
    EXPECT_FALSE(scan_json_structure(text).empty()) << "the scan refuses it";
  }
  EXPECT_TRUE(detail::fast_json_tree(R"({"a": 1, "b": {"a": 2}})", kMaxNestingDepth)) << "one key in two objects";
  const auto nested = [](int levels) { return std::string(levels, '[') + std::string(levels, ']'); };
  for (int levels : {kMaxNestingDepth - 1, kMaxNestingDepth, kMaxNestingDepth + 1, kMaxNestingDepth + 5}) {
    SCOPED_TRACE(levels);
    const bool fast = detail::fast_json_tree(nested(levels), kMaxNestingDepth).has_value();
    EXPECT_EQ(fast, levels <= kMaxNestingDepth);
    EXPECT_EQ(scan_json_structure(nested(levels)).empty(), fast) << "the scan draws the line at the same level";
  }
  EXPECT_FALSE(detail::fast_json_tree(R"({"a": [[1]]})", 2)) << "the root's container is level 1";
  EXPECT_TRUE(detail::fast_json_tree(R"({"a": [1]})", 2));
}

// A long section directly under the root (4096 elements and more) is built on two cores: the
// tree is still nlohmann's, and a key given twice or nesting too deep in either half declines.
TEST(FastJsonTree, ALongSectionBuiltOnTwoCoresIsStillNlohmannsTree) {
  const auto register_text = [](int n, int odd_one_at, const std::string& odd_one) {
    std::string text = "{\"format\": \"x\", \"sifs\": [";
    for (int i = 0; i < n; ++i)
      text +=
          (i ? ", " : "") + (i == odd_one_at ? odd_one
                                             : "{\"id\": \"S" + std::to_string(i) + "\", \"n\": " + std::to_string(i) +
                                                   ", \"x\": [" + std::to_string(i * 0.25) + ", -3, true, null]}");
    return text + "], \"tail\": {\"a\": [1, 2]}}";
  };
  const std::string good = register_text(5000, -1, "");
  ASSERT_TRUE(detail::fast_json_tree(good, kMaxNestingDepth));
  expect_same_or_declined(good);
  const std::string twice = "{\"id\": 1, \"id\": 2}";
  const std::string deep = std::string(kMaxNestingDepth, '[') + std::string(kMaxNestingDepth, ']');
  for (int at : {10, 4990}) {
    SCOPED_TRACE(at);
    EXPECT_FALSE(detail::fast_json_tree(register_text(5000, at, twice), kMaxNestingDepth));
    EXPECT_FALSE(detail::fast_json_tree(register_text(5000, at, deep), kMaxNestingDepth));
    EXPECT_EQ(scan_json_structure(register_text(5000, at, deep)).empty(), false) << "the scan refuses it too";
  }
}

// The project's long sections are held back by the parse and built one element at a time. The
// property: building every held element gives, place by place, the tree the whole parse gives
// (nlohmann's); and the parse declines exactly where the whole parse declines.
std::optional<json> deferred_then_built(const std::string& text, std::shared_ptr<detail::DeferredSections>& held) {
  auto tree = detail::fast_json_tree_deferring(text, kMaxNestingDepth, 0, {"components", "sifs", "scenarios"}, held);
  if (!tree || !held) return tree;
  for (const char* section : {"components", "sifs", "scenarios"}) {
    if (!held->holds(section)) continue;
    json& items = (*tree)[section];
    for (std::size_t i = 0; i < items.size(); ++i) {
      EXPECT_TRUE(items[i].is_null()) << section << " " << i << " is a null until it is asked for";
      held->build(section, i, items[i]);
    }
  }
  return tree;
}

void expect_deferring_gives_the_whole_tree(const std::string& text) {
  const auto whole = detail::fast_json_tree(text, kMaxNestingDepth);
  std::shared_ptr<detail::DeferredSections> held;
  const auto built = deferred_then_built(text, held);
  ASSERT_EQ(built.has_value(), whole.has_value()) << "declines where the whole parse declines";
  if (!whole) {
    EXPECT_FALSE(held) << "nothing held when it declines";
    return;
  }
  EXPECT_EQ(built->dump(), whole->dump());
  EXPECT_TRUE(same_types(*built, *whole));
}

TEST(DeferredSections, EveryShippedAndTestProjectBuiltElementByElementIsTheWholeTree) {
  std::size_t held_files = 0;
  for (const fs::path& file : every_project_file()) {
    const std::string text = read_text(file);
    SCOPED_TRACE(file.string());
    expect_deferring_gives_the_whole_tree(text);
    std::shared_ptr<detail::DeferredSections> held;
    if (detail::fast_json_tree_deferring(text, kMaxNestingDepth, 0, {"sifs"}, held) && held) ++held_files;
  }
  EXPECT_GT(held_files, 50u) << "most projects have SIFs to hold back";
}

TEST(DeferredSections, AKeyGivenTwiceOrNestingTooDeepInsideAHeldElementDeclinesAsTheWholeParseDoes) {
  const auto register_text = [](int n, int odd_one_at, const std::string& odd_one) {
    std::string text = "{\"format\": \"x\", \"sifs\": [";
    for (int i = 0; i < n; ++i)
      text += (i ? ", " : "") + (i == odd_one_at ? odd_one
                                                 : "{\"id\": \"S" + std::to_string(i) +
                                                       "\", \"subsystems\": [{\"vote\": \"1oo2\", \"x\": [1.5, -3]}]}");
    return text + "], \"scenarios\": [{\"id\": \"Z\", \"layers\": [{\"layer\": \"L\"}]}]}";
  };
  expect_deferring_gives_the_whole_tree(register_text(50, -1, ""));
  const std::string twice = R"({"id": "S", "subsystems": [{"vote": "1oo1", "vote": "1oo2"}]})";
  const std::string deep_inside =
      "{\"id\": \"S\", \"x\": " + std::string(kMaxNestingDepth - 3, '[') + std::string(kMaxNestingDepth - 3, ']') + "}";
  const std::string too_deep =
      "{\"id\": \"S\", \"x\": " + std::string(kMaxNestingDepth - 2, '[') + std::string(kMaxNestingDepth - 2, ']') + "}";
  for (int at : {0, 25, 49}) {
    SCOPED_TRACE(at);
    for (const std::string& odd : {twice, deep_inside, too_deep})
      expect_deferring_gives_the_whole_tree(register_text(50, at, odd));
    std::shared_ptr<detail::DeferredSections> held;
    EXPECT_FALSE(detail::fast_json_tree_deferring(register_text(50, at, twice), kMaxNestingDepth, 0, {"sifs"}, held));
    EXPECT_FALSE(
        detail::fast_json_tree_deferring(register_text(50, at, too_deep), kMaxNestingDepth, 0, {"sifs"}, held));
    EXPECT_TRUE(
        detail::fast_json_tree_deferring(register_text(50, at, deep_inside), kMaxNestingDepth, 0, {"sifs"}, held))
        << "the deepest nesting allowed: the root, the section, then the element's own levels";
  }
}

TEST(DeferredSections, AnElementIsBuiltOnceAndATemplateIsFoundWithoutBuilding) {
  const std::string text = R"({"sifs": [{"subsystems": [{"name": "a"}, {"template": "T"}]},
                                         {"subsystems": [{"name": "b"}]}, 5,
                                         {"subsystems": {"template": "T"}},
                                         {"template": "T"}],
                               "other": [1, 2]})";
  std::shared_ptr<detail::DeferredSections> held;
  auto tree = detail::fast_json_tree_deferring(text, kMaxNestingDepth, 0, {"sifs", "scenarios"}, held);
  ASSERT_TRUE(tree && held);
  EXPECT_TRUE(held->holds("sifs"));
  EXPECT_FALSE(held->holds("scenarios")) << "absent from the text";
  EXPECT_FALSE(held->holds("other")) << "not asked to be held";
  EXPECT_EQ((*tree)["other"], json::parse("[1, 2]"));
  const std::vector<bool> names_a_template = {true, false, false, false, false};
  for (std::size_t i = 0; i < names_a_template.size(); ++i)
    EXPECT_EQ(held->has_item_with("sifs", i, "subsystems", "template"), names_a_template[i]) << i;
  EXPECT_FALSE(held->has_item_with("sifs", 99, "subsystems", "template")) << "beyond the section";
  // Keys are compared as nlohmann compares them, unescaped; a scenario's layers likewise.
  const std::string escaped = R"({"sifs": [{"subsystems": [{"template": "T"}]}],
                                  "scenarios": [{"layers": [{"id": "a"}, {"layer": "L"}]}, {"layers": [{"id": "b"}]}]})";
  std::shared_ptr<detail::DeferredSections> other;
  ASSERT_TRUE(detail::fast_json_tree_deferring(escaped, kMaxNestingDepth, 0, {"sifs", "scenarios"}, other) && other);
  EXPECT_TRUE(other->has_item_with("sifs", 0, "subsystems", "template"));
  EXPECT_TRUE(other->has_item_with("scenarios", 0, "layers", "layer"));
  EXPECT_FALSE(other->has_item_with("scenarios", 1, "layers", "layer"));
  json& first = (*tree)["sifs"][0];
  held->build("sifs", 0, first);
  EXPECT_EQ(first["subsystems"][1]["template"], "T");
  first["subsystems"][1].erase("template");  // as the template's expansion does
  held->build("sifs", 0, first);
  EXPECT_FALSE(first["subsystems"][1].contains("template")) << "built once: what the loader changed stays";
}

// The same project with its whole tree built: a "$schema" (read and ignored) holding "-0", which
// the fast parse leaves to nlohmann, added after everything else, so that no place before it
// moves. Empty when the text does not end its root object with a member.
std::string whole_tree_twin(const std::string& text) {
  const auto close = text.find_last_of('}');
  const auto last = text.find_last_not_of(" \t\r\n", close == std::string::npos || close == 0 ? 0 : close - 1);
  if (close == std::string::npos || last == std::string::npos || text[last] == '{' ||
      text.find("\"$schema\"") != std::string::npos)
    return {};
  return text.substr(0, close) + ", \"$schema\": \"-0 \"" + text.substr(close);
}

// What a load gives, as text: the problems (place, words, order) or the warnings and results.
std::string load_outcome(const std::string& text, const fs::path& dir) {
  try {
    const auto loaded = load_project_text(text, "same.json", dir.string());
    json results = report::results_json(verify_project(loaded));
    results.erase("project");  // its digest is of the text
    return results.dump();
  } catch (const InputError& e) {
    std::string out;
    for (const auto& d : e.diagnostics())
      out += d.file + ":" + std::to_string(d.line) + ":" + std::to_string(d.column) + " " + d.pointer + " | " +
             d.expected + " | " + d.found + " | " + d.hint + "\n";
    return out;
  }
}

// With the sections held back, the loader reads every example and test project as it reads the
// whole tree: the same problems in the same order, or the same warnings and results.
TEST(DeferredSections, EveryProjectLoadsAsFromTheWholeTree) {
  std::size_t compared = 0, refused = 0;
  for (const fs::path& file : every_project_file()) {
    const std::string text = read_text(file);
    if (!detail::fast_json_tree(text, kMaxNestingDepth)) continue;  // whole tree either way
    const std::string twin = whole_tree_twin(text);
    if (twin.empty()) continue;
    ASSERT_FALSE(detail::fast_json_tree(twin, kMaxNestingDepth)) << "the twin takes the whole-tree path";
    SCOPED_TRACE(file.string());
    const std::string held = load_outcome(text, file.parent_path());
    EXPECT_EQ(held, load_outcome(twin, file.parent_path()));
    ++compared;
    if (held.find(" | ") != std::string::npos) ++refused;
  }
  EXPECT_GT(compared, 100u);
  EXPECT_GT(refused, 20u) << "refused projects compared too";
}

// A small project whose problems fall in every held section and in a template: the same list,
// in the order the loader reads (the template's, then the components', the SIFs', the scenarios').
TEST(DeferredSections, TheLoaderReportsTheSameProblemsInTheSameOrder) {
  const std::string text = R"({
  "format": "sifter-project/1",
  "subsystem_templates": {"T": {"role": "logic", "pfd_avg": 1e-4, "hft": 0, "systematic_capability": 2}},
  "components": [{"id": "A", "lambda_du": "1e-6/h"}, {"id": "B", "lambda_du": "fast"}],
  "sifs": [{"id": "S1", "target": {"sil": 1}, "subsystems": [{"name": "x", "template": "U"}]},
           {"id": "S2", "target": {"sil": 1}, "subsystems": [{"name": "y", "template": "T", "hft": "one"}]},
           {"id": "S3", "target": {"sil": 9}, "subsystems": [{"name": "z", "role": "final", "channels": ["A"]}]}],
  "scenarios": [{"id": "Z1", "frequency": -1}]
})";
  const std::string held = load_outcome(text, ".");
  EXPECT_EQ(held, load_outcome(whole_tree_twin(text), "."));
  std::vector<std::string> pointers;
  for (std::size_t at = 0; at < held.size();) {
    const auto line_end = held.find('\n', at);
    const auto space = held.find(' ', at);
    pointers.push_back(held.substr(space + 1, held.find(' ', space + 1) - space - 1));
    at = line_end + 1;
  }
  ASSERT_GE(pointers.size(), 5u) << held;
  EXPECT_EQ(pointers[0], "/sifs/0/subsystems/0/template");
  EXPECT_EQ(pointers[1], "/components/1/lambda_du");
  EXPECT_EQ(pointers[2], "/sifs/1/subsystems/0/hft") << "traced back into the SIF that took the template";
  EXPECT_EQ(pointers[3], "/sifs/2/target/sil");
  EXPECT_EQ(pointers.back().rfind("/scenarios/0", 0), 0u);
}

TEST(FastJsonTree, TheLoaderStillReportsADuplicateKeyWithItsPlace) {
  try {
    (void)load_project_text("{\n  \"format\": \"sifter-project/1\",\n  \"format\": \"sifter-project/1\"\n}", "dup.json",
                            ".");
    FAIL() << "a key given twice is refused";
  } catch (const InputError& e) {
    ASSERT_FALSE(e.diagnostics().empty());
    const Diagnostic& d = e.diagnostics().front();
    EXPECT_EQ(d.line, 3);
    EXPECT_EQ(d.column, 3);
    EXPECT_EQ(d.expected, "each key once in an object");
    EXPECT_EQ(d.found, "\"format\" a second time");
  }
}

TEST(FastJsonTree, WhereTheParsersCouldDifferItDeclinesAndNlohmannDecides) {
  // Surrogate escapes, paired or lone, go to nlohmann.
  for (const char* text : {R"(["\ud83d\ude00"])", R"(["\ud800"])", R"(["\udc00x"])", R"({"\uDBFF": 1})"})
    EXPECT_FALSE(detail::fast_json_tree(text, kMaxNestingDepth)) << text;
  // A byte-order mark (the loader refuses it before any parse).
  EXPECT_FALSE(detail::fast_json_tree("\xef\xbb\xbf{}", kMaxNestingDepth));
  // Texts both refuse: simdjson declines, so that the message is nlohmann's.
  for (const char* text :
       {"", " ", "{", "[1,]", "{\"a\":1,}", "[1 2]", "{} x", "nul", "[\"\xff\"]", "[\"raw\ttab\"]", "[\"raw\nline\"]",
        "[\"raw\x01\"]", "{\"raw\rkey\": 1}", "{\"a\" 1}", "[01]", "// comment\n{}"}) {
    SCOPED_TRACE(text);
    EXPECT_FALSE(detail::fast_json_tree(text, kMaxNestingDepth));
    EXPECT_FALSE(nlohmann_tree(text));
  }
}

}  // namespace
}  // namespace sifter
