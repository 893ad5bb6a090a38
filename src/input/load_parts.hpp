#pragma once
/// The loader's parts, one per section of the project file (loader internals).
#include <map>
#include <string>

#include "input/json_reader.hpp"
#include "sifter/model/model.hpp"

namespace sifter::detail {

/// A library model's fields, validated in its own file, waiting to be merged into components.
struct ModelEntry {
  Json fields;     ///< the entry without id/title/source/note
  int source = 0;  ///< the library file it came from
  std::string pointer;
};
using ModelIndex = std::map<std::string, ModelEntry>;

/// Reads the files listed under "libraries" (recursively, cycles refused) into `models`.
void read_libraries(LoadContext& ctx, ObjectReader& owner, const std::string& base_dir, ModelIndex& models,
                    std::vector<std::string>& chain);

/// Reads "components", merging library models, into project.components. Each entry's JSON is
/// set to null once read (its text position is found again from the file when reported).
void read_components(LoadContext& ctx, Json& root, const ModelIndex& models, Project& project);

/// Checks one library model entry's fields in its own file.
void check_model_entry(LoadContext& ctx, const Json& entry, int source, const std::string& pointer);

/// "iec61511" (default when absent), "route_1h", "route_2h".
std::optional<ConstraintBasis> parse_constraint_basis(const std::optional<std::string>& text);

/// Reads "sifs" into project.sifs, applying the defaults.
void read_sifs(LoadContext& ctx, Json& root, Project& project);

/// Reads "risk_criteria" and "scenarios".
void read_scenarios(LoadContext& ctx, Json& root, Project& project);

/// Checks across sections: demand mode of vendor figures and targets, the SIF's signal path.
void check_project_plausibility(LoadContext& ctx, const Project& project);
/// "diverse": true on a group whose channels are identical (same component data, or the same
/// library model with no field that differs) is refused at its "diverse" key. Needs the
/// channels' component indices (after the graph validation).
void check_diverse_groups(LoadContext& ctx, const Project& project);

}  // namespace sifter::detail

namespace sifter::detail {

/// "prior_use": {"sil": 1..4, "evidence": "..."} on a component or library model.
std::optional<PriorUse> read_prior_use(ObjectReader& r);

/// "data_source": a string, or {"kind", "document", "revision", "date"}.
std::optional<DataSource> read_data_source(ObjectReader& r);

/// A SIF's "requirements" (safety requirements specification), absent when not written.
std::optional<SifRequirements> read_requirements(ObjectReader& sif);

/// The project's "document" (document control of the deliverables).
std::optional<DocumentControl> read_document(ObjectReader& top);

}  // namespace sifter::detail
