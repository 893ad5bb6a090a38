// Parsing of pressures, lengths, densities and flows written with their units.
#include "sifter/model/pressure_units.hpp"

#include <array>
#include <cctype>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <optional>

namespace sifter {
namespace {

struct NumberAndUnit {
  bool ok = false;
  double number = 0.0;
  std::string_view unit;
};

std::string_view trim(std::string_view s) {
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.front()))) s.remove_prefix(1);
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.back()))) s.remove_suffix(1);
  return s;
}

// std::from_chars keeps the reading independent of the locale.
NumberAndUnit split(std::string_view text) {
  text = trim(text);
  const char* first = text.data();
  const char* last = text.data() + text.size();
  if (first != last && *first == '+') ++first;
  double value = 0.0;
  auto [ptr, ec] = std::from_chars(first, last, value);
  if (ec != std::errc() || ptr == first || !std::isfinite(value)) return {};
  if (value == 0.0) value = 0.0;  // "-0" reads as zero
  return {true, value, trim(std::string_view(ptr, static_cast<std::size_t>(last - ptr)))};
}

struct PressureUnit {
  std::string_view name;
  double bar_per_unit;
  PressureBasis basis;
};

constexpr std::array<PressureUnit, 6> kPressureUnits{{
    {"barg", 1.0, PressureBasis::kGauge},
    {"bara", 1.0, PressureBasis::kAbsolute},
    {"psig", kPascalPerPsi / kPascalPerBar, PressureBasis::kGauge},
    {"psia", kPascalPerPsi / kPascalPerBar, PressureBasis::kAbsolute},
    {"kPag", 1e3 / kPascalPerBar, PressureBasis::kGauge},
    {"MPag", 1e6 / kPascalPerBar, PressureBasis::kGauge},
}};

}  // namespace

Parsed<Pressure> parse_pressure(std::string_view text) {
  const std::string hint = "write a pressure with a gauge or absolute unit, for example " + std::string(kPressureForms);
  auto nu = split(text);
  if (!nu.ok) return {std::nullopt, "no finite number at the start", hint};
  if (nu.unit.empty()) return {std::nullopt, "the unit is missing", hint};
  for (const auto& u : kPressureUnits) {
    if (u.name != nu.unit) continue;
    const double bar = nu.number * u.bar_per_unit;
    if (u.basis == PressureBasis::kAbsolute) {
      if (bar < 0.0) return {std::nullopt, "an absolute pressure below zero", hint};
      return {Pressure{bar - kAtmosphereBar, PressureBasis::kAbsolute}, {}, {}};
    }
    if (bar < -kAtmosphereBar) return {std::nullopt, "a gauge pressure below full vacuum (-1.01325 barg)", hint};
    return {Pressure{bar, PressureBasis::kGauge}, {}, {}};
  }
  if (nu.unit == "bar" || nu.unit == "psi" || nu.unit == "kPa" || nu.unit == "MPa")
    return {std::nullopt, "\"" + std::string(nu.unit) + "\" without saying gauge or absolute",
            "add g (gauge) or a (absolute): \"" + std::string(nu.unit) + "g\"; absolute = gauge + 1.01325 bar"};
  return {std::nullopt, "unknown pressure unit \"" + std::string(nu.unit) + "\"", hint};
}

Parsed<Length> parse_length(std::string_view text) {
  const std::string hint = "write a length with its unit, for example \"35 m\" or \"115 ft\"";
  auto nu = split(text);
  if (!nu.ok) return {std::nullopt, "no finite number at the start", hint};
  if (nu.unit == "m") return {Length{nu.number}, {}, {}};
  if (nu.unit == "ft") return {Length{nu.number * kMetresPerFoot}, {}, {}};
  if (nu.unit.empty()) return {std::nullopt, "the unit is missing", hint};
  return {std::nullopt, "unknown length unit \"" + std::string(nu.unit) + "\"", hint};
}

Parsed<Density> parse_density(std::string_view text) {
  const std::string hint = "write a density with its unit, for example \"1050 kg/m3\"";
  auto nu = split(text);
  if (!nu.ok) return {std::nullopt, "no finite number at the start", hint};
  if (nu.unit != "kg/m3")
    return {std::nullopt,
            nu.unit.empty() ? "the unit is missing" : "unknown density unit \"" + std::string(nu.unit) + "\"", hint};
  if (nu.number <= 0.0)
    return {std::nullopt, "a density of zero or less", "a fluid has a positive density: " + hint.substr(6)};
  return {Density{nu.number}, {}, {}};
}

Parsed<VolumeFlow> parse_flow(std::string_view text) {
  const std::string hint = "write a flow with its unit, for example \"40 m3/h\"";
  auto nu = split(text);
  if (!nu.ok) return {std::nullopt, "no finite number at the start", hint};
  if (nu.unit != "m3/h")
    return {std::nullopt,
            nu.unit.empty() ? "the unit is missing" : "unknown flow unit \"" + std::string(nu.unit) + "\"", hint};
  if (nu.number < 0.0) return {std::nullopt, "a negative flow", "a flow is zero or more: " + hint.substr(6)};
  return {VolumeFlow{nu.number}, {}, {}};
}

std::string format_pressure(double bar_gauge) {
  std::array<char, 32> buf{};
  std::snprintf(buf.data(), buf.size(), "%.2f barg", bar_gauge == 0.0 ? 0.0 : bar_gauge);
  return buf.data();
}

}  // namespace sifter
