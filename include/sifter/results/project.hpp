#pragma once
/// The whole project's results: every SIF and scenario, what they share, and the warnings.
/// Plain data of the results contract: the standard library and the model only.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/diagnostics.hpp"
#include "sifter/model/model.hpp"
#include "sifter/results/lopa.hpp"
#include "sifter/results/pressure.hpp"
#include "sifter/results/sif.hpp"

namespace sifter {

/// A component on which several SIFs rely.
struct SharedComponent {
  std::string component;
  std::vector<std::string> sifs;
};

/// A device on which several SIFs or scenarios rely, and who they are.
struct SharedDevice {
  std::string tag;
  std::vector<std::string> users;  ///< SIF ids (in project order), then scenario ids
};

/// The whole project's results.
struct ProjectResult {
  std::string title;
  std::string file;
  std::string sha256;
  std::vector<SifResult> sifs;
  std::vector<ScenarioResult> scenarios;
  std::vector<SharedComponent> shared_components;
  std::vector<SharedDevice> shared_devices;  ///< devices several SIFs or scenarios rely on
  RiskCriteria risk_criteria;
  std::vector<Warning> warnings;
  std::optional<PressureScreening> pressure;  ///< the overpressure screening, when there is one
  /// Every judged SIF meets its target and every scenario its tolerable frequency.
  [[nodiscard]] bool all_met() const;
};

/// One line per preliminary verdict (equipment items, scenarios, SIFs), for `check --final`.
std::vector<std::string> preliminary_verdicts(const ProjectResult& result);

}  // namespace sifter
