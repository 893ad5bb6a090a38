#pragma once
/// Pressures, heads, densities and flows with their units resolved (the quantity room's part
/// for overpressure screening). Exact unit definitions: 1 bar = 1e5 Pa; 1 psi = 6894.757 Pa
/// (NIST SP 811, seen); standard atmosphere 1.01325 bar; standard gravity 9.80665 m/s^2
/// (ISO 80000-3, seen); 1 ft = 0.3048 m exactly (international foot, seen).
#include <string>
#include <string_view>

#include "sifter/model/quantity.hpp"

namespace sifter {

/// Standard gravity in m/s^2, ISO 80000-3 (seen).
inline constexpr double kStandardGravity = 9.80665;
/// The atmosphere that turns gauge into absolute pressure, in bar (gauge + 1.01325 = absolute).
inline constexpr double kAtmosphereBar = 1.01325;
/// Pascal per bar and per psi (exact definitions; 1 psi = 6894.757 Pa to seven figures).
inline constexpr double kPascalPerBar = 1e5;
inline constexpr double kPascalPerPsi = 6894.757;
/// Metres per international foot (exact).
inline constexpr double kMetresPerFoot = 0.3048;

/// Whether a pressure was written as gauge ("barg", "psig", "kPag", "MPag") or absolute
/// ("bara", "psia").
enum class PressureBasis { kGauge, kAbsolute };

/// A pressure, stored as bar gauge; the basis it was written in is kept so that gauge and
/// absolute values are never mixed silently.
struct Pressure {
  double bar_gauge = 0.0;
  PressureBasis written = PressureBasis::kGauge;
  [[nodiscard]] double bar_absolute() const { return bar_gauge + kAtmosphereBar; }
  [[nodiscard]] double pascal_gauge() const { return bar_gauge * kPascalPerBar; }
};

/// A length or elevation or pump head, stored in metres.
struct Length {
  double metres = 0.0;
};

/// A density, stored in kg/m^3.
struct Density {
  double kg_per_m3 = 0.0;
};

/// A volumetric flow, stored in m^3/h.
struct VolumeFlow {
  double m3_per_hour = 0.0;
};

/// The pressure of a liquid column: rho * g * h, in bar (h may be negative).
[[nodiscard]] inline double static_head_bar(Density rho, Length height) {
  return rho.kg_per_m3 * kStandardGravity * height.metres / kPascalPerBar;
}

/// Parses "12 barg", "13.01325 bara", "150 psig", "164.7 psia", "1200 kPag", "1.2 MPag".
Parsed<Pressure> parse_pressure(std::string_view text);
/// Parses "35 m", "115 ft" (also negative, for elevations).
Parsed<Length> parse_length(std::string_view text);
/// Parses "1050 kg/m3" (positive).
Parsed<Density> parse_density(std::string_view text);
/// Parses "40 m3/h" (zero or more).
Parsed<VolumeFlow> parse_flow(std::string_view text);

/// Accepted forms, for hints.
inline constexpr std::string_view kPressureForms =
    "\"12 barg\", \"13 bara\", \"150 psig\", \"1200 kPag\" or \"1.2 MPag\"";

/// "12.3 barg" for people.
std::string format_pressure(double bar_gauge);

}  // namespace sifter
