// Escaping control characters in user text, and neutralising formula-like CSV cells.
#include "sifter/model/printable.hpp"

#include <charconv>
#include <cstdio>

namespace sifter {

std::string escape_controls(std::string_view text) {
  std::string out;
  out.reserve(text.size());
  char buf[8];
  for (std::size_t i = 0; i < text.size(); ++i) {
    const auto c = static_cast<unsigned char>(text[i]);
    if ((c < 0x20 && c != '\n' && c != '\t') || c == 0x7F) {
      std::snprintf(buf, sizeof buf, "\\x%02x", c);
      out += buf;
    } else if (c == 0xC2 && i + 1 < text.size() && static_cast<unsigned char>(text[i + 1]) >= 0x80 &&
               static_cast<unsigned char>(text[i + 1]) <= 0x9F) {
      std::snprintf(buf, sizeof buf, "\\u%04x", static_cast<unsigned char>(text[i + 1]));
      out += buf;
      ++i;
    } else {
      out += static_cast<char>(c);
    }
  }
  return out;
}

std::string neutralise_formula(std::string_view cell) {
  if (cell.empty()) return std::string(cell);
  const char first = cell.front();
  if (first != '=' && first != '+' && first != '-' && first != '@' && first != '\t' && first != '\r')
    return std::string(cell);
  double v = 0.0;
  const char* begin = cell.data() + (first == '+' ? 1 : 0);
  const auto [end, ec] = std::from_chars(begin, cell.data() + cell.size(), v);
  if (ec == std::errc() && end == cell.data() + cell.size()) return std::string(cell);  // a number, kept
  return "'" + std::string(cell);
}

}  // namespace sifter
