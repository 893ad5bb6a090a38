// `sifter import`: a table cell's text as the JSON value of its column.
#include "input/table_import_cells.hpp"

#include <algorithm>
#include <cctype>
#include <optional>
#include <sstream>
#include <vector>

namespace sifter::detail {
namespace {

using OJson = nlohmann::ordered_json;

std::vector<std::string> split(const std::string& s, char sep) {
  std::vector<std::string> out;
  std::string part;
  std::istringstream in(s);
  while (std::getline(in, part, sep))
    if (!trim_cell(part).empty()) out.push_back(trim_cell(part));
  return out;
}

std::optional<OJson> as_number(const std::string& text) {
  if (text.empty() || text.find_first_not_of("+-.0123456789eE") != std::string::npos) return std::nullopt;
  try {
    OJson v = OJson::parse(text[0] == '+' ? text.substr(1) : text);
    if (v.is_number()) return v;
  } catch (const std::exception&) {
  }
  return std::nullopt;
}

}  // namespace

std::string trim_cell(const std::string& s) {
  const auto b = s.find_first_not_of(" \t");
  if (b == std::string::npos) return "";
  return s.substr(b, s.find_last_not_of(" \t") - b + 1);
}

OJson cell_value(CellKind kind, const std::string& text) {
  switch (kind) {
    case CellKind::kText:
      return text;
    case CellKind::kValue:
      return as_number(text).value_or(OJson(text));
    case CellKind::kBool: {
      std::string low = text;
      std::transform(low.begin(), low.end(), low.begin(), [](unsigned char ch) { return std::tolower(ch); });
      if (low == "true" || low == "yes") return true;
      if (low == "false" || low == "no") return false;
      return text;
    }
    case CellKind::kList: {
      OJson a = OJson::array();
      for (const auto& s : split(text, ';')) a.push_back(s);
      return a;
    }
    case CellKind::kChannels: {
      OJson a = OJson::array();
      for (const auto& ch : split(text, ';')) {
        const auto parts = split(ch, '+');
        if (parts.size() == 1)
          a.push_back(parts[0]);
        else
          a.push_back(parts);
      }
      return a;
    }
    case CellKind::kConsequences: {
      OJson a = OJson::array();
      for (const auto& c : split(text, ';')) {
        const auto colon = c.rfind(':');
        const std::string category = trim_cell(c.substr(0, colon == std::string::npos ? c.size() : colon));
        const std::string severity = colon == std::string::npos ? "" : trim_cell(c.substr(colon + 1));
        OJson q{{"category", category}};
        if (!severity.empty()) {
          auto n = as_number(severity);
          q["severity"] = n && n->is_number_integer() ? *n : OJson(severity);
        }
        a.push_back(q);
      }
      return a;
    }
  }
  return text;
}

}  // namespace sifter::detail
