// Loading the "pressure" and "options" sections, and the overpressure scenarios they generate.
#include "input/load_pressure.hpp"

#include <set>

#include "sifter/model/vocabulary.hpp"

namespace sifter::detail {
namespace {

const char* const kOneBasisHint =
    "write every pressure of the project as gauge (barg, psig, kPag, MPag) or every one as absolute "
    "(bara, psia); absolute = gauge + 1.01325 bar";

// Reads the section's quantities; remembers the first pressure's basis so that gauge and
// absolute values are never mixed silently.
class QuantityReader {
 public:
  explicit QuantityReader(LoadContext& ctx) : ctx_(ctx) {}

  template <typename T>
  std::optional<T> read(ObjectReader& r, const std::string& key, bool required, Parsed<T> (*parse)(std::string_view),
                        const std::string& expected, const std::string& forms) {
    const Json* v = required ? r.require(key, expected) : r.member(key);
    if (!v) return std::nullopt;
    if (!v->is_string()) {
      ctx_.error(r.source(), r.at(key), expected, describe(*v), "write the unit: " + forms);
      return std::nullopt;
    }
    auto parsed = parse(v->get<std::string>());
    if (!parsed.value) {
      ctx_.error(r.source(), r.at(key), expected + " (" + parsed.problem + ")", describe(*v), parsed.hint);
      return std::nullopt;
    }
    return parsed.value;
  }

  std::optional<Pressure> pressure(ObjectReader& r, const std::string& key, bool required) {
    auto p = read<Pressure>(r, key, required, &parse_pressure, "a pressure with its unit", std::string(kPressureForms));
    if (!p) return p;
    if (!basis_) {
      basis_ = p->written;
      basis_at_ = r.at(key);
    } else if (*basis_ != p->written) {
      const char* first = *basis_ == PressureBasis::kGauge ? "a gauge" : "an absolute";
      const char* now = p->written == PressureBasis::kGauge ? "a gauge" : "an absolute";
      ctx_.error(r.source(), r.at(key), std::string(first) + " pressure, as at " + basis_at_,
                 std::string(now) + " pressure", kOneBasisHint);
    }
    return p;
  }
  std::optional<Length> length(ObjectReader& r, const std::string& key, bool required) {
    return read<Length>(r, key, required, &parse_length, "a length with its unit", "\"35 m\" or \"115 ft\"");
  }
  std::optional<Density> density(ObjectReader& r, const std::string& key, bool required) {
    return read<Density>(r, key, required, &parse_density, "a density with its unit", "\"1050 kg/m3\"");
  }
  std::optional<VolumeFlow> flow(ObjectReader& r, const std::string& key, bool required) {
    return read<VolumeFlow>(r, key, required, &parse_flow, "a flow with its unit", "\"40 m3/h\"");
  }
  LoadContext& ctx() { return ctx_; }

 private:
  LoadContext& ctx_;
  std::optional<PressureBasis> basis_;
  std::string basis_at_;
};

template <typename Fn>
void each(LoadContext& ctx, ObjectReader& r, const std::string& key, const std::string& what, Fn fn) {
  const Json* v = r.member(key);
  if (!v) return;
  if (!v->is_array()) {
    ctx.error(0, r.at(key), "an array of " + what, describe(*v));
    return;
  }
  for (std::size_t i = 0; i < v->size(); ++i) fn((*v)[i], r.at(key) + "/" + std::to_string(i));
}

void read_curve(QuantityReader& q, ObjectReader& r, PressureSource& s) {
  LoadContext& ctx = q.ctx();
  each(ctx, r, "curve", "curve points {\"flow\", \"head\"}", [&](const Json& v, const std::string& p) {
    ObjectReader c(ctx, v, p, 0, "a curve point");
    auto flow = q.flow(c, "flow", true);
    auto head = q.length(c, "head", true);
    c.finish();
    if (flow && head) s.curve.push_back({*flow, *head});
  });
  if (!r.has("curve") || s.curve.size() != r.member("curve")->size()) return;
  const std::string at = r.at("curve");
  if (s.curve.size() < 2) {
    ctx.error(0, at, "a curve of at least two points, the first at zero flow",
              std::to_string(s.curve.size()) + " point",
              "give the vendor's points from shutoff (0 m3/h) to the end of the curve");
    s.curve.clear();
    return;
  }
  if (s.curve.front().flow.m3_per_hour != 0.0)
    ctx.error(0, at + "/0/flow", "the first point at zero flow (the shutoff head)",
              format_number(s.curve.front().flow.m3_per_hour) + " m3/h",
              "add the shutoff point {\"flow\": \"0 m3/h\", ...}");
  for (std::size_t i = 1; i < s.curve.size(); ++i) {
    const auto& a = s.curve[i - 1];
    const auto& b = s.curve[i];
    const std::string pi = at + "/" + std::to_string(i);
    if (b.flow.m3_per_hour <= a.flow.m3_per_hour)
      ctx.error(0, pi + "/flow", "flows that rise from point to point",
                format_number(b.flow.m3_per_hour) + " m3/h after " + format_number(a.flow.m3_per_hour) + " m3/h",
                "list the points in order of flow");
    else if (b.head.metres > a.head.metres)
      ctx.error(0, pi + "/head", "a head that falls as the flow rises, so that the shutoff head is the highest",
                format_number(b.head.metres) + " m at " + format_number(b.flow.m3_per_hour) + " m3/h above " +
                    format_number(a.head.metres) + " m at " + format_number(a.flow.m3_per_hour) + " m3/h",
                "a curve rising from zero flow is unstable there; state the highest head as the shutoff point");
  }
}

PressureSource read_source(QuantityReader& q, const Json& v, const std::string& p) {
  LoadContext& ctx = q.ctx();
  ObjectReader r(ctx, v, p, 0, "a pressure source");
  PressureSource s;
  s.pointer = p;
  s.id = r.string("id", true).value_or("");
  s.title = r.string("title").value_or("");
  s.status = read_status(r);
  const auto kind = r.choice("kind", {"centrifugal_pump", "fixed"}, true).value_or("fixed");
  s.kind = kind == "centrifugal_pump" ? PressureSource::Kind::kCentrifugalPump : PressureSource::Kind::kFixed;
  s.elevation = q.length(r, "elevation", s.kind == PressureSource::Kind::kCentrifugalPump).value_or(Length{});
  s.density_max = q.density(r, "density_max", s.kind == PressureSource::Kind::kCentrifugalPump);
  if (s.kind == PressureSource::Kind::kFixed) {
    s.pressure = q.pressure(r, "pressure", true).value_or(Pressure{});
  } else {
    s.suction_max = q.pressure(r, "suction_max", true).value_or(Pressure{});
    if (auto ratio = r.number("speed_max_ratio")) {
      if (*ratio < 1.0)
        ctx.error(0, r.at("speed_max_ratio"), "the highest speed over the rated speed, 1 or more",
                  "the number " + format_number(*ratio),
                  "a variable-speed drive's top speed, e.g. 1.05; 1 for fixed speed");
      else
        s.speed_max_ratio = *ratio;
    }
    read_curve(q, r, s);
    s.rated_differential = q.length(r, "rated_differential", false);
    if (auto margin = r.fraction("shutoff_margin")) s.shutoff_margin = *margin;
    const bool curve = r.has("curve"), estimate = r.has("rated_differential");
    if (curve == estimate)
      ctx.error(0, p, "either a vendor \"curve\" or an estimate \"rated_differential\" with \"shutoff_margin\"",
                curve ? "both" : "neither",
                "until the vendor's curve is known, estimate: rated differential + 10-25 %");
    if (estimate && !r.has("shutoff_margin"))
      ctx.error(0, p, "\"shutoff_margin\" with \"rated_differential\"", "no margin",
                "a preliminary shutoff head is commonly the rated differential + 10-25 %, e.g. \"20%\"");
  }
  r.allow({"note"});
  r.finish();
  return s;
}

PressureEquipment read_equipment(QuantityReader& q, const Json& v, const std::string& p, const Project& project) {
  LoadContext& ctx = q.ctx();
  ObjectReader r(ctx, v, p, 0, "an equipment item");
  PressureEquipment e;
  e.pointer = p;
  e.id = r.string("id", true).value_or("");
  e.title = r.string("title").value_or("");
  e.status = read_status(r);
  const bool design = r.has("design_pressure");
  const std::string rating = design && !r.has("mawp") ? "design_pressure" : "mawp";
  auto mawp = q.pressure(r, rating, true);
  if (design && r.has("mawp")) ctx.error(0, r.at("design_pressure"), "\"mawp\" or \"design_pressure\"", "both");
  if (mawp && mawp->bar_gauge <= 0.0)
    ctx.error(0, r.at(rating), "a rating above atmospheric pressure", format_pressure(mawp->bar_gauge),
              "this screening compares gauge pressures with a positive rating");
  e.mawp = mawp.value_or(Pressure{1.0});
  if (r.has("test_pressure") == r.has("test_factor"))
    ctx.error(0, p, "\"test_pressure\" or \"test_factor\"", r.has("test_pressure") ? "both" : "neither",
              "the hydrotest pressure, e.g. \"test_factor\": 1.43 or \"test_pressure\": \"23 barg\"");
  if (auto test = q.pressure(r, "test_pressure", false)) {
    e.test_pressure = *test;
    if (mawp && test->bar_gauge < mawp->bar_gauge)
      ctx.error(0, r.at("test_pressure"),
                "a test pressure at or above the MAWP (" + format_pressure(mawp->bar_gauge) + ")",
                format_pressure(test->bar_gauge), "check the units; the hydrotest is above the rating");
  }
  if (auto factor = r.number("test_factor")) {
    if (*factor < 1.0)
      ctx.error(0, r.at("test_factor"), "a test factor of 1 or more (test pressure at or above the MAWP)",
                "the number " + format_number(*factor), "for example 1.3 or 1.43");
    e.test_pressure = Pressure{e.mawp.bar_gauge * *factor, e.mawp.written};
  }
  e.elevation = q.length(r, "elevation", true).value_or(Length{});
  e.sifs = r.strings("sifs");
  for (std::size_t i = 0; i < e.sifs.size(); ++i) {
    bool known = false;
    for (const auto& sif : project.sifs) known = known || sif.id == e.sifs[i];
    if (!known)
      ctx.error(0, r.at("sifs") + "/" + std::to_string(i), "the id of a SIF in \"sifs\"", "\"" + e.sifs[i] + "\"",
                "define the SIF under \"sifs\"");
  }
  if (e.sifs.size() > 1)
    ctx.error(0, r.at("sifs"), "at most one SIF under assessment per item", std::to_string(e.sifs.size()) + " SIFs",
              "credit the others as \"relief_devices\" or in a written scenario");
  each(ctx, r, "relief_devices", "relief devices", [&](const Json& rv, const std::string& rp) {
    ObjectReader d(ctx, rv, rp, 0, "a relief device");
    PressureEquipment::Relief relief;
    relief.id = d.string("id", true).value_or("");
    relief.title = d.string("title").value_or("");
    relief.pfd = d.probability("pfd", true).value_or(1.0);
    d.allow({"note"});
    d.finish();
    e.relief_devices.push_back(relief);
  });
  r.allow({"note"});
  r.finish();
  return e;
}

void check_band(LoadContext& ctx, ObjectReader& bands, const std::string& key, BandConsequence& out,
                const Project& project) {
  const Json* v = bands.require(key, "the category and severity of the band");
  if (!v) return;
  ObjectReader r(ctx, *v, bands.at(key), 0, "an overpressure band");
  out.category = r.string("category", true).value_or("");
  if (const Json* sev = r.require("severity", "a severity level of the risk criteria")) {
    if (sev->is_number_integer())
      out.severity = std::to_string(sev->get<long long>());
    else if (sev->is_string())
      out.severity = sev->get<std::string>();
    else
      ctx.error(0, r.at("severity"), "a severity level (a number or a string)", describe(*sev));
  }
  r.allow({"note"});
  r.finish();
  if (out.category.empty() || out.severity.empty()) return;
  auto cat = project.risk_criteria.find(out.category);
  if (cat == project.risk_criteria.end() || !cat->second.count(out.severity))
    ctx.error(0, r.pointer(), "a category and severity of \"risk_criteria\"",
              "\"" + out.category + "\" severity \"" + out.severity + "\"",
              "add it to \"risk_criteria\" or use one there");
}

void read_connections(LoadContext& ctx, ObjectReader& r, const std::set<std::string>& ids, PressureSection& section) {
  const std::vector<std::string> known(ids.begin(), ids.end());
  each(ctx, r, "connections", "connections {\"from\", \"to\"}", [&](const Json& v, const std::string& p) {
    ObjectReader c(ctx, v, p, 0, "a connection");
    PressureConnection conn{c.string("from", true).value_or(""), c.string("to", true).value_or(""), p};
    c.allow({"note"});
    c.finish();
    for (const auto* end : {&conn.from, &conn.to}) {
      if (end->empty() || ids.count(*end)) continue;
      const auto near = nearest(*end, known);
      ctx.error(0, c.at(end == &conn.from ? "from" : "to"), "the id of a source or an equipment item of \"pressure\"",
                "\"" + *end + "\"",
                near.empty() ? "add it under \"sources\" or \"equipment\"" : "did you mean \"" + near + "\"?");
    }
    section.connections.push_back(conn);
  });
}

// Looked for only when nothing else is wrong so far.
void check_no_cycle(LoadContext& ctx, const PressureSection& section) {
  if (ctx.problems.empty()) {
    if (auto cycle = connection_cycle(section); !cycle.empty()) {
      std::string text;
      for (const auto& id : cycle) text += (text.empty() ? "" : " -> ") + id;
      ctx.error(0, "/pressure/connections", "connections in the flow direction without a cycle", "the cycle " + text,
                "remove the connection that closes the loop; a recycle is screened from the pump that drives it");
    }
  }
}

void read_bands(LoadContext& ctx, ObjectReader& r, const Project& project, PressureSection& section) {
  if (const Json* b = r.member("consequence_bands")) {
    ObjectReader bands(ctx, *b, "/pressure/consequence_bands", 0, "the overpressure bands");
    ConsequenceBands cb;
    if (auto acc = bands.fraction("accumulation")) cb.accumulation = *acc;
    check_band(ctx, bands, "minor", cb.minor, project);
    check_band(ctx, bands, "leak_possible", cb.leak, project);
    check_band(ctx, bands, "rupture_possible", cb.rupture, project);
    bands.allow({"note"});
    bands.finish();
    section.bands = cb;
  }
}

void read_blocked_outlet(LoadContext& ctx, ObjectReader& r, PressureSection& section) {
  if (const Json* f = r.member("blocked_outlet_frequency")) {
    ObjectReader fr(ctx, *f, "/pressure/blocked_outlet_frequency", 0, "the blocked-outlet frequency");
    BlockedOutletFrequency bo;
    bo.frequency = fr.rate("frequency", true).value_or(Rate{});
    bo.source = fr.string("source", true).value_or("");
    bo.status = read_status(fr);
    fr.allow({"note"});
    fr.finish();
    section.blocked_outlet = bo;
  }
}

void read_section(LoadContext& ctx, const Json& value, Project& project) {
  QuantityReader q(ctx);
  ObjectReader r(ctx, value, "/pressure", 0, "the pressure section");
  if (!r.is_object()) return;
  PressureSection section;
  std::set<std::string> ids;
  auto unique = [&](const std::string& id, const std::string& pointer) {
    if (!id.empty() && !ids.insert(id).second)
      ctx.error(0, pointer + "/id", "an id used once among sources and equipment", "\"" + id + "\" again");
  };
  each(ctx, r, "sources", "pressure sources", [&](const Json& v, const std::string& p) {
    section.sources.push_back(read_source(q, v, p));
    unique(section.sources.back().id, p);
  });
  each(ctx, r, "equipment", "equipment items", [&](const Json& v, const std::string& p) {
    section.equipment.push_back(read_equipment(q, v, p, project));
    unique(section.equipment.back().id, p);
  });
  read_connections(ctx, r, ids, section);
  check_no_cycle(ctx, section);
  read_bands(ctx, r, project, section);
  read_blocked_outlet(ctx, r, section);
  r.allow({"note"});
  r.finish();
  project.pressure = std::move(section);
}

void read_options(LoadContext& ctx, const Json& value, Project& project) {
  QuantityReader q(ctx);
  ObjectReader r(ctx, value, "/options", 0, "the options section");
  if (!r.is_object()) return;
  project.options.discount_rate = r.fraction("discount_rate").value_or(0.0);
  std::set<std::string> ids;
  each(ctx, r, "alternatives", "alternatives", [&](const Json& v, const std::string& p) {
    ObjectReader o(ctx, v, p, 0, "an alternative");
    ScenarioOption opt;
    opt.pointer = p;
    opt.scenario = o.string("scenario", true).value_or("");
    opt.id = o.string("id", true).value_or("");
    opt.title = o.string("title").value_or("");
    const auto kind = o.choice("kind", {"rerate", "relief", "sif", "layer"}, true).value_or("layer");
    opt.kind = kind == "rerate"   ? ScenarioOption::Kind::kRerate
               : kind == "relief" ? ScenarioOption::Kind::kRelief
               : kind == "sif"    ? ScenarioOption::Kind::kSif
                                  : ScenarioOption::Kind::kLayer;
    if (opt.kind == ScenarioOption::Kind::kRerate) opt.new_mawp = q.pressure(o, "new_mawp", true);
    if (opt.kind == ScenarioOption::Kind::kRelief) {
      opt.set_pressure = q.pressure(o, "set_pressure", true);
      opt.receiver = o.string("receiver", true).value_or("");
      opt.receiver_capacity = q.flow(o, "receiver_capacity", true);
    }
    if (opt.kind == ScenarioOption::Kind::kRelief || opt.kind == ScenarioOption::Kind::kLayer) {
      opt.pfd = o.probability("pfd", true).value_or(1.0);
      opt.test_interval = o.duration("test_interval");
    }
    if (opt.kind == ScenarioOption::Kind::kSif) {
      opt.sif = o.string("sif", true).value_or("");
      bool known = false;
      for (const auto& sif : project.sifs) known = known || sif.id == opt.sif;
      if (!opt.sif.empty() && !known)
        ctx.error(0, o.at("sif"), "the id of a SIF in \"sifs\"", "\"" + opt.sif + "\"",
                  "define the SIF under \"sifs\"");
    }
    for (auto [key, field] : {std::pair{"capex", &opt.capex}, std::pair{"annual_cost", &opt.annual_cost},
                              std::pair{"cost_per_test", &opt.cost_per_test},
                              std::pair{"cost_per_spurious_trip", &opt.cost_per_spurious_trip}}) {
      if (auto cost = o.number(key)) {
        if (*cost < 0.0)
          ctx.error(0, o.at(key), "a cost of zero or more", "the number " + format_number(*cost));
        else
          *field = *cost;
      }
    }
    o.allow({"note"});
    o.finish();
    if (!opt.id.empty() && !ids.insert(opt.scenario + "\n" + opt.id).second)
      ctx.error(0, p + "/id", "an alternative id used once per scenario", "\"" + opt.id + "\" again");
    project.options.alternatives.push_back(std::move(opt));
  });
  r.allow({"note"});
  r.finish();
}

}  // namespace

DataStatus read_status(ObjectReader& r) {
  const auto s = r.choice("status", {"estimate", "vendor", "as_built"});
  if (!s || *s == "vendor") return DataStatus::kVendor;
  return *s == "estimate" ? DataStatus::kEstimate : DataStatus::kAsBuilt;
}

void read_pressure(LoadContext& ctx, const Json& root, Project& project) {
  if (auto it = root.find("pressure"); it != root.end()) read_section(ctx, *it, project);
  if (auto it = root.find("options"); it != root.end()) read_options(ctx, *it, project);
}

std::optional<PressureScreening> screen_and_generate(LoadContext& ctx, Project& project) {
  std::optional<PressureScreening> screening;
  if (project.pressure) {
    screening = screen_pressure(*project.pressure);
    auto generated = overpressure_scenarios(*project.pressure, *screening);
    for (auto& s : generated) {
      for (const auto& written : project.scenarios)
        if (written.id == s.id)
          ctx.error(0, written.pointer + "/id", "an id other than that of a generated scenario", "\"" + s.id + "\"",
                    "ids \"OP-<item>-by-<source>\" are kept for the overpressure screening");
      project.scenarios.push_back(std::move(s));
    }
    for (const auto& id : screening->not_reached)
      ctx.warn("/pressure/equipment", "no pressure source reaches " + id + ": it is not screened; add its connections");
    if (!screening->missing.empty()) {
      std::string what;
      for (const auto& m : screening->missing) what += (what.empty() ? "" : " and ") + m;
      ctx.warn("/pressure", "items exceed their MAWP but no overpressure scenario is generated: " + what +
                                (screening->missing.size() > 1 ? " are" : " is") + " missing");
    }
  }
  for (const auto& opt : project.options.alternatives) {
    bool known = false;
    for (const auto& s : project.scenarios) known = known || s.id == opt.scenario;
    if (!known && opt.scenario.rfind("OP-", 0) == 0 && project.pressure) {
      // A generated id that this revision's screening does not generate (the item is within its
      // rating, or not yet): the options wait for it.
      ctx.warn(opt.pointer, "no overpressure scenario " + opt.scenario +
                                " in this revision: the screening did not generate it; option " + opt.id +
                                " is not compared");
    } else if (!opt.scenario.empty() && !known) {
      std::vector<std::string> ids;
      for (const auto& s : project.scenarios) ids.push_back(s.id);
      const auto near = nearest(opt.scenario, ids);
      ctx.error(
          0, opt.pointer + "/scenario", "the id of a scenario, written or generated", "\"" + opt.scenario + "\"",
          near.empty() ? "generated scenarios are named OP-<item>-by-<source>" : "did you mean \"" + near + "\"?");
    }
  }
  return screening;
}

}  // namespace sifter::detail
