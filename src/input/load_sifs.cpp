// Loading safety instrumented functions and their subsystems, with the project defaults.
#include <algorithm>
#include <cctype>
#include <cmath>
#include <set>
#include <unordered_set>

#include "input/load_parts.hpp"

namespace sifter::detail {
namespace {

// The exact engine composes whole test cycles by repeated squaring: its work grows with the
// logarithm of the number of tests. Beyond 1e12 tests the count of cycles leaves the exact
// integers of a double (README "Limits").
constexpr double kMaxTestsPerMission = 1e12;
// A partial stroke interval that neither divides the proof-test interval nor is a whole
// multiple of it has no common cycle: the engine steps through every test, at most this many.
constexpr double kMaxUnrelatedTests = 20000.0;

// "20000", "10^12": a count of tests for a message.
std::string format_count(double n) {
  if (n < 1e6) return std::to_string(std::llround(n));
  return "10^" + std::to_string(std::lround(std::log10(n)));
}

bool whole_multiple(double x) { return x >= 1.0 - 1e-9 && std::fabs(x - std::round(x)) <= 1e-9 * x; }

Role role_of(const std::string& s) {
  if (s == "logic") return Role::kLogic;
  if (s == "final") return Role::kFinal;
  return Role::kSensor;
}

void read_channels(LoadContext& ctx, ObjectReader& r, Subsystem& sub) {
  const Json* v = r.member("channels");
  if (!v) return;
  if (!v->is_array()) {
    ctx.error(0, r.at("channels"), "an array of component ids (or arrays of ids in series)", describe(*v));
    return;
  }
  sub.channels.reserve(v->size());  // held for the whole run: no room beyond what is read
  for (std::size_t i = 0; i < v->size(); ++i) {
    const Json& c = (*v)[i];
    Channel ch;
    ch.pointer = r.at("channels") + "/" + std::to_string(i);
    if (c.is_string()) {
      ch.component_ids.push_back(c.get<std::string>());
    } else if (c.is_array() && !c.empty()) {
      ch.component_ids.reserve(c.size());
      for (std::size_t j = 0; j < c.size(); ++j) {
        if (c[j].is_string())
          ch.component_ids.push_back(c[j].get<std::string>());
        else
          ctx.error(0, ch.pointer + "/" + std::to_string(j), "a component id", describe(c[j]));
      }
    } else {
      ctx.error(0, ch.pointer, "a component id, or an array of ids in series such as [\"SOV-1\", \"XV-1\"]",
                describe(c));
      continue;
    }
    sub.channels.push_back(std::move(ch));
  }
}

void read_partial_stroke(LoadContext& ctx, ObjectReader& r, Subsystem& sub) {
  const Json* v = r.member("partial_stroke");
  if (!v) return;
  ObjectReader p(ctx, *v, r.at("partial_stroke"), 0, "a partial stroke test");
  auto interval = p.duration("interval", true);
  auto coverage = p.fraction("coverage", true);
  p.finish();
  if (interval && coverage) {
    if (interval->hours <= 0.0)
      ctx.error(0, p.at("interval"), "a positive interval", "zero");
    else
      sub.partial_stroke = PartialStroke{*interval, *coverage};
  }
}

// Bounds on the exact engine's work, refused before any work starts (README "Limits"): at most
// kMaxTestsPerMission tests over the mission, and kMaxUnrelatedTests where the partial stroke
// and the proof test share no cycle.
void refuse_unbounded_tests(LoadContext& ctx, ObjectReader& r, const Subsystem& sub, const Defaults& defaults) {
  const double mission = defaults.mission_time.hours;
  auto check = [&](double interval, double limit, const std::string& pointer, const char* what,
                   const std::string& hint) {
    if (!(interval > 0.0) || !(mission > 0.0) || mission / interval <= limit) return;
    ctx.error(0, pointer,
              std::string("a ") + what + " of at least " + format_duration(Duration{mission / limit}) + " (at most " +
                  format_count(limit) + " tests over the mission of " + format_duration(defaults.mission_time) + ")",
              format_duration(Duration{interval}), hint);
  };
  const std::string diagnostic =
      "a proof test this frequent is an online diagnostic: count it in lambda_dd (dc) instead";
  if (!sub.is_vendor())
    check(sub.proof_test_interval.hours, kMaxTestsPerMission,
          r.has("proof_test_interval") ? r.at("proof_test_interval") : r.pointer(), "proof-test interval", diagnostic);
  if (!sub.partial_stroke) return;
  const double tp = sub.partial_stroke->interval.hours;
  const double t1 = sub.proof_test_interval.hours;
  const bool shared_cycle =
      sub.is_vendor() || !(t1 > 0.0) || !(tp > 0.0) || whole_multiple(t1 / tp) || whole_multiple(tp / t1);
  check(tp, shared_cycle ? kMaxTestsPerMission : kMaxUnrelatedTests, r.at("partial_stroke") + "/interval",
        "partial stroke interval",
        shared_cycle ? diagnostic
                     : "choose a partial stroke interval that divides the proof-test interval of " +
                           format_duration(Duration{t1}) +
                           " (a half, a quarter, a twelfth of it): the engine then "
                           "composes whole test cycles");
}

// Applies a duration from the subsystem, else the project default; reports when neither.
Duration with_default(LoadContext& ctx, ObjectReader& r, const std::string& key,
                      const std::optional<Duration>& fallback, bool& defaulted, bool needed) {
  auto own = r.duration(key);
  defaulted = !own.has_value();
  if (own) return *own;
  if (fallback) return *fallback;
  if (needed && ctx.has_problem_under(0, "/defaults/" + key))
    ++ctx.follow_ons_suppressed;  // the default was written and refused: that one message says it
  else if (needed)
    ctx.error(0, r.pointer(), "\"" + key + "\" on the subsystem or in \"defaults\"", "neither",
              "add for example \"defaults\": {\"" + key +
                  "\": " + (key == "proof_test_interval" ? "\"1 yr\"" : "\"8 h\"") + "}");
  return Duration{};
}

// Values a reviewer would question; computed on, but shown (common practice).
void warn_implausible(LoadContext& ctx, const Subsystem& sub, const Defaults& defaults) {
  if (sub.beta > 0.2) ctx.warn(sub.pointer, "beta above 20% is unusually high; check the common-cause estimate");
  if (sub.is_vendor()) return;
  if (sub.proof_test_interval.hours > defaults.mission_time.hours)
    ctx.warn(sub.pointer, "the proof-test interval (" + format_duration(sub.proof_test_interval) +
                              ") is longer than the mission time (" + format_duration(defaults.mission_time) + ")");
  if (sub.mttr.hours > sub.proof_test_interval.hours && sub.proof_test_interval.hours > 0.0)
    ctx.warn(sub.pointer, "the MTTR (" + format_duration(sub.mttr) + ") is longer than the proof-test interval");
}

// The supplier's figures, the declarations, the vote and the channels.
void read_figures_and_vote(LoadContext& ctx, ObjectReader& r, Subsystem& sub) {
  const std::string& pointer = sub.pointer;
  sub.vendor_pfd_avg = r.probability("pfd_avg");
  if (sub.vendor_pfd_avg && *sub.vendor_pfd_avg <= 0.0) {
    ctx.error(0, r.at("pfd_avg"), "a supplier's PFDavg above 0 and at most 1", "0",
              "a PFDavg of 0 claims a subsystem that never fails; take the figure from the safety manual");
  }
  sub.vendor_pfh = r.rate("pfh");
  if (sub.vendor_pfd_avg && sub.vendor_pfh)
    ctx.error(0, pointer, "either \"pfd_avg\" or \"pfh\" from the safety manual", "both",
              "give the figure for the SIF's demand mode");
  sub.hft_declared = r.integer("hft", 0, 3);
  sub.sc_declared = r.integer("systematic_capability", 1, 4);
  sub.sil_capability = r.integer("sil_capability", 1, 4);
  r.allow({"title", "note"});
  const bool vendor = sub.is_vendor();
  if (auto vote_text = r.string("vote", !vendor)) {
    if (auto vote = parse_vote(*vote_text)) {
      sub.vote = *vote;
    } else {
      ctx.error(0, r.at("vote"), "a vote such as \"1oo1\", \"1oo2\", \"2oo3\", \"1oo2D\" or any \"KooN\"",
                "\"" + *vote_text + "\"", "K and N are whole numbers, K from 1 to N");
    }
  }
  if (sub.vote.n > kMaxChannels)
    ctx.error(0, r.at("vote"), "a vote of at most " + std::to_string(kMaxChannels) + " channels",
              std::to_string(sub.vote.n) + " channels");
  read_channels(ctx, r, sub);
  if (vendor && !sub.channels.empty())
    ctx.error(0, r.at("channels"), "either channels or a vendor figure (\"pfd_avg\" / \"pfh\")", "both",
              "a vendor figure already covers the subsystem's hardware");
}

// Beta, beta_D and their scaling; a redundant group must state beta.
void read_common_cause(LoadContext& ctx, ObjectReader& r, Subsystem& sub) {
  const std::string& pointer = sub.pointer;
  const bool vendor = sub.is_vendor();
  auto beta = r.fraction("beta");
  auto beta_d = r.fraction("beta_d");
  sub.beta = beta.value_or(0.0);
  sub.beta_d = beta_d.value_or(sub.beta);
  sub.beta_d_defaulted = beta.has_value() && !beta_d.has_value();
  const bool beta_written = r.has("beta");
  if (!vendor && sub.vote.n > 1 && !sub.vote.diagnostic && sub.vote.k < sub.vote.n && !beta_written)
    ctx.error(0, pointer, "\"beta\" on a redundant group (" + sub.vote.text() + ")", "no beta",
              "estimate beta with IEC 61508-6 Annex D; 2% to 10% is usual for field devices");
  if (!vendor && sub.vote.diagnostic && !beta_written)
    ctx.error(0, pointer, "\"beta\" on a redundant group (1oo2D)", "no beta",
              "estimate beta with IEC 61508-6 Annex D; 2% to 10% is usual");
  if (auto scaling = r.choice("ccf_scaling", {"none", "iec61508-6-d5"})) {
    sub.ccf_scaling = *scaling == "none" ? CcfScaling::kNone : CcfScaling::kIec61508TableD5;
    if (sub.ccf_scaling == CcfScaling::kIec61508TableD5 && !table_d5_covers(sub.vote.k, sub.vote.n))
      ctx.error(0, r.at("ccf_scaling"), "a vote that IEC 61508-6 Table D.5 covers (N up to 5)", sub.vote.text(),
                "use \"none\" and enter beta for this group directly");
  }
}

// The intervals and times, from the subsystem or the project defaults, and the test plan.
void read_times(LoadContext& ctx, ObjectReader& r, Subsystem& sub, const Defaults& defaults) {
  const bool vendor = sub.is_vendor();
  const bool needs_times = !vendor;
  sub.proof_test_interval =
      with_default(ctx, r, "proof_test_interval", defaults.proof_test_interval, sub.interval_defaulted, needs_times);
  sub.mttr = with_default(ctx, r, "mttr", defaults.mttr, sub.mttr_defaulted, needs_times);
  if (auto own_mrt = r.duration("mrt")) {
    sub.mrt = *own_mrt;
  } else if (defaults.mrt) {
    sub.mrt = *defaults.mrt;
  } else {
    sub.mrt = sub.mttr;
    sub.mrt_defaulted = true;
  }
  if (needs_times && sub.proof_test_interval.hours <= 0.0 && r.has("proof_test_interval"))
    ctx.error(0, r.at("proof_test_interval"), "a positive proof-test interval", "zero");
  sub.proof_test_coverage = r.fraction("proof_test_coverage").value_or(1.0);
  read_partial_stroke(ctx, r, sub);
  refuse_unbounded_tests(ctx, r, sub, defaults);
  sub.test_duration = r.duration("test_duration");
  // The channel is bypassed while tested: a test longer than the interval leaves it bypassed
  // for good, which no test plan means (IEC 61508-6:2010 B.3.2.5 counts the test time inside T1).
  if (needs_times && sub.test_duration && sub.proof_test_interval.hours > 0.0 &&
      sub.test_duration->hours > sub.proof_test_interval.hours)
    ctx.error(
        0, r.at("test_duration"),
        "a test duration no longer than the proof-test interval (" + format_duration(sub.proof_test_interval) + ")",
        format_duration(*sub.test_duration), "the test duration is how long one test keeps a channel bypassed");
}

Subsystem read_subsystem(LoadContext& ctx, const Json& value, const std::string& pointer, const Defaults& defaults) {
  ObjectReader r(ctx, value, pointer, 0, "a subsystem");
  Subsystem sub;
  sub.pointer = pointer;
  sub.name = r.string("name", true).value_or("");
  if (r.has("name") && sub.name.empty() && r.member("name")->is_string())
    ctx.error(0, r.at("name"), "a subsystem name that is not empty", "\"\"", "name it, e.g. \"transmitters\"");
  sub.role = role_of(r.choice("role", {"sensor", "logic", "final"}, true).value_or("sensor"));
  read_figures_and_vote(ctx, r, sub);
  read_common_cause(ctx, r, sub);
  read_times(ctx, r, sub, defaults);
  sub.response_time = r.duration("response_time");
  sub.staggered = r.boolean("staggered").value_or(false);
  sub.trip_on_detected = r.boolean("trip_on_detected").value_or(false);
  sub.alarm_only_on_detected = r.choice("on_detected_failure", {"safe_state", "alarm_only"}) == "alarm_only";
  sub.diverse = r.boolean("diverse").value_or(false);
  sub.diversity_note = r.string("diversity_note").value_or("");
  if (sub.diverse && sub.diversity_note.empty())
    ctx.error(0, r.at("diverse"), "a \"diversity_note\" that justifies the diverse channels", "none",
              "say why one systematic fault cannot fail every channel (different technology, maker, software)");
  r.finish();
  warn_implausible(ctx, sub, defaults);
  return sub;
}

std::optional<Target> read_target(LoadContext& ctx, ObjectReader& sif) {
  const Json* v = sif.member("target");
  if (!v) return std::nullopt;
  ObjectReader t(ctx, *v, sif.at("target"), 0, "a target");
  std::vector<Target> found;
  if (auto sil = t.integer("sil", 1, 4)) found.push_back({Target::Kind::kSil, static_cast<double>(*sil)});
  if (auto rrf = t.number("rrf")) {
    if (*rrf < 1.0)
      ctx.error(0, t.at("rrf"), "a risk reduction factor of 1 or more", "the number " + Json(*rrf).dump());
    else
      found.push_back({Target::Kind::kRrf, *rrf});
  }
  if (auto pfd = t.probability("pfd_avg")) {
    if (*pfd <= 0.0)
      ctx.error(0, t.at("pfd_avg"), "a PFDavg above 0", "0");
    else
      found.push_back({Target::Kind::kPfdAvg, *pfd});
  }
  if (auto pfh = t.rate("pfh")) found.push_back({Target::Kind::kPfh, pfh->per_hour});
  t.finish();
  int written = 0;
  for (const char* key : {"sil", "rrf", "pfd_avg", "pfh"}) written += t.has(key) ? 1 : 0;
  if (written != 1 && v->is_object())
    ctx.error(0, sif.at("target"), "exactly one of {\"sil\": n}, {\"rrf\": x}, {\"pfd_avg\": x}, {\"pfh\": \"…/h\"}",
              std::to_string(written) + " targets");
  if (found.size() != 1) return std::nullopt;
  return found.front();
}

}  // namespace

std::optional<ConstraintBasis> parse_constraint_basis(const std::optional<std::string>& s) {
  if (!s) return std::nullopt;
  if (*s == "route_1h") return ConstraintBasis::kRoute1H;
  if (*s == "route_2h") return ConstraintBasis::kRoute2H;
  return ConstraintBasis::kIec61511;
}

namespace {

// One SIF of the "sifs" section.
void read_sif(LoadContext& ctx, const Json& value, const std::string& pointer, std::unordered_set<std::string>& ids,
              Project& project) {
  ObjectReader r(ctx, value, pointer, 0, "a SIF");
  Sif sif;
  sif.pointer = pointer;
  sif.id = r.string("id", true).value_or("");
  if (r.has("id") && sif.id.empty() && r.member("id")->is_string())
    ctx.error(0, r.at("id"), "a SIF id that is not empty", "\"\"", "use the tag of the SIF, e.g. \"SIF-101\"");
  sif.title = r.string("title").value_or("");
  sif.path_exception = r.string("path_exception").value_or("");
  if (auto mode = r.choice("demand_mode", {"low", "high"}))
    sif.demand_mode_stated = *mode == "low" ? DemandMode::kLow : DemandMode::kHigh;
  sif.target = read_target(ctx, r);
  sif.constraints = parse_constraint_basis(r.choice("constraints", {"iec61511", "route_1h", "route_2h"}));
  r.allow({"note", "tags"});
  sif.requirements = read_requirements(r);
  if (const Json* subs = r.require("subsystems", "an array of subsystems")) {
    if (!subs->is_array() || subs->empty()) {
      ctx.error(0, r.at("subsystems"), "a non-empty array of subsystems", describe(*subs));
    } else {
      sif.subsystems.reserve(subs->size());
      for (std::size_t j = 0; j < subs->size(); ++j)
        sif.subsystems.push_back(
            read_subsystem(ctx, (*subs)[j], r.at("subsystems") + "/" + std::to_string(j), project.defaults));
    }
  }
  r.finish();
  if (!sif.id.empty() && !ids.insert(sif.id).second)
    ctx.error(0, r.at("id"), "a SIF id used once", "\"" + sif.id + "\" a second time");
  std::set<std::string> names;
  for (const auto& sub : sif.subsystems)
    if (!sub.name.empty() && !names.insert(sub.name).second)
      ctx.error(0, sub.pointer + "/name", "a subsystem name used once in the SIF", "\"" + sub.name + "\" again");
  project.sifs.push_back(std::move(sif));
}

}  // namespace

void read_sifs(LoadContext& ctx, Json& root, Project& project) {
  auto it = root.find("sifs");
  if (it == root.end()) return;
  if (!it->is_array()) {
    ctx.error(0, "/sifs", "an array of SIFs", describe(*it));
    return;
  }
  std::unordered_set<std::string> ids;
  project.sifs.reserve(project.sifs.size() + it->size());
  for (std::size_t i = 0; i < it->size(); ++i) {
    read_sif(ctx, section_item(ctx, "sifs", *it, i), "/sifs/" + std::to_string(i), ids, project);
    (*it)[i] = nullptr;  // its JSON is freed while still in cache, and its memory serves the next SIF
  }
}

}  // namespace sifter::detail
