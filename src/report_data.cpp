// The drawings of a report, computed once from the project and its results.
#include "sifter/report_data.hpp"

#include <algorithm>
#include <cassert>

#include "sifter/sil.hpp"

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

}  // namespace

ReportData build_report_data(const Project& project, const ProjectResult& result, const ReportOptions& options) {
  assert(project.sifs.size() == result.sifs.size());
  ReportData data;
  data.date = options.date;
  data.tool_version = SIFTER_VERSION;
  data.exact_requested = options.exact;
  for (std::size_t i = 0; i < result.sifs.size(); ++i) {
    const SifResult& r = result.sifs[i];
    SifReportData d;
    d.required_pfd = required_line(r);
    d.limiting = limiting_results(r);
    if (r.demand_mode == DemandMode::kLow && r.pfd_avg) {
      d.pfd_curve = simplified_curve(project, project.sifs[i], options.curve_samples);
      if (d.required_pfd) d.interval_sweep = interval_sweep(project, project.sifs[i], *d.required_pfd);
    }
    data.sifs.push_back(std::move(d));
  }
  return data;
}

}  // namespace sifter
