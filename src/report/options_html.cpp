// The report's options sections: a ranked table and a picture of our own comparing the options.
#include <algorithm>
#include <cstdio>

#include "sifter/model/format.hpp"
#include "sifter/model/vocabulary.hpp"
#include "sifter/report/html_deliverable.hpp"
#include "sifter/report/options_text.hpp"
#include "sifter/report/svg.hpp"
#include "sifter/results/lopa.hpp"

namespace sifter::report {
namespace {

std::string num(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f", v);
  return buf;
}

std::string money(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.0f", checked(v, "cost"));
  return buf;
}

// One row per option: the lifecycle cost as a bar split into capital, annual costs, proof
// tests and spurious trips; an option that cannot answer the scenario is drawn as an outline
// with a cross at its end, one that answers it but leaves it intolerable as an outline only.
std::string comparison_svg(const ScenarioOptions& o) {
  const double width = 640, label = 150, row = 26, top = 24;
  const double height = top + row * static_cast<double>(o.options.size()) + 30;
  double most = 1.0;
  for (const auto& r : o.options) most = std::max(most, r.lifecycle_cost);
  const double scale = (width - label - 90) / most;
  std::string s = "<svg viewBox=\"0 0 " + num(width) + " " + num(height) +
                  "\" role=\"img\" aria-label=\"lifecycle cost of each option\">\n";
  s += "<text x=\"" + num(label) +
       "\" y=\"14\" font-size=\"11\">lifecycle cost (capital | annual | tests | trips)</text>\n";
  const char* fills[] = {"#345", "#789", "#abc", "#dde"};
  for (std::size_t i = 0; i < o.options.size(); ++i) {
    const auto& r = o.options[i];
    const double y = top + row * static_cast<double>(i);
    s += "<text x=\"" + num(label - 6) + "\" y=\"" + num(y + 15) + "\" font-size=\"11\" text-anchor=\"end\">" +
         escape_html(std::to_string(i + 1) + ". " + r.id) + "</text>\n";
    double x = label;
    const double parts[] = {r.capex, r.pv_annual_cost, r.pv_test_cost, r.pv_trip_cost};
    for (int k = 0; k < 4; ++k) {
      const double w = parts[k] * scale;
      if (w <= 0.0) continue;
      const bool solid = r.feasible && r.makes_tolerable;
      s += "<rect x=\"" + num(x) + "\" y=\"" + num(y + 4) + "\" width=\"" + num(w) + "\" height=\"16\" fill=\"" +
           (solid ? fills[k] : "none") + "\" stroke=\"#345\"/>\n";
      x += w;
    }
    if (!r.feasible)
      s += "<path d=\"M" + num(x + 4) + " " + num(y + 6) +
           " l12 12 m0 -12 l-12 12\" stroke=\"#000\" stroke-width=\"2\"/>\n";
    s += "<text x=\"" + num(x + (r.feasible ? 6 : 22)) + "\" y=\"" + num(y + 16) + "\" font-size=\"11\">" +
         money(r.lifecycle_cost) + "</text>\n";
  }
  s += "<text x=\"" + num(label) + "\" y=\"" + num(height - 8) +
       "\" font-size=\"10\">filled: feasible and tolerable; " +
       "outline: not tolerable alone; cross: infeasible</text>\n</svg>\n";
  return s;
}

std::string section(const ScenarioOptions& o) {
  std::string out = "<section class=\"options\" id=\"options-" + escape_html(o.scenario) + "\">\n";
  out += "<h2>Options for " + escape_html(o.scenario) + "</h2>\n<p>" + escape_html(o.title) + "</p>\n";
  out += "<p>Target " + escape_html(format_number(o.target_frequency_per_yr)) + "/yr; without any SIF " +
         escape_html(format_number(o.frequency_unprotected_per_yr)) +
         "/yr. Lifecycle cost: capital plus the present value over " + escape_html(format_number(o.mission_years)) +
         " yr at " + escape_html(format_number(100.0 * o.discount_rate)) +
         " %/yr of annual costs, proof tests and spurious trips.</p>\n";
  Table t{"",
          {"rank", "option", "kind", "feasible", "tolerable", "lifecycle cost", "reason"},
          {},
          {},
          std::vector<bool>(7, false)};
  for (std::size_t i = 0; i < o.options.size(); ++i) {
    const auto& r = o.options[i];
    t.rows.push_back({{std::to_string(i + 1)},
                      {r.id},
                      {to_string(r.kind)},
                      {r.feasible ? "yes" : "no"},
                      {r.makes_tolerable ? "yes" : "no"},
                      {money(r.lifecycle_cost)},
                      {r.reason + (r.preliminary ? " (preliminary)" : "")}});
  }
  out += html_table(t) + "<figure>" + comparison_svg(o) + "<figcaption>Lifecycle cost of each option, ranked." +
         "</figcaption></figure>\n</section>\n";
  return out;
}

}  // namespace

std::string options_sections_html(const std::vector<ScenarioOptions>& all) {
  std::string out;
  for (const auto& o : all) out += section(o);
  return out;
}

}  // namespace sifter::report
