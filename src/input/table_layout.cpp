// The CSV tables' columns: one table per kind, as a workbook keeps them (data/csv-tables.md).
#include "input/table_layout.hpp"

#include <stdexcept>

namespace sifter::detail {

int TableLayout::index(const std::string& header) const {
  for (std::size_t i = 0; i < columns.size(); ++i)
    if (columns[i].header == header) return static_cast<int>(i);
  return -1;
}

namespace {
using K = CellKind;

// A table of data, not logic: kept at namespace scope so that no function grows with the layout.
const std::vector<TableLayout> kLayouts = {
    {"project.csv", {{"setting", "", K::kText, true}, {"value", "", K::kText, true}}},
    {"revisions.csv",
     {{"revision", "revision", K::kText, true},
      {"date", "date", K::kText},
      {"by", "by", K::kText},
      {"description", "description", K::kText}}},
    {"components.csv",
     {{"id", "id", K::kText, true},
      {"model", "model", K::kText},
      {"lambda_du", "lambda_du", K::kValue},
      {"lambda_dd", "lambda_dd", K::kValue},
      {"lambda_su", "lambda_su", K::kValue},
      {"lambda_sd", "lambda_sd", K::kValue},
      {"lambda_d", "lambda_d", K::kValue},
      {"lambda_s", "lambda_s", K::kValue},
      {"dc", "dc", K::kValue},
      {"element_type", "element_type", K::kText},
      {"systematic_capability", "systematic_capability", K::kValue},
      {"sff", "sff", K::kValue},
      {"data_confidence", "data_confidence", K::kValue},
      {"error_factor", "uncertainty/error_factor", K::kValue},
      {"field_failures", "field_data/failures", K::kValue},
      {"field_device_hours", "field_data/device_hours", K::kValue},
      {"field_confidence", "field_data/confidence", K::kValue},
      {"data_source", "data_source", K::kText},
      {"data_source_kind", "data_source/kind", K::kText},
      {"data_source_document", "data_source/document", K::kText},
      {"data_source_revision", "data_source/revision", K::kText},
      {"data_source_date", "data_source/date", K::kText},
      {"data_source_note", "data_source/note", K::kText},
      {"field_data_source", "field_data/data_source", K::kText},
      {"prior_use_sil", "prior_use/sil", K::kValue},
      {"prior_use_evidence", "prior_use/evidence", K::kText},
      {"response_time", "response_time", K::kValue},
      {"title", "title", K::kText},
      {"manufacturer", "manufacturer", K::kText},
      {"tag_description", "tag_description", K::kText},
      {"note", "note", K::kText}}},
    {"risk_criteria.csv",
     {{"category", "", K::kText, true},
      {"severity", "", K::kText, true},
      {"tolerable_frequency", "", K::kValue, true}}},
    {"sifs.csv",
     {{"id", "id", K::kText, true},
      {"title", "title", K::kText},
      {"demand_mode", "demand_mode", K::kText},
      {"target_sil", "target/sil", K::kValue},
      {"target_rrf", "target/rrf", K::kValue},
      {"target_pfd_avg", "target/pfd_avg", K::kValue},
      {"target_pfh", "target/pfh", K::kValue},
      {"constraints", "constraints", K::kText},
      {"note", "note", K::kText}}},
    {"requirements.csv",
     {{"sif", "", K::kText, true},
      {"safe_state", "requirements/safe_state", K::kText},
      {"trip_setpoint", "requirements/trip_setpoint", K::kText},
      {"process_safety_time", "requirements/process_safety_time", K::kValue},
      {"response_time_fraction", "requirements/response_time_fraction", K::kValue},
      {"max_spurious_trip_rate", "requirements/max_spurious_trip_rate", K::kValue},
      {"reset", "requirements/reset", K::kText},
      {"manual_shutdown", "requirements/manual_shutdown", K::kText},
      {"bypass", "requirements/bypass", K::kText},
      {"proof_test_interval", "requirements/proof_test_interval", K::kValue},
      {"proof_test_coverage", "requirements/proof_test_coverage", K::kText},
      {"energize_to_trip", "requirements/energize_to_trip", K::kText},
      {"action", "requirements/action", K::kText},
      {"functional_relation", "requirements/functional_relation", K::kText},
      {"fault_response", "requirements/fault_response", K::kText},
      {"startup_restart", "requirements/startup_restart", K::kText},
      {"interfaces", "requirements/interfaces", K::kText},
      {"environment", "requirements/environment", K::kText},
      {"operating_modes", "requirements/operating_modes", K::kText},
      {"notes", "requirements/notes", K::kText}}},
    {"subsystems.csv",
     {{"sif", "", K::kText, true},
      {"name", "name", K::kText, true},
      {"role", "role", K::kText},
      {"vote", "vote", K::kText},
      {"channels", "channels", K::kChannels},
      {"beta", "beta", K::kValue},
      {"beta_d", "beta_d", K::kValue},
      {"ccf_scaling", "ccf_scaling", K::kText},
      {"proof_test_interval", "proof_test_interval", K::kValue},
      {"mttr", "mttr", K::kValue},
      {"mrt", "mrt", K::kValue},
      {"proof_test_coverage", "proof_test_coverage", K::kValue},
      {"partial_stroke_interval", "partial_stroke/interval", K::kValue},
      {"partial_stroke_coverage", "partial_stroke/coverage", K::kValue},
      {"test_duration", "test_duration", K::kValue},
      {"staggered", "staggered", K::kBool},
      {"trip_on_detected", "trip_on_detected", K::kBool},
      {"pfd_avg", "pfd_avg", K::kValue},
      {"pfh", "pfh", K::kValue},
      {"hft", "hft", K::kValue},
      {"systematic_capability", "systematic_capability", K::kValue},
      {"sil_capability", "sil_capability", K::kValue},
      {"response_time", "response_time", K::kValue},
      {"diverse", "diverse", K::kBool},
      {"diversity_note", "diversity_note", K::kText},
      {"title", "title", K::kText},
      {"note", "note", K::kText}}},
    {"scenarios.csv",
     {{"scenario", "", K::kText, true},
      {"scenario_title", "title", K::kText},
      {"node", "node", K::kText},
      {"deviation", "deviation", K::kText},
      {"consequences", "consequences", K::kConsequences},
      {"target_frequency", "target_frequency", K::kValue},
      {"scenario_note", "note", K::kText},
      {"cause", "id", K::kText, true},
      {"cause_title", "title", K::kText},
      {"frequency", "frequency", K::kValue, true},
      {"devices", "devices", K::kList},
      {"note", "note", K::kText}}},
    {"layers.csv",
     {{"scenario", "", K::kText, true},
      {"entry", "", K::kText, true},
      {"id", "id", K::kText},
      {"sif", "sif", K::kText},
      {"title", "title", K::kText},
      {"kind", "kind", K::kText},
      {"pfd", "pfd", K::kValue},
      {"probability", "probability", K::kValue},
      {"cause", "", K::kText},
      {"applies_to", "applies_to", K::kList},
      {"devices", "devices", K::kList},
      {"response_time", "response_time", K::kValue},
      {"time_available", "time_available", K::kValue},
      {"independence_note", "independence_note", K::kText},
      {"reason", "reason", K::kText},
      {"note", "note", K::kText}}},
};
}  // namespace

const std::vector<TableLayout>& table_layouts() { return kLayouts; }

const TableLayout& table_layout(const std::string& file) {
  for (const auto& t : table_layouts())
    if (t.file == file) return t;
  throw std::logic_error("no table " + file);
}

const std::vector<Setting>& project_settings() {
  static const std::vector<Setting> settings = {
      {"title", "title", K::kText},
      {"note", "note", K::kText},
      {"revision", "revision", K::kText},
      {"author", "author", K::kText},
      {"document_number", "document/number", K::kText},
      {"document_revision", "document/revision", K::kText},
      {"document_date", "document/date", K::kText},
      {"prepared_by", "document/prepared_by", K::kText},
      {"checked_by", "document/checked_by", K::kText},
      {"approved_by", "document/approved_by", K::kText},
      {"constraints", "constraints", K::kText},
      {"proof_test_interval", "defaults/proof_test_interval", K::kValue},
      {"mttr", "defaults/mttr", K::kValue},
      {"mrt", "defaults/mrt", K::kValue},
      {"mission_time", "defaults/mission_time", K::kValue},
      {"operator_time_multiple", "lopa/operator_time_multiple", K::kValue},
      {"library", "libraries", K::kList},
  };
  return settings;
}

// The sif layer is written {"sif": ID}; ordinary layers carry kind and pfd; "applies_to" names
// causes for a layer and consequence categories for a modifier.
std::vector<std::string> layer_entry_columns(const std::string& entry) {
  if (entry == "layer")
    return {
        "id",  "title", "kind", "pfd", "applies_to", "devices", "response_time", "time_available", "independence_note",
        "note"};
  if (entry == "sif") return {"id", "sif", "title", "note"};
  if (entry == "modifier") return {"title", "probability", "applies_to", "note"};
  if (entry == "enabling") return {"cause", "title", "probability", "note"};
  if (entry == "not_credited") return {"title", "reason"};
  return {};
}

}  // namespace sifter::detail
