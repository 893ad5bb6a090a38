#pragma once
/// Architectural constraints (HFT, SFF, IEC 61511 Table 6, Route 1H, Route 2H) and systematic
/// capability of subsystems and SIFs; and the limits that keep a SIF below its required SIL.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/results/constraints.hpp"

namespace sifter {

// ---- Element measures ------------------------------------------------------------------

/// Hardware fault tolerance of a vote, N - K (1oo2D: 1), IEC 61508-2:2010 7.4.4.1.1.
int hardware_fault_tolerance(const Vote& vote);

/// Safe failure fraction (lS + lDD) / (lS + lDD + lDU), IEC 61508-2:2010 Annex C, Edition 2
/// (no-effect failures are not part of lS); empty when the element has no failure rate at all.
std::optional<double> safe_failure_fraction(const FailureRates& rates);

/// Diagnostic coverage lDD / (lDD + lDU), IEC 61508-2:2010 Annex C; empty when lD = 0.
std::optional<double> diagnostic_coverage(const FailureRates& rates);

/// The SFF used for an element: the safety manual's declared value, else from its rates.
struct ElementSff {
  std::optional<double> value;  ///< fraction 0..1; empty when neither is available
  bool declared = false;        ///< taken from Component::sff_declared
};
ElementSff element_sff(const Component& component);

/// The SFF bands of IEC 61508-2:2010 Tables 2 and 3.
enum class SffBand { kBelow60, kFrom60To90, kFrom90To99, kAtLeast99 };

/// The band of an SFF (fraction). Edges are compared with sil.hpp's kEdgeRelTol, so an SFF
/// computed as 0.5999999999999999 from rates that make 60 % exactly lies in the 60 % band.
SffBand sff_band(double sff);

/// The band's lower edge as a fraction (0, 0.6, 0.9, 0.99).
double sff_band_lower_edge(SffBand band);

// ---- The three rule tables -------------------------------------------------------------

/// Minimum HFT for a SIL (0..4) and demand mode, IEC 61511-1:2016 11.4 Table 6: SIL 1: 0;
/// SIL 2 low demand: 0; SIL 2 high demand or continuous: 1; SIL 3: 1; SIL 4: 2.
int min_hft_table6(int sil, DemandMode mode);

/// The highest SIL a group of HFT h may claim under IEC 61511-1:2016 Table 6 (h >= 2: SIL 4).
int max_sil_table6(int hft, DemandMode mode);

/// The highest SIL of an element by type, SFF (fraction) and the HFT of its group, Route 1H,
/// IEC 61508-2:2010 Table 2 (Type A) and Table 3 (Type B). 0 is the "not allowed" cell (Type B,
/// SFF < 60 %, HFT 0). Beyond HFT 2 each further fault tolerated adds one SIL (7.4.4.2.4),
/// capped at 4.
int max_sil_route_1h(ElementType type, double sff, int hft);

/// The lowest SFF (a band's lower edge, fraction) with which an element of this type reaches
/// the SIL at this HFT on Route 1H; empty when no SFF is enough (Type B at HFT 0 for SIL 4).
std::optional<double> min_sff_route_1h(ElementType type, int hft, int sil);

/// The smallest HFT at which an element of this type and SFF reaches the SIL on Route 1H.
int min_hft_route_1h(ElementType type, double sff, int sil);

/// Route 2H thresholds, IEC 61508-2:2010 7.4.4.3: DC of Type B elements and confidence of the
/// failure data.
inline constexpr double kRoute2hMinDiagnosticCoverage = 0.6;
inline constexpr double kRoute2hMinDataConfidence = 0.7;

/// The basis a SIF is assessed on: its own "constraints", else the project's, else IEC 61511.
ConstraintBasis constraint_basis(const Sif& sif, std::optional<ConstraintBasis> project_basis);

// ---- Subsystem and SIF results ---------------------------------------------------------

/// Architecture and SC of one subsystem on a basis. A channel takes the lowest result of its
/// series elements and a group the lowest of its channels (IEC 61508-2:2010 7.4.4.2.3, 7.4.3).
/// - IEC 61511: Table 6 on the vote's HFT.
/// - Route 1H: each element looked up in Tables 2/3 at the group's HFT, the lowest governs; an
///   element without type or SFF cannot be claimed (0).
/// - Route 2H: Table 6 on the HFT, and each element that fails a condition of 7.4.4.3 caps the
///   subsystem at 0 with a cap naming it (the route cannot be used for it): a Type B element, or
///   one of unknown type, with DC below 60 %; any element whose data_confidence is undeclared or
///   below 0.7.
/// - SC: the lowest declared SC of the elements, each the higher of its SC and its prior-use
///   claim (IEC 61511-1:2016 11.5.3); an element with neither caps at 0. A group marked
///   diverse takes one more, up to 4, only if it is redundant (HFT >= 1: in a 2oo2 one
///   systematic fault still fails it) and has a diversity note.
/// - A vendor subsystem uses hft_declared (Table 6) and sc_declared; a missing one caps at 0. On
///   Route 1H it has no elements, so its sil_capability stands for the Tables 2/3 result and
///   without one it caps at 0.
/// - sil_capability, where declared, caps both the architecture and the SC.
SubsystemConstraints subsystem_constraints(const Subsystem& subsystem, const std::vector<Component>& components,
                                           ConstraintBasis basis, DemandMode mode);

SifConstraints sif_constraints(const Sif& sif, const std::vector<Component>& components, ConstraintBasis basis);
/// The same in a demand mode decided elsewhere (by the LOPA demand rate).
SifConstraints sif_constraints(const Sif& sif, const std::vector<Component>& components, ConstraintBasis basis,
                               DemandMode mode);

// ---- Limits ----------------------------------------------------------------------------

/// Every result below the required SIL: the probability (also when its SIL is reached but
/// the achieved value is above the required one), and each architecture and SC cap of each
/// subsystem below it, in subsystem order. Empty when the required SIL is 0.
std::vector<Limit> limits_for(const ProbabilityCheck& probability, const SifConstraints& constraints, int sil_required);

namespace detail {
/// value >= edge, with sil.hpp's kEdgeRelTol (the mirror of at_most).
bool at_least(double value, double edge);
/// A fraction as a percentage for messages, "72.50 %", with as many decimals as it takes not
/// to round across an edge of the rules (60, 70, 90, 99 %).
std::string format_percent(double fraction);
/// A rule's edge as a whole percentage, "60 %".
std::string format_edge(double fraction);
/// "'name'", how messages quote a subsystem.
std::string quoted(const std::string& name);
}  // namespace detail

}  // namespace sifter
