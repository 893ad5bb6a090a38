#pragma once
/// Comments in project and library files: blanked out before any JSON parser sees the text.
#include <optional>
#include <string>
#include <string_view>

#include "sifter/input/json_source.hpp"

namespace sifter {

/// An unterminated block comment, reported where it opens.
struct CommentProblem {
  TextPosition position;
  std::string expected;
  std::string found;
  std::string hint;
};

/// Whether the text may hold a comment: true when "//" or "/*" occurs anywhere in it (inside
/// a string too). blank_json_comments changes no byte of a text for which this is false.
bool may_hold_json_comments(std::string_view text);

/// Replaces every `// …` (to the end of the line) and `/* … */` comment in `text` by spaces,
/// keeping newlines and every other byte where it was, so that byte offsets, lines and columns
/// of the JSON left over are those of the file as written. Slashes inside strings are text.
/// Works for any JSON parser, since the result is plain JSON of the same length.
std::optional<CommentProblem> blank_json_comments(std::string& text);

}  // namespace sifter
