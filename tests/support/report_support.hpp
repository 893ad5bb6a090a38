#pragma once
// Reading the report's tables back, from HTML and from Markdown, so that tests compare cells.
#include <cstddef>
#include <string>
#include <vector>

namespace sifter::testing {

/// A table as a reader sees it: plain text cells, entities and escapes undone.
struct ParsedTable {
  std::string caption;
  std::vector<std::string> header;
  std::vector<std::vector<std::string>> rows;
};

inline std::size_t count_of(const std::string& text, const std::string& needle) {
  std::size_t n = 0;
  for (auto p = text.find(needle); p != std::string::npos; p = text.find(needle, p + needle.size())) ++n;
  return n;
}

/// Undoes the five entities the writer produces.
inline std::string html_unescape(const std::string& s) {
  static const std::pair<const char*, const char*> kEntities[] = {
      {"&lt;", "<"}, {"&gt;", ">"}, {"&quot;", "\""}, {"&#39;", "'"}, {"&amp;", "&"}};
  std::string out;
  for (std::size_t i = 0; i < s.size();) {
    bool matched = false;
    for (const auto& [entity, ch] : kEntities) {
      const std::string e = entity;
      if (s.compare(i, e.size(), e) == 0) {
        out += ch;
        i += e.size();
        matched = true;
        break;
      }
    }
    if (!matched) out += s[i++];
  }
  return out;
}

/// The text of an element's content with its tags removed, unescaped.
inline std::string text_of(const std::string& markup) {
  std::string out;
  bool in_tag = false;
  for (char c : markup) {
    if (c == '<')
      in_tag = true;
    else if (c == '>')
      in_tag = false;
    else if (!in_tag)
      out += c;
  }
  return html_unescape(out);
}

/// The contents of every <open ...>...</close> element in [from, to), in order.
inline std::vector<std::string> elements(const std::string& html, const std::string& name, std::size_t from,
                                         std::size_t to) {
  std::vector<std::string> out;
  const std::string open = "<" + name, close = "</" + name + ">";
  for (auto p = html.find(open, from); p != std::string::npos && p < to; p = html.find(open, p + 1)) {
    const char after = html[p + open.size()];
    if (after != '>' && after != ' ') continue;  // <th> is not <thead>
    const auto start = html.find('>', p) + 1;
    const auto end = html.find(close, start);
    out.push_back(html.substr(start, end - start));
  }
  return out;
}

/// Every <table> of an HTML document.
inline std::vector<ParsedTable> html_tables(const std::string& html) {
  std::vector<ParsedTable> out;
  for (auto p = html.find("<table"); p != std::string::npos; p = html.find("<table", p + 1)) {
    const auto end = html.find("</table>", p);
    ParsedTable t;
    const auto caption = elements(html, "caption", p, end);
    if (!caption.empty()) t.caption = text_of(caption.front());
    for (const auto& th : elements(html, "th", p, end)) t.header.push_back(text_of(th));
    const auto body = html.find("<tbody>", p);
    for (const auto& tr : elements(html, "tr", body, end)) {
      std::vector<std::string> cells;
      for (const auto& td : elements(tr, "td", 0, tr.size())) cells.push_back(text_of(td));
      t.rows.push_back(std::move(cells));
    }
    out.push_back(std::move(t));
  }
  return out;
}

/// The cells of one pipe-table line, backslash escapes undone, trimmed.
inline std::vector<std::string> markdown_cells(const std::string& line) {
  std::vector<std::string> cells;
  std::string cell;
  for (std::size_t i = 1; i < line.size(); ++i) {  // line[0] is the opening pipe
    if (line[i] == '\\' && i + 1 < line.size()) {
      cell += line[++i];
    } else if (line[i] == '|') {
      const auto b = cell.find_first_not_of(' '), e = cell.find_last_not_of(' ');
      cells.push_back(b == std::string::npos ? "" : cell.substr(b, e - b + 1));
      cell.clear();
    } else {
      cell += line[i];
    }
  }
  return cells;
}

/// Every pipe table of a Markdown document, with the bold line above it as its caption.
inline std::vector<ParsedTable> markdown_tables(const std::string& md) {
  std::vector<std::string> lines;
  for (std::size_t p = 0, q; p < md.size(); p = q + 1) {
    q = md.find('\n', p);
    if (q == std::string::npos) q = md.size();
    lines.push_back(md.substr(p, q - p));
  }
  std::vector<ParsedTable> out;
  for (std::size_t i = 0; i < lines.size(); ++i) {
    if (lines[i].rfind("|", 0) != 0) continue;
    ParsedTable t;
    if (i >= 2 && lines[i - 2].rfind("**", 0) == 0) {
      std::string caption;
      const std::string bold = lines[i - 2].substr(2, lines[i - 2].size() - 4);
      for (std::size_t k = 0; k < bold.size(); ++k)
        caption += bold[k] == '\\' && k + 1 < bold.size() ? bold[++k] : bold[k];
      t.caption = caption;
    }
    t.header = markdown_cells(lines[i]);
    for (i += 2; i < lines.size() && lines[i].rfind("|", 0) == 0; ++i) t.rows.push_back(markdown_cells(lines[i]));
    out.push_back(std::move(t));
  }
  return out;
}

}  // namespace sifter::testing
