// Comments blanked to spaces, so that the JSON left over keeps every offset of the file as written.
#include "sifter/input/json_comments.hpp"

namespace sifter {

// A comment opens with "//" or "/*": a text with neither has none (a register, most often).
// One search from slash to slash (memchr) is many times faster than the walk of
// blank_json_comments.
bool may_hold_json_comments(std::string_view text) {
  for (std::size_t slash = text.find('/'); slash != std::string_view::npos; slash = text.find('/', slash + 1))
    if (slash + 1 < text.size() && (text[slash + 1] == '/' || text[slash + 1] == '*')) return true;
  return false;
}

std::optional<CommentProblem> blank_json_comments(std::string& text) {
  if (!may_hold_json_comments(text)) return std::nullopt;
  const std::size_t n = text.size();
  std::size_t i = 0;
  while (i < n) {
    const char c = text[i];
    if (c == '"') {  // a string: skip to its closing quote, honouring backslash escapes
      for (++i; i < n && text[i] != '"'; ++i)
        if (text[i] == '\\') ++i;
      ++i;
      continue;
    }
    if (c != '/' || i + 1 >= n || (text[i + 1] != '/' && text[i + 1] != '*')) {
      ++i;  // a lone slash is left for the parser to refuse
      continue;
    }
    if (text[i + 1] == '/') {
      for (; i < n && text[i] != '\n' && text[i] != '\r'; ++i) text[i] = ' ';
      continue;
    }
    const std::size_t open = i;
    const std::size_t close = text.find("*/", i + 2);
    if (close == std::string::npos)
      return CommentProblem{position_of_offset(text, open), "a block comment closed by \"*/\"",
                            "\"/*\" that is never closed", "close the comment, or use // for a one-line comment"};
    // Newlines inside the comment stay, so that the lines after it keep their numbers.
    for (; i < close + 2; ++i)
      if (text[i] != '\n' && text[i] != '\r') text[i] = ' ';
  }
  return std::nullopt;
}

}  // namespace sifter
