// Comments in project files: blanked before parsing, every position kept.
#include "sifter/input/json_comments.hpp"

#include <gtest/gtest.h>

#include "sifter/input/load.hpp"
#include "support/results_support.hpp"

namespace sifter {
namespace {

TEST(JsonComments, LineAndBlockCommentsBecomeSpacesAndKeepEveryNewline) {
  std::string text = "{ // one\n  \"a\": /* two\nlines */ 1\n}";
  const std::string before = text;
  ASSERT_FALSE(blank_json_comments(text).has_value());
  EXPECT_EQ(text, "{       \n  \"a\":       \n         1\n}");
  EXPECT_EQ(text.size(), before.size());
}

TEST(JsonComments, ACommentInsideAStringIsText) {
  std::string text = R"({"title": "see http://example.invalid /* not a comment */", "b": "a \" // quote"})";
  const std::string before = text;
  ASSERT_FALSE(blank_json_comments(text).has_value());
  EXPECT_EQ(text, before);
}

// The test that lets the loader hash a text while it is parsed: a text for which it is false
// is never changed by blanking (a slash alone, as in a unit, is no comment).
TEST(JsonComments, ATextWithoutASlashPairMayHoldNoCommentAndIsLeftAsItIs) {
  EXPECT_FALSE(may_hold_json_comments(R"({"rate": "2/yr", "a": [1, 2]})"));
  EXPECT_TRUE(may_hold_json_comments("{} // end"));
  EXPECT_TRUE(may_hold_json_comments("/* head */ {}"));
  EXPECT_TRUE(may_hold_json_comments(R"({"u": "http://example.invalid"})")) << "inside a string it still answers true";
  EXPECT_FALSE(may_hold_json_comments("{}/")) << "a slash at the very end opens nothing";
  EXPECT_FALSE(may_hold_json_comments("/ / {} / "));
  EXPECT_TRUE(may_hold_json_comments("{} / /*"));
  EXPECT_TRUE(may_hold_json_comments("//"));
  EXPECT_FALSE(may_hold_json_comments(""));
  std::string text = R"({"rate": "2/yr", "note": "a / b"})";
  const std::string before = text;
  ASSERT_FALSE(blank_json_comments(text).has_value());
  EXPECT_EQ(text, before);
}

TEST(JsonComments, AnUnclosedBlockCommentIsReportedWhereItOpens) {
  std::string text = "{\n  \"a\": 1 /* never closed\n}";
  const auto problem = blank_json_comments(text);
  ASSERT_TRUE(problem.has_value());
  EXPECT_EQ(problem->position.line, 2);
  EXPECT_EQ(problem->position.column, 10);
}

TEST(JsonComments, AProjectWithCommentsAndSchemaGivesTheResultsOfItsPlainTwin) {
  const std::string dir = std::string(SIFTER_TEST_DATA) + "/reuse/";
  const auto commented = testing::comparable_results(dir + "with_templates.json");
  std::string text = testing::slurp_text(dir + "with_templates.json");
  ASSERT_FALSE(blank_json_comments(text).has_value());
  auto plain = nlohmann::json::parse(text);
  plain.erase("$schema");
  const auto again = testing::comparable_results(load_project_text(plain.dump(), "plain.json", dir));
  EXPECT_EQ(commented.dump(2), again.dump(2));
}

TEST(JsonComments, APositionAfterACommentIsTheFilesOwn) {
  const std::string text =
      "// header\n"
      "{\"format\": \"sifter-project/1\", /* a block\n"
      "   over two lines */ \"defaults\": {\"mttr\": 8}}";
  try {
    (void)load_project_text(text, "p.json", ".");
    FAIL() << "accepted";
  } catch (const InputError& e) {
    ASSERT_EQ(e.diagnostics().size(), 1u);
    EXPECT_EQ(e.diagnostics()[0].pointer, "/defaults/mttr");
    EXPECT_EQ(e.diagnostics()[0].line, 3);
    EXPECT_EQ(e.diagnostics()[0].column, 35);  // the "mttr" key, counted in the file as written
  }
}

TEST(JsonComments, TheSchemaKeyMustBeAString) {
  try {
    (void)load_project_text(R"({"$schema": 1, "format": "sifter-project/1"})", "p.json", ".");
    FAIL() << "accepted";
  } catch (const InputError& e) {
    ASSERT_EQ(e.diagnostics().size(), 1u);
    EXPECT_EQ(e.diagnostics()[0].pointer, "/$schema");
  }
}

}  // namespace
}  // namespace sifter
