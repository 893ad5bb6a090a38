#pragma once
/// What the signed documents show beyond the figures: component data, subsystem parameters, open requirements.
/// Plain data of the results contract: the standard library and the model only.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"

namespace sifter {

/// One row of the component-data table.
struct ComponentDataRow {
  std::string id;
  std::string model;
  FailureRates rates;
  std::optional<double> sff;  ///< from the rates, or declared (fraction)
  bool sff_declared = false;
  std::optional<ElementType> type;
  std::optional<int> systematic_capability;
  std::optional<PriorUse> prior_use;
  std::string source;       ///< one line; empty when none is given
  std::string source_kind;  ///< certificate, fmeda, handbook, field, estimate; empty for text
  std::optional<double> response_time_s;
  std::vector<std::string> sifs;  ///< ids of the SIFs that use it
};

/// A subsystem's test, repair and common-cause parameters as the figures used them.
struct SubsystemParameters {
  std::string name;
  bool vendor = false;
  double beta = 0.0;
  double beta_d = 0.0;
  Duration proof_test_interval;
  Duration mttr;
  Duration mrt;
  double proof_test_coverage = 1.0;
  std::optional<PartialStroke> partial_stroke;
  std::optional<Duration> test_duration;
  bool staggered = false;
};

/// One requirement of the specification: what it is, what the project states (empty: open).
struct RequirementItem {
  std::string clause;  ///< the checklist item, e.g. "safe state"
  std::string stated;  ///< as the project states it; empty when not stated
};

/// A SIF's part of the deliverables.
struct SifDeliverable {
  std::optional<SifRequirements> requirements;
  std::vector<SubsystemParameters> subsystems;  ///< in signal order
  std::vector<RequirementItem> items;           ///< the IEC 61511-1:2016 10.3.2 checklist, stated or open
  [[nodiscard]] std::vector<std::string> open_items() const;
};

/// Everything the deliverables need from the project besides the results.
struct DeliverableData {
  std::string project_title;
  std::optional<DocumentControl> document;
  std::vector<ComponentDataRow> components;  ///< every component, in project order
  std::vector<SifDeliverable> sifs;          ///< one per SIF, project order
};

}  // namespace sifter
