// The report's plots: bars, PFD(t), the interval sweep, the sensitivity ranking.
#include "sifter/report/charts.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "sifter/model/format.hpp"
#include "sifter/report/svg.hpp"

namespace sifter::report {
namespace {

using svg::Anchor;
using svg::Axis;
using svg::Canvas;
using svg::Plot;
using svg::Scale;

constexpr double kWidth = 720.0;
constexpr std::size_t kMaxLabelChars = 34;
constexpr int kSubsystemStyles = 4;  // line styles cycled over the subsystems

double label_width(const std::vector<std::string>& labels) {
  std::size_t longest = 0;
  for (const auto& l : labels) longest = std::max(longest, std::min(l.size(), kMaxLabelChars));
  return 16.0 + svg::kCharPx * static_cast<double>(longest);
}

Axis log_axis(double lo, double hi, std::string title) {
  Axis a;
  a.ticks = svg::decade_ticks(lo, hi);
  for (double t : a.ticks) a.labels.push_back(svg::power_of_ten_label(t));
  a.title = std::move(title);
  return a;
}

Axis linear_axis(double lo, double hi, int count, std::string title, const char* suffix = "") {
  Axis a;
  a.ticks = svg::linear_ticks(lo, hi, count);
  for (double t : a.ticks) a.labels.push_back(plain(t) + suffix);
  a.title = std::move(title);
  return a;
}

std::string subsystem_style(std::size_t i) { return "sub sub-" + std::to_string(i % kSubsystemStyles); }

}  // namespace

std::string factor_words(double factor) {
  checked(factor, "interval factor");
  if (factor < 1.0 && std::fabs(1.0 / factor - std::round(1.0 / factor)) < 1e-9)
    return "×1/" + plain(std::round(1.0 / factor));
  char buf[32];
  std::snprintf(buf, sizeof buf, "×%.3g", factor);
  return buf;
}

std::string contribution_svg(const SifResult& sif) {
  std::vector<std::string> names;
  for (const auto& s : sif.subsystems) names.push_back(svg::shortened(s.name, kMaxLabelChars));
  const double left = label_width(names);
  const double row = 28.0, top = 12.0;
  const double plot_w = kWidth - left - 150.0;
  const double height = top + row * static_cast<double>(names.size()) + 52.0;
  Canvas c(kWidth, height);
  Plot p{left,
         top,
         plot_w,
         row * static_cast<double>(names.size()),
         Scale(0.0, 1.0, left, left + plot_w, false),
         Scale(0.0, 1.0, 0.0, 1.0, false)};
  Axis x = linear_axis(
      0.0, 100.0, 5,
      std::string("share of the SIF's ") + (sif.demand_mode == DemandMode::kLow ? "PFDavg" : "PFH") + " [%]");
  for (auto& t : x.ticks) t /= 100.0;
  svg::draw_axes(c, p, x, Axis{});
  const bool low = sif.demand_mode == DemandMode::kLow;
  for (std::size_t i = 0; i < sif.subsystems.size(); ++i) {
    const auto& s = sif.subsystems[i];
    const double y = top + row * static_cast<double>(i);
    c.text(left - 8, y + row / 2 + 4, names[i], "label", Anchor::kEnd);
    c.rect(left, y + 5, p.x(s.share) - left, row - 10, "bar bar-" + std::to_string(i % kSubsystemStyles));
    const auto& v = low ? s.pfd_avg : s.pfh_per_hour;
    c.text(p.x(s.share) + 6, y + row / 2 + 4, percent(s.share) + (v ? "  (" + sci(*v) + (low ? ")" : "/h)") : ""),
           "value");
  }
  return c.render("contributions", "Share of each subsystem in " + sif.id);
}

namespace {

void draw_series(Canvas& c, const Plot& p, const std::vector<double>& t_hours, const std::vector<double>& values,
                 const std::string& cls) {
  svg::Points pts;
  pts.reserve(values.size());
  for (std::size_t i = 0; i < values.size() && i < t_hours.size(); ++i)
    pts.emplace_back(p.x(t_hours[i] / kHoursPerYear), p.y(values[i]));
  c.polyline(pts, cls);
}

void draw_level(Canvas& c, const Plot& p, double value, const std::string& cls) {
  c.line(p.left, p.y(value), p.left + p.width, p.y(value), cls);
}

}  // namespace

std::string pfd_curve_svg(const SifResult& sif, const PfdPlot& curve, const std::optional<double>& required_pfd) {
  // Every line drawn sets the range; the levels (average, requirement, band) are never cut off.
  std::vector<double> values = curve.pfd_sif, keep;
  for (const auto& sub : curve.pfd_subsystems) values.insert(values.end(), sub.begin(), sub.end());
  if (required_pfd) keep.push_back(*required_pfd);
  if (sif.pfd_avg) keep.push_back(*sif.pfd_avg);
  if (sif.uncertainty) {
    keep.push_back(sif.uncertainty->p95);
    keep.push_back(sif.uncertainty->p05);
  }
  const auto [lo, hi] = svg::log_range(values, 5, keep);
  const double mission_yr = curve.t_hours.empty() ? 1.0 : curve.t_hours.back() / kHoursPerYear;
  const std::size_t entries = curve.pfd_subsystems.size() + 3 + (sif.uncertainty ? 1 : 0);
  const double plot_h = 250.0, top = 14.0, left = 80.0;
  const double legend_top = top + plot_h + 62.0;
  Canvas c(kWidth, legend_top + 18.0 * static_cast<double>((entries + 1) / 2) + 6.0);
  Plot p{left,
         top,
         kWidth - left - 24.0,
         plot_h,
         Scale(0.0, mission_yr, left, kWidth - 24.0, false),
         Scale(lo, hi, top + plot_h, top, true)};
  svg::draw_axes(c, p, linear_axis(0.0, mission_yr, 10, "time since start of the mission [years]"),
                 log_axis(lo, hi, "PFD(t) [probability, log scale]"));
  if (sif.uncertainty) {
    const auto& u = *sif.uncertainty;
    c.rect(p.left, p.y(u.p95), p.width, p.y(u.p05) - p.y(u.p95), "band");
  }
  for (std::size_t i = 0; i < curve.pfd_subsystems.size(); ++i)
    draw_series(c, p, curve.t_hours, curve.pfd_subsystems[i], subsystem_style(i));
  draw_series(c, p, curve.t_hours, curve.pfd_sif, "sif-line");
  if (sif.pfd_avg) draw_level(c, p, *sif.pfd_avg, "avg-line");
  if (required_pfd) draw_level(c, p, *required_pfd, "req-line");
  // The legend, two columns under the plot: every line named in words, so it reads in black and white.
  std::vector<std::pair<std::string, std::string>> legend{{"sif-line", "PFD(t) of " + sif.id}};
  for (std::size_t i = 0; i < curve.pfd_subsystems.size() && i < sif.subsystems.size(); ++i)
    legend.emplace_back(subsystem_style(i), svg::shortened(sif.subsystems[i].name, kMaxLabelChars));
  if (sif.pfd_avg) legend.emplace_back("avg-line", "PFDavg " + sci(*sif.pfd_avg) + " (simplified equations)");
  if (required_pfd) legend.emplace_back("req-line", "required PFD " + sci(*required_pfd));
  if (sif.uncertainty) legend.emplace_back("band-key", "PFDavg 5th to 95th percentile (uncertainty run)");
  for (std::size_t i = 0; i < legend.size(); ++i)
    svg::legend_line(c, left + (i % 2 == 0 ? 0.0 : 320.0), legend_top + 18.0 * static_cast<double>(i / 2),
                     legend[i].first, legend[i].second);
  return c.render("pfd-curve", "PFD(t) of " + sif.id + " over the mission");
}

std::string interval_svg(const SifResult& sif, const IntervalSweep& sweep) {
  std::vector<double> values;
  for (const auto& pt : sweep.points) values.push_back(pt.pfd_avg);
  const auto [lo, hi] = svg::log_range(values, 6, {sweep.required_pfd});
  const double left = 80.0, top = 14.0, plot_h = 240.0;
  Canvas c(kWidth, top + plot_h + 86.0);
  Plot p{left,
         top,
         kWidth - left - 24.0,
         plot_h,
         Scale(kSweepMinFactor, kSweepMaxFactor, left, kWidth - 24.0, true),
         Scale(lo, hi, top + plot_h, top, true)};
  Axis x;
  for (double f = kSweepMinFactor; f <= kSweepMaxFactor * 1.0001; f *= 2.0) {
    x.ticks.push_back(f);
    x.labels.push_back(factor_words(f));
  }
  x.title = "every proof-test interval of the SIF times this factor [×, log scale]";
  svg::draw_axes(c, p, x, log_axis(lo, hi, "PFDavg [probability, log scale]"));
  draw_level(c, p, sweep.required_pfd, "req-line");
  svg::Points pts;
  for (const auto& pt : sweep.points) pts.emplace_back(p.x(pt.factor), p.y(pt.pfd_avg));
  c.polyline(pts, "sif-line");
  for (const auto& [px, py] : pts) c.circle(px, py, 2.2, "dot");
  c.line(p.x(1.0), p.top, p.x(1.0), p.top + p.height, "now-line");
  c.text(p.x(1.0) + 4, p.top + 14, "present intervals", "note");
  const double legend_y = top + plot_h + 62.0;
  svg::legend_line(c, left, legend_y, "req-line", "required PFD " + sci(sweep.required_pfd));
  // The longest interval is the what-if engine's (the answer of `sifter interval`): one
  // interval for every tested subsystem, which this plot of scaled intervals cannot mark.
  std::string words = "longest interval: not computed (no requirement)";
  if (sweep.longest) {
    const auto& l = *sweep.longest;
    words = l.outcome == IntervalOutcome::kNone ? "longest interval: none meets the requirement"
            : l.outcome == IntervalOutcome::kWholeMission
                ? "longest interval: the whole mission, " + format_duration(l.longest)
                : "longest interval (all tested subsystems): " + format_duration(l.longest);
  }
  c.text(left + 320, legend_y, words, "legend");
  return c.render("interval-sweep", "PFDavg of " + sif.id + " against its proof-test intervals");
}

std::string sensitivity_svg(const SifResult& sif, const std::vector<SensitivityRow>& rows) {
  std::vector<std::string> names;
  std::vector<double> values;
  for (const auto& r : rows) {
    names.push_back(svg::shortened(r.name, kMaxLabelChars));
    values.push_back(r.low_pfd);
    values.push_back(r.high_pfd);
  }
  const auto [lo, hi] =
      svg::log_range(values, 6, sif.pfd_avg ? std::vector<double>{*sif.pfd_avg} : std::vector<double>{});
  const double left = label_width(names), top = 12.0, row = 26.0;
  const double plot_h = row * static_cast<double>(rows.size());
  Canvas c(kWidth, top + plot_h + 56.0);
  Plot p{left,
         top,
         kWidth - left - 24.0,
         plot_h,
         Scale(lo, hi, left, kWidth - 24.0, true),
         Scale(0.0, 1.0, 0.0, 1.0, false)};
  svg::draw_axes(c, p, log_axis(lo, hi, "PFDavg with the input at its low and its high value [log scale]"), Axis{});
  for (std::size_t i = 0; i < rows.size(); ++i) {
    const double y = top + row * static_cast<double>(i);
    const double a = p.x(std::min(rows[i].low_pfd, rows[i].high_pfd));
    const double b = p.x(std::max(rows[i].low_pfd, rows[i].high_pfd));
    c.text(left - 8, y + row / 2 + 4, names[i], "label", Anchor::kEnd);
    c.rect(a, y + 5, std::max(b - a, 1.0), row - 10, "bar bar-0");
  }
  if (sif.pfd_avg) {
    c.line(p.x(*sif.pfd_avg), top, p.x(*sif.pfd_avg), top + plot_h, "avg-line");
    c.text(p.x(*sif.pfd_avg) + 4, top + plot_h + 48, "as designed " + sci(*sif.pfd_avg), "note");
  }
  return c.render("sensitivity", "Sensitivity ranking of " + sif.id);
}

}  // namespace sifter::report
