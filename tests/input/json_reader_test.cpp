// Specification of the strict object reader: every key a read asks for is known, present or
// not; finish() reports the others, each with the keys asked for as its hint; a member's
// pointer escapes "~" and "/" (RFC 6901 section 4). The reader holds its keys inline up to a
// point and on the heap beyond: both sides of that point read alike.
#include "input/json_reader.hpp"

#include <gtest/gtest.h>

#include <string>
#include <vector>

namespace sifter::detail {
namespace {

// The problems a finished reader left in its context, as "pointer: found | hint".
std::vector<std::string> problems_of(const LoadContext& ctx) {
  std::vector<std::string> out;
  for (const auto& p : ctx.problems)
    out.push_back(p.diagnostic.pointer + ": " + p.diagnostic.found + " | " + p.diagnostic.hint);
  return out;
}

TEST(ObjectReader, AKeyAskedForPresentOrAbsentOrAllowedIsKnownAndOnlyTheOthersAreReported) {
  LoadContext ctx;
  const Json object = Json::parse(R"({"rate": 1, "note": "kept", "mode": "low", "rates": 2})");
  ObjectReader r(ctx, object, "/things/0", 0, "a thing");
  EXPECT_EQ(r.number("rate"), 1.0);
  EXPECT_EQ(r.number("rate"), 1.0);    // asked twice, listed once in the hint
  EXPECT_FALSE(r.number("interval"));  // absent and optional: known, no problem
  EXPECT_EQ(r.string("mode"), "low");
  r.allow({"note"});
  r.finish();
  EXPECT_EQ(problems_of(ctx),
            (std::vector<std::string>{"/things/0/rates: unknown key \"rates\" | did you mean \"rate\"? the keys of a "
                                      "thing are: interval, mode, note, rate"}));
}

TEST(ObjectReader, EveryTypedReadOfAnAbsentOptionalKeyAnswersNothingAndKnowsTheKey) {
  LoadContext ctx;
  const Json object = Json::parse(R"({"extra": 1, "mode": "low"})");
  ObjectReader r(ctx, object, "/a", 0, "a thing");
  EXPECT_FALSE(r.integer("count", 1, 4));
  EXPECT_FALSE(r.fraction("coverage"));
  EXPECT_FALSE(r.probability("pfd"));
  EXPECT_FALSE(r.rate("lambda"));
  EXPECT_FALSE(r.duration("interval"));
  EXPECT_FALSE(r.choice("kind", {"x", "y"}));
  r.allow({"mode"});
  EXPECT_EQ(r.choice("mode", {"low", "high"}), "low");  // allowed and read: listed once
  r.finish();
  EXPECT_EQ(problems_of(ctx), (std::vector<std::string>{"/a/extra: unknown key \"extra\" | the keys of a thing are: "
                                                        "count, coverage, interval, kind, lambda, mode, pfd"}));
}

TEST(ObjectReader, AValueThatIsNotAnObjectIsReportedOnceAndItsReadsAnswerNothing) {
  LoadContext ctx;
  const Json array = Json::parse("[1, 2]");
  ObjectReader r(ctx, array, "/b", 0, "a thing");
  EXPECT_FALSE(r.number("rate"));
  EXPECT_FALSE(r.fraction("coverage", true));
  EXPECT_FALSE(r.member("x"));
  r.finish();
  EXPECT_EQ(problems_of(ctx), (std::vector<std::string>{"/b: an array | "}));
}

TEST(ObjectReader, ManyLongKeysReadAsFewShortOnes) {
  // 60 members read and 40 absent keys asked for, each name 28 bytes: more than the reader
  // holds inline (40 present keys, 24 absent ones, 512 bytes of their text).
  auto name = [](const char* stem, int i) { return std::string(stem) + (i < 10 ? "0" : "") + std::to_string(i); };
  Json object = Json::object();
  for (int i = 0; i < 60; ++i) object[name("a_rather_long_member_name_", i)] = i;
  object["an_unexpected_member"] = true;
  LoadContext ctx;
  ObjectReader r(ctx, object, "", 0, "a wide object");
  double sum = 0;
  for (int i = 0; i < 60; ++i) sum += r.number(name("a_rather_long_member_name_", i)).value_or(-1000);
  for (int i = 0; i < 40; ++i) EXPECT_FALSE(r.number(name("an_absent_long_member_name", i)));
  r.finish();
  EXPECT_EQ(sum, 59 * 60 / 2);
  ASSERT_EQ(ctx.problems.size(), 1U);
  const auto& d = ctx.problems.front().diagnostic;
  EXPECT_EQ(d.pointer, "/an_unexpected_member");
  std::string keys;  // every key asked for, in byte order
  for (int i = 0; i < 60; ++i) keys += (keys.empty() ? "" : ", ") + name("a_rather_long_member_name_", i);
  for (int i = 0; i < 40; ++i) keys += ", " + name("an_absent_long_member_name", i);
  EXPECT_EQ(d.hint.substr(d.hint.find("are: ") + 5), keys);
}

TEST(ObjectReader, AMembersPointerEscapesTildeAndSlash) {
  LoadContext ctx;
  const Json object = Json::object();
  const ObjectReader r(ctx, object, "/criteria/a~1b", 0, "criteria");
  EXPECT_EQ(r.at("plain"), "/criteria/a~1b/plain");
  EXPECT_EQ(r.at("1/2"), "/criteria/a~1b/1~12");
  EXPECT_EQ(r.at("1~2"), "/criteria/a~1b/1~02");
  EXPECT_EQ(r.at("1/2~3"), "/criteria/a~1b/1~12~03");
  EXPECT_EQ(r.at(""), "/criteria/a~1b/");
}

}  // namespace
}  // namespace sifter::detail
