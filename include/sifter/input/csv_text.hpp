#pragma once
/// CSV text as spreadsheets write it (RFC 4180), read and written cell by cell.
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace sifter {

/// One table: rows of cells, the header first; `rows[i]` is spreadsheet row i + 1.
using CsvRows = std::vector<std::vector<std::string>>;

/// A CSV text that cannot be read (an unclosed quote), with the row where it starts.
struct CsvSyntaxProblem {
  int row = 0;
  int column = 0;
  std::string found;
};

/// Reads RFC 4180 text: quoted cells may hold commas, quotes ("") and line breaks; lines end in
/// CRLF or LF; a UTF-8 byte-order mark (as spreadsheets save it) is skipped. Rows that are
/// wholly empty are kept as empty rows so that row numbers stay those of the spreadsheet.
std::optional<CsvSyntaxProblem> parse_csv(std::string_view text, CsvRows& rows);

/// A cell quoted when it holds a comma, a quote or a line break.
std::string csv_cell(std::string_view text);

/// The inverse on import: one leading apostrophe before = + - @, tab or CR is removed.
std::string restore_formula_text(std::string_view text);

/// One line of cells, quoted where needed and neutralised, ending in CRLF.
std::string csv_line(const std::vector<std::string>& cells);

}  // namespace sifter
