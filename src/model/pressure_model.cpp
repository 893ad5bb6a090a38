// Names of the pressure section's enumerations.
#include "sifter/model/pressure_model.hpp"

namespace sifter {

std::string to_string(DataStatus status) {
  switch (status) {
    case DataStatus::kEstimate:
      return "estimate";
    case DataStatus::kVendor:
      return "vendor";
    case DataStatus::kAsBuilt:
      return "as_built";
  }
  return "vendor";
}

std::string to_string(ScenarioOption::Kind kind) {
  switch (kind) {
    case ScenarioOption::Kind::kRerate:
      return "rerate";
    case ScenarioOption::Kind::kRelief:
      return "relief";
    case ScenarioOption::Kind::kSif:
      return "sif";
    case ScenarioOption::Kind::kLayer:
      return "layer";
  }
  return "layer";
}

}  // namespace sifter
