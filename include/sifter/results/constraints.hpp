#pragma once
/// Architectural constraints and systematic capability of a SIF, as results: the caps and the limits.
/// Plain data of the results contract: the standard library and the model only.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"

namespace sifter {

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
  int sil = 0;                         ///< the highest SIL this rule allows, 0..4
  std::optional<std::string> element;  ///< component id it names, if one
  std::string reason;                  ///< one sentence with its source
};

/// What the constraints read from one component of a group.
struct ElementConstraints {
  std::string component;  ///< component id (tag)
  std::optional<ElementType> type;
  std::optional<double> sff;                 ///< the SFF used, fraction
  bool sff_declared = false;                 ///< from the safety manual, not the rates
  std::optional<double> dc;                  ///< diagnostic coverage from the rates, fraction
  std::optional<double> data_confidence;     ///< as declared, fraction (Route 2H)
  std::optional<int> sil_route_1h;           ///< Tables 2/3 at the group's HFT (Route 1H only)
  std::optional<int> systematic_capability;  ///< as declared, SC 1..4
  std::optional<PriorUse> prior_use;         ///< as declared (IEC 61511-1:2016 11.5.3)
};

/// Architecture and systematic capability of one subsystem.
struct SubsystemConstraints {
  std::string subsystem;  ///< Subsystem::name
  ConstraintBasis basis = ConstraintBasis::kIec61511;
  DemandMode mode = DemandMode::kLow;
  bool vendor = false;  ///< Subsystem::is_vendor()
  Vote vote;
  std::optional<int> hft;                    ///< from the vote, or declared by a vendor
  std::optional<double> sff;                 ///< lowest SFF of its components, fraction
  std::optional<std::string> sff_element;    ///< the component with that SFF
  int sil_architecture = 0;                  ///< lowest architecture cap, 0..4
  int systematic_capability = 0;             ///< lowest SC cap, 0..4 (0: cannot claim)
  bool diversity_credit = false;             ///< SC N+1 taken, IEC 61508-2:2010 7.4.3
  std::vector<ElementConstraints> elements;  ///< each component once, in channel order
  std::vector<Cap> caps;                     ///< every rule applied, both kinds
  std::vector<std::string> findings;         ///< notes and the reasons of caps below SIL 4
};

/// A SIF's architecture and SC: the lowest of its subsystems (series rule, IEC 61508-2:2010
/// 7.4.4.2.3 and 7.4.3); 0 for a SIF with no subsystems.
struct SifConstraints {
  ConstraintBasis basis = ConstraintBasis::kIec61511;
  int sil_architecture = 0;
  int sil_systematic = 0;
  std::vector<SubsystemConstraints> subsystems;  ///< in the SIF's order
};

/// The probability side of a SIF, as verify computed it.
struct ProbabilityCheck {
  DemandMode mode = DemandMode::kLow;
  int sil = 0;            ///< sil_probability
  double achieved = 0.0;  ///< PFDavg (low demand) or PFH per hour (high demand)
  double required = 0.0;  ///< the PFDavg or PFH per hour the function must reach
};

/// One result that keeps a SIF below its required SIL, and what would lift it.
struct Limit {
  std::string kind;                      ///< "probability", "architecture" or "systematic"
  std::optional<std::string> subsystem;  ///< Subsystem::name
  std::optional<std::string> element;    ///< component id (tag)
  int sil = 0;                           ///< the SIL this result allows
  std::string message;                   ///< plain English: why, and how to lift it
};

}  // namespace sifter
