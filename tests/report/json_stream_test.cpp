// Specification of the streamed results JSON: the same values as the tree, compact or indented,
// numbers in shortest round-trip form, and no non-finite number ever written.
#include "sifter/report/json_stream.hpp"

#include <gtest/gtest.h>

#include <algorithm>
#include <limits>
#include <nlohmann/json.hpp>
#include <sstream>

#include "sifter/analysis/verify.hpp"
#include "sifter/input/load.hpp"
#include "sifter/report/json_results.hpp"

namespace sifter {
namespace {

using report::JsonLayout;
using report::JsonStream;

std::string written(JsonLayout layout, const std::function<void(JsonStream&)>& body) {
  std::ostringstream out;
  {
    JsonStream w(out, layout);
    body(w);
  }
  return out.str();
}

TEST(JsonStream, CompactLayoutHasNoSpacesOrLineBreaks) {
  const auto text = written(JsonLayout::kCompact, [](JsonStream& w) {
    w.begin_object().key("a").value(1).key("b").begin_array().value("x").null().value(true).end_array();
    w.key("c").begin_object().end_object().end_object();
  });
  EXPECT_EQ(text, R"({"a":1,"b":["x",null,true],"c":{}})");
}

TEST(JsonStream, PrettyLayoutMatchesTheTreeDumpedWithTwoSpaces) {
  const auto text = written(JsonLayout::kPretty, [](JsonStream& w) {
    w.begin_object().key("a").value(1).key("b").begin_array().value("x").number(0.5).end_array();
    w.key("c").begin_array().end_array().end_object();
  });
  EXPECT_EQ(text, nlohmann::json::parse(text).dump(2));
}

TEST(JsonStream, NumbersAreShortestRoundTripAndStayFloatingPoint) {
  for (double v : {0.1, 1e-5, 2.0 / 3.0, 1234.5678e-12, 100.0, 0.0, -3.25e300}) {
    const auto text = written(JsonLayout::kCompact, [v](JsonStream& w) { w.number(v); });
    const auto parsed = nlohmann::json::parse(text);
    EXPECT_TRUE(parsed.is_number_float()) << text;
    EXPECT_EQ(parsed.get<double>(), v) << text;  // round trip: bit for bit
  }
  EXPECT_EQ(written(JsonLayout::kCompact, [](JsonStream& w) { w.number(0.1); }), "0.1");
}

TEST(JsonStream, TextsAreEscapedAsJsonRequires) {
  const std::string nasty = "quote \" backslash \\ tab \t newline \n bell \x07 degree \xC2\xB0";
  const auto text = written(JsonLayout::kCompact, [&](JsonStream& w) { w.value(nasty); });
  EXPECT_EQ(nlohmann::json::parse(text).get<std::string>(), nasty);
}

// The escaping scans eight bytes at a time: a character to escape at every offset of a word,
// beside UTF-8 and every control character, must come out as nlohmann::json writes it
// (an independent implementation of RFC 8259 section 7).
TEST(JsonStream, TextsAreEscapedAsNlohmannWritesThemWhereverTheCharacterFalls) {
  const std::string specials = std::string("\"\\\n\t\r\b\f\x01\x1f", 9) + std::string(1, '\0');
  std::vector<std::string> texts = {"", "plain text longer than one word", "\xc3\xa9t\xc3\xa9 \xe2\x89\xa4 1e-3 /h ~"};
  for (char c : specials)
    for (std::size_t at = 0; at < 20; ++at) {
      std::string t(21, 'a');
      t[at] = c;
      texts.push_back(t);
      texts.push_back("\xce\xbb" + t.substr(0, at + 1));  // a two-byte letter before it
    }
  for (int c = 0; c < 0x20; ++c) texts.push_back("control " + std::string(1, static_cast<char>(c)) + " here");
  for (const auto& t : texts) {
    const std::string ours = written(JsonLayout::kCompact, [&](JsonStream& w) { w.value(t); });
    EXPECT_EQ(ours, nlohmann::json(t).dump()) << "text of " << t.size() << " bytes";
  }
}

TEST(JsonStream, NonFiniteNumberIsRefusedAsAnInternalError) {
  for (double bad : {std::numeric_limits<double>::quiet_NaN(), std::numeric_limits<double>::infinity()}) {
    try {
      written(JsonLayout::kCompact, [bad](JsonStream& w) { w.begin_array().number(bad, "test value").end_array(); });
      FAIL() << "a non-finite number was written";
    } catch (const Error& e) {
      EXPECT_EQ(e.exit_code(), ExitCode::kInternal);
    }
  }
}

// The results of an example, streamed compact and indented, hold the same keys and values as
// the tree of results_json (the order of keys aside).
TEST(JsonStream, StreamedResultsOfAnExampleEqualTheTree) {
  const auto result = verify_project(load_project_file(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json"));
  const auto tree = report::results_json(result);
  for (auto layout : {JsonLayout::kCompact, JsonLayout::kPretty}) {
    std::ostringstream out;
    report::write_results_json(result, out, layout);
    EXPECT_EQ(nlohmann::json::parse(out.str()), tree);
  }
}

// Elements written apart, by elements-only streams, and appended: the text of one stream,
// in both layouts, whether the array already held elements or not.
TEST(JsonStream, ElementsWrittenApartAreByteForByteThoseOfOneStream) {
  for (auto layout : {JsonLayout::kCompact, JsonLayout::kPretty}) {
    const auto one = written(layout, [](JsonStream& w) {
      w.begin_object().key("list").begin_array();
      for (int i = 0; i < 5; ++i)
        w.begin_object().key("i").value(i).key("x").begin_array().value("t").end_array().end_object();
      w.end_array().key("empty").begin_array().end_array().end_object();
    });
    const auto apart = written(layout, [layout](JsonStream& w) {
      w.begin_object().key("list").begin_array();
      for (int part = 0; part < 3; ++part) {
        std::ostringstream text;
        {
          JsonStream p(text, layout, w.depth(), part == 0);
          for (int i = 2 * part; i < std::min(5, 2 * part + 2); ++i)
            p.begin_object().key("i").value(i).key("x").begin_array().value("t").end_array().end_object();
        }
        w.elements(text.str());
      }
      w.end_array().key("empty").begin_array().elements("").end_array().end_object();
    });
    EXPECT_EQ(apart, one);
  }
}

// A register's results are rendered on two cores in blocks of SIFs and scenarios: the text is
// byte for byte the one-core text, in both layouts, and holds the tree's keys and values.
TEST(JsonStream, ResultsOfManySifsOnTwoCoresAreTheOneCoreText) {
  auto result = verify_project(load_project_file(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json"));
  ASSERT_FALSE(result.sifs.empty());
  ASSERT_FALSE(result.scenarios.empty());
  const auto sifs = result.sifs;
  const auto scenarios = result.scenarios;
  for (int copy = 1; result.sifs.size() < 700; ++copy) {  // several blocks of 128, the last one partial
    for (auto s : sifs) {
      s.id += "-" + std::to_string(copy);
      result.sifs.push_back(std::move(s));
    }
    for (auto s : scenarios) {
      s.id += "-" + std::to_string(copy);
      result.scenarios.push_back(std::move(s));
    }
  }
  const auto tree = report::results_json(result);
  for (auto layout : {JsonLayout::kCompact, JsonLayout::kPretty}) {
    std::ostringstream one, two;
    report::write_results_json(result, one, layout, 1);
    report::write_results_json(result, two, layout, 0);
    EXPECT_EQ(two.str(), one.str());
    EXPECT_EQ(nlohmann::json::parse(two.str()), tree);
  }
}

}  // namespace
}  // namespace sifter
