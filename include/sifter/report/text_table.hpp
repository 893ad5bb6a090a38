#pragma once
/// A plain-text table with aligned columns, for the terminal writers.
#include <string>
#include <vector>

namespace sifter::report {

/// Columns are left-aligned unless marked right-aligned; rows may hold a rule ("-").
class TextTable {
 public:
  explicit TextTable(std::vector<std::string> header, std::vector<bool> right_aligned = {});
  void add_row(std::vector<std::string> cells);
  void add_rule();
  /// Every line starts with `indent`.
  [[nodiscard]] std::string render(const std::string& indent = "  ") const;

 private:
  std::vector<std::string> header_;
  std::vector<bool> right_;
  std::vector<std::vector<std::string>> rows_;  // an empty row is a rule
};

/// Wraps text at word boundaries; every line starts with `indent`.
std::string wrap(const std::string& text, std::size_t width, const std::string& indent);

}  // namespace sifter::report
