// Loading what turns a calculation into a deliverable: prior use, data sources, the SIF's
// safety requirements and the document control.
#include <array>

#include "input/load_parts.hpp"

namespace sifter::detail {
namespace {

// Text fields of people (evidence, notes, names) are bounded so that a hostile file cannot
// make every output huge; 4000 characters hold any real paragraph.
constexpr std::size_t kMaxText = 4000;

std::optional<std::string> bounded_string(ObjectReader& r, const std::string& key, bool required = false) {
  auto s = r.string(key, required);
  if (s && s->size() > kMaxText) {
    r.context().error(r.source(), r.at(key), "a text of at most " + std::to_string(kMaxText) + " characters",
                      std::to_string(s->size()) + " characters", "keep the detail in the referenced document");
    return std::nullopt;
  }
  return s;
}

}  // namespace

std::optional<PriorUse> read_prior_use(ObjectReader& r) {
  const Json* v = r.member("prior_use");
  if (!v) return std::nullopt;
  ObjectReader p(r.context(), *v, r.at("prior_use"), r.source(), "a prior-use claim");
  auto sil = p.integer("sil", 1, 4, true);
  auto evidence = bounded_string(p, "evidence", true);
  p.finish();
  if (!p.is_object() || !sil || !evidence) return std::nullopt;
  if (evidence->find_first_not_of(" \t\r\n") == std::string::npos) {
    r.context().error(r.source(), p.at("evidence"), "the evidence of prior use (operating hours, sites, records)",
                      "an empty text", "IEC 61511-1:2016 11.5.3 asks for evidence of use in a similar environment");
    return std::nullopt;
  }
  return PriorUse{*sil, *evidence};
}

std::optional<DataSource> read_data_source(ObjectReader& r) {
  const Json* v = r.member("data_source");
  if (!v) return std::nullopt;
  if (v->is_string()) {
    auto text = bounded_string(r, "data_source");
    if (!text) return std::nullopt;
    DataSource d;
    d.text = *text;
    return d;
  }
  if (!v->is_object()) {
    r.context().error(r.source(), r.at("data_source"), "a string or {\"kind\", \"document\", \"revision\", \"date\"}",
                      describe(*v));
    return std::nullopt;
  }
  ObjectReader s(r.context(), *v, r.at("data_source"), r.source(), "a data source");
  DataSource d;
  d.kind = s.choice("kind", {"certificate", "fmeda", "handbook", "field", "estimate"}, true).value_or("");
  d.document = bounded_string(s, "document", true).value_or("");
  d.revision = bounded_string(s, "revision").value_or("");
  d.date = bounded_string(s, "date").value_or("");
  s.allow({"note"});
  s.finish();
  if (d.kind.empty()) return std::nullopt;
  return d;
}

std::optional<SifRequirements> read_requirements(ObjectReader& sif) {
  const Json* v = sif.member("requirements");
  if (!v) return std::nullopt;
  LoadContext& ctx = sif.context();
  ObjectReader r(ctx, *v, sif.at("requirements"), 0, "the SIF's requirements");
  SifRequirements q;
  q.pointer = r.pointer();
  q.safe_state = bounded_string(r, "safe_state").value_or("");
  q.trip_setpoint = bounded_string(r, "trip_setpoint").value_or("");
  q.process_safety_time = r.duration("process_safety_time");
  if (q.process_safety_time && !(q.process_safety_time->hours > 0.0)) {
    ctx.error(0, r.at("process_safety_time"), "a positive process safety time", "zero");
    q.process_safety_time.reset();
  }
  if (auto f = r.fraction("response_time_fraction")) {
    if (!(*f > 0.0)) {
      ctx.error(0, r.at("response_time_fraction"), "a fraction above 0 and at most 1", "0",
                "half of the process safety time (0.5) is common practice");
    } else {
      q.response_time_fraction = *f;
      q.response_time_fraction_stated = true;
    }
  }
  q.max_spurious_trip_rate = r.rate("max_spurious_trip_rate");
  if (auto reset = r.choice("reset", {"manual", "automatic"}))
    q.reset = *reset == "manual" ? ResetKind::kManual : ResetKind::kAutomatic;
  q.manual_shutdown = bounded_string(r, "manual_shutdown").value_or("");
  q.bypass = bounded_string(r, "bypass").value_or("");
  q.notes = bounded_string(r, "notes").value_or("");
  q.proof_test_interval = r.duration("proof_test_interval");
  if (q.proof_test_interval && !(q.proof_test_interval->hours > 0.0)) {
    ctx.error(0, r.at("proof_test_interval"), "a positive proof-test interval", "zero");
    q.proof_test_interval.reset();
  }
  q.proof_test_coverage = bounded_string(r, "proof_test_coverage").value_or("");
  q.energize_to_trip = bounded_string(r, "energize_to_trip").value_or("");
  q.action = bounded_string(r, "action").value_or("");
  q.functional_relation = bounded_string(r, "functional_relation").value_or("");
  q.fault_response = bounded_string(r, "fault_response").value_or("");
  q.startup_restart = bounded_string(r, "startup_restart").value_or("");
  q.interfaces = bounded_string(r, "interfaces").value_or("");
  q.environment = bounded_string(r, "environment").value_or("");
  q.operating_modes = bounded_string(r, "operating_modes").value_or("");
  r.finish();
  if (!r.is_object()) return std::nullopt;
  return q;
}

std::optional<DocumentControl> read_document(ObjectReader& top) {
  const Json* v = top.member("document");
  if (!v) return std::nullopt;
  LoadContext& ctx = top.context();
  ObjectReader r(ctx, *v, "/document", 0, "the document control");
  DocumentControl d;
  d.number = bounded_string(r, "number", true).value_or("");
  d.revision = bounded_string(r, "revision", true).value_or("");
  d.date = bounded_string(r, "date").value_or("");
  d.prepared_by = bounded_string(r, "prepared_by").value_or("");
  d.checked_by = bounded_string(r, "checked_by").value_or("");
  d.approved_by = bounded_string(r, "approved_by").value_or("");
  if (const Json* h = r.member("history")) {
    if (!h->is_array()) {
      ctx.error(0, "/document/history", "an array of {\"revision\", \"date\", \"by\", \"description\"}", describe(*h));
    } else {
      for (std::size_t i = 0; i < h->size(); ++i) {
        ObjectReader e(ctx, (*h)[i], "/document/history/" + std::to_string(i), 0, "a revision");
        DocumentRevision rev;
        rev.revision = bounded_string(e, "revision", true).value_or("");
        rev.date = bounded_string(e, "date").value_or("");
        rev.by = bounded_string(e, "by").value_or("");
        rev.description = bounded_string(e, "description").value_or("");
        e.finish();
        d.history.push_back(std::move(rev));
      }
    }
  }
  r.finish();
  if (!r.is_object()) return std::nullopt;
  return d;
}

}  // namespace sifter::detail
