// The sifter-results/1 JSON writer: every number finite, absent values as null.
#include "sifter/report/json_results.hpp"

#include <algorithm>
#include <array>
#include <future>
#include <ostream>
#include <streambuf>
#include <string>

#include "sifter/model/cores.hpp"
#include "sifter/model/format.hpp"
#include "sifter/report/json_stream.hpp"

namespace sifter::report {
namespace {

using nlohmann::json;

// Builds a nlohmann tree through the same calls as JsonStream, so that the tree (what-if
// commands, tests) and the stream (`check --json`) come from one list of keys.
class TreeSink {
 public:
  explicit TreeSink(json& root) { stack_.push_back(&root); }
  TreeSink& begin_object() { return open(json::object()); }
  TreeSink& begin_array() { return open(json::array()); }
  TreeSink& end_object() { return close(); }
  TreeSink& end_array() { return close(); }
  TreeSink& key(std::string_view name) {
    key_ = name;
    return *this;
  }
  template <typename T>
  TreeSink& value(const T& v) {
    return put(json(v));
  }
  TreeSink& value(std::string_view v) { return put(json(std::string(v))); }
  TreeSink& value(const std::vector<SharedText>& texts) {
    json list = json::array();
    for (const auto& t : texts) list.push_back(t.str());
    return put(std::move(list));
  }
  TreeSink& value(const std::optional<int>& v) { return put(v ? json(*v) : json(nullptr)); }
  TreeSink& value(const std::optional<bool>& v) { return put(v ? json(*v) : json(nullptr)); }
  TreeSink& number(double v, const char* what = "number") { return put(json(checked(v, what))); }
  TreeSink& number(const std::optional<double>& v, const char* what) { return v ? number(*v, what) : null(); }
  TreeSink& null() { return put(json(nullptr)); }

 private:
  TreeSink& open(json empty) {
    json* slot = place(std::move(empty));
    stack_.push_back(slot);
    return *this;
  }
  TreeSink& close() {
    stack_.pop_back();
    return *this;
  }
  TreeSink& put(json v) {
    place(std::move(v));
    return *this;
  }
  json* place(json v) {
    json& top = *stack_.back();
    if (stack_.size() == 1 && top.is_null()) {  // the root itself
      top = std::move(v);
      return &top;
    }
    if (top.is_array()) {
      top.push_back(std::move(v));
      return &top.back();
    }
    json& slot = top[key_];
    slot = std::move(v);
    return &slot;
  }
  std::vector<json*> stack_;
  std::string key_;
};

template <typename W>
void emit_subsystem(W& w, const SubsystemResult& s) {
  w.begin_object();
  w.key("name").value(s.name);
  if (s.template_name.empty())
    w.key("template").null();
  else
    w.key("template").value(s.template_name);
  w.key("role").value(to_string(s.role));
  w.key("vote").value(s.vote);
  w.key("channels").begin_array();
  for (const auto& channel : s.channels) w.value(channel);
  w.end_array();
  w.key("pfd_avg").number(s.pfd_avg, "pfd_avg");
  w.key("pfh").number(s.pfh_per_hour, "pfh");
  w.key("share").number(s.share, "share");
  w.key("terms").begin_object();
  w.key("independent_undetected").number(s.independent_undetected, "term");
  w.key("independent_detected").number(s.independent_detected, "term");
  w.key("common_cause").number(s.common_cause, "term");
  w.end_object();
  w.key("beta_effective").number(s.beta_effective, "beta_effective");
  w.key("beta_d_effective").number(s.beta_d_effective, "beta_d_effective");
  w.key("equation").value(s.equation);
  w.key("hft").value(s.hft);
  w.key("sff").number(s.sff, "sff");
  w.key("sil_architecture").value(s.sil_architecture);
  w.key("systematic_capability").value(s.systematic_capability);
  w.key("constraint_notes").value(s.constraint_notes);
  w.key("pfd_avg_exact").number(s.pfd_avg_exact, "pfd_avg_exact");
  w.key("pfh_exact").number(s.pfh_exact_per_hour, "pfh_exact");
  w.key("spurious_trip_rate_per_yr").number(s.spurious_trip_rate_per_yr, "spurious trip rate");
  w.key("mttf_spurious_yr").number(s.mttf_spurious_yr, "mttf_spurious_yr");
  w.key("pfd_avg_simplified").number(s.pfd_avg_simplified, "pfd_avg_simplified");
  w.key("pfh_simplified").number(s.pfh_simplified_per_hour, "pfh_simplified");
  w.key("pfd_avg_judged").number(s.pfd_avg, "pfd_avg_judged");
  w.key("pfh_judged").number(s.pfh_per_hour, "pfh_judged");
  w.key("judged_on").value(to_string(s.judged_on));
  w.key("test_duration_term").number(s.test_duration_term, "test duration term");
  w.key("systematic_basis").begin_array();
  for (const auto& e : s.systematic_basis) {
    w.begin_object();
    w.key("component").value(e.component);
    w.key("basis").value(to_string(e.basis));
    w.key("sil").value(e.sil);
    w.key("evidence").value(e.evidence);
    w.end_object();
  }
  w.end_array();
  w.end_object();
}

template <typename W>
void emit_consequences(W& w, const ScenarioResult& s) {
  w.key("consequences").begin_array();
  for (const auto& c : s.consequences) {
    w.begin_object();
    w.key("category").value(c.category);
    w.key("severity").value(c.severity);
    w.key("target_frequency_per_yr").number(c.target_frequency_per_yr, "target");
    w.key("modifier_product").number(c.modifier_product, "modifiers");
    w.key("frequency_without_sif_per_yr").number(c.frequency_without_sif_per_yr, "frequency");
    w.key("required_pfd").number(c.required_pfd, "required_pfd");
    w.key("required_rrf").number(c.required_rrf, "required_rrf");
    w.key("required_sil").value(c.required_sil);
    w.key("required_pfh").number(c.required_pfh_per_hour, "required_pfh");
    w.key("mitigated_frequency_per_yr").number(c.mitigated_frequency_per_yr, "mitigated");
    w.key("meets_target").value(c.meets_target);
    w.end_object();
  }
  w.end_array();
}

template <typename W>
void emit_scenario(W& w, const ScenarioResult& s) {
  w.begin_object();
  w.key("id").value(s.id);
  w.key("title").value(s.title);
  if (s.sif)
    w.key("sif").value(*s.sif);
  else
    w.key("sif").null();
  w.key("target_frequency_per_yr").number(s.target_frequency_per_yr, "target frequency");
  w.key("frequency_without_sif_per_yr").number(s.frequency_without_sif_per_yr, "frequency");
  w.key("required_pfd").number(s.required_pfd, "required_pfd");
  w.key("required_rrf").number(s.required_rrf, "required_rrf");
  w.key("required_sil").value(s.required_sil);
  // Without a SIF the demand is the one on the first layer: the causes with their enabling conditions.
  double demand = 0.0;
  for (const auto& c : s.causes) demand += c.frequency_per_yr * c.enabling_product;
  w.key("demand_rate_per_yr").number(s.demand_rate_per_yr.value_or(demand), "demand rate");
  w.key("demand_mode").value(to_string(s.demand_mode.value_or(demand > 1.0 ? DemandMode::kHigh : DemandMode::kLow)));
  w.key("required_pfh").number(s.required_pfh_per_hour, "required_pfh");
  w.key("mitigated_frequency_per_yr").number(s.mitigated_frequency_per_yr, "mitigated frequency");
  w.key("meets_target").value(s.meets_target);
  emit_consequences(w, s);
  w.key("causes").begin_array();
  for (const auto& c : s.causes) {
    w.begin_object();
    w.key("id").value(c.id);
    w.key("frequency_per_yr").number(c.frequency_per_yr, "frequency");
    w.key("enabling_product").number(c.enabling_product, "enabling");
    w.key("demand_rate_per_yr").number(c.demand_rate_per_yr, "demand");
    w.key("frequency_without_sif_per_yr").number(c.frequency_without_sif_per_yr, "frequency");
    w.key("sif_credited").value(c.sif_credited);
    w.end_object();
  }
  w.end_array();
  w.key("findings").begin_array();
  for (const auto& f : s.findings) {
    w.begin_object();
    w.key("kind").value(to_string(f.kind));
    w.key("message").value(f.message);
    w.end_object();
  }
  w.end_array();
  w.key("assumptions").value(s.assumptions);
  w.key("sif_credit_pfd").number(s.sif_credit_pfd, "sif_credit_pfd");
  w.key("sif_credit_capped").value(s.sif_credit_capped);
  w.key("generated").value(s.generated);
  w.key("preliminary").value(s.preliminary);
  w.key("preliminary_because").value(s.preliminary_because);
  w.end_object();
}

template <typename W>
void emit_limits(W& w, const SifResult& s) {
  w.key("limits").begin_array();
  for (const auto& l : s.limits) {
    w.begin_object();
    w.key("kind").value(l.kind);
    if (l.subsystem)
      w.key("subsystem").value(*l.subsystem);
    else
      w.key("subsystem").null();
    if (l.element)
      w.key("element").value(*l.element);
    else
      w.key("element").null();
    w.key("sil").value(l.sil);
    w.key("message").value(l.message);
    w.end_object();
  }
  w.end_array();
}

template <typename W>
void emit_uncertainty(W& w, const SifResult& s) {
  if (s.uncertainty) {
    const auto& u = *s.uncertainty;
    w.key("uncertainty").begin_object();
    w.key("mean").number(u.mean, "mean");
    w.key("p05").number(u.p05, "p05");
    w.key("p50").number(u.p50, "p50");
    w.key("p95").number(u.p95, "p95");
    w.key("probability_meets_target").number(u.probability_meets_target, "probability");
    w.key("samples").value(u.samples);
    w.key("method").value(u.method);
    w.end_object();
  } else {
    w.key("uncertainty").null();
  }
}

template <typename W>
void emit_requirement_checks(W& w, const SifResult& s) {
  w.key("requirement_checks").begin_array();
  for (const auto& c : s.requirement_checks) {
    w.begin_object();
    w.key("check").value(c.check);
    w.key("ok").value(c.ok);
    w.key("value").number(c.value, "requirement value");
    w.key("limit").number(c.limit, "requirement limit");
    w.key("message").value(c.message);
    w.end_object();
  }
  w.end_array();
}

template <typename W>
void emit_sif(W& w, const SifResult& s) {
  w.begin_object();
  w.key("id").value(s.id);
  w.key("title").value(s.title);
  w.key("demand_mode").value(to_string(s.demand_mode));
  w.key("warnings").value(s.warnings);  // also in the project's "warnings"
  w.key("demand_mode_basis").value(s.demand_mode_basis);
  w.key("pfd_avg").number(s.pfd_avg, "pfd_avg");
  w.key("pfh").number(s.pfh_per_hour, "pfh");
  w.key("rrf").number(s.rrf, "rrf");
  w.key("sil_probability").value(s.sil_probability);
  w.key("sil_required").value(s.sil_required);
  w.key("required_rrf").number(s.required_rrf, "required_rrf");
  w.key("required_pfd").number(s.required_pfd, "required_pfd");
  w.key("required_pfh").number(s.required_pfh_per_hour, "required_pfh");
  w.key("target").value(s.target_text);
  w.key("meets_target").value(s.meets_target);
  w.key("sil_architecture").value(s.sil_architecture);
  w.key("sil_systematic").value(s.sil_systematic);
  w.key("sil_achieved").value(s.sil_achieved);
  w.key("constraints").value(to_string(s.constraints));
  emit_limits(w, s);
  w.key("subsystems").begin_array();
  for (const auto& sub : s.subsystems) emit_subsystem(w, sub);
  w.end_array();
  w.key("assumptions").value(s.assumptions);
  w.key("scenarios").value(s.scenarios);
  w.key("pfd_avg_exact").number(s.pfd_avg_exact, "pfd_avg_exact");
  w.key("pfh_exact").number(s.pfh_exact_per_hour, "pfh_exact");
  w.key("simplified_over_exact").number(s.simplified_over_exact, "ratio");
  w.key("spurious_trip_rate_per_yr").number(s.spurious_trip_rate_per_yr, "spurious trip rate");
  w.key("mttf_spurious_yr").number(s.mttf_spurious_yr, "mttf_spurious_yr");
  emit_uncertainty(w, s);
  w.key("response_time_s").number(s.response_time_s, "response_time_s");
  w.key("response_time_limit_s").number(s.response_time_limit_s, "response_time_limit_s");
  emit_requirement_checks(w, s);
  w.key("pfd_avg_simplified").number(s.pfd_avg_simplified, "pfd_avg_simplified");
  w.key("pfh_simplified").number(s.pfh_simplified_per_hour, "pfh_simplified");
  w.key("pfd_avg_judged").number(s.pfd_avg, "pfd_avg_judged");
  w.key("pfh_judged").number(s.pfh_per_hour, "pfh_judged");
  if (s.pfd_avg || s.pfh_per_hour)
    w.key("judged_on").value(to_string(s.judged_on));
  else
    w.key("judged_on").null();
  w.key("judged_why").value(to_string(s.judged_why));
  w.key("demand_mode_raised").value(s.demand_mode_raised);
  w.key("credit_pfd").number(s.credit_pfd, "credit_pfd");
  w.key("credit_capped").value(s.credit_capped);
  w.key("preliminary").value(s.preliminary);
  w.key("preliminary_because").value(s.preliminary_because);
  w.end_object();
}

// The overpressure screening: one entry per item a source reaches.
template <typename W>
void emit_pressure(W& w, const PressureScreening& p) {
  w.key("pressure").begin_object();
  w.key("equipment").begin_array();
  for (const auto& e : p.equipment) {
    w.begin_object();
    w.key("id").value(e.id);
    w.key("title").value(e.title);
    w.key("max_pressure_barg").number(e.max_pressure_barg, "max pressure");
    w.key("mawp_barg").number(e.mawp_barg, "mawp");
    w.key("test_pressure_barg").number(e.test_pressure_barg, "test pressure");
    w.key("ratio").number(e.ratio, "ratio");
    w.key("category").value(to_string(e.category));
    w.key("source").value(e.source);
    w.key("path").value(e.path);
    w.key("static_head_bar").number(e.static_head_bar, "static head");
    w.key("preliminary").value(e.preliminary());
    w.key("preliminary_because").value(e.estimates);
    w.end_object();
  }
  w.end_array();
  w.key("not_reached").value(p.not_reached);
  w.key("generated_scenarios").value(p.generated);
  w.key("missing_for_scenarios").value(p.missing);
  w.end_object();
}

// A stream that appends to a string it does not own: a block's text is rendered into a buffer
// kept from block to block, so that a register's blocks grow no new buffer each (a fresh one of
// half a megabyte is fresh pages from the system, grown by copies, at every block).
class AppendToString : public std::streambuf {
 public:
  explicit AppendToString(std::string& to) : to_(to) {}

 protected:
  std::streamsize xsputn(const char* s, std::streamsize n) override {
    to_.append(s, static_cast<std::size_t>(n));
    return n;
  }
  int_type overflow(int_type c) override {
    if (!traits_type::eq_int_type(c, traits_type::eof())) to_ += traits_type::to_char_type(c);
    return traits_type::not_eof(c);
  }

 private:
  std::string& to_;
};

// The elements of a long array (the SIFs, the scenarios) written on two cores: blocks rendered
// by elements-only streams, two at a time, and appended in order, so that the text is byte for
// byte one stream's and no more than two blocks are held at once. Block b is rendered into
// buffer b % 2, which is written out before the block after next is rendered into it.
template <typename T, typename Emit>
void emit_elements(JsonStream& w, const std::vector<T>& items, Emit emit, int threads) {
  constexpr std::size_t kBlock = 128;
  if (items.size() <= kBlock || thread_budget(threads) < 2) {
    for (const auto& item : items) emit(w, item);
    return;
  }
  const JsonLayout layout = w.layout();  // read here: the helper thread never touches `w`
  const std::size_t depth = w.depth();
  std::array<std::string, 2> buffers;
  auto render = [&items, &emit, &buffers, layout, depth](std::size_t b) -> const std::string& {
    std::string& text = buffers[b % 2];
    text.clear();  // keeps its capacity
    AppendToString sink(text);
    std::ostream out(&sink);
    {
      JsonStream part(out, layout, depth, b == 0);
      for (std::size_t i = b * kBlock; i < std::min(items.size(), (b + 1) * kBlock); ++i) emit(part, items[i]);
    }
    return text;
  };
  const std::size_t blocks = (items.size() + kBlock - 1) / kBlock;
  for (std::size_t b = 0; b < blocks; b += 2) {
    std::future<const std::string*> next;
    if (b + 1 < blocks) next = alongside(threads, [&render, b] { return &render(b + 1); });
    w.elements(render(b));
    if (next.valid()) w.elements(*next.get());
  }
}

// A tree is built in order, on one core.
template <typename T, typename Emit>
void emit_elements(TreeSink& w, const std::vector<T>& items, Emit emit, int /*threads*/) {
  for (const auto& item : items) emit(w, item);
}

// The whole results file; the SIFs and scenarios go out block by block, never held whole.
template <typename W>
void emit_results(W& w, const ProjectResult& r, int threads = 1) {
  w.begin_object();
  w.key("format").value(kResultsFormat);
  w.key("tool").begin_object().key("name").value("sifter").key("version").value(SIFTER_VERSION).end_object();
  w.key("project").begin_object();
  w.key("title").value(r.title).key("file").value(r.file).key("sha256").value(r.sha256);
  w.end_object();
  w.key("risk_criteria").begin_object();
  for (const auto& [category, levels] : r.risk_criteria) {
    w.key(category).begin_object();
    for (const auto& [severity, rate] : levels) w.key(severity).number(rate.per_year(), "risk criterion");
    w.end_object();
  }
  w.end_object();
  w.key("shared_devices").begin_array();
  for (const auto& d : r.shared_devices)
    w.begin_object().key("device").value(d.tag).key("users").value(d.users).end_object();
  w.end_array();
  w.key("shared_components").begin_array();
  for (const auto& s : r.shared_components)
    w.begin_object().key("component").value(s.component).key("sifs").value(s.sifs).end_object();
  w.end_array();
  w.key("warnings").begin_array();
  for (const auto& x : r.warnings)
    w.begin_object().key("where").value(x.where).key("message").value(x.message).end_object();
  w.end_array();
  w.key("caution").value(kCaution);
  if (r.pressure) emit_pressure(w, *r.pressure);
  w.key("sifs").begin_array();
  emit_elements(
      w, r.sifs, [](auto& to, const SifResult& s) { emit_sif(to, s); }, threads);
  w.end_array();
  w.key("scenarios").begin_array();
  emit_elements(
      w, r.scenarios, [](auto& to, const ScenarioResult& s) { emit_scenario(to, s); }, threads);
  w.end_array();
  w.end_object();
}

}  // namespace

json sif_json(const SifResult& s) {
  json j;
  TreeSink sink(j);
  emit_sif(sink, s);
  return j;
}

json results_json(const ProjectResult& r) {
  json j;
  TreeSink sink(j);
  emit_results(sink, r);
  return j;
}

void write_results_json(const ProjectResult& r, std::ostream& out, JsonLayout layout, int threads) {
  JsonStream stream(out, layout);
  emit_results(stream, r, threads);
}

}  // namespace sifter::report
