// LOPA worksheets: the terminal table and the CSV rows.
#include "sifter/report/worksheet.hpp"

#include <algorithm>

#include "sifter/model/format.hpp"
#include "sifter/model/printable.hpp"
#include "sifter/report/text_table.hpp"

namespace sifter::report {
namespace {

std::string step_label(const WorksheetRow& row) {
  switch (row.step) {
    case WorksheetStep::kCause:
      return "cause " + row.item;
    case WorksheetStep::kEnabling:
      return "  enabling";
    case WorksheetStep::kLayer:
      return "  layer " + row.item;
    case WorksheetStep::kSif:
      return "  SIF " + row.item;
    case WorksheetStep::kNotCredited:
      return "  not credited";
    case WorksheetStep::kTotal:
      return "all causes";
    case WorksheetStep::kModifier:
      return "  modifier";
    case WorksheetStep::kTarget:
      return "target";
    case WorksheetStep::kWithSif:
      return "with SIF " + row.item;
  }
  return {};
}

std::string value_text(const WorksheetRow& row) {
  if (!row.value) return "";
  switch (row.step) {
    case WorksheetStep::kCause:
    case WorksheetStep::kTarget:
      return sci(*row.value) + "/yr";
    default:
      return plain(*row.value);
  }
}

std::string credit_text(const WorksheetRow& row) {
  if (row.step != WorksheetStep::kLayer && row.step != WorksheetStep::kSif) return "";
  if (row.step == WorksheetStep::kSif) return "assessed";
  return row.credited ? "credited" : "NO CREDIT";
}

}  // namespace

std::string render_worksheet(const ScenarioResult& s, std::size_t width) {
  std::string out = fit_line("Scenario " + s.id + (s.title.empty() ? "" : "  " + s.title), width, "");
  TextTable t({"step", "title", "value", "credit", "frequency [/yr]", "note"},
              {false, false, true, false, true, false});
  // In a narrow terminal the title breaks between words and the note goes under its row.
  t.set_fit({Fit::kKeep, Fit::kWrap, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kBelow});
  std::string last_consequence;
  for (const auto& row : s.worksheet) {
    if (!row.consequence.empty() && row.consequence != last_consequence) {
      t.add_rule();
      t.add_section("consequence: " + row.consequence);
      last_consequence = row.consequence;
    }
    // The SIF row's role is said by its credit column; the target row's note carries the gap.
    const std::string note = row.step == WorksheetStep::kSif ? "" : row.note;
    t.add_row({step_label(row), row.title, value_text(row), credit_text(row),
               row.frequency_per_yr ? sci(*row.frequency_per_yr) : "", note});
  }
  out += t.render("  ", width);
  std::string required = "required: PFD " + sci(s.required_pfd) + ", RRF " + plain(s.required_rrf) + ", SIL " +
                         std::to_string(s.required_sil);
  if (s.demand_rate_per_yr)
    required += "; demand on the SIF " + sci(*s.demand_rate_per_yr) + "/yr (" +
                to_string(s.demand_mode.value_or(DemandMode::kLow)) + " demand)";
  out += fit_line(required, width, "  ");
  if (s.mitigated_frequency_per_yr)
    out +=
        fit_line("with the SIF: " + sci(*s.mitigated_frequency_per_yr) + "/yr against a target of " +
                     sci(s.target_frequency_per_yr) + "/yr -> " +
                     (s.meets_target ? (*s.meets_target ? "TOLERABLE" : "NOT TOLERABLE") : std::string("not judged")),
                 width, "  ");
  const std::size_t text_width = prose_width(width);
  if (!s.findings.empty()) {
    out += "  findings\n";
    for (const auto& f : s.findings) out += fit_line("- [" + to_string(f.kind) + "] " + f.message, text_width, "    ");
  }
  if (!s.assumptions.empty()) {
    out += "  assumptions\n";
    for (const auto& a : s.assumptions) out += fit_line("- " + a, text_width, "    ");
  }
  return out;
}

std::string csv_field(const std::string& raw) {
  // A cell a spreadsheet would take for a formula is neutralised first (README, "CSV files").
  const std::string text = neutralise_formula(raw);
  if (text.find_first_of(",\"\r\n") == std::string::npos) return text;
  std::string out = "\"";
  for (char c : text) out += c == '"' ? std::string("\"\"") : std::string(1, c);
  return out + "\"";
}

std::string worksheet_csv(const ProjectResult& result) {
  std::string out = "scenario,consequence,step,cause,item,title,value,credited,frequency_per_yr,required_rrf,note\r\n";
  auto num = [](const std::optional<double>& v) {
    if (!v) return std::string();
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.6g", checked(*v, "worksheet value"));
    return std::string(buf);
  };
  for (const auto& s : result.scenarios)
    for (const auto& row : s.worksheet)
      out += csv_field(s.id) + "," + csv_field(row.consequence) + "," + to_string(row.step) + "," +
             csv_field(row.cause) + "," + csv_field(row.item) + "," + csv_field(row.title) + "," + num(row.value) +
             "," + (row.credited ? "true" : "false") + "," + num(row.frequency_per_yr) + "," + num(row.gap) + "," +
             csv_field(row.note) + "\r\n";
  return out;
}

}  // namespace sifter::report
