#pragma once
/// The plots of the HTML report, as inline SVG: contributions, PFD(t), PFDavg against the
/// proof-test interval, the sensitivity ranking. They draw what they are given; they compute
/// nothing about the results.
#include <optional>
#include <string>
#include <vector>

#include "sifter/results/report.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::report {

/// Each subsystem's share of the SIF's PFDavg (or PFH) as horizontal bars, 0 to 100 %.
std::string contribution_svg(const SifResult& sif);

/// PFD(t) of the SIF and its subsystems over the mission (log y axis), with the PFDavg, the
/// required PFD and, when present, the 5th to 95th percentile band of the uncertainty run.
std::string pfd_curve_svg(const SifResult& sif, const PfdPlot& curve, const std::optional<double>& required_pfd);

/// PFDavg against the proof-test intervals scaled together (log-log), the required PFD, the
/// present intervals and the longest allowed scaling marked.
std::string interval_svg(const SifResult& sif, const IntervalSweep& sweep);

/// The sensitivity rows as horizontal bars from the low to the high PFDavg (log x axis), with
/// the SIF's PFDavg as a vertical line.
std::string sensitivity_svg(const SifResult& sif, const std::vector<SensitivityRow>& rows);

/// "×2.7", "×1/4": a factor of the proof-test intervals, as the plots and text write it.
std::string factor_words(double factor);

}  // namespace sifter::report
