#pragma once
/// The column layout of the CSV tables (internals of import and export).
#include <string>
#include <vector>

namespace sifter::detail {

/// How a cell becomes a JSON value and back.
enum class CellKind {
  kText,          ///< a string
  kValue,         ///< a number when the cell is one, else a string ("250 FIT", "5%", "1 yr")
  kBool,          ///< true / false
  kList,          ///< strings separated by ";"
  kChannels,      ///< channels separated by ";", elements in series joined by "+"
  kConsequences,  ///< "category:severity" separated by ";"
};

/// One column: its header, the member it fills (a "/" goes one object deeper), its kind.
struct Column {
  std::string header;
  std::string path;
  CellKind kind = CellKind::kText;
  bool required = false;
};

/// One table of the layout.
struct TableLayout {
  std::string file;
  std::vector<Column> columns;
  [[nodiscard]] int index(const std::string& header) const;  ///< -1 when absent
};

/// The tables in the order they are read: project, revisions, components, risk_criteria, sifs,
/// requirements, subsystems, scenarios, layers.
const std::vector<TableLayout>& table_layouts();
const TableLayout& table_layout(const std::string& file);

/// project.csv: the setting names and the member each fills.
struct Setting {
  std::string name;
  std::string path;
  CellKind kind;
};
const std::vector<Setting>& project_settings();

/// layers.csv: the columns each kind of entry may fill.
std::vector<std::string> layer_entry_columns(const std::string& entry);

}  // namespace sifter::detail
