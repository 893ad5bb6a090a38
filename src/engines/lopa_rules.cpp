// The LOPA layer rules: which layer gets which credit, and the findings that say why.
// CCPS, Layer of Protection Analysis (2001): an IPL is independent of the initiating event and
// of the other credited layers; IEC 61511-1:2016 clause 9.3: a BPCS layer claims a risk
// reduction of 10 at most, and no more than two BPCS layers per scenario (from memory).
#include <algorithm>
#include <string>
#include <vector>

#include "sifter/engines/lopa.hpp"
#include "sifter/engines/sil.hpp"
#include "sifter/graph/dependency_graph.hpp"

namespace sifter {
namespace {

constexpr double kLowestPlausibleLayerPfd = 1e-5;

std::string layer_label(const Layer& layer, std::size_t index) {
  if (!layer.id.empty()) return layer.id;
  if (!layer.sif.empty()) return layer.sif;
  return "#" + std::to_string(index + 1);
}

std::string kind_phrase(LayerKind kind) {
  return kind == LayerKind::kBpcsFunction ? "BPCS function" : "operator response";
}

bool capped_kind(LayerKind kind) { return kind == LayerKind::kBpcsFunction || kind == LayerKind::kOperatorResponse; }

// "device DCS-4", "devices DCS-4 and LT-400", "devices A, B and C".
std::string device_list(const std::vector<std::string>& tags) {
  std::string out = tags.size() == 1 ? "device " : "devices ";
  for (std::size_t i = 0; i < tags.size(); ++i) {
    if (i > 0) out += i + 1 == tags.size() ? " and " : ", ";
    out += tags[i];
  }
  return out;
}

std::string minutes(double hours) { return format_number(hours * 60.0) + " min"; }

std::string ordinal(std::size_t n) {
  static const char* const kWords[] = {"first", "second",  "third",  "fourth", "fifth",
                                       "sixth", "seventh", "eighth", "ninth",  "tenth"};
  return n >= 1 && n <= 10 ? kWords[n - 1] : std::to_string(n) + "th";
}

std::string join(const std::vector<std::string>& parts, const std::string& sep) {
  std::string out;
  for (const auto& p : parts) {
    if (p.empty()) continue;
    if (!out.empty()) out += sep;
    out += p;
  }
  return out;
}

// Applies the rules to one scenario. The graph holds only this scenario and the SIFs its
// layers name, so a call costs the size of the scenario, not of the project.
class LayerRules {
 public:
  LayerRules(const Project& project, const Scenario& scenario, const LopaContext& context)
      : project_(project), scenario_(scenario), context_(context) {
    // The SIFs the layers credit first, found by index: add_scenario then needs no scan.
    for (const auto& layer : scenario.layers)
      if (auto it = context.sif_index.find(layer.sif); !layer.sif.empty() && it != context.sif_index.end())
        graph_.add_sif(project, project.sifs[it->second]);
    vertices_ = graph_.add_scenario(project, scenario);
  }

  LayerAssessment run() {
    const auto& layers = scenario_.layers;
    for (std::size_t i = 0; i < layers.size(); ++i)
      if (!layers[i].sif.empty()) {
        out_.sif_layer = i;
        break;
      }
    check_sif_against_causes();
    for (std::size_t i = 0; i < layers.size(); ++i)
      if (!out_.sif_layer || i != *out_.sif_layer) out_.layers.push_back(assess(i));
    return std::move(out_);
  }

 private:
  void finding(FindingKind kind, std::string message) { out_.findings.push_back({kind, std::move(message)}); }

  std::vector<std::string> shared(std::size_t layer, std::size_t other_vertex) const {
    return graph_.common_devices(vertices_.layers[layer], other_vertex);
  }

  void check_sif_against_causes() {
    const std::size_t n = scenario_.causes.size();
    out_.sif_for_cause.assign(n, true);
    out_.sif_cause_notes.assign(n, "");
    if (!out_.sif_layer) return;
    const Layer& sif = scenario_.layers[*out_.sif_layer];
    for (std::size_t c = 0; c < n; ++c) {
      const auto tags = shared(*out_.sif_layer, vertices_.causes[c]);
      if (tags.empty()) continue;
      const std::string& cause = scenario_.causes[c].id;
      const std::string head =
          sif.sif + ", the SIF under assessment, shares " + device_list(tags) + " with initiating cause " + cause;
      if (sif.independence_note.empty()) {
        out_.sif_for_cause[c] = false;
        out_.sif_cause_notes[c] = "no credit against " + cause + ": shares " + join(tags, ", ");
        finding(FindingKind::kNotIndependent,
                head + ", so " + sif.sif + " is not independent of that cause and gets no credit against it.");
      } else {
        out_.sif_cause_notes[c] = "independence note: " + sif.independence_note;
        finding(FindingKind::kNotIndependent,
                head + "; " + sif.sif + " is credited on its independence note \"" + sif.independence_note + "\".");
      }
    }
  }

  LayerCredit assess(std::size_t i) {
    const Layer& layer = scenario_.layers[i];
    LayerCredit lc;
    lc.layer = i;
    lc.before_sif = !out_.sif_layer || i < *out_.sif_layer;
    lc.for_cause.assign(scenario_.causes.size(), true);
    lc.cause_notes.assign(scenario_.causes.size(), "");
    lc.pfd_claimed = claimed_pfd(layer);
    lc.pfd_credited = lc.pfd_claimed;
    std::vector<std::string> notes;
    apply_cap(i, lc, notes);
    question_low_pfd(i, lc);
    bool ok = operator_time_allows(i, notes);
    ok = independent_of_sif(i, notes) && ok;
    ok = independent_of_causes(i, lc) && ok;
    ok = limited_to_causes(i, lc) && ok;
    ok = independent_of_earlier(i, notes) && ok;
    lc.bpcs_based = bpcs_based(i);
    if (ok && lc.bpcs_based) ok = within_bpcs_limit(i, notes);
    lc.credited = ok;
    if (!ok) lc.for_cause.assign(lc.for_cause.size(), false);
    lc.note = join(notes, "; ");
    if (ok) credited_.push_back(i);
    return lc;
  }

  double claimed_pfd(const Layer& layer) const {
    // A SIF credited as an ordinary layer counts with its computed PFDavg where there is one.
    if (!layer.sif.empty()) {
      auto it = context_.sifs.find(layer.sif);
      if (it != context_.sifs.end() && it->second.pfd_avg) return *it->second.pfd_avg;
    }
    return layer.pfd;
  }

  void apply_cap(std::size_t i, LayerCredit& lc, std::vector<std::string>& notes) {
    const Layer& layer = scenario_.layers[i];
    if (!capped_kind(layer.kind) || at_most(kBpcsMinPfd, lc.pfd_claimed)) return;
    lc.pfd_credited = kBpcsMinPfd;
    const std::string name = layer_label(layer, i);
    notes.push_back("capped at " + format_number(kBpcsMinPfd) + " (claims " + format_number(lc.pfd_claimed) + ")");
    finding(FindingKind::kBpcsCreditCapped,
            "Layer " + name + " (" + kind_phrase(layer.kind) + ") claims PFD " + format_number(lc.pfd_claimed) +
                "; a BPCS function or operator response is credited with a PFD no lower than " +
                format_number(kBpcsMinPfd) + " (risk reduction " + format_number(1.0 / kBpcsMinPfd) +
                " at most, IEC 61511-1:2016 clause 9.3), so " + format_number(kBpcsMinPfd) + " is used.");
  }

  // A layer other than a computed SIF claiming a PFD below 1e-5 (RRF above 100 000) claims more
  // than any single device or procedure is shown to give; CCPS LOPA (2001) tables list IPL PFDs
  // of 1e-1 to 1e-5 at best (from memory). Credited as claimed, but questioned.
  void question_low_pfd(std::size_t i, const LayerCredit& lc) {
    const Layer& layer = scenario_.layers[i];
    if (!layer.sif.empty() || capped_kind(layer.kind) || !(lc.pfd_claimed < kLowestPlausibleLayerPfd)) return;
    finding(FindingKind::kImplausiblyLowPfd,
            "Layer " + layer_label(layer, i) + " claims PFD " + format_number(lc.pfd_claimed) + ", below the " +
                format_number(kLowestPlausibleLayerPfd) +
                " that any single protection layer is credited with in practice; justify it or use a higher PFD.");
  }

  bool operator_time_allows(std::size_t i, std::vector<std::string>& notes) {
    const Layer& layer = scenario_.layers[i];
    if (layer.kind != LayerKind::kOperatorResponse) return true;
    const std::string name = layer_label(layer, i);
    const std::string head = "Operator response " + name;
    const std::string tail = ", so " + name + " gets no credit.";
    const double multiple = project_.operator_time_multiple;
    if (!layer.time_available) {
      notes.push_back("no credit: no time available stated");
      finding(FindingKind::kResponseTime, head +
                                              " states no time available; an operator response is credited only "
                                              "with at least 10 min available and at least " +
                                              format_number(multiple) + " times its response time" + tail);
      return false;
    }
    const double available = layer.time_available->hours;
    if (!at_most(kOperatorMinTimeAvailableHours, available)) {
      notes.push_back("no credit: " + minutes(available) + " available, under 10 min");
      finding(FindingKind::kResponseTime, head + " has " + minutes(available) +
                                              " available, less than the 10 min an operator response needs for credit" +
                                              tail);
      return false;
    }
    if (!layer.response_time) {
      out_.assumptions.push_back(head + " states no response time; only the 10 min rule is checked.");
      return true;
    }
    const double needed = multiple * layer.response_time->hours;
    if (at_most(needed, available)) return true;
    notes.push_back("no credit: " + minutes(available) + " available, under " + format_number(multiple) +
                    " x response time");
    finding(FindingKind::kResponseTime, head + " has " + minutes(available) + " available, less than " +
                                            format_number(multiple) + " times its response time of " +
                                            minutes(layer.response_time->hours) + " (" + minutes(needed) + ")" + tail);
    return false;
  }

  bool independent_of_sif(std::size_t i, std::vector<std::string>& notes) {
    if (!out_.sif_layer) return true;
    const auto tags = shared(i, vertices_.layers[*out_.sif_layer]);
    if (tags.empty()) return true;
    const Layer& layer = scenario_.layers[i];
    const std::string name = layer_label(layer, i);
    const std::string& sif = scenario_.layers[*out_.sif_layer].sif;
    const std::string head =
        "Layer " + name + " shares " + device_list(tags) + " with " + sif + ", the SIF under assessment";
    return independence(layer, name, head, "shares " + join(tags, ", ") + " with " + sif, notes);
  }

  bool independent_of_earlier(std::size_t i, std::vector<std::string>& notes) {
    const Layer& layer = scenario_.layers[i];
    const std::string name = layer_label(layer, i);
    bool ok = true;
    for (std::size_t j : credited_) {
      const auto tags = shared(i, vertices_.layers[j]);
      if (tags.empty()) continue;
      const std::string other = layer_label(scenario_.layers[j], j);
      const std::string head = "Layer " + name + " shares " + device_list(tags) + " with layer " + other;
      ok = independence(layer, name, head, "shares " + join(tags, ", ") + " with " + other, notes,
                        ", credited before it") &&
           ok;
    }
    return ok;
  }

  // Reports one sharing; true when the layer keeps its credit on its independence note.
  bool independence(const Layer& layer, const std::string& name, const std::string& head, const std::string& short_note,
                    std::vector<std::string>& notes, const std::string& aside = "") {
    if (!layer.independence_note.empty()) {
      notes.push_back("independence note: " + layer.independence_note);
      finding(FindingKind::kNotIndependent,
              head + "; " + name + " is credited on its independence note \"" + layer.independence_note + "\".");
      return true;
    }
    notes.push_back("no credit: " + short_note);
    finding(FindingKind::kNotIndependent, head + aside + ", so " + name + " is not independent and gets no credit.");
    return false;
  }

  // Per cause: no credit against a cause the layer shares a device with. False when the layer
  // is left with credit against no cause at all.
  // "applies_to_causes": the layer acts only on the causes it names (its sensor or its path sees
  // only those), so against the others it is no layer at all and takes no credit (common practice).
  bool limited_to_causes(std::size_t i, LayerCredit& lc) {
    const Layer& layer = scenario_.layers[i];
    if (layer.applies_to_causes.empty()) return true;
    for (std::size_t c = 0; c < scenario_.causes.size(); ++c) {
      const std::string& cause = scenario_.causes[c].id;
      const auto& named = layer.applies_to_causes;
      if (std::find(named.begin(), named.end(), cause) != named.end()) continue;
      lc.for_cause[c] = false;
      lc.cause_notes[c] = "does not apply to " + cause + " (\"applies_to_causes\": " + join(named, ", ") + ")";
    }
    return std::any_of(lc.for_cause.begin(), lc.for_cause.end(), [](bool b) { return b; });
  }

  bool independent_of_causes(std::size_t i, LayerCredit& lc) {
    const Layer& layer = scenario_.layers[i];
    const std::string name = layer_label(layer, i);
    for (std::size_t c = 0; c < scenario_.causes.size(); ++c) {
      const auto tags = shared(i, vertices_.causes[c]);
      if (tags.empty()) continue;
      const std::string& cause = scenario_.causes[c].id;
      const std::string head = "Layer " + name + " shares " + device_list(tags) + " with initiating cause " + cause;
      if (!layer.independence_note.empty()) {
        lc.cause_notes[c] = "independence note: " + layer.independence_note;
        finding(FindingKind::kNotIndependent,
                head + "; " + name + " is credited on its independence note \"" + layer.independence_note + "\".");
        continue;
      }
      lc.for_cause[c] = false;
      lc.cause_notes[c] = "no credit against " + cause + ": shares " + join(tags, ", ");
      finding(FindingKind::kNotIndependent,
              head + ", so " + name + " is not independent of that cause and gets no credit against it.");
    }
    if (lc.for_cause.empty()) return true;
    return std::any_of(lc.for_cause.begin(), lc.for_cause.end(), [](bool b) { return b; });
  }

  // BPCS-based: a BPCS function, or an operator response that shares a device with a BPCS
  // function of the scenario or with an initiating cause (its alarm runs in the same system).
  bool bpcs_based(std::size_t i) const {
    const Layer& layer = scenario_.layers[i];
    if (layer.kind == LayerKind::kBpcsFunction) return true;
    if (layer.kind != LayerKind::kOperatorResponse) return false;
    for (std::size_t j = 0; j < scenario_.layers.size(); ++j)
      if (j != i && scenario_.layers[j].kind == LayerKind::kBpcsFunction && !shared(i, vertices_.layers[j]).empty())
        return true;
    for (std::size_t c = 0; c < scenario_.causes.size(); ++c)
      if (!shared(i, vertices_.causes[c]).empty()) return true;
    return false;
  }

  static_assert(kMaxBpcsLayers == 2, "the too_many_bpcs_layers finding names the two credited layers");

  bool within_bpcs_limit(std::size_t i, std::vector<std::string>& notes) {
    ++bpcs_seen_;
    const std::string name = layer_label(scenario_.layers[i], i);
    if (bpcs_credited_.size() < static_cast<std::size_t>(kMaxBpcsLayers)) {
      bpcs_credited_.push_back(name);
      return true;
    }
    notes.push_back("no credit: more than two BPCS-based layers");
    finding(FindingKind::kTooManyBpcsLayers,
            "Layer " + name + " is the " + ordinal(bpcs_seen_) + " BPCS-based layer in scenario " + scenario_.id +
                "; no more than two are credited in one scenario (" + bpcs_credited_[0] + " and " + bpcs_credited_[1] +
                "), so " + name + " gets no credit.");
    return false;
  }

  const Project& project_;
  const Scenario& scenario_;
  const LopaContext& context_;
  DependencyGraph graph_;
  ScenarioVertices vertices_;
  LayerAssessment out_;
  std::vector<std::size_t> credited_;       // layers credited so far, in order of action
  std::vector<std::string> bpcs_credited_;  // BPCS-based layers credited so far
  std::size_t bpcs_seen_ = 0;               // BPCS-based layers that passed the other rules
};

}  // namespace

LayerAssessment assess_layers(const Project& project, const Scenario& scenario, const LopaContext& context) {
  return LayerRules(project, scenario, context).run();
}

}  // namespace sifter
