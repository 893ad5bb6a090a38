// The drawings of a report, computed once from the project and its results.
#include "sifter/analysis/report_data.hpp"

#include <algorithm>
#include <cassert>

#include "sifter/analysis/whatif.hpp"
#include "sifter/engines/cross_check.hpp"
#include "sifter/engines/sil.hpp"
#include "sifter/model/diagnostics.hpp"

namespace sifter {

std::vector<std::string> limiting_results(const SifResult& sif) {
  std::vector<std::string> out;
  if (sif.sil_probability == sif.sil_achieved) out.emplace_back("probability");
  if (sif.sil_architecture == sif.sil_achieved) out.emplace_back("architecture");
  if (sif.sil_systematic == sif.sil_achieved) out.emplace_back("systematic");
  return out;
}

namespace {

// The PFDavg the lines mark: verify asks for both the band of the required SIL (IEC 61511-1:2016
// Table 4) and the required PFD itself, so the stricter of the two.
std::optional<double> required_line(const SifResult& sif) {
  if (sif.demand_mode != DemandMode::kLow) return std::nullopt;
  std::optional<double> line = sif.required_pfd;
  if (sif.sil_required && *sif.sil_required > 0) {
    const double band = sil_upper_limit(*sif.sil_required, DemandMode::kLow);
    line = line ? std::min(*line, band) : band;
  }
  return line;
}

// PFD(t) from the exact engine where it models every group; else the simplified sawtooth.
PfdPlot pfd_plot(const Project& project, const Sif& sif, const ReportOptions& options) {
  if (options.exact) {
    try {
      return exact_curve(project, sif, static_cast<int>(options.curve_samples));
    } catch (const Error&) {
      // A group the exact engine cannot model: the simplified curve, which says so.
    }
  }
  return simplified_curve(project, sif, options.curve_samples);
}

// The tornado rows from the what-if engine, widest swing first.
std::vector<SensitivityRow> sensitivity_rows(const WhatIf& what_if, std::size_t sif) {
  // The report draws the inputs that matter: the widest dozen, and none that moves the figure
  // by less than a thousandth of itself (the command `sifter sensitivity` lists them all).
  constexpr std::size_t kMostRows = 12;
  constexpr double kLeastRelativeSwing = 1e-3;
  std::vector<SensitivityRow> rows;
  try {
    const SensitivityResult r = sensitivity(what_if, sif, 2.0);
    for (const auto& in : r.inputs)
      if (in.swing > kLeastRelativeSwing * r.base && rows.size() < kMostRows)
        rows.push_back({in.name, in.at_low, in.at_high});
  } catch (const Error&) {
    // No requirement to rank against: the section says "not computed".
  }
  return rows;
}

}  // namespace

ReportData build_report_data(const Project& project, const ProjectResult& result, const ReportOptions& options) {
  assert(project.sifs.size() == result.sifs.size());
  ReportData data;
  data.date = options.date;
  data.tool_version = SIFTER_VERSION;
  data.exact_requested = options.exact;
  data.deliverable = build_deliverable_data(project, result);
  data.compact = options.compact;
  const WhatIf what_if(project);
  for (std::size_t i = 0; i < result.sifs.size(); ++i) {
    const SifResult& r = result.sifs[i];
    SifReportData d;
    d.required_pfd = required_line(r);
    d.limiting = limiting_results(r);
    if (i < data.deliverable.sifs.size()) d.deliverable = data.deliverable.sifs[i];
    d.compact = options.compact;
    if (r.demand_mode == DemandMode::kLow && r.pfd_avg && !options.compact) {
      d.pfd_curve = pfd_plot(project, project.sifs[i], options);
      if (options.sensitivity) d.sensitivity = sensitivity_rows(what_if, i);
      if (d.required_pfd) d.interval_sweep = interval_sweep(what_if, i, *d.required_pfd);
    }
    data.sifs.push_back(std::move(d));
  }
  return data;
}

}  // namespace sifter
