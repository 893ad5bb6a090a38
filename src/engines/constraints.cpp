// Architectural constraints and systematic capability (DEVELOPERS.md, Methods M5).
#include "sifter/engines/constraints.hpp"

#include <algorithm>
#include <array>
#include <cassert>
#include <cstdio>
#include <cstdlib>

#include "engines/constraints_assessment.hpp"
#include "sifter/engines/sil.hpp"

namespace sifter {

namespace detail {

bool at_least(double value, double edge) { return value >= edge * (1.0 - kEdgeRelTol); }

std::string format_percent(double fraction) {
  // Two decimals suffice nearly always; more only where rounding would carry a value across a
  // rule's edge (0.599951 must not print as "60.00 %").
  constexpr std::array<double, 4> kEdges{0.6, 0.7, 0.9, 0.99};
  std::array<char, 48> buf{};
  for (int decimals = 2; decimals <= 8; ++decimals) {
    std::snprintf(buf.data(), buf.size(), "%.*f %%", decimals, fraction * 100.0);
    const double shown = std::strtod(buf.data(), nullptr) / 100.0;
    const bool same_side = std::all_of(kEdges.begin(), kEdges.end(),
                                       [&](double e) { return at_least(shown, e) == at_least(fraction, e); });
    if (same_side) break;
  }
  return buf.data();
}

std::string format_edge(double fraction) {
  std::array<char, 16> buf{};
  std::snprintf(buf.data(), buf.size(), "%.0f %%", fraction * 100.0);
  return buf.data();
}

std::string quoted(const std::string& name) { return "'" + name + "'"; }

}  // namespace detail

using detail::at_least;
using detail::format_edge;
using detail::format_percent;
using detail::quoted;

// ---- Element measures ------------------------------------------------------------------

int hardware_fault_tolerance(const Vote& vote) {
  // N - K channel faults still leave K working; 1oo2D is K = 1, N = 2, so HFT 1 as well.
  assert(vote.k >= 1 && vote.k <= vote.n);
  return vote.n - vote.k;
}

std::optional<double> safe_failure_fraction(const FailureRates& rates) {
  const double safe_or_detected = rates.lambda_s() + rates.lambda_dd.per_hour;
  const double total = safe_or_detected + rates.lambda_du.per_hour;
  if (!(total > 0.0)) return std::nullopt;
  return safe_or_detected / total;
}

std::optional<double> diagnostic_coverage(const FailureRates& rates) {
  const double ld = rates.lambda_d();
  if (!(ld > 0.0)) return std::nullopt;
  return rates.lambda_dd.per_hour / ld;
}

ElementSff element_sff(const Component& component) {
  if (component.sff_declared) return {component.sff_declared, true};
  return {safe_failure_fraction(component.rates), false};
}

SffBand sff_band(double sff) {
  if (at_least(sff, 0.99)) return SffBand::kAtLeast99;
  if (at_least(sff, 0.90)) return SffBand::kFrom90To99;
  if (at_least(sff, 0.60)) return SffBand::kFrom60To90;
  return SffBand::kBelow60;
}

double sff_band_lower_edge(SffBand band) {
  switch (band) {
    case SffBand::kBelow60:
      return 0.0;
    case SffBand::kFrom60To90:
      return 0.6;
    case SffBand::kFrom90To99:
      return 0.9;
    case SffBand::kAtLeast99:
      return 0.99;
  }
  return 0.0;
}

// ---- The three rule tables -------------------------------------------------------------

int min_hft_table6(int sil, DemandMode mode) {
  assert(sil >= 0 && sil <= 4);
  // IEC 61511-1:2016 Table 6.
  switch (sil) {
    case 0:
    case 1:
      return 0;
    case 2:
      return mode == DemandMode::kLow ? 0 : 1;
    case 3:
      return 1;
    default:
      return 2;
  }
}

int max_sil_table6(int hft, DemandMode mode) {
  int sil = 0;
  while (sil < 4 && min_hft_table6(sil + 1, mode) <= hft) ++sil;
  return sil;
}

namespace {

// IEC 61508-2:2010 Table 2 (Type A) and Table 3 (Type B): rows by SFF band, columns HFT 0, 1,
// 2. The 0 is the "not allowed" cell.
constexpr std::array<std::array<int, 3>, 4> kTable2TypeA{{{1, 2, 3}, {2, 3, 4}, {3, 4, 4}, {3, 4, 4}}};
constexpr std::array<std::array<int, 3>, 4> kTable3TypeB{{{0, 1, 2}, {1, 2, 3}, {2, 3, 4}, {3, 4, 4}}};

constexpr std::array<SffBand, 4> kBands{SffBand::kBelow60, SffBand::kFrom60To90, SffBand::kFrom90To99,
                                        SffBand::kAtLeast99};

int route_1h_cell(ElementType type, SffBand band, int hft) {
  assert(hft >= 0);
  const auto& table = type == ElementType::kA ? kTable2TypeA : kTable3TypeB;
  const auto& row = table[static_cast<std::size_t>(band)];
  if (hft <= 2) return row[static_cast<std::size_t>(hft)];
  // The tables stop at HFT 2; every further fault tolerated adds one SIL, as the parallel
  // combination rule of 7.4.4.2.4 does, up to SIL 4.
  return std::min(4, row[2] + (hft - 2));
}

}  // namespace

int max_sil_route_1h(ElementType type, double sff, int hft) { return route_1h_cell(type, sff_band(sff), hft); }

std::optional<double> min_sff_route_1h(ElementType type, int hft, int sil) {
  for (SffBand band : kBands)
    if (route_1h_cell(type, band, hft) >= sil) return sff_band_lower_edge(band);
  return std::nullopt;
}

int min_hft_route_1h(ElementType type, double sff, int sil) {
  // Every row reaches SIL 4 by HFT 4 at the latest, so the loop ends.
  int hft = 0;
  while (max_sil_route_1h(type, sff, hft) < sil) ++hft;
  return hft;
}

ConstraintBasis constraint_basis(const Sif& sif, std::optional<ConstraintBasis> project_basis) {
  if (sif.constraints) return *sif.constraints;
  return project_basis.value_or(ConstraintBasis::kIec61511);
}

// ---- Subsystem and SIF results ---------------------------------------------------------

SubsystemConstraints subsystem_constraints(const Subsystem& subsystem, const std::vector<Component>& components,
                                           ConstraintBasis basis, DemandMode mode) {
  SubsystemConstraints out;
  out.subsystem = subsystem.name;
  out.basis = basis;
  out.mode = mode;
  out.vendor = subsystem.is_vendor();
  out.vote = subsystem.vote;
  detail::Assessment assessment(subsystem, out);
  if (out.vendor)
    assessment.vendor();
  else
    assessment.group(components);
  assessment.certificate();
  assessment.finish();
  return out;
}

SifConstraints sif_constraints(const Sif& sif, const std::vector<Component>& components, ConstraintBasis basis) {
  return sif_constraints(sif, components, basis, sif.demand_mode());
}

SifConstraints sif_constraints(const Sif& sif, const std::vector<Component>& components, ConstraintBasis basis,
                               DemandMode mode) {
  SifConstraints out;
  out.basis = basis;
  for (const auto& s : sif.subsystems) out.subsystems.push_back(subsystem_constraints(s, components, basis, mode));
  if (out.subsystems.empty()) return out;
  // Subsystems act in series: the lowest result governs (IEC 61508-2:2010 7.4.4.2.3, 7.4.3).
  out.sil_architecture = 4;
  out.sil_systematic = 4;
  for (const auto& s : out.subsystems) {
    out.sil_architecture = std::min(out.sil_architecture, s.sil_architecture);
    out.sil_systematic = std::min(out.sil_systematic, s.systematic_capability);
  }
  return out;
}

}  // namespace sifter
