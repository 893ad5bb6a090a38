#pragma once
/// Layer of protection analysis: scenario arithmetic, demand rate and mode on the SIF, the
/// layer rules and their findings, and the worksheet rows the writers print.
///
/// Method: CCPS, Layer of Protection Analysis (2001) and Guidelines for Enabling Conditions and
/// Conditional Modifiers in LOPA (2013); demand mode IEC 61511-1:2016 3.2.39; BPCS credit
/// IEC 61511-1:2016 clause 9.3 (DEVELOPERS.md, Methods M6). Pure functions: no I/O.
#include <cstddef>
#include <map>
#include <optional>
#include <string>
#include <unordered_map>
#include <vector>

#include "sifter/model.hpp"
#include "sifter/quantity.hpp"

namespace sifter {

/// A BPCS function or an operator response is credited with a PFD no lower than this (a risk
/// reduction of 10 at most), IEC 61511-1:2016 clause 9.3.
inline constexpr double kBpcsMinPfd = 0.1;
/// At most this many BPCS-based layers are credited in one scenario (CCPS 2001).
inline constexpr int kMaxBpcsLayers = 2;
/// An operator response needs at least this much time available to be credited, in hours
/// (10 min; CCPS 2001 typical values, common practice).
inline constexpr double kOperatorMinTimeAvailableHours = 10.0 / 60.0;
/// Demands on a SIF more often than once a year mean high demand mode, IEC 61511-1:2016 3.2.39.
inline constexpr double kHighDemandAbovePerYear = 1.0;
/// A required risk reduction of no more than this needs no SIF (SIL 0), IEC 61511-1:2016 9.
inline constexpr double kNoSifRrf = 10.0;
/// A required risk reduction above this is SIL 4 and calls for re-examining the design first,
/// IEC 61511-1:2016 clause 9.2.
inline constexpr double kSil4Rrf = 10000.0;

/// What a finding is about.
enum class FindingKind {
  kNotIndependent,     ///< a layer shares a device with a cause, another layer or the SIF
  kBpcsCreditCapped,   ///< a BPCS function or operator response claimed a PFD below 0.1
  kTooManyBpcsLayers,  ///< more than two BPCS-based layers in one scenario
  kResponseTime,       ///< an operator response has too little time
  kNoSifNeeded,        ///< required risk reduction of 10 or less
  kSil4Review,         ///< required risk reduction above 10 000
  kModeMismatch,       ///< the stated demand mode contradicts the demand rate
  kImplausiblyLowPfd,  ///< a credited layer claims a PFD below 1e-5
};

/// The output name of a finding kind: "not_independent", "bpcs_credit_capped", ...
std::string to_string(FindingKind kind);

/// One finding, in plain English naming the tags and both parties.
struct Finding {
  FindingKind kind = FindingKind::kNotIndependent;
  std::string message;
};

/// What the SIF engines computed for one SIF, and the mode its author stated.
struct SifFigures {
  std::optional<double> pfd_avg;                  ///< computed PFDavg (low demand)
  std::optional<Rate> pfh;                        ///< computed PFH (high demand), per hour
  std::optional<DemandMode> demand_mode_stated;   ///< Sif::demand_mode_stated
  /// The PFD (PFH) the scenarios credit: the judged figure, no better than the lower edge of
  /// the band of the SIL the SIF achieves (judge.hpp sif_credit); absent = the figure above.
  std::optional<double> credit;
  bool credit_capped = false;
};

/// Everything LOPA takes from outside the scenario: per SIF id, its computed figures.
struct LopaContext {
  std::map<std::string, SifFigures> sifs;
  /// Position of each SIF in Project::sifs, so that a scenario finds the SIF it credits
  /// without a scan of every SIF (empty: found by a scan).
  std::unordered_map<std::string, std::size_t> sif_index;
};

/// The context a project gives before any SIF is computed: stated modes only.
LopaContext lopa_context_from_project(const Project& project);

/// Whether a conditional modifier applies to a consequence category (an empty applies_to
/// means every category), CCPS 2013.
bool modifier_applies(const Modifier& modifier, const std::string& category);

/// The credit one layer (other than the SIF under assessment) receives after the layer rules.
struct LayerCredit {
  std::size_t layer = 0;       ///< index into Scenario::layers
  double pfd_claimed = 1.0;    ///< Layer::pfd, or the computed PFDavg of a credited SIF layer
  double pfd_credited = 1.0;   ///< after the BPCS cap; the factor applied where credited
  bool credited = false;       ///< credited against at least one cause
  std::vector<bool> for_cause; ///< credited against each cause (index into Scenario::causes)
  bool before_sif = true;      ///< acts before the SIF under assessment (or there is none)
  bool bpcs_based = false;     ///< counts towards the two-BPCS-layer limit
  std::string note;            ///< why no or reduced credit, or the independence note relied on
  std::vector<std::string> cause_notes;  ///< per cause: why no credit against it (or the note)
};

/// The layer rules applied to a scenario (CCPS 2001; IEC 61511-1:2016 clause 9.3).
struct LayerAssessment {
  std::vector<LayerCredit> layers;        ///< one per layer except the SIF under assessment
  std::optional<std::size_t> sif_layer;   ///< index of the SIF under assessment in Scenario::layers
  std::vector<bool> sif_for_cause;        ///< the SIF is independent of each cause (or justified)
  std::vector<std::string> sif_cause_notes;  ///< per cause: why the SIF gets no credit (or note)
  std::vector<Finding> findings;
  std::vector<std::string> assumptions;
};

/// Applies the layer rules, in the order the layers act: the BPCS cap, the operator-time rule,
/// independence from the SIF under assessment, from each cause (per cause), and from earlier
/// credited layers, then the two-BPCS-layer limit. The SIF under assessment is the first layer
/// naming a SIF; later SIF layers are ordinary layers credited with their computed PFDavg.
LayerAssessment assess_layers(const Project& project, const Scenario& scenario, const LopaContext& context);

/// The kind of a worksheet row.
enum class WorksheetStep {
  kCause,        ///< an initiating cause: value = IEF per year
  kEnabling,     ///< an enabling condition of the cause above: value = probability
  kLayer,        ///< a protection layer: value = PFD credited (claimed when not credited)
  kSif,          ///< the SIF under assessment, not credited in the frequency without it
  kNotCredited,  ///< a layer the author considered and did not credit (Scenario::not_credited)
  kTotal,        ///< the causes summed, before the modifiers
  kModifier,     ///< a conditional modifier of the consequence: value = probability
  kTarget,       ///< value = target per year; frequency = without the SIF; gap = required RRF
  kWithSif,      ///< value = the SIF's PFDavg (or PFH per hour); frequency = mitigated
};

/// The output name of a step: "cause", "enabling", "layer", "sif", "not_credited", "total",
/// "modifier", "target", "with_sif".
std::string to_string(WorksheetStep step);

/// One row of the LOPA worksheet, ready to print: writers compute nothing.
struct WorksheetRow {
  WorksheetStep step = WorksheetStep::kCause;
  std::string consequence;  ///< category of modifier, target and with-SIF rows; else empty
  std::string cause;        ///< the cause a cause, enabling, layer or SIF row belongs to
  std::string item;         ///< id of the cause, layer or SIF; empty for conditions and modifiers
  std::string title;
  std::optional<double> value;             ///< see WorksheetStep
  bool credited = true;                    ///< false for a layer given no credit
  std::string note;                        ///< why no credit, the cap, the independence note
  std::optional<double> frequency_per_yr;  ///< frequency after this step
  std::optional<double> gap;               ///< target rows: frequency / target (required RRF)
};

/// The figures of one consequence of a scenario.
struct ConsequenceResult {
  std::string category;  ///< empty when the scenario gives its target frequency directly
  std::string severity;
  double target_frequency_per_yr = 0.0;
  double modifier_product = 1.0;  ///< the modifiers that apply to this category, multiplied
  double frequency_without_sif_per_yr = 0.0;
  double required_pfd = 1.0;      ///< target / frequency without the SIF, at most 1
  double required_rrf = 0.0;      ///< frequency without the SIF / target (below 1: met already)
  int required_sil = 0;           ///< from the RRF (low demand) or the required PFH (high)
  std::optional<double> required_pfh_per_hour;       ///< whenever there is a SIF
  std::optional<double> mitigated_frequency_per_yr;  ///< with the SIF's computed figure
  std::optional<bool> meets_target;
};

/// What one initiating cause contributes, before the modifiers.
struct CauseResult {
  std::string id;
  double frequency_per_yr = 0.0;    ///< initiating event frequency
  double enabling_product = 1.0;    ///< its enabling conditions, multiplied
  double demand_rate_per_yr = 0.0;  ///< x the layers credited before the SIF: demands on it
  double frequency_without_sif_per_yr = 0.0;  ///< x every layer credited against it
  bool sif_credited = true;         ///< the SIF is independent of this cause (or justified)
};

/// The result of one scenario. The top-level figures are those of the governing consequence
/// (largest required RRF); required_rrf and required_sil are the largest over consequences.
struct ScenarioResult {
  std::string id;
  std::string title;
  std::optional<std::string> sif;  ///< the SIF under assessment
  double target_frequency_per_yr = 0.0;
  double frequency_without_sif_per_yr = 0.0;
  double required_pfd = 1.0;
  double required_rrf = 0.0;
  int required_sil = 0;
  std::optional<double> demand_rate_per_yr;        ///< demands on the SIF
  std::optional<DemandMode> demand_mode;           ///< decided: the stated mode, else the rate's
  std::optional<DemandMode> demand_mode_stated;    ///< as the SIF states it
  std::optional<double> required_pfh_per_hour;     ///< high demand: the smallest over consequences
  std::optional<double> sif_pfd_avg;               ///< the SIF's computed PFDavg used (low demand)
  std::optional<double> sif_pfh_per_hour;          ///< the SIF's computed PFH used (high demand)
  std::optional<double> sif_credit_pfd;            ///< what the SIF is credited with (PFD, or PFH high demand)
  std::optional<bool> sif_credit_capped;           ///< the band of its achieved SIL caps the credit
  std::optional<double> mitigated_frequency_per_yr;
  std::optional<bool> meets_target;                ///< every consequence meets its target
  std::size_t governing_consequence = 0;           ///< index into consequences
  std::vector<ConsequenceResult> consequences;
  std::vector<CauseResult> causes;
  std::vector<Finding> findings;
  std::vector<std::string> assumptions;
  std::vector<WorksheetRow> worksheet;
  bool generated = false;  ///< made by the overpressure screening
  // Data maturity: the verdict rests on these estimates (empty: it does not).
  bool preliminary = false;
  std::vector<std::string> preliminary_because;
};

/// Evaluates one scenario (CCPS 2001): per consequence, frequency without the SIF = sum over
/// causes of IEF x enabling x PFD of the layers credited against that cause x the modifiers of
/// the category; required PFD = target / that frequency. Targets come from
/// Project::risk_criteria, or from Scenario::target_frequency for every consequence when given.
/// Precondition (checked by the loader): every consequence is in the risk criteria.
ScenarioResult evaluate_scenario(const Project& project, const Scenario& scenario, const LopaContext& context);

/// The worksheet rows of an evaluated scenario: per cause its enabling conditions and each layer
/// with its credit or why none, then the total, and per consequence the modifiers, the target
/// with the gap, and the frequency with the SIF.
std::vector<WorksheetRow> build_worksheet(const Scenario& scenario, const LayerAssessment& assessment,
                                          const ScenarioResult& result);

/// Every scenario of the project, in order.
std::vector<ScenarioResult> evaluate_scenarios(const Project& project, const LopaContext& context);

/// What the scenarios require of one SIF.
struct SifRequirement {
  std::string sif;
  std::vector<std::string> scenarios;  ///< the scenarios that assess it, in order
  std::string governing_scenario;      ///< the one with the largest required RRF
  double required_rrf = 0.0;           ///< the largest over its scenarios
  double required_pfd = 1.0;           ///< 1 / required_rrf, at most 1
  int sil_required = 0;                ///< from required_rrf (low) or required PFH (high demand)
  double demand_rate_per_yr = 0.0;     ///< summed over its scenarios
  DemandMode demand_mode = DemandMode::kLow;
  std::optional<double> required_pfh_per_hour;  ///< high demand: smallest over its scenarios
  std::vector<Finding> findings;
  std::vector<std::string> assumptions;
};

/// Gathers, for each SIF assessed by at least one scenario, what it must achieve: the largest
/// required RRF, the SIL that follows, and the demand mode. In order of first appearance.
std::vector<SifRequirement> sif_requirements(const std::vector<ScenarioResult>& results);

/// Formats a number for findings and notes: three significant digits, plain between 1e-3 and
/// 1e5 ("0.01", "20000"), otherwise "2.5e-7" or "2e+6".
std::string format_number(double value);

}  // namespace sifter
