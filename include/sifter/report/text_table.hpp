#pragma once
/// A plain-text table with aligned columns, for the terminal writers.
#include <cstddef>
#include <limits>
#include <string>
#include <vector>

namespace sifter::report {

/// What a column does when the table is wider than the terminal.
enum class Fit {
  kKeep,   ///< stays on one line; only its header may break between words
  kWrap,   ///< its cells break between words, inside the column
  kBelow,  ///< leaves the grid and is written under its row, labelled by its header
};

/// Columns are left-aligned unless marked right-aligned; rows may hold a rule ("-") or a
/// section line that spans the table.
class TextTable {
 public:
  explicit TextTable(std::vector<std::string> header, std::vector<bool> right_aligned = {});
  /// How each column gives way in a narrow terminal (default: every column kKeep).
  void set_fit(std::vector<Fit> fit);
  void add_row(std::vector<std::string> cells);
  void add_rule();
  /// A line of its own across the table (e.g. "consequence: safety 4"); it sets no width.
  void add_section(std::string text);
  /// Every line starts with `indent`. A table wider than `width` (indent included) gives way:
  /// first kBelow columns move under their rows, then kWrap cells and headers break between
  /// words; if it still does not fit, every row is stacked as "header: value" lines. Only a
  /// single word longer than the width can leave it.
  [[nodiscard]] std::string render(const std::string& indent = "  ",
                                   std::size_t width = std::numeric_limits<std::size_t>::max()) const;

 private:
  [[nodiscard]] std::string render_grid(const std::string& indent, const std::vector<std::size_t>& columns,
                                        const std::vector<std::size_t>& widths, std::size_t width) const;
  [[nodiscard]] std::string render_stacked(const std::string& indent, std::size_t width) const;

  std::vector<std::string> header_;
  std::vector<bool> right_;
  std::vector<Fit> fit_;
  struct Row {
    enum class Kind { kCells, kRule, kSection } kind = Kind::kCells;
    std::vector<std::string> cells;  ///< kSection: one cell, the text
  };
  std::vector<Row> rows_;
};

/// Prose (limits, assumptions, notes, warnings) stops at 96 columns on a wide terminal, and at
/// the terminal's edge on a narrower one; tables may use the whole width.
inline constexpr std::size_t kProseWidth = 96;
[[nodiscard]] inline std::size_t prose_width(std::size_t terminal_width) {
  return terminal_width < kProseWidth ? terminal_width : kProseWidth;
}

/// Wraps text at word boundaries; every line starts with `indent`; `width` excludes the indent.
/// Text that starts with "- " hangs: its later lines start two columns further in and hold two
/// columns less, so that every line fits `width` after the indent.
std::string wrap(const std::string& text, std::size_t width, const std::string& indent);

/// `text` as one line when indent and text fit in `width`, else broken between words (runs of
/// spaces kept) with continuation lines indented by `indent` + `hang` (a "- " item hangs by two
/// when `hang` is empty); a word longer than the width keeps a line of its own.
std::string fit_line(const std::string& text, std::size_t width, const std::string& indent,
                     const std::string& hang = "");

/// The characters of UTF-8 text as a terminal shows them (one column each).
std::size_t display_width(const std::string& text);

}  // namespace sifter::report
