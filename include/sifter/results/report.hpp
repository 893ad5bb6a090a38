#pragma once
/// What the report draws: curves, interval sweeps, sensitivity rows, per SIF.
/// Plain data of the results contract: the standard library and the model only.
#include <cstddef>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/results/deliverable.hpp"
#include "sifter/results/options.hpp"
#include "sifter/results/project.hpp"
#include "sifter/results/whatif.hpp"

namespace sifter {

/// A SIF's PFD(t) and that of each of its subsystems, sampled at the same instants. Where a test
/// renews a channel the instant appears twice: the value just before the test, then just after,
/// so that a plotted line drops vertically.
struct PfdPlot {
  std::vector<double> t_hours;                      ///< sample instants from 0 to the mission time, in hours
  std::vector<double> pfd_sif;                      ///< the SIF: sum over its subsystems in series
  std::vector<std::vector<double>> pfd_subsystems;  ///< one series per subsystem, in the SIF's order
  std::string engine;                               ///< which engine drew it, in words, with its source
  std::vector<std::string> subsystem_names;         ///< the subsystems' names, in the order of pfd_subsystems
  std::optional<double> pfd_avg;  ///< the SIF's mission average of PFD(t), where the engine computed it
};

/// One point of the sweep: every proof-test interval of the SIF times `factor`.
struct IntervalPoint {
  double factor = 1.0;
  double pfd_avg = 0.0;  ///< the SIF's PFDavg at that factor (verify_sif, IEC 61508-6:2010 Annex B)
};

/// A subsystem's proof-test interval now and the longest allowed; both empty for a supplier's
/// figure, which has no interval of its own here.
struct SubsystemInterval {
  std::string name;
  std::optional<Duration> present;
  std::optional<Duration> longest;  ///< the what-if engine's answer, for the subsystems it varied
};

/// PFDavg against the proof-test intervals of one SIF (low demand).
struct IntervalSweep {
  std::vector<IntervalPoint> points;  ///< from kSweepMinFactor to kSweepMaxFactor, geometric
  double required_pfd = 0.0;          ///< the PFDavg the SIF must not exceed
  /// The longest interval, from the what-if engine (longest_proof_test_interval, every tested
  /// subsystem together, no margin): the same answer `sifter interval` gives. Empty when the
  /// SIF has no requirement to solve against.
  std::optional<IntervalResult> longest;
  std::vector<SubsystemInterval> subsystems;  ///< in the SIF's order
};

/// One row of the sensitivity ranking: the SIF's PFDavg with one input at its low and at its
/// high value, the others as in the project. Filled by the what-if engine once it is wired.
struct ServiceResult;

struct SensitivityRow {
  std::string name;       ///< the input, e.g. "outlet isolation: lambda_DU"
  double low_pfd = 0.0;   ///< PFDavg with the input at its low value
  double high_pfd = 0.0;  ///< PFDavg with the input at its high value
};

/// The drawings of one SIF.
struct SifReportData {
  std::optional<PfdPlot> pfd_curve;             ///< low demand only (PFD(t) has no meaning for PFH)
  std::optional<IntervalSweep> interval_sweep;  ///< low demand with a required PFD
  std::vector<SensitivityRow> sensitivity;      ///< largest swing first; empty: not computed in this run
  std::optional<double> required_pfd;  ///< the line drawn: the stricter of the required PFD and the required SIL's band
  std::vector<std::string> limiting;   ///< which of "probability", "architecture", "systematic" give the achieved SIL
  SifDeliverable deliverable;          ///< stated requirements and subsystem parameters
  bool compact = false;                ///< register mode: the figures are left out
};

/// Everything a report writer needs besides the ProjectResult.
struct ReportData {
  std::string date;          ///< of the run, ISO 8601 ("2025-01-31")
  std::string tool_version;  ///< SIFTER_VERSION
  bool exact_requested = true;
  std::vector<SifReportData> sifs;               ///< one per ProjectResult::sifs, same order
  DeliverableData deliverable;                   ///< document control, component data, requirements
  bool compact = false;                          ///< register mode: figures and long tables left out
  std::shared_ptr<const ServiceResult> service;  ///< in-service records assessed (report --records), or null
  std::vector<ScenarioOptions> options;          ///< the options of each scenario that lists some
};

/// Options of a report run.
struct ReportOptions {
  std::string date;  ///< as ReportData::date
  bool exact = true;
  std::size_t curve_samples = 400;  ///< uniform samples of each PFD(t) curve
  bool sensitivity = true;          ///< rank each SIF's inputs (what-if engine, factor 2)
  bool compact = false;             ///< register mode (ReportData::compact); no curves computed
};

/// The range of factors the sweep draws (multiples of every present proof-test interval).
inline constexpr double kSweepMinFactor = 1.0 / 16.0;

inline constexpr double kSweepMaxFactor = 16.0;

}  // namespace sifter
