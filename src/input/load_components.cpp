// Loading components and library models, with the two ways of writing failure rates.
#include <cmath>
#include <cstdio>
#include <map>
#include <memory>
#include <set>
#include <unordered_set>

#include "input/load_parts.hpp"
#include "input/load_pressure.hpp"
#include "sifter/input/json_source.hpp"
#include "sifter/model/civil_date.hpp"
#include "sifter/model/format.hpp"

namespace sifter::detail {
namespace {

// A declared SFF may round the rates' own figure; a larger gap means one of them is wrong.
constexpr double kSffAgreement = 0.01;
constexpr double kMaxRatePerHour = 1e5;

// What one JSON object says about an element; absent fields stay empty so that a component
// can override its library model field by field.
struct ElementFields {
  std::optional<Rate> lambda_du, lambda_dd, lambda_su, lambda_sd, lambda_d, lambda_s;
  std::optional<double> dc;
  std::optional<ElementType> element_type;
  std::optional<int> systematic_capability;
  std::optional<double> sff;
  std::optional<double> data_confidence;
  std::optional<RateUncertainty> uncertainty;
  std::optional<FieldData> field_data;
  std::shared_ptr<const DataSource> data_source;  ///< shared: a model's components copy only the pointer
  std::optional<PriorUse> prior_use;
  std::optional<Duration> response_time;

  [[nodiscard]] bool has_split_form() const { return lambda_du || lambda_dd || lambda_su || lambda_sd; }
  [[nodiscard]] bool has_total_form() const { return lambda_d || dc || lambda_s; }
  /// Some dangerous failure rate is stated (IEC 61508-6 needs lambda_D to compute anything).
  [[nodiscard]] bool has_dangerous() const { return lambda_du || lambda_dd || lambda_d || field_data; }
  /// The safe rates are stated too, so that the rates alone give the SFF.
  [[nodiscard]] bool has_safe() const { return lambda_su || lambda_sd || lambda_s; }
};

std::optional<RateUncertainty> read_uncertainty(ObjectReader& r) {
  const Json* v = r.member("uncertainty");
  if (!v) return std::nullopt;
  ObjectReader u(r.context(), *v, r.at("uncertainty"), r.source(), "an uncertainty");
  auto ef = u.number("error_factor", true);
  u.allow({"note"});
  u.finish();
  if (!ef) return std::nullopt;
  if (*ef < 1.0 || *ef > 100.0) {
    r.context().error(r.source(), u.at("error_factor"), "an error factor from 1 to 100 (95th / 50th percentile)",
                      "the number " + Json(*ef).dump(), "typical failure data have error factors of 2 to 10");
    return std::nullopt;
  }
  return RateUncertainty{*ef};
}

std::optional<FieldData> read_field_data(ObjectReader& r) {
  const Json* v = r.member("field_data");
  if (!v) return std::nullopt;
  ObjectReader f(r.context(), *v, r.at("field_data"), r.source(), "field data");
  auto failures = f.integer("failures", 0, 1000000, true);
  auto hours = f.duration("device_hours", true);
  auto confidence = f.number("confidence");
  f.allow({"note", "data_source"});
  f.finish();
  if (confidence && (*confidence <= 0.0 || *confidence >= 1.0)) {
    r.context().error(r.source(), f.at("confidence"), "a confidence strictly between 0 and 1",
                      "the number " + Json(*confidence).dump(), "Route 2H asks for at least 0.7");
    confidence.reset();
    return std::nullopt;
  }
  if (!failures || !hours) return std::nullopt;
  if (hours->hours <= 0.0) {
    r.context().error(r.source(), f.at("device_hours"), "a positive number of device hours", "zero");
    return std::nullopt;
  }
  return FieldData{*failures, *hours, confidence.value_or(0.7)};
}

ElementFields read_element_fields(ObjectReader& r) {
  ElementFields e;
  e.lambda_du = r.rate("lambda_du");
  e.lambda_dd = r.rate("lambda_dd");
  e.lambda_su = r.rate("lambda_su");
  e.lambda_sd = r.rate("lambda_sd");
  e.lambda_d = r.rate("lambda_d");
  e.lambda_s = r.rate("lambda_s");
  e.dc = r.fraction("dc");
  if (auto t = r.choice("element_type", {"A", "B"})) e.element_type = *t == "A" ? ElementType::kA : ElementType::kB;
  e.systematic_capability = r.integer("systematic_capability", 1, 4);
  e.sff = r.fraction("sff");
  if (const Json* v = r.member("data_confidence")) {
    if (!v->is_number() || !(v->get<double>() > 0.0) || !(v->get<double>() < 1.0))
      r.context().error(r.source(), r.at("data_confidence"), "a confidence strictly between 0 and 1", describe(*v),
                        "Route 2H asks for failure data at 0.7 confidence or more");
    else
      e.data_confidence = v->get<double>();
  }
  e.uncertainty = read_uncertainty(r);
  e.field_data = read_field_data(r);
  if (auto source = read_data_source(r)) e.data_source = std::make_shared<const DataSource>(std::move(*source));
  e.prior_use = read_prior_use(r);
  e.response_time = r.duration("response_time");
  if (e.has_split_form() && e.has_total_form())
    r.context().error(r.source(), r.pointer(),
                      "rates either as lambda_du/lambda_dd/lambda_su/lambda_sd or as lambda_d with dc (and lambda_s)",
                      "both forms", "keep one form; lambda_d with dc splits into lambda_dd = dc x lambda_d");
  if (e.lambda_d && !e.dc)
    r.context().error(r.source(), r.at("lambda_d"), "\"dc\" beside \"lambda_d\"", "no diagnostic coverage",
                      "write \"dc\": 0 if the element has no diagnostics");
  if (e.dc && !e.lambda_d)
    r.context().error(r.source(), r.at("dc"), "\"lambda_d\" beside \"dc\"", "no dangerous failure rate");
  return e;
}

// The component's own fields win; a different rate form replaces the model's form whole.
ElementFields merge(const ElementFields& model, const ElementFields& own) {
  ElementFields m = model;
  if (own.has_split_form() || own.has_total_form()) {
    if (own.has_split_form() && model.has_total_form()) m.lambda_d = m.lambda_s = std::nullopt, m.dc = std::nullopt;
    if (own.has_total_form() && model.has_split_form())
      m.lambda_du = m.lambda_dd = m.lambda_su = m.lambda_sd = std::nullopt;
  }
  auto take = [](auto& into, const auto& from) {
    if (from) into = from;
  };
  take(m.lambda_du, own.lambda_du);
  take(m.lambda_dd, own.lambda_dd);
  take(m.lambda_su, own.lambda_su);
  take(m.lambda_sd, own.lambda_sd);
  take(m.lambda_d, own.lambda_d);
  take(m.lambda_s, own.lambda_s);
  take(m.dc, own.dc);
  take(m.element_type, own.element_type);
  take(m.systematic_capability, own.systematic_capability);
  take(m.sff, own.sff);
  take(m.data_confidence, own.data_confidence);
  take(m.uncertainty, own.uncertainty);
  take(m.field_data, own.field_data);
  take(m.data_source, own.data_source);
  take(m.prior_use, own.prior_use);
  take(m.response_time, own.response_time);
  return m;
}

FailureRates resolve_rates(const ElementFields& e) {
  FailureRates r;
  if (e.lambda_d) {
    const double dc = e.dc.value_or(0.0);
    r.lambda_dd.per_hour = dc * e.lambda_d->per_hour;
    r.lambda_du.per_hour = (1.0 - dc) * e.lambda_d->per_hour;
    r.lambda_su = e.lambda_s.value_or(Rate{});
    return r;
  }
  r.lambda_du = e.lambda_du.value_or(Rate{});
  r.lambda_dd = e.lambda_dd.value_or(Rate{});
  r.lambda_su = e.lambda_su.value_or(Rate{});
  r.lambda_sd = e.lambda_sd.value_or(Rate{});
  return r;
}

void allow_descriptive(ObjectReader& r) { r.allow({"title", "note", "manufacturer", "tag_description"}); }

void warn_implausible(LoadContext& ctx, const std::string& pointer, const FailureRates& rates) {
  const std::pair<const char*, double> named[] = {{"lambda_du", rates.lambda_du.per_hour},
                                                  {"lambda_dd", rates.lambda_dd.per_hour},
                                                  {"lambda_su", rates.lambda_su.per_hour},
                                                  {"lambda_sd", rates.lambda_sd.per_hour}};
  for (const auto& [name, v] : named) {
    // Common practice: field-device rates lie within about 1e-10..1e-3 per hour.
    if (v > 0.0 && (v < 1e-10 || v > 1e-3))
      ctx.warn(pointer, std::string(name) + " = " + format_rate(Rate{v}) +
                            " lies outside the usual 1e-10..1e-3 per hour; check the unit");
  }
}

// A component must state how it fails dangerously: without it the SIF would count it as never
// failing (PFD 0). A declared SFF must agree with the component's own rates when those rates
// give one (IEC 61508-2:2010 7.4.4.2.2 / Annex C defines SFF from the rates; seen).
void check_failure_behaviour(LoadContext& ctx, ObjectReader& r, const Component& c, const ElementFields& fields,
                             bool model_found) {
  // A rate written but refused, or an unknown model, is reported already: not twice.
  const bool written = r.has("lambda_du") || r.has("lambda_dd") || r.has("lambda_d") || r.has("field_data");
  if (!fields.has_dangerous() && (written || !model_found)) return;
  if (!fields.has_dangerous()) {
    ctx.error(0, r.pointer(),
              "the component's dangerous failure rates (\"lambda_du\" and \"lambda_dd\", \"lambda_d\" with \"dc\", "
              "or \"field_data\")",
              c.model.empty() ? "none" : "none, here or in model \"" + c.model + "\"",
              "copy them from the safety manual; a device without rates would count as never failing");
    return;
  }
  // Far above any device (field devices lie within about 1e-10..1e-3/h, common practice; those
  // outside are warned below) the engines' arithmetic leaves its range: 1e30/h made the exact
  // engine answer 0. 1e5/h (a failure every 36 ms) bounds the rates any unit can express.
  const std::pair<const char*, double> named[] = {{"lambda_du", c.rates.lambda_du.per_hour},
                                                  {"lambda_dd", c.rates.lambda_dd.per_hour},
                                                  {"lambda_su", c.rates.lambda_su.per_hour},
                                                  {"lambda_sd", c.rates.lambda_sd.per_hour}};
  for (const auto& [name, v] : named)
    if (v > kMaxRatePerHour) {
      ctx.error(0, r.pointer(), "failure rates of at most 1e5/h", std::string(name) + " = " + format_rate(Rate{v}),
                "check the unit: 1 FIT is 1e-9/h; field devices lie within about 1e-10..1e-3/h");
      return;
    }
  if (!fields.sff || !fields.has_safe()) return;  // declared SFF alone: used as declared
  // The SFF of the stated rates: field data re-estimate lambda_du, not the design's SFF.
  const FailureRates stated = resolve_rates(fields);
  const double total = stated.lambda_d() + stated.lambda_s();
  if (!(total > 0.0)) return;
  const double from_rates = (stated.lambda_s() + stated.lambda_dd.per_hour) / total;
  if (std::fabs(from_rates - *fields.sff) > kSffAgreement)
    ctx.error(0, r.has("sff") ? r.at("sff") : r.pointer(),
              "a declared SFF within 1 percentage point of the SFF of the component's own rates (" +
                  sifter::percent(from_rates) + ")",
              "a declared SFF of " + sifter::percent(*fields.sff),
              "correct the rates or the SFF; drop \"sff\" to use the rates' own figure");
}

void unknown_model(LoadContext& ctx, ObjectReader& r, const std::string& model, const ModelIndex& models) {
  std::vector<std::string> names;
  for (const auto& [name, _] : models) names.push_back(name);
  const auto near = nearest(model, names);
  ctx.error(0, r.at("model"), "the id of a model in the libraries", "\"" + model + "\"",
            near.empty() ? "add the library that holds it to \"libraries\"" : "did you mean \"" + near + "\"?");
}

// A model's fields are read once, however many components use it (a register names the same
// few models thousands of times).
class ModelFieldsCache {
 public:
  const ElementFields& of(const ModelEntry& entry, const std::string& id) {
    auto [cached, inserted] = fields_.try_emplace(id);
    if (inserted) {
      LoadContext scratch;  // the model was checked in its own file already; its problems are not repeated
      ObjectReader mr(scratch, entry.fields, entry.pointer, entry.source, "a library model");
      mr.allow({"id", "source", "title", "note", "manufacturer", "tag_description"});
      cached->second = read_element_fields(mr);
    }
    return cached->second;
  }

 private:
  std::map<std::string, ElementFields> fields_;
};

void read_in_service_since(LoadContext& ctx, ObjectReader& r, Component& c) {
  if (auto since = r.string("in_service_since")) {  // for the in-service records
    if (parse_iso_date(*since))
      c.in_service_since = *since;
    else
      ctx.error(0, r.at("in_service_since"), "a date written YYYY-MM-DD (ISO 8601)", "\"" + *since + "\"",
                "a real calendar day between 1900 and 2999, e.g. 2024-02-29");
  }
}

// Gives the component what its fields (its own over its model's) say.
void take_fields(Component& c, ElementFields& fields) {
  c.rates = resolve_rates(fields);
  if (fields.field_data) {
    // Field experience replaces the stated lambda_du by its one-sided upper confidence bound.
    c.rates.lambda_du = lambda_du_from_field_data(*fields.field_data);
    if (!fields.data_confidence) fields.data_confidence = fields.field_data->confidence;
  }
  c.element_type = fields.element_type;
  c.systematic_capability = fields.systematic_capability;
  c.sff_declared = fields.sff;
  c.data_confidence = fields.data_confidence;
  c.uncertainty = fields.uncertainty;
  c.field_data = fields.field_data;
  c.source = fields.data_source;
  c.prior_use = fields.prior_use;
  c.response_time = fields.response_time;
}

void read_component(LoadContext& ctx, const Json& value, const std::string& pointer, const ModelIndex& models,
                    ModelFieldsCache& model_fields, std::unordered_set<std::string>& seen, Project& project) {
  ObjectReader r(ctx, value, pointer, 0, "a component");
  Component c;
  c.pointer = pointer;
  c.id = r.string("id", true).value_or("");
  if (r.has("id") && c.id.empty() && r.member("id")->is_string())
    ctx.error(0, r.at("id"), "a component id that is not empty", "\"\"", "use the device's tag, e.g. \"PT-101A\"");
  c.model = r.string("model").value_or("");
  read_in_service_since(ctx, r, c);
  if (const Json* made = r.member("manufacturer"); made && made->is_string()) c.manufacturer = made->get<std::string>();
  allow_descriptive(r);
  ElementFields own = read_element_fields(r);
  c.status = read_status(r);
  r.finish();
  if (!c.id.empty() && !seen.insert(c.id).second)
    ctx.error(0, r.at("id"), "a component id used once", "\"" + c.id + "\" a second time",
              "give every component its own tag");
  ElementFields fields = own;
  const auto m = c.model.empty() ? models.end() : models.find(c.model);
  if (!c.model.empty() && m == models.end()) {
    if (ctx.libraries_failed())
      ++ctx.follow_ons_suppressed;  // the library that should hold it was reported already
    else
      unknown_model(ctx, r, c.model, models);
  }
  if (m != models.end()) {
    fields = merge(model_fields.of(m->second, m->first), own);
    const auto made = m->second.fields.find("manufacturer");
    if (c.manufacturer.empty() && made != m->second.fields.end() && made->is_string())
      c.manufacturer = made->get<std::string>();
  }
  take_fields(c, fields);
  check_failure_behaviour(ctx, r, c, fields, c.model.empty() || m != models.end());
  c.dangerous_rates_stated = fields.has_dangerous();
  warn_implausible(ctx, pointer, c.rates);
  project.components.push_back(std::move(c));
}

}  // namespace

void check_model_entry(LoadContext& ctx, const Json& entry, int source, const std::string& pointer) {
  ObjectReader r(ctx, entry, pointer, source, "a library model");
  r.string("id", true);
  r.allow({"source"});
  allow_descriptive(r);
  read_element_fields(r);
  r.finish();
}

void read_components(LoadContext& ctx, Json& root, const ModelIndex& models, Project& project) {
  auto it = root.find("components");
  if (it == root.end()) return;
  if (!it->is_array()) {
    ctx.error(0, "/components", "an array of components", describe(*it));
    return;
  }
  std::unordered_set<std::string> seen;
  ModelFieldsCache model_fields;
  project.components.reserve(project.components.size() + it->size());
  for (std::size_t i = 0; i < it->size(); ++i) {
    read_component(ctx, section_item(ctx, "components", *it, i), "/components/" + std::to_string(i), models,
                   model_fields, seen, project);
    (*it)[i] = nullptr;  // its JSON is freed while still in cache, and its memory serves the next component
  }
}

}  // namespace sifter::detail
