// Subsystem templates and the layer catalogue: expanded in the parsed JSON, traced back in messages.
#include "input/load_reuse.hpp"

#include <algorithm>
#include <map>
#include <set>
#include <string_view>
#include <tuple>
#include <unordered_map>

#include "input/json_tree.hpp"
#include "sifter/input/json_source.hpp"

namespace sifter::detail {
namespace {

bool under(const std::string& pointer, const std::string& prefix) {
  return pointer.compare(0, prefix.size(), prefix) == 0 &&
         (pointer.size() == prefix.size() || pointer[prefix.size()] == '/');
}

// The origin's fields, then the object's own (which win), without the referring key.
ReuseOrigin merge_into(Json& object, const Json& origin, const std::string& ref_key, const std::string& pointer,
                       const std::string& origin_pointer, const std::string& name) {
  ReuseOrigin o{pointer, origin_pointer, name, {}};
  Json merged = origin;
  for (auto it = object.begin(); it != object.end(); ++it)
    if (it.key() != ref_key) merged[it.key()] = it.value();
  for (auto it = origin.begin(); it != origin.end(); ++it)
    if (!object.contains(it.key())) o.inherited_keys.push_back(it.key());
  object = std::move(merged);
  return o;
}

// Whether element `i` of `section` may hold an item of `array_key` with the member `key` (a
// subsystem naming a template, a layer naming a catalogue entry), so that the expansion must
// read it: always for a section the tree holds whole; for one held back by the parse, only when
// its document says so, without building the element.
bool may_name(const LoadContext& ctx, std::string_view section, std::size_t i, std::string_view array_key,
              std::string_view key) {
  return !ctx.deferred || !ctx.deferred->holds(section) || ctx.deferred->has_item_with(section, i, array_key, key);
}

std::vector<std::string> keys_of(const std::map<std::string, std::string>& m) {
  std::vector<std::string> out;
  for (const auto& [k, _] : m) out.push_back(k);
  return out;
}

void expand_templates(LoadContext& ctx, Json& root, ObjectReader& top, ReuseRecord& record) {
  std::map<std::string, std::string> templates;  // name -> pointer
  if (const Json* t = top.member("subsystem_templates")) {
    if (!t->is_object()) {
      ctx.error(0, "/subsystem_templates", "an object of subsystem templates by name", describe(*t),
                "for example {\"LS-SAFE\": {\"role\": \"logic\", \"vote\": \"1oo1\", …}}");
    } else {
      for (auto it = t->begin(); it != t->end(); ++it) {
        const std::string p = "/subsystem_templates/" + escape_pointer_token(it.key());
        if (!it.value().is_object())
          ctx.error(0, p, "a template: an object of subsystem fields", describe(it.value()));
        else if (it.value().contains("template"))
          ctx.error(0, p + "/template", "a template that does not name another template", "\"template\"",
                    "write the fields out in this template");
        else
          templates[it.key()] = p;
      }
    }
  }
  auto sifs = root.find("sifs");
  if (sifs == root.end() || !sifs->is_array()) return;
  for (std::size_t i = 0; i < sifs->size(); ++i) {
    // A SIF held back by the parse is built here only when a subsystem of it names a template.
    if (!may_name(ctx, "sifs", i, "subsystems", "template")) continue;
    Json& sif = section_item(ctx, "sifs", *sifs, i);
    if (!sif.is_object() || !sif.contains("subsystems") || !sif["subsystems"].is_array()) continue;
    Json& subs = sif["subsystems"];
    for (std::size_t j = 0; j < subs.size(); ++j) {
      Json& sub = subs[j];
      if (!sub.is_object() || !sub.contains("template")) continue;
      const std::string p = "/sifs/" + std::to_string(i) + "/subsystems/" + std::to_string(j);
      const Json& ref = sub["template"];
      auto found = ref.is_string() ? templates.find(ref.get<std::string>()) : templates.end();
      if (found == templates.end()) {
        if (!ref.is_string()) {
          ctx.error(0, p + "/template", "the name of a subsystem template", describe(ref));
        } else {
          const auto near = nearest(ref.get<std::string>(), keys_of(templates));
          ctx.error(
              0, p + "/template", "the name of an entry of \"subsystem_templates\"", describe(ref),
              near.empty() ? "define the template under \"subsystem_templates\"" : "did you mean \"" + near + "\"?");
        }
        record.unresolved.push_back(p);
        sub.erase("template");
        continue;
      }
      const Json& tpl = root["subsystem_templates"][found->first];
      record.subsystems.push_back(merge_into(sub, tpl, "template", p, found->second, found->first));
    }
  }
}

void expand_catalogue(LoadContext& ctx, Json& root, ObjectReader& top, ReuseRecord& record) {
  std::map<std::string, std::string> entries;  // id -> pointer
  std::map<std::string, std::size_t> index;
  if (const Json* c = top.member("layer_catalogue")) {
    if (!c->is_array()) {
      ctx.error(0, "/layer_catalogue", "an array of protection layers with ids", describe(*c));
    } else {
      for (std::size_t k = 0; k < c->size(); ++k) {
        const std::string p = "/layer_catalogue/" + std::to_string(k);
        const Json& e = (*c)[k];
        if (!e.is_object() || !e.contains("id") || !e["id"].is_string()) {
          ctx.error(0, p, "a protection layer with a string \"id\"", describe(e));
          continue;
        }
        if (e.contains("layer")) {
          ctx.error(0, p + "/layer", "a catalogue entry that does not name another entry", "\"layer\"");
          continue;
        }
        const std::string id = e["id"].get<std::string>();
        if (!entries.emplace(id, p).second) {
          ctx.error(0, p + "/id", "a catalogue id used once", "\"" + id + "\" again");
          continue;
        }
        index[id] = k;
      }
    }
  }
  auto scenarios = root.find("scenarios");
  if (scenarios == root.end() || !scenarios->is_array()) return;
  for (std::size_t i = 0; i < scenarios->size(); ++i) {
    // A scenario held back by the parse is built here only when a layer of it names an entry.
    if (!may_name(ctx, "scenarios", i, "layers", "layer")) continue;
    Json& s = section_item(ctx, "scenarios", *scenarios, i);
    if (!s.is_object() || !s.contains("layers") || !s["layers"].is_array()) continue;
    Json& layers = s["layers"];
    for (std::size_t j = 0; j < layers.size(); ++j) {
      Json& layer = layers[j];
      if (!layer.is_object() || !layer.contains("layer")) continue;
      const std::string p = "/scenarios/" + std::to_string(i) + "/layers/" + std::to_string(j);
      const Json& ref = layer["layer"];
      auto found = ref.is_string() ? entries.find(ref.get<std::string>()) : entries.end();
      if (found == entries.end()) {
        const auto near = ref.is_string() ? nearest(ref.get<std::string>(), keys_of(entries)) : "";
        ctx.error(0, p + "/layer", "the id of an entry of \"layer_catalogue\"", describe(ref),
                  near.empty() ? "define the layer under \"layer_catalogue\"" : "did you mean \"" + near + "\"?");
        record.unresolved.push_back(p);
        layer.erase("layer");
        continue;
      }
      const Json& entry = root["layer_catalogue"][index[found->first]];
      record.layers.push_back(merge_into(layer, entry, "layer", p, found->second, found->first));
    }
  }
}

// Moves a problem found in an inherited field to the field in the template or catalogue entry.
void trace_back(PendingDiagnostic& p, const std::vector<ReuseOrigin>& origins) {
  std::string& at = p.diagnostic.pointer;
  for (const auto& o : origins) {
    if (!under(at, o.pointer) || at.size() == o.pointer.size()) continue;
    const std::string rest = at.substr(o.pointer.size());  // "/beta", "/partial_stroke/interval"
    const std::string key =
        rest.substr(1, rest.find('/', 1) == std::string::npos ? std::string::npos : rest.find('/', 1) - 1);
    if (std::find(o.inherited_keys.begin(), o.inherited_keys.end(), key) != o.inherited_keys.end())
      at = o.origin_pointer + rest;
    return;
  }
}

void check_applies_to_causes(LoadContext& ctx, const Scenario& s) {
  for (const auto& layer : s.layers) {
    for (std::size_t k = 0; k < layer.applies_to_causes.size(); ++k) {
      const std::string& id = layer.applies_to_causes[k];
      const bool known = std::any_of(s.causes.begin(), s.causes.end(), [&](const Cause& c) { return c.id == id; });
      if (known) continue;
      std::string ids;
      for (const auto& c : s.causes) ids += (ids.empty() ? "" : ", ") + c.id;
      ctx.error(0, layer.pointer + "/applies_to_causes/" + std::to_string(k), "the id of a cause of scenario " + s.id,
                "\"" + id + "\"", "the causes are: " + ids);
    }
  }
}

}  // namespace

ReuseRecord expand_reuse(LoadContext& ctx, Json& root, ObjectReader& top) {
  ReuseRecord record;
  expand_templates(ctx, root, top, record);
  expand_catalogue(ctx, root, top, record);
  record.first_problem = ctx.problems.size();
  return record;
}

namespace {
// Origin names by the pointer of the object that took them (the last one written wins), so
// that a register of thousands of templated subsystems is matched in one pass, not a square.
std::unordered_map<std::string_view, const std::string*> names_by_pointer(const std::vector<ReuseOrigin>& origins) {
  std::unordered_map<std::string_view, const std::string*> out;
  for (const auto& o : origins) out.insert_or_assign(o.pointer, &o.name);
  return out;
}
}  // namespace

void name_templated_subsystems(const ReuseRecord& record, Project& project) {
  const auto templates = names_by_pointer(record.subsystems);
  for (auto& sif : project.sifs)
    for (auto& sub : sif.subsystems)
      if (auto it = templates.find(sub.pointer); it != templates.end()) sub.template_name = *it->second;
}

void finish_reuse(LoadContext& ctx, const ReuseRecord& record, Project& project) {
  const auto entries = names_by_pointer(record.layers);
  for (auto& s : project.scenarios) {
    for (auto& layer : s.layers)
      if (auto it = entries.find(layer.pointer); it != entries.end()) layer.catalogue_id = *it->second;
    check_applies_to_causes(ctx, s);
  }
}

void settle_reuse_problems(LoadContext& ctx,
                           const ReuseRecord& record) {  // Problems of the sections: traced back to their origin, each
                                                         // reported once; those inside an
  // object whose template or entry is unknown follow from that and are only counted.
  std::vector<PendingDiagnostic> kept(ctx.problems.begin(),
                                      ctx.problems.begin() + static_cast<std::ptrdiff_t>(record.first_problem));
  std::set<std::tuple<int, std::string, std::string, std::string>> seen;
  for (std::size_t i = record.first_problem; i < ctx.problems.size(); ++i) {
    PendingDiagnostic p = ctx.problems[i];
    const bool follow_on =
        p.source == 0 && std::any_of(record.unresolved.begin(), record.unresolved.end(),
                                     [&](const std::string& u) { return under(p.diagnostic.pointer, u); });
    if (follow_on) {
      ++ctx.follow_ons_suppressed;
      continue;
    }
    if (p.source == 0) {
      trace_back(p, record.subsystems);
      trace_back(p, record.layers);
    }
    const auto& d = p.diagnostic;
    if (!seen.emplace(p.source, d.pointer, d.expected, d.found).second) {
      ++ctx.follow_ons_suppressed;
      continue;
    }
    kept.push_back(std::move(p));
  }
  ctx.problems = std::move(kept);
}

}  // namespace sifter::detail
