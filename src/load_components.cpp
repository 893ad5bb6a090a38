// Loading components and library models, with the two ways of writing failure rates.
#include <cmath>
#include <map>
#include <set>

#include "sifter/detail/load_parts.hpp"
#include "sifter/detail/load_pressure.hpp"
#include "sifter/json_source.hpp"
#include "sifter/uncertainty.hpp"

namespace sifter::detail {
namespace {

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
  std::optional<std::string> data_source;

  [[nodiscard]] bool has_split_form() const { return lambda_du || lambda_dd || lambda_su || lambda_sd; }
  [[nodiscard]] bool has_total_form() const { return lambda_d || dc || lambda_s; }
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
  e.data_source = r.string("data_source");
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

}  // namespace

void check_model_entry(LoadContext& ctx, const Json& entry, int source, const std::string& pointer) {
  ObjectReader r(ctx, entry, pointer, source, "a library model");
  r.string("id", true);
  r.allow({"source"});
  allow_descriptive(r);
  read_element_fields(r);
  r.finish();
}

void read_components(LoadContext& ctx, const Json& root, const ModelIndex& models, Project& project) {
  auto it = root.find("components");
  if (it == root.end()) return;
  if (!it->is_array()) {
    ctx.error(0, "/components", "an array of components", describe(*it));
    return;
  }
  std::set<std::string> seen;
  // A model's fields are read once, however many components use it (a register names the same
  // few models thousands of times).
  std::map<std::string, ElementFields> model_fields;
  auto fields_of = [&](const ModelEntry& entry, const std::string& id) -> const ElementFields& {
    auto [cached, inserted] = model_fields.try_emplace(id);
    if (inserted) {
      LoadContext scratch;  // the model was checked in its own file already; its problems are not repeated
      ObjectReader mr(scratch, entry.fields, entry.pointer, entry.source, "a library model");
      mr.allow({"id", "source", "title", "note", "manufacturer", "tag_description"});
      cached->second = read_element_fields(mr);
    }
    return cached->second;
  };
  for (std::size_t i = 0; i < it->size(); ++i) {
    const std::string pointer = "/components/" + std::to_string(i);
    ObjectReader r(ctx, (*it)[i], pointer, 0, "a component");
    Component c;
    c.pointer = pointer;
    c.id = r.string("id", true).value_or("");
    c.model = r.string("model").value_or("");
    allow_descriptive(r);
    ElementFields own = read_element_fields(r);
    c.status = read_status(r);
    r.finish();
    if (!c.id.empty() && !seen.insert(c.id).second)
      ctx.error(0, r.at("id"), "a component id used once", "\"" + c.id + "\" a second time",
                "give every component its own tag");
    ElementFields fields = own;
    if (!c.model.empty()) {
      auto m = models.find(c.model);
      if (m == models.end()) {
        std::vector<std::string> names;
        for (const auto& [name, _] : models) names.push_back(name);
        const auto near = nearest(c.model, names);
        ctx.error(0, r.at("model"), "the id of a model in the libraries", "\"" + c.model + "\"",
                  near.empty() ? "add the library that holds it to \"libraries\"" : "did you mean \"" + near + "\"?");
      } else {
        fields = merge(fields_of(m->second, m->first), own);
      }
    }
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
    c.data_source = fields.data_source.value_or("");
    warn_implausible(ctx, pointer, c.rates);
    project.components.push_back(std::move(c));
  }
}

}  // namespace sifter::detail
