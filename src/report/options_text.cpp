// The options comparison as a terminal table and as sifter-options/1 JSON.
#include "sifter/report/options_text.hpp"

#include <cstdio>

#include "sifter/model/format.hpp"
#include "sifter/model/vocabulary.hpp"
#include "sifter/report/terminal.hpp"
#include "sifter/report/text_table.hpp"
#include "sifter/results/lopa.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::report {
namespace {

std::string money(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.0f", checked(v, "cost"));
  return buf;
}

std::string yes_no(bool v) { return v ? "yes" : "no"; }

// Prose lines fit an 80-column terminal: the text is wrapped so that indent + text <= 78.
constexpr std::size_t kLineWidth = 78;
std::string fitted(const std::string& text, const std::string& indent) {
  return wrap(text, kLineWidth - indent.size(), indent);
}

}  // namespace

std::string render_options_text(const ScenarioOptions& o) {
  std::string out = "Options for scenario " + o.scenario + "\n" + fitted(o.title, "  ");
  out += "  target " + format_number(o.target_frequency_per_yr) + "/yr; without any SIF " +
         format_number(o.frequency_unprotected_per_yr) + "/yr\n";
  out += fitted("lifecycle cost = capex + present value over " + format_number(o.mission_years) + " yr at " +
                    format_number(100.0 * o.discount_rate) + " %/yr of annual costs, proof tests, spurious trips",
                "  ") +
         "\n";
  char line[160];
  std::snprintf(line, sizeof line, "  %-4s %-18s %-7s %-8s %-9s %14s\n", "rank", "option", "kind", "feasible",
                "tolerable", "lifecycle cost");
  out += line;
  for (std::size_t i = 0; i < o.options.size(); ++i) {
    const auto& r = o.options[i];
    std::snprintf(line, sizeof line, "  %-4zu %-18.18s %-7s %-8s %-9s %14s\n", i + 1, r.id.c_str(),
                  to_string(r.kind).c_str(), yes_no(r.feasible).c_str(), yes_no(r.makes_tolerable).c_str(),
                  money(r.lifecycle_cost).c_str());
    out += line;
  }
  out += "\n";
  for (const auto& r : o.options) {
    out += fitted(r.id + ": capex " + money(r.capex) + ", annual " + money(r.pv_annual_cost) + ", tests " +
                      money(r.pv_test_cost) + ", trips " + money(r.pv_trip_cost) + " (present values)",
                  "  ");
    if (!r.reason.empty()) out += fitted(std::string(r.feasible ? "" : "infeasible: ") + r.reason, "    ");
    if (r.preliminary) {
      std::string rests = "PRELIMINARY, rests on:";
      for (const auto& e : r.preliminary_because) rests += " " + e + ";";
      out += fitted(rests, "    ");
    }
  }
  out += "\n" + wrapped_caution(kLineWidth);
  return out;
}

nlohmann::json options_json(const ScenarioOptions& o) {
  nlohmann::json j;
  j["format"] = kOptionsFormat;
  j["scenario"] = o.scenario;
  j["title"] = o.title;
  j["target_frequency_per_yr"] = checked(o.target_frequency_per_yr, "target");
  j["frequency_unprotected_per_yr"] = checked(o.frequency_unprotected_per_yr, "frequency");
  j["discount_rate"] = checked(o.discount_rate, "discount rate");
  j["mission_years"] = checked(o.mission_years, "mission");
  j["options"] = nlohmann::json::array();
  for (std::size_t i = 0; i < o.options.size(); ++i) {
    const auto& r = o.options[i];
    j["options"].push_back({{"rank", i + 1},
                            {"id", r.id},
                            {"title", r.title},
                            {"kind", to_string(r.kind)},
                            {"feasible", r.feasible},
                            {"makes_tolerable", r.makes_tolerable},
                            {"lifecycle_cost", checked(r.lifecycle_cost, "cost")},
                            {"capex", checked(r.capex, "cost")},
                            {"pv_annual_cost", checked(r.pv_annual_cost, "cost")},
                            {"pv_test_cost", checked(r.pv_test_cost, "cost")},
                            {"pv_trip_cost", checked(r.pv_trip_cost, "cost")},
                            {"tests_per_yr", checked(r.tests_per_yr, "tests")},
                            {"spurious_trips_per_yr", checked(r.trips_per_yr, "trips")},
                            {"mitigated_frequency_per_yr",
                             r.mitigated_frequency_per_yr ? nlohmann::json(checked(*r.mitigated_frequency_per_yr, "f"))
                                                          : nlohmann::json(nullptr)},
                            {"reason", r.reason},
                            {"preliminary", r.preliminary},
                            {"preliminary_because", r.preliminary_because}});
  }
  j["caution"] = kCaution;
  return j;
}

}  // namespace sifter::report
