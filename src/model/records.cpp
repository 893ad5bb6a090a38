// Names of the in-service record kinds.
#include "sifter/model/records.hpp"

namespace sifter {

std::string to_string(EventKind kind) {
  switch (kind) {
    case EventKind::kProofTest:
      return "proof_test";
    case EventKind::kDemand:
      return "demand";
    case EventKind::kSpuriousTrip:
      return "spurious_trip";
    case EventKind::kRepair:
      return "repair";
  }
  return {};
}

std::string to_string(EventResult result) {
  switch (result) {
    case EventResult::kPass:
      return "pass";
    case EventResult::kFailDangerous:
      return "fail_dangerous";
    case EventResult::kFailSafe:
      return "fail_safe";
  }
  return {};
}

std::string to_string(FoundBy found_by) {
  switch (found_by) {
    case FoundBy::kProofTest:
      return "proof_test";
    case FoundBy::kDemand:
      return "demand";
    case FoundBy::kDiagnostics:
      return "diagnostics";
  }
  return {};
}

}  // namespace sifter
