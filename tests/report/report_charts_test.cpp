// The log axes of the report's drawings are fitted to what they draw: read back from the SVG, the
// lowest and highest decade labels are the decades enclosing the data (DEVELOPERS.md, "The
// report"; a plot that leaves most of its height empty, or flattens a curve on its floor, is
// common practice to avoid).
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <regex>
#include <string>
#include <vector>

#include "sifter/report/charts.hpp"

namespace sifter::report {
namespace {

// "10⁻⁵" -> -5, "1" -> 0, "10" -> 1; nullopt for any other text.
std::optional<int> decade_of(const std::string& label) {
  if (label == "1") return 0;
  if (label == "10") return 1;
  if (label.rfind("10", 0) != 0) return std::nullopt;
  static const std::vector<std::string> digits = {"⁰", "¹", "²", "³", "⁴", "⁵", "⁶", "⁷", "⁸", "⁹"};
  std::string rest = label.substr(2);
  int sign = 1;
  if (rest.rfind("⁻", 0) == 0) {
    sign = -1;
    rest = rest.substr(std::string("⁻").size());
  }
  int value = 0;
  bool any = false;
  while (!rest.empty()) {
    bool found = false;
    for (std::size_t d = 0; d < digits.size(); ++d)
      if (rest.rfind(digits[d], 0) == 0) {
        value = value * 10 + static_cast<int>(d);
        rest = rest.substr(digits[d].size());
        found = any = true;
        break;
      }
    if (!found) return std::nullopt;
  }
  if (!any) return std::nullopt;
  return sign * value;
}

struct Tick {
  double at = 0.0;  // the pixel of the label's axis position
  int decade = 0;
};

// The decade labels of the log axis: y labels are anchored at their end, x labels in the middle.
std::vector<Tick> decade_ticks_of(const std::string& svg, bool y_axis) {
  std::vector<Tick> out;
  const std::regex text(R"re(<text x="([-0-9.]+)" y="([-0-9.]+)" text-anchor="(\w+)" class="tick">([^<]*)</text>)re");
  for (auto it = std::sregex_iterator(svg.begin(), svg.end(), text); it != std::sregex_iterator(); ++it) {
    const auto& m = *it;
    if ((m[3] == "end") != y_axis) continue;
    if (auto d = decade_of(m[4])) out.push_back({y_axis ? std::stod(m[2]) - 4.0 : std::stod(m[1]), *d});
  }
  std::sort(out.begin(), out.end(), [](const Tick& a, const Tick& b) { return a.decade < b.decade; });
  return out;
}

// The pixel rows of the SIF's line (class sif-line).
std::vector<double> line_ys(const std::string& svg) {
  std::vector<double> ys;
  const std::regex line(R"re(<polyline points="([^"]*)" class="sif-line"/>)re");
  std::smatch m;
  if (!std::regex_search(svg, m, line)) return ys;
  const std::string points = m[1];
  const std::regex pair(R"(([-0-9.]+),([-0-9.]+))");
  for (auto it = std::sregex_iterator(points.begin(), points.end(), pair); it != std::sregex_iterator(); ++it)
    ys.push_back(std::stod((*it)[2]));
  return ys;
}

SifResult low_demand_sif(std::optional<double> pfd_avg) {
  SifResult s;
  s.id = "SIF-T";
  s.pfd_avg = pfd_avg;
  SubsystemResult a;
  a.name = "sensing";
  s.subsystems.push_back(a);
  return s;
}

// A sawtooth of one proof test a year over four years: from `low` just after a test to `high`
// just before the next.
PfdPlot sawtooth(double low, double high) {
  PfdPlot p;
  for (int year = 0; year < 4; ++year)
    for (int k = 0; k <= 10; ++k) {
      p.t_hours.push_back((year + k / 10.0) * 8760.0);
      p.pfd_sif.push_back(low + (high - low) * k / 10.0);
    }
  p.pfd_subsystems.push_back(p.pfd_sif);
  p.engine = "test";
  return p;
}

TEST(LogAxes, APfdCurveUpTo4e5IsDrawnBetweenTheDecadesEnclosingIt) {
  const std::string svg = pfd_curve_svg(low_demand_sif(2.05e-5), sawtooth(1e-6 * 1.5, 4e-5), std::nullopt);
  const auto ticks = decade_ticks_of(svg, true);
  ASSERT_GE(ticks.size(), 2u) << svg;
  EXPECT_EQ(ticks.front().decade, -6);  // the curve's lowest point, 1.5e-6, lies in 1e-6..1e-5
  EXPECT_EQ(ticks.back().decade, -4);   // its highest, 4e-5, in 1e-5..1e-4: not on a 1e-4 floor
  // Read back in pixels: the line reaches into the top decade and into the bottom decade, and
  // never leaves the axis.
  const auto ys = line_ys(svg);
  ASSERT_FALSE(ys.empty());
  const double top = ticks.back().at, bottom = ticks.front().at;  // pixel rows of 1e-4 and 1e-6
  const double below_top = ticks[ticks.size() - 2].at, above_bottom = ticks[1].at;
  const auto [hi_px, lo_px] = std::minmax_element(ys.begin(), ys.end());
  EXPECT_GE(*hi_px, top - 0.01);
  EXPECT_LT(*hi_px, below_top);  // the maximum lies in the top decade
  EXPECT_LE(*lo_px, bottom + 0.01);
  EXPECT_GT(*lo_px, above_bottom);  // the minimum lies in the bottom decade
}

TEST(LogAxes, TheRequiredLineWidensTheAxisAndAnAverageBelowTheCutIsNeverLost) {
  // Required PFD 3.3e-3 sets the ceiling (1e-2); the curve dips to 1e-12 after each test, so the
  // floor is cut five decades down (1e-7), unless a level must show: an average of 3e-9 takes it
  // to 1e-9.
  PfdPlot curve = sawtooth(1e-12, 4e-5);
  auto ticks = decade_ticks_of(pfd_curve_svg(low_demand_sif(2e-5), curve, 3.3e-3), true);
  ASSERT_FALSE(ticks.empty());
  EXPECT_EQ(ticks.back().decade, -2);
  EXPECT_EQ(ticks.front().decade, -7);
  ticks = decade_ticks_of(pfd_curve_svg(low_demand_sif(3e-9), curve, 3.3e-3), true);
  ASSERT_FALSE(ticks.empty());
  EXPECT_EQ(ticks.front().decade, -9);
}

TEST(LogAxes, ALineOnADecadeGetsTheDecadeAboveItSoThatItDoesNotMergeWithTheFrame) {
  const auto ticks = decade_ticks_of(pfd_curve_svg(low_demand_sif(5e-5), sawtooth(2e-5, 8e-5), 1e-4), true);
  ASSERT_FALSE(ticks.empty());
  EXPECT_EQ(ticks.back().decade, -3);
  EXPECT_EQ(ticks.front().decade, -5);
}

TEST(LogAxes, TheSensitivityBarsAreDrawnOnTheDecadeThatHoldsThem) {
  const std::vector<SensitivityRow> rows = {{"lambda_DU", 2.2e-5, 8.1e-5}, {"beta", 3.0e-5, 6.0e-5}};
  const auto ticks = decade_ticks_of(sensitivity_svg(low_demand_sif(4e-5), rows), false);
  ASSERT_EQ(ticks.size(), 2u);
  EXPECT_EQ(ticks.front().decade, -5);
  EXPECT_EQ(ticks.back().decade, -4);
}

TEST(LogAxes, DecadeLabelsAreReadBack) {  // the parser of this test, checked on its own
  EXPECT_EQ(decade_of("10⁻¹²"), -12);
  EXPECT_EQ(decade_of("10²"), 2);
  EXPECT_EQ(decade_of("1"), 0);
  EXPECT_FALSE(decade_of("2.5").has_value());
}

}  // namespace
}  // namespace sifter::report
