// Readable names of the model's enumerations.
#include "sifter/model.hpp"

namespace sifter {

std::string to_string(Role role) {
  switch (role) {
    case Role::kSensor: return "sensor";
    case Role::kLogic: return "logic";
    case Role::kFinal: return "final";
  }
  return "sensor";
}

std::string to_string(DemandMode mode) { return mode == DemandMode::kLow ? "low" : "high"; }

std::string to_string(ConstraintBasis basis) {
  switch (basis) {
    case ConstraintBasis::kIec61511: return "iec61511";
    case ConstraintBasis::kRoute1H: return "route_1h";
    case ConstraintBasis::kRoute2H: return "route_2h";
  }
  return "iec61511";
}

std::string to_string(LayerKind kind) {
  switch (kind) {
    case LayerKind::kBpcsFunction: return "bpcs_function";
    case LayerKind::kOperatorResponse: return "operator_response";
    case LayerKind::kReliefDevice: return "relief_device";
    case LayerKind::kMechanical: return "mechanical";
    case LayerKind::kSif: return "sif";
    case LayerKind::kOther: return "other";
  }
  return "other";
}

}  // namespace sifter
