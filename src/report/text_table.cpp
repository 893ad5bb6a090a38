// Aligned plain-text tables and word wrapping, fitted to the terminal's width.
#include "sifter/report/text_table.hpp"

#include <algorithm>
#include <sstream>

namespace sifter::report {

namespace {

std::vector<std::string> words_of(const std::string& text) {
  std::istringstream in(text);
  std::vector<std::string> words;
  for (std::string w; in >> w;) words.push_back(w);
  return words;
}

std::size_t longest_word(const std::string& text) {
  std::size_t n = 0;
  for (const auto& w : words_of(text)) n = std::max(n, display_width(w));
  return n;
}

// The lines of a cell broken between words to `width`; leading spaces (the hierarchy of the
// worksheet's step labels) stay on the first line. A cell that fits is returned whole.
std::vector<std::string> cell_lines(const std::string& text, std::size_t width) {
  if (display_width(text) <= width) return {text};
  const std::size_t lead = text.find_first_not_of(' ');
  std::vector<std::string> lines;
  std::string line = lead == std::string::npos ? "" : text.substr(0, lead);
  bool first_word = true;
  for (const auto& w : words_of(text)) {
    if (!first_word && display_width(line) + 1 + display_width(w) > width) {
      lines.push_back(line);
      line.clear();
      first_word = true;
    }
    line += (first_word ? "" : " ") + w;
    first_word = false;
  }
  lines.push_back(line);
  return lines;
}

std::string trimmed_right(std::string s) {
  while (!s.empty() && s.back() == ' ') s.pop_back();
  return s;
}

}  // namespace

std::size_t display_width(const std::string& s) {
  std::size_t n = 0;
  for (unsigned char c : s)
    if ((c & 0xC0) != 0x80) ++n;
  return n;
}

TextTable::TextTable(std::vector<std::string> header, std::vector<bool> right_aligned)
    : header_(std::move(header)), right_(std::move(right_aligned)) {
  right_.resize(header_.size(), false);
  fit_.resize(header_.size(), Fit::kKeep);
}

void TextTable::set_fit(std::vector<Fit> fit) {
  fit_ = std::move(fit);
  fit_.resize(header_.size(), Fit::kKeep);
}

void TextTable::add_row(std::vector<std::string> cells) {
  cells.resize(header_.size());
  rows_.push_back({Row::Kind::kCells, std::move(cells)});
}

void TextTable::add_rule() { rows_.push_back({Row::Kind::kRule, {}}); }

void TextTable::add_section(std::string text) { rows_.push_back({Row::Kind::kSection, {std::move(text)}}); }

std::string TextTable::render(const std::string& indent, std::size_t width) const {
  std::vector<std::size_t> natural(header_.size());
  for (std::size_t c = 0; c < header_.size(); ++c) {
    natural[c] = display_width(header_[c]);
    for (const auto& row : rows_)
      if (row.kind == Row::Kind::kCells) natural[c] = std::max(natural[c], display_width(row.cells[c]));
  }
  auto total = [&](const std::vector<std::size_t>& cols, const std::vector<std::size_t>& w) {
    std::size_t sum = display_width(indent);
    for (std::size_t i = 0; i < cols.size(); ++i) sum += w[cols[i]] + (i ? 2 : 0);
    return sum;
  };
  std::vector<std::size_t> all(header_.size());
  for (std::size_t c = 0; c < all.size(); ++c) all[c] = c;
  if (total(all, natural) <= width) return render_grid(indent, all, natural, width);

  // Columns that may leave the grid go under their rows.
  std::vector<std::size_t> grid;
  for (std::size_t c : all)
    if (fit_[c] != Fit::kBelow) grid.push_back(c);
  if (total(grid, natural) <= width) return render_grid(indent, grid, natural, width);

  // Then cells of kWrap columns, and headers of every column, break between words: give each
  // column its narrowest width, then hand out what is left to the columns that lose most.
  std::vector<std::size_t> narrow(header_.size());
  for (std::size_t c : grid) {
    narrow[c] = longest_word(header_[c]);
    for (const auto& row : rows_) {
      if (row.kind != Row::Kind::kCells) continue;
      narrow[c] = std::max(narrow[c], fit_[c] == Fit::kWrap ? longest_word(row.cells[c]) : display_width(row.cells[c]));
    }
  }
  if (total(grid, narrow) > width) return render_stacked(indent, width);
  // The room left goes to the wrapping columns first (their text would take most lines),
  // whole columns before partial ones, the cheapest to restore first; then to the headers.
  std::vector<std::size_t> w = narrow;
  std::size_t spare = width - total(grid, narrow);
  std::vector<std::size_t> by_deficit = grid;
  std::stable_sort(by_deficit.begin(), by_deficit.end(), [&](std::size_t a, std::size_t b) {
    const bool wrap_a = fit_[a] == Fit::kWrap, wrap_b = fit_[b] == Fit::kWrap;
    if (wrap_a != wrap_b) return wrap_a;
    return natural[a] - narrow[a] < natural[b] - narrow[b];
  });
  for (std::size_t c : by_deficit) {
    const std::size_t deficit = natural[c] - w[c];
    if (deficit > spare) {
      w[c] += spare;
      break;
    }
    w[c] = natural[c];
    spare -= deficit;
  }
  return render_grid(indent, grid, w, width);
}

std::string TextTable::render_grid(const std::string& indent, const std::vector<std::size_t>& cols,
                                   const std::vector<std::size_t>& w, std::size_t width) const {
  std::size_t span = 0;
  for (std::size_t i = 0; i < cols.size(); ++i) span += w[cols[i]] + (i ? 2 : 0);
  auto line = [&](const std::vector<std::string>& cells) {
    std::vector<std::vector<std::string>> parts;
    std::size_t height = 1;
    for (std::size_t c : cols) {
      parts.push_back(cell_lines(cells[c], w[c]));
      height = std::max(height, parts.back().size());
    }
    std::string out;
    for (std::size_t k = 0; k < height; ++k) {
      std::string text = indent;
      for (std::size_t i = 0; i < cols.size(); ++i) {
        const std::string cell = k < parts[i].size() ? parts[i][k] : "";
        const std::size_t shown = display_width(cell);
        const std::string pad(w[cols[i]] > shown ? w[cols[i]] - shown : 0, ' ');
        text += right_[cols[i]] ? pad + cell : cell + pad;
        if (i + 1 < cols.size()) text += "  ";
      }
      out += trimmed_right(text) + "\n";
    }
    return out;
  };
  std::string out = line(header_);
  const std::string below_indent = indent + "    ";
  for (const auto& row : rows_) {
    switch (row.kind) {
      case Row::Kind::kRule:
        out += indent + std::string(span, '-') + "\n";
        break;
      case Row::Kind::kSection:
        out += fit_line(row.cells[0], width, indent);
        break;
      case Row::Kind::kCells:
        out += line(row.cells);
        for (std::size_t c = 0; c < header_.size(); ++c)
          if (std::find(cols.begin(), cols.end(), c) == cols.end() && !row.cells[c].empty())
            out += fit_line(header_[c] + ": " + row.cells[c], width, below_indent, "  ");
        break;
    }
  }
  return out;
}

std::string TextTable::render_stacked(const std::string& indent, std::size_t width) const {
  std::string out;
  for (const auto& row : rows_) {
    switch (row.kind) {
      case Row::Kind::kRule:
        out += "\n";
        break;
      case Row::Kind::kSection:
        out += fit_line(row.cells[0], width, indent);
        break;
      case Row::Kind::kCells: {
        // The fields sit under the row's first cell, keeping its indentation (the worksheet's
        // steps), and their continuation lines hang under the value.
        const std::size_t lead = std::min(row.cells[0].find_first_not_of(' '), row.cells[0].size());
        const std::string field_indent = indent + std::string(lead + 2, ' ');
        out += fit_line(row.cells[0], width, indent);
        for (std::size_t c = 1; c < header_.size(); ++c)
          if (!row.cells[c].empty()) out += fit_line(header_[c] + ": " + row.cells[c], width, field_indent, "  ");
        break;
      }
    }
  }
  return out;
}

std::string wrap(const std::string& text, std::size_t width, const std::string& indent) {
  std::istringstream words(text);
  std::string word, line, out;
  // Continuation lines hang under the first word when the text starts with "- ".
  const bool hanging = text.rfind("- ", 0) == 0;
  while (words >> word) {
    // A hanging line starts two columns further in, so it holds two columns less.
    const std::size_t room = out.empty() || !hanging ? width : width - std::min<std::size_t>(width, 2);
    if (!line.empty() && display_width(line) + 1 + display_width(word) > room) {
      out += (out.empty() ? indent : indent + (hanging ? "  " : "")) + line + "\n";
      line.clear();
    }
    line += (line.empty() ? "" : " ") + word;
  }
  if (!line.empty()) out += (out.empty() ? indent : indent + (hanging ? "  " : "")) + line + "\n";
  return out;
}

std::string fit_line(const std::string& text, std::size_t width, const std::string& indent, const std::string& hang) {
  const std::size_t used = display_width(indent);
  if (used + display_width(text) <= width) return indent + text + "\n";
  // Break at spaces, keeping the runs of spaces that align a label and its value.
  const std::string next_indent = indent + (hang.empty() && text.rfind("- ", 0) == 0 ? "  " : hang);
  std::string out, line;
  std::string pending_space;
  std::size_t i = 0;
  bool first = true;
  while (i < text.size()) {
    const std::size_t end = std::min(text.find(' ', i), text.size());
    const std::string word = text.substr(i, end - i);
    const std::size_t room = width - std::min(width, display_width(first ? indent : next_indent));
    if (!line.empty() && display_width(line) + display_width(pending_space) + display_width(word) > room) {
      out += (first ? indent : next_indent) + line + "\n";
      line.clear();
      first = false;
      pending_space.clear();
    }
    line += pending_space + word;
    std::size_t after = text.find_first_not_of(' ', end);
    if (after == std::string::npos) after = text.size();
    pending_space = text.substr(end, after - end);
    i = after;
  }
  if (!line.empty()) out += (first ? indent : next_indent) + line + "\n";
  return out;
}

}  // namespace sifter::report
