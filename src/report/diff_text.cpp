// Terminal text and JSON of `sifter diff`.
#include "sifter/report/diff_text.hpp"

#include <algorithm>

#include "sifter/model/format.hpp"
#include "sifter/report/pressure_text.hpp"
#include "sifter/report/terminal.hpp"
#include "sifter/report/text_table.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::report {
namespace {

using nlohmann::json;

std::string value_text(const std::optional<DiffValue>& v, const std::string& unit) {
  if (!v) return "(absent)";
  if (!v->number) return v->text.empty() ? "\"\"" : v->text;
  const double x = *v->number;
  if (unit == "/h" || unit == "/yr") return sci(x) + unit;
  if (unit == "h") return format_duration(Duration{x});
  return plain(x);
}

std::string verdict_text(const std::optional<bool>& v, bool scenario) {
  if (!v) return "not judged";
  if (scenario) return *v ? "tolerable" : "NOT TOLERABLE";
  return *v ? "meets" : "FALLS SHORT";
}

std::string render_function(const FunctionDiff& d, const std::string& kind, std::size_t width) {
  std::string out = kind + " " + d.id;
  if (d.presence != Presence::kBoth) out += "  " + to_string(d.presence);
  if (d.verdict != VerdictChange::kNone)
    out += "  verdict " + std::string(d.verdict == VerdictChange::kWorsened ? "WORSENED" : to_string(d.verdict)) +
           ": " + verdict_text(d.old_verdict, kind != "SIF") + " -> " + verdict_text(d.new_verdict, kind != "SIF");
  out = fit_line(out, prose_width(width), "", "  ");
  if (!d.related.empty()) {
    std::string s;
    for (const auto& r : d.related) s += (s.empty() ? "" : ", ") + r;
    out += wrap("fed by changed scenario" + std::string(d.related.size() > 1 ? "s " : " ") + s, prose_width(width) - 4,
                "  ");
  }
  if (!d.inputs.empty()) {
    out += "  inputs\n";
    TextTable t({"pointer", "input", "old", "new"});
    for (const auto& c : d.inputs)
      t.add_row({c.pointer, c.what, value_text(c.old_value, c.unit), value_text(c.new_value, c.unit)});
    out += t.render("    ", width);
  }
  if (!d.results.empty()) {
    out += "  results\n";
    TextTable t({"result", "old", "new"});
    for (const auto& c : d.results) {
      t.add_row({c.quantity, value_text(c.old_value, c.unit), value_text(c.new_value, c.unit)});
    }
    out += t.render("    ", width);
  }
  return out;
}

json value_json(const std::optional<DiffValue>& v) {
  if (!v) return nullptr;
  if (v->number) return checked(*v->number, "diff value");
  return v->text;
}

json inputs_json(const std::vector<InputChange>& inputs) {
  json a = json::array();
  for (const auto& c : inputs)
    a.push_back({{"pointer", c.pointer},
                 {"what", c.what},
                 {"unit", c.unit},
                 {"old", value_json(c.old_value)},
                 {"new", value_json(c.new_value)}});
  return a;
}

json function_json(const FunctionDiff& d) {
  json results = json::array();
  for (const auto& c : d.results)
    results.push_back({{"quantity", c.quantity}, {"old", value_json(c.old_value)}, {"new", value_json(c.new_value)}});
  auto verdict = [](const std::optional<bool>& v) { return v ? json(*v) : json(nullptr); };
  return {{"id", d.id},
          {"presence", to_string(d.presence)},
          {"changed", d.changed()},
          {"verdict_change", to_string(d.verdict)},
          {"old_verdict", verdict(d.old_verdict)},
          {"new_verdict", verdict(d.new_verdict)},
          {"inputs", inputs_json(d.inputs)},
          {"results", results},
          {"related_scenarios", d.related}};
}

}  // namespace

std::string render_diff(const ProjectDiff& diff, std::size_t width) {
  std::string out =
      fit_line("sifter diff: " + diff.old_file + " -> " + diff.new_file, prose_width(width), "", "  ") + "\n";
  std::string unchanged;
  int changed_sifs = 0;
  int changed_scenarios = 0;
  int worsened = 0;
  auto section = [&](const std::vector<FunctionDiff>& items, const std::string& kind, int& changed) {
    for (const auto& d : items) {
      if (!d.changed() && d.verdict == VerdictChange::kNone) {
        unchanged += (unchanged.empty() ? "" : ", ") + d.id;
        continue;
      }
      ++changed;
      worsened += d.verdict == VerdictChange::kWorsened ? 1 : 0;
      out += render_function(d, kind, width) + "\n";
    }
  };
  section(diff.sifs, "SIF", changed_sifs);
  section(diff.scenarios, "Scenario", changed_scenarios);
  if (!diff.project_inputs.empty()) {
    out += "Project inputs\n";
    TextTable t({"pointer", "input", "old", "new"});
    for (const auto& c : diff.project_inputs)
      t.add_row({c.pointer, c.what, value_text(c.old_value, c.unit), value_text(c.new_value, c.unit)});
    out += t.render("    ", width) + "\n";
  }
  out += render_equipment_diff(diff.equipment);
  if (!unchanged.empty()) out += wrap("Unchanged: " + unchanged, prose_width(width), "") + "\n";
  auto count = [](int n, const char* one, const char* many) { return std::to_string(n) + " " + (n == 1 ? one : many); };
  out += fit_line("Summary: " + count(changed_sifs, "SIF", "SIFs") + " and " +
                      count(changed_scenarios, "scenario", "scenarios") + " changed; " +
                      count(worsened, "verdict", "verdicts") + " worsened",
                  prose_width(width), "", "  ");
  return out + "\n" + wrapped_caution(prose_width(width));
}

json diff_json(const ProjectDiff& diff) {
  json j;
  j["format"] = "sifter-diff/1";
  j["old"] = diff.old_file;
  j["new"] = diff.new_file;
  j["any_worsened"] = diff.any_worsened();
  j["sifs"] = json::array();
  for (const auto& d : diff.sifs) j["sifs"].push_back(function_json(d));
  j["scenarios"] = json::array();
  for (const auto& d : diff.scenarios) j["scenarios"].push_back(function_json(d));
  j["project_inputs"] = inputs_json(diff.project_inputs);
  j["equipment"] = equipment_diff_json(diff.equipment);
  j["caution"] = kCaution;
  return j;
}

}  // namespace sifter::report
