#pragma once
/// What the report draws besides the verification results: the PFD(t) curve, the sweep of the
/// proof-test intervals, the sensitivity ranking, the required line. Computed here, once, so
/// that the writers only format.
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "sifter/curve.hpp"
#include "sifter/deliverable.hpp"
#include "sifter/interval_curve.hpp"
#include "sifter/options.hpp"
#include "sifter/verify.hpp"

namespace sifter {

struct ServiceResult;

/// One row of the sensitivity ranking: the SIF's PFDavg with one input at its low and at its
/// high value, the others as in the project. Filled by the what-if engine once it is wired.
struct SensitivityRow {
  std::string name;       ///< the input, e.g. "outlet isolation: lambda_DU"
  double low_pfd = 0.0;   ///< PFDavg with the input at its low value
  double high_pfd = 0.0;  ///< PFDavg with the input at its high value
};

/// The drawings of one SIF.
struct SifReportData {
  std::optional<PfdPlot> pfd_curve;            ///< low demand only (PFD(t) has no meaning for PFH)
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
  std::vector<SifReportData> sifs;  ///< one per ProjectResult::sifs, same order
  DeliverableData deliverable;      ///< document control, component data, requirements
  bool compact = false;             ///< register mode: figures and long tables left out
  std::shared_ptr<const ServiceResult> service;  ///< in-service records assessed (report --records), or null
  std::vector<ScenarioOptions> options;  ///< the options of each scenario that lists some
};

/// Options of a report run.
struct ReportOptions {
  std::string date;  ///< as ReportData::date
  bool exact = true;
  std::size_t curve_samples = 400;  ///< uniform samples of each PFD(t) curve
  bool sensitivity = true;          ///< rank each SIF's inputs (what-if engine, factor 2)
  bool compact = false;             ///< register mode (ReportData::compact); no curves computed
};

/// The drawings of every SIF of a verified project. `result` must come from verify_project on
/// `project` (its SIFs in the same order).
ReportData build_report_data(const Project& project, const ProjectResult& result, const ReportOptions& options);

/// The results (of probability, architecture and systematic) whose SIL equals the achieved one.
std::vector<std::string> limiting_results(const SifResult& sif);

}  // namespace sifter
