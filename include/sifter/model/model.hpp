#pragma once
/// The project as plain structs, units resolved: what `load` produces and every engine reads.
#include <map>
#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "sifter/model/pressure_model.hpp"
#include "sifter/model/quantity.hpp"

namespace sifter {

/// The most channels a voting group may have: the loader refuses more, the exact engine models
/// up to this many, the what-if arguments accept no more.
inline constexpr int kMaxChannels = 8;

/// IEC 61508-2 element type: A (simple, well-known failure modes) or B (complex).
enum class ElementType { kA, kB };

/// Lognormal state-of-knowledge uncertainty on a component's rates (the stated rates are means).
struct RateUncertainty {
  double error_factor = 1.0;  ///< 95th percentile / median
};

/// Field experience from which lambda_du is estimated at a one-sided confidence (chi-squared).
struct FieldData {
  int failures = 0;         ///< dangerous undetected failures counted
  Duration device_hours;    ///< cumulated operating time of the population
  double confidence = 0.7;  ///< one-sided confidence level, 0..1
};

/// lambda_du at the one-sided upper confidence bound of field experience, per hour:
/// chi-squared(confidence; 2n + 2) / (2 T), n failures in T device-hours (the time-truncated
/// bound used for Route 2H failure data, IEC 61508-2:2010 7.4.4.3, from memory; common
/// practice in reliability handbooks). Preconditions, validated by the loader: n >= 0, T > 0, 0 < confidence < 1.
Rate lambda_du_from_field_data(const FieldData& data);

/// The four failure rates of one element, per hour (IEC 61508-6 notation).
struct FailureRates {
  Rate lambda_du;  ///< dangerous undetected
  Rate lambda_dd;  ///< dangerous detected
  Rate lambda_su;  ///< safe undetected
  Rate lambda_sd;  ///< safe detected

  [[nodiscard]] double lambda_d() const { return lambda_du.per_hour + lambda_dd.per_hour; }
  [[nodiscard]] double lambda_s() const { return lambda_su.per_hour + lambda_sd.per_hour; }
  FailureRates& operator+=(const FailureRates& o) {
    lambda_du.per_hour += o.lambda_du.per_hour;
    lambda_dd.per_hour += o.lambda_dd.per_hour;
    lambda_su.per_hour += o.lambda_su.per_hour;
    lambda_sd.per_hour += o.lambda_sd.per_hour;
    return *this;
  }
};

/// A claim that an element is fit for a SIL on evidence of prior use in a similar environment
/// instead of an IEC 61508 systematic capability (IEC 61511-1:2016 11.5.3, from memory).
struct PriorUse {
  int sil = 0;           ///< the SIL claimed, 1..4
  std::string evidence;  ///< the record it rests on, quoted in every output
};

/// Where failure data come from, when written as an object (a plain string keeps `text` only).
struct DataSource {
  std::string kind;  ///< "certificate", "fmeda", "handbook", "field", "estimate"; empty for plain text
  std::string document;
  std::string revision;
  std::string date;
  std::string text;  ///< the plain-string form
};

/// One line of a data source as a reviewer reads it, e.g. "FMEDA: R-123 rev B, 2024-03-01".
std::string describe(const DataSource& source);

/// Whether describe(source) is the empty line: no kind and no text.
inline bool says_nothing(const DataSource& source) { return source.kind.empty() && source.text.empty(); }

/// One field device or element (a transmitter, a logic solver, a solenoid, a valve).
struct Component {
  std::string id;
  std::string model;  ///< library model it takes its data from, empty if none
  FailureRates rates;
  std::optional<ElementType> element_type;
  std::optional<int> systematic_capability;  ///< SC 1..4
  std::optional<double> sff_declared;        ///< from the safety manual, used instead of the rates
  std::optional<double> data_confidence;     ///< confidence of the failure data (Route 2H), 0..1
  std::optional<RateUncertainty> uncertainty;
  std::optional<FieldData> field_data;
  bool dangerous_rates_stated = false;      ///< the project or its library states lambda_D (checked in loading)
  std::string in_service_since;             ///< ISO 8601 date the device went into service, empty if not stated
  DataStatus status = DataStatus::kVendor;  ///< maturity of its data
  std::string pointer;                      ///< where it is defined, e.g. "/components/3"
  std::optional<PriorUse> prior_use;        ///< prior-use claim, IEC 61511-1:2016 11.5.3
  /// Where the failure data come from (a safety manual, a database), null when not stated; one
  /// for all the components that take it from the same library model, since a register has
  /// thousands of them. Its one line is data_source_line(), built when asked for.
  std::shared_ptr<const DataSource> source;
  std::optional<Duration> response_time;  ///< time from demand to its action (a valve's stroke)
  std::string manufacturer;               ///< as written on the component or its library model, empty if none

  /// The data source's one line (describe), empty when none is stated.
  [[nodiscard]] std::string data_source_line() const { return source ? describe(*source) : std::string(); }
  /// Whether its failure data name no source: the line would be empty.
  [[nodiscard]] bool data_source_untold() const { return !source || says_nothing(*source); }
};

/// A vote: the group works while K of its N channels work. 1oo2D is K=1, N=2 with diagnostics.
struct Vote {
  int k = 1;
  int n = 1;
  bool diagnostic = false;  ///< 1oo2D
  [[nodiscard]] std::string text() const {
    return std::to_string(k) + "oo" + std::to_string(n) + (diagnostic ? "D" : "");
  }
  /// Number of channel failures that fail the group (N - K + 1).
  [[nodiscard]] int failures_to_fail() const { return n - k + 1; }
};

/// Reads "2oo3", "1oo2D" (K out of N, both at least 1; D only for 1oo2); K <= N and the
/// largest N are for the caller to check, so that it can say which rule was broken.
std::optional<Vote> parse_vote(std::string_view text);

/// How beta is adjusted for groups other than 1oo2.
enum class CcfScaling { kNone, kIec61508TableD5 };

/// Whether IEC 61508-6:2010 Table D.5 has a cell for the vote K-out-of-N (N up to 5, and NooN).
bool table_d5_covers(int k, int n);

/// A subsystem's role in the signal path.
enum class Role { kSensor, kLogic, kFinal };

/// The partial stroke test of final elements.
struct PartialStroke {
  Duration interval;
  double coverage = 0.0;  ///< share of lambda_du the partial stroke reveals
};

/// A channel of a voting group: components in series (a solenoid and its valve).
struct Channel {
  std::vector<std::string> component_ids;  ///< as written in the project file
  std::vector<std::size_t> components;     ///< indices into Project::components, set by validation
  std::string pointer;                     ///< e.g. "/sifs/0/subsystems/2/channels/0"
};

/// A voting group of channels, or a vendor figure from a safety manual.
struct Subsystem {
  std::string name;
  Role role = Role::kSensor;
  Vote vote;
  std::vector<Channel> channels;
  double beta = 0.0;              ///< common-cause fraction of undetected failures, as entered (1oo2 value)
  double beta_d = 0.0;            ///< common-cause fraction of detected failures, as entered
  bool beta_d_defaulted = false;  ///< beta_D was not given and equals beta
  CcfScaling ccf_scaling = CcfScaling::kNone;
  Duration proof_test_interval;
  Duration mttr;  ///< mean time to restoration after a detected failure
  Duration mrt;   ///< mean repair time after a failure found by the proof test
  bool mrt_defaulted = false;
  bool interval_defaulted = false;
  bool mttr_defaulted = false;
  double proof_test_coverage = 1.0;  ///< PTC, 0..1
  std::optional<PartialStroke> partial_stroke;
  std::optional<Duration> test_duration;  ///< channel bypassed while tested (exact engine)
  bool staggered = false;                 ///< tests spread evenly over the interval (exact engine)
  bool trip_on_detected = false;          ///< a detected dangerous failure trips the process
  /// "on_detected_failure": "alarm_only": a detected dangerous failure only raises an alarm and
  /// stays dangerous until restored (IEC 61508-6:2010 B.3.3.2 assumes the safe state instead).
  bool alarm_only_on_detected = false;
  // Vendor figures (instead of channels).
  std::optional<double> vendor_pfd_avg;
  std::optional<Rate> vendor_pfh;
  // Declarations used by the architectural constraints.
  std::optional<int> hft_declared;
  std::optional<int> sc_declared;
  std::optional<int> sil_capability;
  bool diverse = false;
  std::string diversity_note;
  std::string pointer;                    ///< e.g. "/sifs/0/subsystems/1"
  std::string template_name;              ///< the "subsystem_templates" entry it was built from, empty if none
  std::optional<Duration> response_time;  ///< the subsystem's own, instead of its elements' sum

  [[nodiscard]] bool is_vendor() const { return vendor_pfd_avg.has_value() || vendor_pfh.has_value(); }
};

/// Low demand: PFDavg is the measure; high demand (or continuous): PFH.
enum class DemandMode { kLow, kHigh };

/// The basis of the architectural constraints.
enum class ConstraintBasis { kIec61511, kRoute1H, kRoute2H };

/// A SIF's own target, as written in the project.
struct Target {
  enum class Kind { kSil, kRrf, kPfdAvg, kPfh } kind = Kind::kSil;
  double value = 0.0;  ///< SIL number, RRF, PFDavg, or PFH per hour
};

/// How a SIF is reset after a trip.
enum class ResetKind { kManual, kAutomatic };

/// What the safety requirements specification states of a SIF (IEC 61511-1:2016 10.3.2, from
/// memory); every field optional, the SRS lists what is missing as an open item.
struct SifRequirements {
  std::string safe_state;
  std::string trip_setpoint;
  std::optional<Duration> process_safety_time;
  double response_time_fraction = 0.5;  ///< of the process safety time (common practice)
  bool response_time_fraction_stated = false;
  std::optional<Rate> max_spurious_trip_rate;
  std::optional<ResetKind> reset;
  std::string manual_shutdown;
  std::string bypass;
  std::string notes;
  std::optional<Duration> proof_test_interval;  ///< the longest interval the SIF may be tested at
  std::string proof_test_coverage;              ///< what the proof test must cover (text)
  std::string energize_to_trip;                 ///< "de-energise to trip" or its reverse (text)
  std::string action;                           ///< output action and its criterion of success (tight shut-off)
  std::string functional_relation;              ///< how the inputs decide the outputs (voting, permissives)
  std::string fault_response;                   ///< response to detected faults, with the repair time allowed
  std::string startup_restart;                  ///< start-up and restart after a trip
  std::string interfaces;                       ///< with the BPCS and the operators
  std::string environment;                      ///< environmental extremes the devices must withstand
  std::string operating_modes;                  ///< plant modes in which the SIF is needed
  std::string pointer;                          ///< e.g. "/sifs/0/requirements"
};

/// One safety instrumented function: subsystems in series.
struct Sif {
  std::string id;
  std::string title;
  std::optional<DemandMode> demand_mode_stated;
  std::optional<Target> target;
  std::optional<ConstraintBasis> constraints;
  std::vector<Subsystem> subsystems;
  std::string pointer;
  std::string path_exception;  ///< why the SIF lacks a sensor or final-element subsystem, if it does
  std::optional<SifRequirements> requirements;

  [[nodiscard]] DemandMode demand_mode() const { return demand_mode_stated.value_or(DemandMode::kLow); }
};

/// Which figure a verdict rests on: the more conservative of simplified and exact (default),
/// or one of them (project key "judge_on").
enum class JudgeOn { kConservative, kSimplified, kExact };

/// Project-wide defaults applied where a subsystem leaves a value out.
struct Defaults {
  std::optional<Duration> proof_test_interval;
  std::optional<Duration> mttr;
  std::optional<Duration> mrt;
  Duration mission_time{20.0 * kHoursPerYear};
  bool mission_time_defaulted = true;
};

// ---- Layer of protection analysis -------------------------------------------------------

/// A condition that must hold for a cause to lead to the hazard.
struct EnablingCondition {
  std::string title;
  double probability = 1.0;
};

/// An initiating cause with its frequency.
struct Cause {
  std::string id;
  std::string title;
  Rate frequency;  ///< initiating event frequency (stored per hour; reported per year)
  std::vector<std::string> devices;
  std::vector<EnablingCondition> enabling;
  DataStatus status = DataStatus::kVendor;  ///< maturity of the frequency
  std::string pointer;
};

/// A conditional modifier (ignition, occupancy, injury) applied after the release.
struct Modifier {
  std::string title;
  double probability = 1.0;
  std::vector<std::string> applies_to;  ///< consequence categories; empty = all
  std::string pointer;
};

/// The kind of a protection layer.
enum class LayerKind { kBpcsFunction, kOperatorResponse, kReliefDevice, kMechanical, kSif, kOther };

/// A protection layer in the order it acts; one of them may be the SIF under assessment.
struct Layer {
  std::string id;
  std::string title;
  LayerKind kind = LayerKind::kOther;
  double pfd = 1.0;
  std::string sif;  ///< for a SIF layer: the SIF's id
  std::vector<std::string> devices;
  std::optional<Duration> response_time;
  std::optional<Duration> time_available;
  std::string independence_note;
  std::string pointer;
  std::vector<std::string> applies_to_causes;  ///< credited only against these causes; empty = all
  std::string catalogue_id;                    ///< the "layer_catalogue" entry it was taken from, empty if none
};

/// A consequence of a scenario, rated in the risk criteria.
struct Consequence {
  std::string category;
  std::string severity;
};

/// A layer considered but not credited, kept for the record.
struct NotCredited {
  std::string title;
  std::string reason;
};

/// One LOPA scenario.
struct Scenario {
  std::string id;
  std::string title;
  std::vector<Consequence> consequences;
  std::optional<Rate> target_frequency;  ///< given directly instead of consequences
  std::vector<Cause> causes;
  std::vector<Modifier> modifiers;
  std::vector<Layer> layers;
  std::vector<NotCredited> not_credited;
  bool generated = false;              ///< made by the overpressure screening
  std::vector<std::string> estimates;  ///< the estimates a generated scenario rests on
  std::string pointer;
};

/// Tolerable frequencies: category -> severity -> frequency.
using RiskCriteria = std::map<std::string, std::map<std::string, Rate>>;

/// One row of a document's revision history.
struct DocumentRevision {
  std::string revision, date, by, description;
};

/// Document control of the deliverables (report, SRS): printed on their covers.
struct DocumentControl {
  std::string number, revision, date, prepared_by, checked_by, approved_by;
  std::vector<DocumentRevision> history;
};

/// The whole project file, resolved.
struct Project {
  std::string format;
  std::string title;
  std::string file;  ///< path as given
  Defaults defaults;
  std::optional<ConstraintBasis> constraints;
  JudgeOn judge_on = JudgeOn::kConservative;
  double operator_time_multiple = 2.0;  ///< time available must be at least this x response time
  std::vector<Component> components;
  std::vector<Sif> sifs;
  RiskCriteria risk_criteria;
  std::vector<Scenario> scenarios;
  std::optional<DocumentControl> document;
  std::optional<PressureSection> pressure;  ///< overpressure screening input
  OptionsSection options;                   ///< alternatives to compare per scenario
};

/// The readable name of a role, a demand mode, a basis, a layer kind.
std::string to_string(Role role);
std::string to_string(DemandMode mode);
std::string to_string(ConstraintBasis basis);
std::string to_string(LayerKind kind);

}  // namespace sifter
