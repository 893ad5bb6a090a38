// The one parse of every JSON input (projects, libraries, record files): byte-order mark,
// comments, the fast tree, and the structure scan and nlohmann's messages for any other text.
#include "input/parse_source.hpp"

#include <cstdio>
#include <string>

#include "input/json_tree.hpp"
#include "sifter/input/json_comments.hpp"
#include "sifter/input/json_source.hpp"

namespace sifter::detail {
namespace {

// The parser quotes the bytes it read last; bytes outside printable ASCII are shown as \xNN,
// so that a message about invalid UTF-8 is not itself invalid UTF-8.
std::string printable(const std::string& text) {
  std::string out;
  for (unsigned char c : text) {
    if (c >= 0x20 && c < 0x7F) {
      out += static_cast<char>(c);
    } else {
      char buf[5];
      std::snprintf(buf, sizeof buf, "\\x%02X", c);
      out += buf;
    }
  }
  return out;
}

}  // namespace

std::optional<Json> parse_source(LoadContext& ctx, int source,
                                 std::initializer_list<std::string_view> deferred_sections) {
  std::string& text = ctx.sources[static_cast<std::size_t>(source)].text;
  const std::string& path = ctx.sources[static_cast<std::size_t>(source)].path;
  auto report = [&](TextPosition pos, const std::string& pointer, const std::string& expected, const std::string& found,
                    const std::string& hint) {
    Diagnostic d{path, pos.line, pos.column, pointer, expected, found, hint};
    ctx.problems.push_back({source, d});
  };
  if (text.size() >= 3 && static_cast<unsigned char>(text[0]) == 0xEF && static_cast<unsigned char>(text[1]) == 0xBB &&
      static_cast<unsigned char>(text[2]) == 0xBF) {
    report({1, 1}, "", "JSON text without a byte-order mark", "a UTF-8 byte-order mark",
           "save the file as UTF-8 without BOM");
    return std::nullopt;
  }
  if (auto comment = blank_json_comments(text)) {  // the one place comments are handled, before any parser
    report(comment->position, "", comment->expected, comment->found, comment->hint);
    return std::nullopt;
  }
  // nlohmann's very tree at parser speed, for a text the structure scan would pass; the scan
  // and nlohmann's parser report the problems of any other.
  reserve_parser_padding(text);  // already there for a file the loader read: then nothing moves
  const std::size_t spare = text.capacity() - text.size();
  if (deferred_sections.size() > 0) {
    if (auto tree = detail::fast_json_tree_deferring(text, kMaxNestingDepth, spare, deferred_sections, ctx.deferred))
      return tree;
  } else if (auto tree = detail::fast_json_tree(text, kMaxNestingDepth, spare)) {
    return tree;
  }
  const auto structure = scan_json_structure(text);
  for (const auto& p : structure) report(p.position, p.pointer, p.expected, p.found, p.hint);
  if (!structure.empty()) return std::nullopt;
  try {
    return Json::parse(text);  // a text simdjson refused or left in doubt: nlohmann's message
  } catch (const Json::parse_error& e) {
    std::string what = e.what();
    // nlohmann's message: "[json.exception.parse_error.101] parse error at line 3, column 5: syntax error ..."
    const auto colon = what.find(": ", what.find("parse error"));
    std::string detail = printable(colon == std::string::npos ? what : what.substr(colon + 2));
    const std::size_t offset = e.byte == 0 ? 0 : e.byte - 1;
    report(position_of_offset(text, offset), "", "valid JSON", detail,
           "check for a missing comma, quote or bracket near this place");
    return std::nullopt;
  } catch (const Json::out_of_range& e) {
    // nlohmann: "number overflow parsing '1e400'": locate the number in the text.
    const std::string what = e.what();
    const auto q1 = what.find('\''), q2 = what.rfind('\'');
    const std::string token = q1 != std::string::npos && q2 > q1 ? what.substr(q1 + 1, q2 - q1 - 1) : "";
    const auto at = token.empty() ? std::string::npos : text.find(token);
    report(position_of_offset(text, at == std::string::npos ? 0 : at), "", "numbers within the range of finite values",
           token.empty() ? "a number out of range" : "the number " + token, "write a finite number");
    return std::nullopt;
  }
}

}  // namespace sifter::detail
