// Aligned plain-text tables and word wrapping.
#include "sifter/report/text_table.hpp"

#include <algorithm>
#include <sstream>

namespace sifter::report {

namespace {
// Display width of UTF-8 text: count the characters, not the bytes.
std::size_t display_width(const std::string& s) {
  std::size_t n = 0;
  for (unsigned char c : s)
    if ((c & 0xC0) != 0x80) ++n;
  return n;
}
}  // namespace

TextTable::TextTable(std::vector<std::string> header, std::vector<bool> right_aligned)
    : header_(std::move(header)), right_(std::move(right_aligned)) {
  right_.resize(header_.size(), false);
}

void TextTable::add_row(std::vector<std::string> cells) {
  cells.resize(header_.size());
  rows_.push_back(std::move(cells));
}

void TextTable::add_rule() { rows_.emplace_back(); }

std::string TextTable::render(const std::string& indent) const {
  std::vector<std::size_t> width(header_.size());
  for (std::size_t c = 0; c < header_.size(); ++c) width[c] = display_width(header_[c]);
  for (const auto& row : rows_)
    for (std::size_t c = 0; c < row.size(); ++c) width[c] = std::max(width[c], display_width(row[c]));
  std::size_t total = 0;
  for (auto w : width) total += w + 2;
  auto line = [&](const std::vector<std::string>& cells) {
    std::string out = indent;
    for (std::size_t c = 0; c < cells.size(); ++c) {
      const std::string pad(width[c] - display_width(cells[c]), ' ');
      out += right_[c] ? pad + cells[c] : cells[c] + pad;
      if (c + 1 < cells.size()) out += "  ";
    }
    while (!out.empty() && out.back() == ' ') out.pop_back();
    return out + "\n";
  };
  std::string out = line(header_);
  for (const auto& row : rows_) out += row.empty() ? indent + std::string(total - 2, '-') + "\n" : line(row);
  return out;
}

std::string wrap(const std::string& text, std::size_t width, const std::string& indent) {
  std::istringstream words(text);
  std::string word, line, out;
  // Continuation lines hang under the first word when the text starts with "- " or "[".
  const bool hanging = text.rfind("- ", 0) == 0;
  while (words >> word) {
    if (!line.empty() && display_width(line) + 1 + display_width(word) > width) {
      out += (out.empty() ? indent : indent + (hanging ? "  " : "")) + line + "\n";
      line.clear();
    }
    line += (line.empty() ? "" : " ") + word;
  }
  if (!line.empty()) out += (out.empty() ? indent : indent + (hanging ? "  " : "")) + line + "\n";
  return out;
}

}  // namespace sifter::report
