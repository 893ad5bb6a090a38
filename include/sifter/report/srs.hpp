#pragma once
/// The safety requirements specification (IEC 61511-1:2016 10.3, from memory): one section per
/// SIF with its hazard and scenarios, the integrity it must reach and how that was derived, the
/// function, timing, proof test, spurious trips, operation, devices with their data sources, and
/// the open items. Written as HTML (self-contained, like the report) or Markdown.
#include <string>
#include <string_view>
#include <unordered_map>
#include <vector>

#include "sifter/report/tables.hpp"
#include "sifter/results/deliverable.hpp"
#include "sifter/results/project.hpp"

namespace sifter::report {

/// One block of a SIF's section, rendered alike in HTML and Markdown.
struct SrsBlock {
  enum class Kind { kHeading, kParagraph, kTable, kList, kOpenItems } kind = Kind::kParagraph;
  std::string text;                ///< heading or paragraph
  Table table;                     ///< kTable
  std::vector<std::string> items;  ///< kList, kOpenItems
};

/// The component rows of the deliverables found by id: built once per document, as a register's
/// SRS looks up every device of every SIF. Ids are unique in a project; were one given twice,
/// its last row would answer.
class ComponentRows {
 public:
  explicit ComponentRows(const std::vector<ComponentDataRow>& rows);
  explicit ComponentRows(std::vector<ComponentDataRow>&&) = delete;  ///< it keeps views into the rows
  /// The row of `id`, nullptr if none.
  [[nodiscard]] const ComponentDataRow* find(const std::string& id) const;

 private:
  const std::vector<ComponentDataRow>& rows_;
  std::unordered_map<std::string_view, std::size_t> index_;
};

/// The blocks of one SIF's section (without its title); `rows` are those of `data.components`.
std::vector<SrsBlock> srs_sif_blocks(const ProjectResult& result, const DeliverableData& data,
                                     const ComponentRows& rows, std::size_t sif);

/// What the SRS writers need besides the results.
struct SrsOptions {
  std::string date;               ///< of the run, ISO 8601
  std::string tool_version;       ///< SIFTER_VERSION
  std::vector<std::size_t> sifs;  ///< indices of the SIFs to specify, in order
};

/// The whole SRS as one self-contained HTML page.
std::string render_srs_html(const ProjectResult& result, const DeliverableData& data, const SrsOptions& options);
/// The same as Markdown.
std::string render_srs_markdown(const ProjectResult& result, const DeliverableData& data, const SrsOptions& options);

}  // namespace sifter::report
