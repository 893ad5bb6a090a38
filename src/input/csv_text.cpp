// RFC 4180 reading and writing, and the neutralising of formula-like text for spreadsheets.
#include "sifter/input/csv_text.hpp"

#include <cstdlib>

#include "sifter/model/printable.hpp"

namespace sifter {
namespace {

bool starts_like_formula(std::string_view t) {
  return !t.empty() && (t[0] == '=' || t[0] == '+' || t[0] == '-' || t[0] == '@' || t[0] == '\t' || t[0] == '\r');
}

}  // namespace

namespace {

// Reads a quoted cell starting at text[i] == '"'; returns false when it is never closed.
bool read_quoted(std::string_view text, std::size_t& i, std::string& cell, int& line) {
  for (++i; i < text.size();) {
    if (text[i] == '"') {
      if (i + 1 < text.size() && text[i + 1] == '"') {  // a doubled quote is one quote
        cell += '"';
        i += 2;
        continue;
      }
      ++i;
      return true;
    }
    if (text[i] == '\n') ++line;
    cell += text[i++];
  }
  return false;
}

}  // namespace

std::optional<CsvSyntaxProblem> parse_csv(std::string_view text, CsvRows& rows) {
  rows.clear();
  if (text.size() >= 3 && text.substr(0, 3) == "\xEF\xBB\xBF") text.remove_prefix(3);
  std::vector<std::string> row;
  std::string cell;
  int line = 1;
  std::size_t i = 0;
  bool row_open = false;
  while (i < text.size()) {
    const char c = text[i];
    if (c == '"' && cell.empty()) {
      const int start_line = line, start_column = static_cast<int>(row.size()) + 1;
      if (!read_quoted(text, i, cell, line))
        return CsvSyntaxProblem{start_line, start_column, "a quote that is never closed"};
      row_open = true;
    } else if (c == ',') {
      row.push_back(std::move(cell));
      cell.clear();
      row_open = true;
      ++i;
    } else if (c == '\r' || c == '\n') {
      i += (c == '\r' && i + 1 < text.size() && text[i + 1] == '\n') ? 2 : 1;
      if (row_open || !cell.empty()) row.push_back(std::move(cell));
      cell.clear();
      rows.push_back(std::move(row));
      row.clear();
      row_open = false;
      ++line;
    } else {
      cell += c;
      row_open = true;
      ++i;
    }
  }
  if (row_open || !cell.empty()) {
    row.push_back(std::move(cell));
    rows.push_back(std::move(row));
  }
  return std::nullopt;
}

std::string csv_cell(std::string_view text) {
  if (text.find_first_of(",\"\r\n") == std::string_view::npos) return std::string(text);
  std::string out = "\"";
  for (char c : text) {
    if (c == '"') out += '"';
    out += c;
  }
  return out + "\"";
}

std::string restore_formula_text(std::string_view text) {
  if (text.size() >= 2 && text[0] == '\'' && starts_like_formula(text.substr(1))) return std::string(text.substr(1));
  return std::string(text);
}

std::string csv_line(const std::vector<std::string>& cells) {
  std::string out;
  for (std::size_t i = 0; i < cells.size(); ++i) {
    if (i > 0) out += ',';
    out += csv_cell(neutralise_formula(cells[i]));
  }
  return out + "\r\n";
}

}  // namespace sifter
