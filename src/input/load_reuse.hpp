#pragma once
/// Shared parts written once: subsystem templates and the layer catalogue (loader internals).
#include <string>
#include <vector>

#include "input/json_reader.hpp"
#include "sifter/model/model.hpp"

namespace sifter::detail {

/// Where one expanded object came from: a template or a catalogue entry, and the keys it gave.
struct ReuseOrigin {
  std::string pointer;                      ///< the object in the project, e.g. "/sifs/2/subsystems/1"
  std::string origin_pointer;               ///< e.g. "/subsystem_templates/LS-SAFE" or "/layer_catalogue/0"
  std::string name;                         ///< the template's name or the catalogue entry's id
  std::vector<std::string> inherited_keys;  ///< keys taken from the origin (not overridden)
};

/// What the expansion did, so that problems and the model can be traced back to the origin.
struct ReuseRecord {
  std::vector<ReuseOrigin> subsystems;
  std::vector<ReuseOrigin> layers;
  std::vector<std::string> unresolved;  ///< objects whose template or entry is unknown
  std::size_t first_problem = 0;        ///< problems before this one are not the expansion's
};

/// Replaces, in the parsed project, every SIF subsystem written {"name", "template", …} by the
/// template's fields overridden by its own, and every scenario layer written {"layer": "ID", …}
/// by the catalogue entry overridden likewise. Reads "subsystem_templates" and "layer_catalogue"
/// through `top`. Called once, after parsing and before the SIFs and scenarios are read.
ReuseRecord expand_reuse(LoadContext& ctx, Json& root, ObjectReader& top);

/// After the SIFs are read: records each subsystem's template in the model.
void name_templated_subsystems(const ReuseRecord& record, Project& project);

/// After the scenarios are read: records each layer's catalogue entry in the model, and checks
/// "applies_to_causes" against the scenario's causes.
void finish_reuse(LoadContext& ctx, const ReuseRecord& record, Project& project);

/// Before the problems are reported: moves those in inherited fields to the template or entry
/// itself and keeps each once, and drops (counting them) those inside an object whose template
/// or entry is unknown.
void settle_reuse_problems(LoadContext& ctx, const ReuseRecord& record);

}  // namespace sifter::detail
