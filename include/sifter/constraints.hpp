#pragma once
/// Architectural constraints (HFT, SFF, IEC 61511 Table 6, Route 1H, Route 2H) and systematic
/// capability of subsystems and SIFs; and the limits that keep a SIF below its required SIL.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model.hpp"

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

/// Which result a cap bounds.
enum class CapKind { kArchitecture, kSystematic };

/// What a cap comes from; it decides what would lift it.
enum class CapCause {
  kFaultTolerance,      ///< Table 6 minimum HFT (IEC 61511 basis and Route 2H)
  kRoute1hElement,      ///< Tables 2/3 lookup of one element at the group's HFT
  kElementTypeMissing,  ///< Route 1H needs Type A or B
  kSffUnknown,          ///< Route 1H: no rates and no declared SFF
  kDiagnosticCoverage,  ///< Route 2H: a Type B element below 60 % DC
  kDataConfidence,      ///< Route 2H: failure data below 70 % confidence or not declared
  kHftNotDeclared,      ///< vendor subsystem without a declared HFT
  kVendorRoute1h,       ///< vendor subsystem on Route 1H without a SIL capability
  kElementSc,           ///< the SC of one element (with any diversity credit)
  kScMissing,           ///< an element without a declared SC
  kVendorSc,            ///< the SC declared for a vendor subsystem
  kScNotDeclared,       ///< vendor subsystem without a declared SC
  kNoElements,          ///< a group without components has no SC to read
  kCertificate,         ///< Subsystem::sil_capability from the vendor's certificate
  kPriorUse,            ///< an element justified by prior use (IEC 61511-1:2016 11.5.3)
};

/// One rule that bounds a subsystem's architecture or SC at a SIL, and where.
struct Cap {
  CapKind kind = CapKind::kArchitecture;
  CapCause cause = CapCause::kFaultTolerance;
  int sil = 0;                          ///< the highest SIL this rule allows, 0..4
  std::optional<std::string> element;   ///< component id it names, if one
  std::string reason;                   ///< one sentence with its source
};

/// What the constraints read from one component of a group.
struct ElementConstraints {
  std::string component;                      ///< component id (tag)
  std::optional<ElementType> type;
  std::optional<double> sff;                  ///< the SFF used, fraction
  bool sff_declared = false;                  ///< from the safety manual, not the rates
  std::optional<double> dc;                   ///< diagnostic coverage from the rates, fraction
  std::optional<double> data_confidence;      ///< as declared, fraction (Route 2H)
  std::optional<int> sil_route_1h;            ///< Tables 2/3 at the group's HFT (Route 1H only)
  std::optional<int> systematic_capability;   ///< as declared, SC 1..4
  std::optional<PriorUse> prior_use;          ///< as declared (IEC 61511-1:2016 11.5.3)
};

/// Architecture and systematic capability of one subsystem.
struct SubsystemConstraints {
  std::string subsystem;                      ///< Subsystem::name
  ConstraintBasis basis = ConstraintBasis::kIec61511;
  DemandMode mode = DemandMode::kLow;
  bool vendor = false;                        ///< Subsystem::is_vendor()
  Vote vote;
  std::optional<int> hft;                     ///< from the vote, or declared by a vendor
  std::optional<double> sff;                  ///< lowest SFF of its components, fraction
  std::optional<std::string> sff_element;     ///< the component with that SFF
  int sil_architecture = 0;                   ///< lowest architecture cap, 0..4
  int systematic_capability = 0;              ///< lowest SC cap, 0..4 (0: cannot claim)
  bool diversity_credit = false;              ///< SC N+1 taken, IEC 61508-2:2010 7.4.3
  std::vector<ElementConstraints> elements;   ///< each component once, in channel order
  std::vector<Cap> caps;                      ///< every rule applied, both kinds
  std::vector<std::string> findings;          ///< notes and the reasons of caps below SIL 4
};

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
SubsystemConstraints subsystem_constraints(const Subsystem& subsystem,
                                           const std::vector<Component>& components,
                                           ConstraintBasis basis, DemandMode mode);

/// A SIF's architecture and SC: the lowest of its subsystems (series rule, IEC 61508-2:2010
/// 7.4.4.2.3 and 7.4.3); 0 for a SIF with no subsystems.
struct SifConstraints {
  ConstraintBasis basis = ConstraintBasis::kIec61511;
  int sil_architecture = 0;
  int sil_systematic = 0;
  std::vector<SubsystemConstraints> subsystems;  ///< in the SIF's order
};
SifConstraints sif_constraints(const Sif& sif, const std::vector<Component>& components,
                               ConstraintBasis basis);
/// The same in a demand mode decided elsewhere (by the LOPA demand rate).
SifConstraints sif_constraints(const Sif& sif, const std::vector<Component>& components, ConstraintBasis basis,
                               DemandMode mode);

// ---- Limits ----------------------------------------------------------------------------

/// The probability side of a SIF, as verify computed it.
struct ProbabilityCheck {
  DemandMode mode = DemandMode::kLow;
  int sil = 0;            ///< sil_probability
  double achieved = 0.0;  ///< PFDavg (low demand) or PFH per hour (high demand)
  double required = 0.0;  ///< the PFDavg or PFH per hour the function must reach
};

/// One result that keeps a SIF below its required SIL, and what would lift it.
struct Limit {
  std::string kind;                       ///< "probability", "architecture" or "systematic"
  std::optional<std::string> subsystem;   ///< Subsystem::name
  std::optional<std::string> element;     ///< component id (tag)
  int sil = 0;                            ///< the SIL this result allows
  std::string message;                    ///< plain English: why, and how to lift it
};

/// Every result below the required SIL: the probability (also when its SIL is reached but
/// the achieved value is above the required one), and each architecture and SC cap of each
/// subsystem below it, in subsystem order. Empty when the required SIL is 0.
std::vector<Limit> limits_for(const ProbabilityCheck& probability, const SifConstraints& constraints,
                              int sil_required);

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
