#pragma once
/// What the report draws besides the verification results: the PFD(t) curve, the sweep of the
/// proof-test intervals, the sensitivity ranking, the required line. Computed here, once, so
/// that the writers only format.
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "sifter/analysis/deliverable.hpp"
#include "sifter/analysis/interval_curve.hpp"
#include "sifter/analysis/options.hpp"
#include "sifter/analysis/verify.hpp"
#include "sifter/engines/curve.hpp"
#include "sifter/results/report.hpp"

namespace sifter {

struct ServiceResult;

/// The drawings of every SIF of a verified project. `result` must come from verify_project on
/// `project` (its SIFs in the same order).
ReportData build_report_data(const Project& project, const ProjectResult& result, const ReportOptions& options);

}  // namespace sifter
