#pragma once
/// The project's pressure section, options and data maturity as plain structs, units resolved.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/pressure_units.hpp"
#include "sifter/model/quantity.hpp"

namespace sifter {

/// How mature a datum is: a preliminary estimate, the vendor's figure, or as built.
enum class DataStatus { kEstimate, kVendor, kAsBuilt };

/// "estimate", "vendor", "as_built".
std::string to_string(DataStatus status);

/// One point of a pump's curve: flow and head at the rated speed.
struct CurvePoint {
  VolumeFlow flow;
  Length head;
};

/// A source of pressure: a centrifugal pump or an upstream system of fixed maximum.
struct PressureSource {
  enum class Kind { kCentrifugalPump, kFixed } kind = Kind::kCentrifugalPump;
  std::string id;
  std::string title;
  DataStatus status = DataStatus::kVendor;
  // Centrifugal pump.
  Pressure suction_max;                      ///< highest suction pressure, stated by the user
  std::optional<Density> density_max;        ///< also used for static head from a fixed source
  double speed_max_ratio = 1.0;              ///< highest speed / rated speed (affinity: H ~ N^2)
  std::vector<CurvePoint> curve;             ///< vendor curve, flow ascending; empty = estimate
  std::optional<Length> rated_differential;  ///< estimate: rated differential head
  double shutoff_margin = 0.0;               ///< estimate: shutoff = rated x (1 + margin)
  // Fixed source.
  Pressure pressure;  ///< the upstream system's maximum
  Length elevation;
  std::string pointer;
  [[nodiscard]] bool shutoff_estimated() const { return kind == Kind::kCentrifugalPump && curve.empty(); }
};

/// An equipment item with its rating.
struct PressureEquipment {
  std::string id;
  std::string title;
  Pressure mawp;           ///< maximum allowable working pressure (or design pressure)
  Pressure test_pressure;  ///< hydrotest pressure (stated, or MAWP x test_factor)
  Length elevation;
  DataStatus status = DataStatus::kVendor;
  std::vector<std::string> sifs;  ///< SIFs that protect it (at most one)
  struct Relief {
    std::string id;
    std::string title;
    double pfd = 0.01;
  };
  std::vector<Relief> relief_devices;
  std::string pointer;
};

/// A directed connection in the flow direction.
struct PressureConnection {
  std::string from;
  std::string to;
  std::string pointer;
};

/// The severity of the project's risk criteria an overpressure band maps to.
struct BandConsequence {
  std::string category;
  std::string severity;
};

/// The overpressure bands: the code's accumulation and the severity of each band above MAWP.
struct ConsequenceBands {
  double accumulation = 0.10;  ///< common pressure-vessel codes, single relief device (memory)
  BandConsequence minor;       ///< MAWP < p <= MAWP x (1 + accumulation)
  BandConsequence leak;        ///< up to the test pressure
  BandConsequence rupture;     ///< above the test pressure
};

/// The blocked-outlet initiating frequency, with the source of the number.
struct BlockedOutletFrequency {
  Rate frequency;
  std::string source;
  DataStatus status = DataStatus::kVendor;
};

/// The "pressure" section.
struct PressureSection {
  std::vector<PressureSource> sources;
  std::vector<PressureEquipment> equipment;
  std::vector<PressureConnection> connections;
  std::optional<ConsequenceBands> bands;
  std::optional<BlockedOutletFrequency> blocked_outlet;
};

/// One alternative answer to a scenario, with its costs (in the project's currency).
struct ScenarioOption {
  enum class Kind { kRerate, kRelief, kSif, kLayer } kind = Kind::kLayer;
  std::string scenario;
  std::string id;
  std::string title;
  // rerate
  std::optional<Pressure> new_mawp;
  // relief
  std::optional<Pressure> set_pressure;
  std::string receiver;
  std::optional<VolumeFlow> receiver_capacity;
  // relief and layer
  double pfd = 1.0;
  std::optional<Duration> test_interval;  ///< proof tests of a relief device or layer
  // sif
  std::string sif;
  // costs
  double capex = 0.0;
  double annual_cost = 0.0;
  double cost_per_test = 0.0;
  double cost_per_spurious_trip = 0.0;
  std::string pointer;
};

/// "rerate", "relief", "sif", "layer".
std::string to_string(ScenarioOption::Kind kind);

/// The "options" section: the alternatives and the discount rate of their costs.
struct OptionsSection {
  double discount_rate = 0.0;  ///< per year
  std::vector<ScenarioOption> alternatives;
};

}  // namespace sifter
