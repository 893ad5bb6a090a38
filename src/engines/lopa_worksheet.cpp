// The LOPA worksheet: the rows a terminal or CSV writer prints, with every figure computed here.
#include <string>
#include <vector>

#include "sifter/engines/lopa.hpp"

namespace sifter {

std::string to_string(WorksheetStep step) {
  switch (step) {
    case WorksheetStep::kCause:
      return "cause";
    case WorksheetStep::kEnabling:
      return "enabling";
    case WorksheetStep::kLayer:
      return "layer";
    case WorksheetStep::kSif:
      return "sif";
    case WorksheetStep::kNotCredited:
      return "not_credited";
    case WorksheetStep::kTotal:
      return "total";
    case WorksheetStep::kModifier:
      return "modifier";
    case WorksheetStep::kTarget:
      return "target";
    case WorksheetStep::kWithSif:
      return "with_sif";
  }
  return "unknown";
}

namespace {

std::string joined(const std::string& a, const std::string& b) {
  if (a.empty()) return b;
  if (b.empty()) return a;
  return a + "; " + b;
}

const LayerCredit* credit_of(const LayerAssessment& a, std::size_t layer) {
  for (const auto& lc : a.layers)
    if (lc.layer == layer) return &lc;
  return nullptr;
}

// One cause's block: the cause, its enabling conditions, then each layer in the order of action.
void cause_rows(std::vector<WorksheetRow>& rows, const Scenario& scenario, const LayerAssessment& a, std::size_t c) {
  const Cause& cause = scenario.causes[c];
  double f = cause.frequency.per_year();
  rows.push_back({WorksheetStep::kCause, "", cause.id, cause.id, cause.title, f, true, "", f, std::nullopt});
  for (const auto& e : cause.enabling) {
    f *= e.probability;
    rows.push_back({WorksheetStep::kEnabling, "", cause.id, "", e.title, e.probability, true, "", f, std::nullopt});
  }
  for (std::size_t i = 0; i < scenario.layers.size(); ++i) {
    const Layer& layer = scenario.layers[i];
    if (a.sif_layer && i == *a.sif_layer) {
      const bool credited = a.sif_for_cause.empty() || a.sif_for_cause[c];
      const std::string note = joined("the SIF under assessment, not counted in the frequency without it",
                                      a.sif_cause_notes.empty() ? "" : a.sif_cause_notes[c]);
      rows.push_back(
          {WorksheetStep::kSif, "", cause.id, layer.sif, layer.title, std::nullopt, credited, note, f, std::nullopt});
      continue;
    }
    const LayerCredit* lc = credit_of(a, i);
    if (lc == nullptr) continue;
    const bool credited = lc->for_cause[c];
    if (credited) f *= lc->pfd_credited;
    const std::string item = layer.id.empty() ? layer.sif : layer.id;
    rows.push_back({WorksheetStep::kLayer, "", cause.id, item, layer.title,
                    credited ? lc->pfd_credited : lc->pfd_claimed, credited,
                    joined(joined(lc->note, lc->cause_notes[c]),
                           layer.catalogue_id.empty() ? "" : "from the layer catalogue (" + layer.catalogue_id + ")"),
                    f, std::nullopt});
  }
}

std::string consequence_label(const ConsequenceResult& c) {
  if (c.category.empty()) return "target frequency";
  return c.category + " " + c.severity;
}

void consequence_rows(std::vector<WorksheetRow>& rows, const Scenario& scenario, const ScenarioResult& r,
                      const ConsequenceResult& c, double total) {
  double f = total;
  for (const auto& m : scenario.modifiers) {
    if (!modifier_applies(m, c.category)) continue;
    f *= m.probability;
    rows.push_back({WorksheetStep::kModifier, c.category, "", "", m.title, m.probability, true, "", f, std::nullopt});
  }
  std::string note = "required PFD " + format_number(c.required_pfd) + ", RRF " + format_number(c.required_rrf) +
                     ", SIL " + std::to_string(c.required_sil);
  if (r.demand_mode == DemandMode::kHigh && c.required_pfh_per_hour)
    note += ", PFH " + format_number(*c.required_pfh_per_hour) + "/h";
  if (!r.sif && c.meets_target) note += *c.meets_target ? "; meets the target" : "; misses the target";
  rows.push_back({WorksheetStep::kTarget, c.category, "", "", consequence_label(c), c.target_frequency_per_yr, true,
                  note, c.frequency_without_sif_per_yr, c.required_rrf});
  if (!r.sif || !c.mitigated_frequency_per_yr) return;
  const std::optional<double> figure =
      r.sif_credit_pfd ? r.sif_credit_pfd : (r.sif_pfd_avg ? r.sif_pfd_avg : r.sif_pfh_per_hour);
  const bool capped = r.sif_credit_capped.value_or(false);
  const double ratio = *c.mitigated_frequency_per_yr / c.target_frequency_per_yr;
  const std::string verdict =
      c.meets_target.value_or(false) ? "meets the target" : "misses the target by a factor of " + format_number(ratio);
  rows.push_back({WorksheetStep::kWithSif, c.category, "", *r.sif,
                  capped ? (r.sif_pfd_avg ? "with the SIF's credit, capped at the best PFD of the SIL it achieves"
                                          : "with the SIF's credit, capped at the best PFH of the SIL it achieves")
                         : (r.sif_pfd_avg ? "with the SIF's PFDavg" : "with the SIF's PFH per hour"),
                  figure, true, verdict, c.mitigated_frequency_per_yr, std::nullopt});
}

}  // namespace

std::vector<WorksheetRow> build_worksheet(const Scenario& scenario, const LayerAssessment& assessment,
                                          const ScenarioResult& result) {
  std::vector<WorksheetRow> rows;
  for (std::size_t c = 0; c < scenario.causes.size(); ++c) cause_rows(rows, scenario, assessment, c);
  for (const auto& nc : scenario.not_credited)
    rows.push_back({WorksheetStep::kNotCredited, "", "", "", nc.title, std::nullopt, false, nc.reason, std::nullopt,
                    std::nullopt});
  double total = 0.0;
  for (const auto& c : result.causes) total += c.frequency_without_sif_per_yr;
  rows.push_back({WorksheetStep::kTotal, "", "", "", "sum over causes", std::nullopt, true, "", total, std::nullopt});
  for (const auto& c : result.consequences) consequence_rows(rows, scenario, result, c, total);
  rows.shrink_to_fit();  // held with the results for the whole run
  return rows;
}

}  // namespace sifter
