#pragma once
/// `sifter import`: a table cell's text as the JSON value of its column (internals of import).
#include <nlohmann/json.hpp>
#include <string>

#include "input/table_layout.hpp"

namespace sifter::detail {

/// The text without the spaces and tabs around it.
std::string trim_cell(const std::string& s);

/// The value a cell of that kind stands for; text that is not what the kind expects stays text,
/// for the loader to report at its cell.
nlohmann::ordered_json cell_value(CellKind kind, const std::string& text);

}  // namespace sifter::detail
