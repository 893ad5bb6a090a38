// Loading risk criteria and LOPA scenarios.
#include <set>
#include <unordered_set>

#include "input/load_parts.hpp"
#include "input/load_pressure.hpp"

namespace sifter::detail {
namespace {

LayerKind layer_kind_of(const std::string& s) {
  if (s == "bpcs_function") return LayerKind::kBpcsFunction;
  if (s == "operator_response") return LayerKind::kOperatorResponse;
  if (s == "relief_device") return LayerKind::kReliefDevice;
  if (s == "mechanical") return LayerKind::kMechanical;
  if (s == "sif") return LayerKind::kSif;
  return LayerKind::kOther;
}

// A probability in (0, 1]: 0 would remove what it multiplies, which is said where it is written.
std::optional<double> positive_probability(ObjectReader& r, const std::string& key, const std::string& zero_hint) {
  auto p = r.probability(key, true);
  if (p && *p <= 0.0) {
    r.context().error(r.source(), r.at(key), "a probability above 0 and at most 1", "0", zero_hint);
    return std::nullopt;
  }
  return p;
}

// A frequency in (0, inf): 0/yr is not a frequency the arithmetic can use.
std::optional<Rate> positive_frequency(ObjectReader& r, const std::string& key, const std::string& zero_hint,
                                       bool required) {
  auto f = r.rate(key, required);
  if (f && !(f->per_hour > 0.0)) {
    r.context().error(r.source(), r.at(key), "a frequency above 0", "\"" + r.member(key)->get<std::string>() + "\"",
                      zero_hint);
    return std::nullopt;
  }
  return f;
}

// An id that must be written and not empty.
std::string non_empty_id(ObjectReader& r, const std::string& key, const std::string& what) {
  auto id = r.string(key, true);
  if (id && id->empty())
    r.context().error(r.source(), r.at(key), "a " + what + " id that is not empty", "\"\"", "give it a short tag");
  return id.value_or("");
}

void read_criteria(LoadContext& ctx, const Json& root, Project& project) {
  auto it = root.find("risk_criteria");
  if (it == root.end()) return;
  if (!it->is_object()) {
    ctx.error(0, "/risk_criteria", "an object of categories, each mapping severities to tolerable frequencies",
              describe(*it), "for example {\"safety\": {\"4\": \"1e-5/yr\"}}");
    return;
  }
  for (auto cat = it->begin(); cat != it->end(); ++cat) {
    ObjectReader r(ctx, cat.value(), "/risk_criteria/" + cat.key(), 0, "a consequence category");
    if (!r.is_object()) continue;
    // A refused frequency still names its level, so that no consequence is refused for it again.
    for (auto sev = cat.value().begin(); sev != cat.value().end(); ++sev)
      project.risk_criteria[cat.key()][sev.key()] =
          positive_frequency(r, sev.key(),
                             "a tolerable frequency of 0/yr cannot be reached by any layer; "
                             "state the frequency the owner tolerates",
                             true)
              .value_or(Rate{});
    r.finish();
  }
}

std::vector<EnablingCondition> read_enabling(LoadContext& ctx, ObjectReader& r) {
  std::vector<EnablingCondition> out;
  const Json* v = r.member("enabling");
  if (!v) return out;
  if (!v->is_array()) {
    ctx.error(0, r.at("enabling"), "an array of enabling conditions", describe(*v));
    return out;
  }
  for (std::size_t i = 0; i < v->size(); ++i) {
    ObjectReader e(ctx, (*v)[i], r.at("enabling") + "/" + std::to_string(i), 0, "an enabling condition");
    EnablingCondition c;
    c.title = e.string("title", true).value_or("");
    c.probability =
        positive_probability(e, "probability", "a probability of 0 removes the cause; delete the cause instead")
            .value_or(1.0);
    e.allow({"note"});
    e.finish();
    out.push_back(c);
  }
  return out;
}

template <typename Fn>
void for_each_in(LoadContext& ctx, ObjectReader& r, const std::string& key, const std::string& what, Fn fn) {
  const Json* v = r.member(key);
  if (!v) return;
  if (!v->is_array()) {
    ctx.error(0, r.at(key), "an array of " + what, describe(*v));
    return;
  }
  for (std::size_t i = 0; i < v->size(); ++i) fn((*v)[i], r.at(key) + "/" + std::to_string(i));
}

Layer read_sif_layer(ObjectReader& r, const std::string& pointer, const std::string& sif) {
  Layer l;
  l.pointer = pointer;
  l.sif = sif;
  l.kind = LayerKind::kSif;
  if (sif.empty())
    r.context().error(0, r.at("sif"), "the id of a SIF in \"sifs\"", "\"\"", "name the SIF this layer credits");
  l.id = r.string("id").value_or(sif);
  l.title = r.string("title").value_or("");
  r.allow({"note"});
  r.finish();
  return l;
}

Layer read_layer(LoadContext& ctx, const Json& value, const std::string& pointer) {
  ObjectReader r(ctx, value, pointer, 0, "a protection layer");
  if (auto sif = r.string("sif")) return read_sif_layer(r, pointer, *sif);
  Layer l;
  l.pointer = pointer;
  l.id = non_empty_id(r, "id", "layer");
  l.title = r.string("title").value_or("");
  l.kind = layer_kind_of(
      r.choice("kind", {"bpcs_function", "operator_response", "relief_device", "mechanical", "sif", "other"}, true)
          .value_or("other"));
  if (l.kind == LayerKind::kSif)
    ctx.error(0, r.at("kind"), "a SIF layer written as {\"sif\": \"<SIF id>\"}", "kind \"sif\" without \"sif\"",
              "name the SIF so that its computed PFDavg is used");
  l.pfd = positive_probability(r, "pfd", "no layer is perfect: take its PFD from its own assessment, or leave it out")
              .value_or(1.0);
  l.devices = r.strings("devices");
  l.response_time = r.duration("response_time");
  l.time_available = r.duration("time_available");
  l.independence_note = r.string("independence_note").value_or("");
  l.applies_to_causes = r.strings("applies_to_causes");  // checked against the causes in load_reuse.cpp
  r.allow({"note"});
  r.finish();
  return l;
}

// The categories known to the risk criteria, for hints.
std::string criteria_categories(const Project& project) {
  std::string known;
  for (const auto& [name, _] : project.risk_criteria) known += (known.empty() ? "" : ", ") + name;
  return known;
}

void check_rated(LoadContext& ctx, ObjectReader& c, const Consequence& q, const Project& project) {
  if (q.category.empty() || q.severity.empty()) return;
  auto cat = project.risk_criteria.find(q.category);
  if (cat == project.risk_criteria.end()) {
    const std::string known = criteria_categories(project);
    ctx.error(0, c.at("category"), "a category of \"risk_criteria\"", "\"" + q.category + "\"",
              known.empty() ? "add \"risk_criteria\" to the project" : "the categories are: " + known);
  } else if (!cat->second.count(q.severity)) {
    std::string known;
    for (const auto& [level, _] : cat->second) known += (known.empty() ? "" : ", ") + level;
    ctx.error(0, c.at("severity"), "a severity of \"" + q.category + "\" in \"risk_criteria\"",
              "\"" + q.severity + "\"", "the severities are: " + known);
  }
}

void read_consequences(LoadContext& ctx, ObjectReader& r, const Project& project, Scenario& s) {
  for_each_in(ctx, r, "consequences", "consequences", [&](const Json& v, const std::string& p) {
    ObjectReader c(ctx, v, p, 0, "a consequence");
    Consequence q;
    q.category = c.string("category", true).value_or("");
    if (const Json* sev = c.require("severity", "a severity level of the risk criteria")) {
      if (sev->is_number_integer())
        q.severity = std::to_string(sev->get<long long>());
      else if (sev->is_string())
        q.severity = sev->get<std::string>();
      else
        ctx.error(0, c.at("severity"), "a severity level (a number or a string)", describe(*sev));
    }
    c.allow({"note", "description"});
    c.finish();
    check_rated(ctx, c, q, project);
    s.consequences.push_back(q);
  });
}

void read_causes(LoadContext& ctx, ObjectReader& r, Scenario& s) {
  std::set<std::string> ids;
  for_each_in(ctx, r, "causes", "initiating causes", [&](const Json& v, const std::string& p) {
    ObjectReader c(ctx, v, p, 0, "an initiating cause");
    Cause cause;
    cause.pointer = p;
    cause.id = non_empty_id(c, "id", "cause");
    if (!cause.id.empty() && !ids.insert(cause.id).second)
      ctx.error(0, c.at("id"), "a cause id used once in the scenario", "\"" + cause.id + "\" a second time",
                "give every initiating cause its own id");
    cause.title = c.string("title").value_or("");
    cause.frequency =
        positive_frequency(c, "frequency", "a frequency of 0/yr removes the cause; delete the cause instead", true)
            .value_or(Rate{});
    cause.devices = c.strings("devices");
    cause.enabling = read_enabling(ctx, c);
    cause.status = read_status(c);
    c.allow({"note"});
    c.finish();
    s.causes.push_back(std::move(cause));
  });
}

void read_modifiers(LoadContext& ctx, ObjectReader& r, const Project& project, Scenario& s) {
  for_each_in(ctx, r, "modifiers", "conditional modifiers", [&](const Json& v, const std::string& p) {
    ObjectReader m(ctx, v, p, 0, "a conditional modifier");
    Modifier mod;
    mod.pointer = p;
    mod.title = m.string("title", true).value_or("");
    mod.probability = positive_probability(m, "probability",
                                           "a probability of 0 removes the consequence; delete the scenario's "
                                           "consequence instead")
                          .value_or(1.0);
    mod.applies_to = m.strings("applies_to");
    for (std::size_t k = 0; k < mod.applies_to.size(); ++k)
      if (!project.risk_criteria.count(mod.applies_to[k])) {
        const std::string known = criteria_categories(project);
        ctx.error(0, m.at("applies_to") + "/" + std::to_string(k), "a category of \"risk_criteria\"",
                  "\"" + mod.applies_to[k] + "\"",
                  known.empty() ? "add \"risk_criteria\" to the project" : "the categories are: " + known);
      }
    m.allow({"note"});
    m.finish();
    s.modifiers.push_back(std::move(mod));
  });
}

void read_layers(LoadContext& ctx, ObjectReader& r, const Project& project,
                 const std::unordered_set<std::string>& sif_ids, Scenario& s) {
  std::set<std::string> sifs, layer_ids;
  for_each_in(ctx, r, "layers", "protection layers", [&](const Json& v, const std::string& p) {
    Layer l = read_layer(ctx, v, p);
    if (!l.sif.empty()) {
      if (!sif_ids.count(l.sif)) {
        std::vector<std::string> ids;
        for (const auto& sif : project.sifs) ids.push_back(sif.id);
        const auto near = nearest(l.sif, ids);
        ctx.error(0, p + "/sif", "the id of a SIF in \"sifs\"", "\"" + l.sif + "\"",
                  near.empty() ? "define the SIF under \"sifs\"" : "did you mean \"" + near + "\"?");
      }
      if (!sifs.insert(l.sif).second)
        ctx.error(0, p + "/sif", "each SIF once in a scenario", "\"" + l.sif + "\" a second time",
                  "a SIF can be credited only once against one scenario");
    }
    if (!l.id.empty() && l.sif.empty() && l.kind != LayerKind::kSif && !layer_ids.insert(l.id).second)
      ctx.error(0, p + "/id", "a layer id used once in the scenario", "\"" + l.id + "\" again");
    s.layers.push_back(std::move(l));
  });
  if (sifs.size() > 1)
    ctx.error(0, r.at("layers"), "at most one SIF under assessment in a scenario",
              std::to_string(sifs.size()) + " SIFs", "split the scenario, or credit the other SIF in another scenario");
}

void read_not_credited(LoadContext& ctx, ObjectReader& r, Scenario& s) {
  for_each_in(ctx, r, "not_credited", "layers not credited", [&](const Json& v, const std::string& p) {
    ObjectReader n(ctx, v, p, 0, "a layer not credited");
    NotCredited nc;
    nc.title = n.string("title", true).value_or("");
    nc.reason = n.string("reason", true).value_or("");
    n.finish();
    s.not_credited.push_back(nc);
  });
}

Scenario read_scenario(LoadContext& ctx, const Json& value, const std::string& pointer, const Project& project,
                       const std::unordered_set<std::string>& sif_ids) {
  ObjectReader r(ctx, value, pointer, 0, "a scenario");
  Scenario s;
  s.pointer = pointer;
  s.id = non_empty_id(r, "id", "scenario");
  s.title = r.string("title").value_or("");
  s.target_frequency =
      positive_frequency(r, "target_frequency",
                         "a tolerable frequency of 0/yr cannot be reached by any layer; state the tolerable "
                         "frequency of the risk criteria",
                         false);
  read_consequences(ctx, r, project, s);
  if (s.consequences.empty() && !s.target_frequency && !r.has("target_frequency"))
    ctx.error(0, pointer, "\"consequences\" or \"target_frequency\"", "neither",
              "a scenario needs a tolerable frequency to compare against");
  read_causes(ctx, r, s);
  if (s.causes.empty()) ctx.error(0, pointer, "at least one initiating cause under \"causes\"", "none");
  read_modifiers(ctx, r, project, s);
  read_layers(ctx, r, project, sif_ids, s);
  read_not_credited(ctx, r, s);
  r.allow({"note", "node", "deviation"});
  r.finish();
  return s;
}

}  // namespace

void read_scenarios(LoadContext& ctx, Json& root, Project& project) {
  read_criteria(ctx, root, project);
  if (auto it = root.find("lopa"); it != root.end()) {
    ObjectReader r(ctx, *it, "/lopa", 0, "the LOPA settings");
    if (auto m = r.number("operator_time_multiple")) {
      if (*m < 1.0)
        ctx.error(0, r.at("operator_time_multiple"), "a multiple of 1 or more", "the number " + Json(*m).dump());
      else
        project.operator_time_multiple = *m;
    }
    r.finish();
  }
  auto it = root.find("scenarios");
  if (it == root.end()) return;
  if (!it->is_array()) {
    ctx.error(0, "/scenarios", "an array of scenarios", describe(*it));
    return;
  }
  std::set<std::string> ids;
  std::unordered_set<std::string> sif_ids;  // looked up once per SIF layer: no scan of every SIF
  for (const auto& sif : project.sifs) sif_ids.insert(sif.id);
  for (std::size_t i = 0; i < it->size(); ++i) {
    Scenario s =
        read_scenario(ctx, section_item(ctx, "scenarios", *it, i), "/scenarios/" + std::to_string(i), project, sif_ids);
    (*it)[i] = nullptr;  // its JSON is freed while still in cache, and its memory serves the next scenario
    if (!s.id.empty() && !ids.insert(s.id).second)
      ctx.error(0, s.pointer + "/id", "a scenario id used once", "\"" + s.id + "\" a second time");
    project.scenarios.push_back(std::move(s));
  }
}

}  // namespace sifter::detail
