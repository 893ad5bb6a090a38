#pragma once
/// The overpressure screening, as results.
/// Plain data of the results contract: the standard library and the model only.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"

namespace sifter {

/// How far an item's maximum credible pressure exceeds its rating (common practice bands).
enum class OverpressureCategory {
  kNone,             ///< at or below MAWP
  kMinor,            ///< up to MAWP x (1 + accumulation)
  kLeakPossible,     ///< up to the test pressure: loss of containment unlikely, leaks possible
  kRupturePossible,  ///< above the test pressure
};

/// "none", "minor", "leak_possible", "rupture_possible".
std::string to_string(OverpressureCategory category);

/// The screening of one equipment item reached by at least one source.
struct EquipmentScreening {
  std::string id;
  std::string title;
  double max_pressure_barg = 0.0;
  double mawp_barg = 0.0;
  double test_pressure_barg = 0.0;
  double ratio = 0.0;  ///< max pressure / MAWP (gauge)
  OverpressureCategory category = OverpressureCategory::kNone;
  std::string source;                  ///< the governing source
  std::vector<std::string> path;       ///< ids from the governing source to the item
  double static_head_bar = 0.0;        ///< rho g (z_source - z_item) of the governing source
  std::vector<std::string> estimates;  ///< the estimates its verdict rests on (empty: final)
  [[nodiscard]] bool preliminary() const { return !estimates.empty(); }
};

/// The whole screening.
struct PressureScreening {
  std::vector<EquipmentScreening> equipment;  ///< items reached, in project order
  std::vector<std::string> not_reached;       ///< items no source reaches
  std::vector<std::string> generated;         ///< ids of the scenarios generated
  std::vector<std::string> missing;           ///< what is missing to generate scenarios
};

}  // namespace sifter
