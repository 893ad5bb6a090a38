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

#include "sifter/model/model.hpp"
#include "sifter/model/quantity.hpp"
#include "sifter/model/vocabulary.hpp"
#include "sifter/results/lopa.hpp"

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

/// What the SIF engines computed for one SIF, and the mode its author stated.
struct SifFigures {
  std::optional<double> pfd_avg;                 ///< computed PFDavg (low demand)
  std::optional<Rate> pfh;                       ///< computed PFH (high demand), per hour
  std::optional<DemandMode> demand_mode_stated;  ///< Sif::demand_mode_stated
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
  /// False for a pass that needs only what each scenario asks of its SIF: the method's
  /// assumptions (and the worksheet rows with them) are then left empty.
  bool assumptions = true;
  /// False where nothing prints the worksheet rows: they are then left empty, and nothing else
  /// changes (no figure, finding or assumption is read from them; the finiteness check reads
  /// them, but each of their values is a checked figure or bounded by one).
  bool worksheet = true;
};

/// The context a project gives before any SIF is computed: stated modes only.
LopaContext lopa_context_from_project(const Project& project);

/// Whether a conditional modifier applies to a consequence category (an empty applies_to
/// means every category), CCPS 2013.
bool modifier_applies(const Modifier& modifier, const std::string& category);

/// The credit one layer (other than the SIF under assessment) receives after the layer rules.
struct LayerCredit {
  std::size_t layer = 0;                 ///< index into Scenario::layers
  double pfd_claimed = 1.0;              ///< Layer::pfd, or the computed PFDavg of a credited SIF layer
  double pfd_credited = 1.0;             ///< after the BPCS cap; the factor applied where credited
  bool credited = false;                 ///< credited against at least one cause
  std::vector<bool> for_cause;           ///< credited against each cause (index into Scenario::causes)
  bool before_sif = true;                ///< acts before the SIF under assessment (or there is none)
  bool bpcs_based = false;               ///< counts towards the two-BPCS-layer limit
  std::string note;                      ///< why no or reduced credit, or the independence note relied on
  std::vector<std::string> cause_notes;  ///< per cause: why no credit against it (or the note)
};

/// The layer rules applied to a scenario (CCPS 2001; IEC 61511-1:2016 clause 9.3).
struct LayerAssessment {
  std::vector<LayerCredit> layers;           ///< one per layer except the SIF under assessment
  std::optional<std::size_t> sif_layer;      ///< index of the SIF under assessment in Scenario::layers
  std::vector<bool> sif_for_cause;           ///< the SIF is independent of each cause (or justified)
  std::vector<std::string> sif_cause_notes;  ///< per cause: why the SIF gets no credit (or note)
  std::vector<Finding> findings;
  std::vector<std::string> assumptions;
};

/// Applies the layer rules, in the order the layers act: the BPCS cap, the operator-time rule,
/// independence from the SIF under assessment, from each cause (per cause), and from earlier
/// credited layers, then the two-BPCS-layer limit. The SIF under assessment is the first layer
/// naming a SIF; later SIF layers are ordinary layers credited with their computed PFDavg.
LayerAssessment assess_layers(const Project& project, const Scenario& scenario, const LopaContext& context);

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

/// Gathers, for each SIF assessed by at least one scenario, what it must achieve: the largest
/// required RRF, the SIL that follows, and the demand mode. In order of first appearance.
std::vector<SifRequirement> sif_requirements(const std::vector<ScenarioResult>& results);

}  // namespace sifter
