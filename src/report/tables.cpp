// The report's tables as plain cells, shared by the HTML and Markdown writers.
#include "sifter/report/tables.hpp"

#include <algorithm>
#include <stdexcept>

#include "sifter/model/format.hpp"

namespace sifter::report {
namespace {

constexpr const char* kNone = "–";

std::string joined(const std::vector<std::string>& parts, const std::string& separator) {
  std::string out;
  for (const auto& p : parts) out += (out.empty() ? "" : separator) + p;
  return out;
}

std::string opt_plain(const std::optional<double>& v) { return v ? plain(*v) : kNone; }
std::string opt_int(const std::optional<int>& v) { return v ? std::to_string(*v) : kNone; }

// PFDavg in low demand, PFH per hour in high demand.
std::string measure_text(const std::optional<double>& pfd_avg, const std::optional<double>& pfh, DemandMode mode) {
  if (mode == DemandMode::kLow) return sci_or_dash(pfd_avg);
  return pfh ? sci(*pfh) + "/h" : kNone;
}

std::string channels_text(const SubsystemResult& s) {
  if (s.channels.empty()) return "(supplier's figure)";
  std::vector<std::string> channels;
  for (const auto& ch : s.channels) channels.push_back(joined(ch, " + "));
  return joined(channels, ", ");
}

std::string basis_text(ConstraintBasis basis) {
  switch (basis) {
    case ConstraintBasis::kIec61511:
      return "minimum HFT, IEC 61511-1:2016 11.4, Table 6";
    case ConstraintBasis::kRoute1H:
      return "Route 1H, IEC 61508-2:2010 Tables 2 and 3";
    case ConstraintBasis::kRoute2H:
      return "Route 2H, IEC 61508-2:2010 7.4.4.3";
  }
  return "";
}

Cell plain_cell(std::string text) { return Cell{std::move(text), Tone::kPlain}; }

std::vector<Cell> cells(std::vector<std::string> texts) {
  std::vector<Cell> out;
  for (auto& t : texts) out.push_back(plain_cell(std::move(t)));
  return out;
}

}  // namespace

Cell sif_verdict(const std::optional<bool>& meets) {
  if (!meets) return {"– not judged", Tone::kNeutral};
  return *meets ? Cell{"✔ meets target", Tone::kGood} : Cell{"✘ falls short", Tone::kBad};
}

Cell scenario_verdict(const std::optional<bool>& meets) {
  if (!meets) return {"– not judged", Tone::kNeutral};
  return *meets ? Cell{"✔ tolerable", Tone::kGood} : Cell{"✘ not tolerable", Tone::kBad};
}

std::string limits_words(const SifResult& sif) {
  std::vector<std::string> parts;
  for (const auto& l : sif.limits) {
    std::string p = l.kind;
    if (l.subsystem) p += " at " + *l.subsystem;
    if (l.element) p += " (" + *l.element + ")";
    parts.push_back(p + ": " + sil_words(l.sil));
  }
  return joined(parts, "; ");
}

std::string limited_by(const SifResult& sif, const SifReportData& data) {
  if (sif.limits.empty()) return sil_words(sif.sil_achieved) + " set by " + joined(data.limiting, ", ");
  return "below target: " + limits_words(sif);
}

Table sif_summary_table(const ProjectResult& result, const ReportData& data) {
  Table t{"Safety instrumented functions",
          {"SIF", "title", "demand", "required SIL", "achieved SIL", "PFDavg or PFH", "RRF", "required RRF", "verdict",
           "what limits it"},
          {false, false, false, true, true, true, true, true, false, false},
          {}};
  for (std::size_t i = 0; i < result.sifs.size(); ++i) {
    const SifResult& s = result.sifs[i];
    std::vector<Cell> row =
        cells({s.id, s.title, to_string(s.demand_mode), opt_int(s.sil_required), std::to_string(s.sil_achieved),
               measure_text(s.pfd_avg, s.pfh_per_hour, s.demand_mode), opt_plain(s.rrf), opt_plain(s.required_rrf)});
    row.push_back(sif_verdict(s.meets_target));
    row.push_back(plain_cell(i < data.sifs.size() ? limited_by(s, data.sifs[i]) : ""));
    t.rows.push_back(std::move(row));
  }
  return t;
}

Table scenario_summary_table(const ProjectResult& result) {
  Table t{"Hazard scenarios (LOPA)",
          {"scenario", "title", "SIF", "without SIF [/yr]", "tolerable [/yr]", "required RRF", "required SIL",
           "with SIF [/yr]", "verdict"},
          {false, false, false, true, true, true, true, true, false},
          {}};
  t.keys = {true, false, true};
  for (const auto& s : result.scenarios) {
    std::vector<Cell> row = cells({s.id, s.title, s.sif.value_or(kNone), sci(s.frequency_without_sif_per_yr),
                                   sci(s.target_frequency_per_yr), plain(s.required_rrf),
                                   std::to_string(s.required_sil), sci_or_dash(s.mitigated_frequency_per_yr)});
    row.push_back(scenario_verdict(s.meets_target));
    t.rows.push_back(std::move(row));
  }
  return t;
}

Table risk_criteria_table(const RiskCriteria& criteria) {
  Table t{"Risk criteria: tolerable frequency of each consequence",
          {"category", "severity", "tolerable [/yr]"},
          {false, false, true},
          {}};
  for (const auto& [category, levels] : criteria)
    for (const auto& [severity, rate] : levels) t.rows.push_back(cells({category, severity, sci(rate.per_year())}));
  return t;
}

Table sil_table(const SifResult& s, const SifReportData& data) {
  const bool low = s.demand_mode == DemandMode::kLow;
  const auto sets = [&](const char* kind) {
    return std::find(data.limiting.begin(), data.limiting.end(), kind) != data.limiting.end() ? "yes" : "";
  };
  std::string probability =
      low ? "PFDavg " + sci_or_dash(s.pfd_avg) : "PFH " + measure_text(s.pfd_avg, s.pfh_per_hour, s.demand_mode);
  if (low && data.required_pfd) probability += "; required: at most " + sci(*data.required_pfd);
  if (!low && s.required_pfh_per_hour) probability += "; required at most " + sci(*s.required_pfh_per_hour) + "/h";
  Table t{"The three results and the verdict",
          {"result", "SIL", "from", "sets the achieved SIL"},
          {false, false, false, false},
          {}};
  t.rows.push_back(cells({"probability", sil_words(s.sil_probability), probability, sets("probability")}));
  t.rows.push_back(
      cells({"architecture", sil_words(s.sil_architecture), basis_text(s.constraints), sets("architecture")}));
  t.rows.push_back(cells({"systematic", sil_words(s.sil_systematic),
                          "lowest systematic capability in the chain, IEC 61508-2:2010 7.4.3", sets("systematic")}));
  t.rows.push_back(cells({"achieved", sil_words(s.sil_achieved), "the lowest of the three", ""}));
  t.rows.push_back(cells({"required", s.sil_required ? sil_words(*s.sil_required) : kNone,
                          s.target_text.empty() ? "no target" : s.target_text, ""}));
  t.rows.push_back({plain_cell("verdict"), sif_verdict(s.meets_target), plain_cell(""), plain_cell("")});
  return t;
}

Table subsystem_table(const SifResult& s) {
  const bool low = s.demand_mode == DemandMode::kLow;
  Table t{"Subsystems",
          {"subsystem", "role", "vote", "channels", low ? "PFDavg" : "PFH", "share", "HFT", "SFF", "SIL (architecture)",
           "SC", "proof-test interval"},
          {false, false, false, false, true, true, true, true, true, true, true},
          {}};
  for (const auto& sub : s.subsystems) {
    const bool vendor = sub.channels.empty();
    t.rows.push_back(
        cells({sub.name, to_string(sub.role), sub.vote, channels_text(sub),
               measure_text(sub.pfd_avg, sub.pfh_per_hour, s.demand_mode), percent(sub.share), opt_int(sub.hft),
               sub.sff ? percent(*sub.sff) : kNone, std::to_string(sub.sil_architecture),
               opt_int(sub.systematic_capability), vendor ? kNone : format_duration(sub.proof_test_interval)}));
  }
  return t;
}

Table interval_table(const IntervalSweep& sweep) {
  Table t{
      "Proof-test intervals, present and longest allowed (every tested subsystem at one interval, as sifter "
      "interval answers)",
      {"subsystem", "present interval", "longest allowed"},
      {false, true, true},
      {}};
  const bool whole_mission = sweep.longest && sweep.longest->outcome == IntervalOutcome::kWholeMission;
  const bool none = sweep.longest && sweep.longest->outcome == IntervalOutcome::kNone;
  for (const auto& s : sweep.subsystems) {
    std::string longest = kNone;
    if (s.longest && whole_mission)
      longest = "the whole mission, " + format_duration(*s.longest);
    else if (s.longest)
      longest = format_duration(*s.longest);
    else if (s.present && none)
      longest = "none: falls short at any interval";
    t.rows.push_back(cells({s.name, s.present ? format_duration(*s.present) : "(supplier's figure)", longest}));
  }
  return t;
}

Table sensitivity_table(const std::vector<SensitivityRow>& rows) {
  Table t{"Sensitivity ranking", {"input", "PFDavg at low value", "PFDavg at high value"}, {false, true, true}, {}};
  for (const auto& r : rows) t.rows.push_back(cells({r.name, sci(r.low_pfd), sci(r.high_pfd)}));
  return t;
}

Table uncertainty_table(const UncertaintyResult& u) {
  Table t{"Uncertainty of the result (Monte Carlo)", {"statistic", "value"}, {false, true}, {}};
  t.rows.push_back(cells({"mean", sci(u.mean)}));
  t.rows.push_back(cells({"5th percentile", sci(u.p05)}));
  t.rows.push_back(cells({"median", sci(u.p50)}));
  t.rows.push_back(cells({"95th percentile", sci(u.p95)}));
  t.rows.push_back(cells({"probability of meeting the target", percent(u.probability_meets_target)}));
  t.rows.push_back(cells({"samples", std::to_string(u.samples)}));
  t.rows.push_back(cells({"method", u.method}));
  return t;
}

namespace {

std::string step_words(const WorksheetRow& row) {
  const std::string of = row.consequence.empty() ? "" : " (" + row.consequence + ")";
  switch (row.step) {
    case WorksheetStep::kCause:
      return "cause " + row.item;
    case WorksheetStep::kEnabling:
      return "enabling condition";
    case WorksheetStep::kLayer:
      return "layer " + row.item;
    case WorksheetStep::kSif:
      return "SIF " + row.item;
    case WorksheetStep::kNotCredited:
      return "not credited";
    case WorksheetStep::kTotal:
      return "all causes";
    case WorksheetStep::kModifier:
      return "modifier" + of;
    case WorksheetStep::kTarget:
      return "without the SIF" + of;
    case WorksheetStep::kWithSif:
      return "with the SIF" + of;
  }
  return "";
}

std::string worksheet_value(const WorksheetRow& row) {
  if (!row.value) return "";
  if (row.step == WorksheetStep::kCause || row.step == WorksheetStep::kTarget) return sci(*row.value) + "/yr";
  return plain(*row.value);
}

Cell worksheet_credit(const WorksheetRow& row) {
  switch (row.step) {
    case WorksheetStep::kLayer:
      return row.credited ? Cell{"✔ credited", Tone::kGood} : Cell{"✘ no credit", Tone::kBad};
    case WorksheetStep::kSif:
      return row.credited ? Cell{"assessed", Tone::kPlain} : Cell{"✘ no credit", Tone::kBad};
    case WorksheetStep::kNotCredited:
      return {"✘ not credited", Tone::kNeutral};
    default:
      return {"", Tone::kPlain};
  }
}

}  // namespace

Table worksheet_table(const ScenarioResult& s) {
  Table t{"Worksheet",
          {"step", "title", "value", "credit", "frequency [/yr]", "note"},
          {false, false, true, false, true, false},
          {}};
  for (const auto& row : s.worksheet) {
    // A credited SIF row would repeat that the SIF is not in the frequency without it; the
    // step's name says so. An uncredited one keeps its reason.
    const bool quiet_note = row.step == WorksheetStep::kSif && row.credited;
    std::vector<Cell> r = cells({step_words(row), row.title, worksheet_value(row)});
    r.push_back(worksheet_credit(row));
    r.push_back(plain_cell(row.frequency_per_yr ? sci(*row.frequency_per_yr) : ""));
    r.push_back(plain_cell(quiet_note ? "" : row.note));
    t.rows.push_back(std::move(r));
  }
  return t;
}

namespace {

// The Annex B form behind an equation name, written out (IEC 61508-6:2010 B.3.2.2 and B.3.3.2,
// as DEVELOPERS.md, Methods M1 and M3 collect them; the general KooN form as DEVELOPERS.md states it).
std::string annex_b_form(const SubsystemResult& sub) {
  if (!sub.voting) return "";  // a supplier's figure
  const bool pfh = sub.pfh_per_hour.has_value();
  const auto [k, n, diagnostic] = *sub.voting;
  const int m = n - k + 1;
  const std::string nn = std::to_string(n);
  if (diagnostic)
    return pfh ? "PFH = 2(1−β)λDU[(1−β)λDU + (1−βD)λDD + λSD]·tCE′ + βD·λDD + β·λDU"
               : "PFD = 2(1−β)λDU[(1−β)λDU + (1−βD)λDD + λSD]·tCE′·tGE′ + CCF";
  if (m == 1)
    return pfh ? "PFH = " + (n > 1 ? nn + "·" : std::string()) + "λDU"
               : "PFD = " + (n > 1 ? nn + "·" : std::string()) + "λD·tCE";
  const int power = pfh ? m - 1 : m;  // PFH: one failure fewer is waited for
  std::string times;
  for (int j = 1; j <= power; ++j) times += j == 1 ? "·tCE" : j == 2 ? "·tGE" : "·tG" + std::to_string(j - 1) + "E";
  long ways = 1;  // the ordered ways N!/(N-m)! of picking the m failed channels
  for (int i = 0; i < m; ++i) ways *= n - i;
  const std::string x_power = power > 1 ? "X^" + std::to_string(power) : "X";
  return (pfh ? "PFH = " : "PFD = ") + std::to_string(ways) + "·" + x_power + (pfh ? "·(1−β)λDU" : "") + times +
         (pfh ? " + βD·λDD + β·λDU" : " + CCF");
}

}  // namespace

Table equations_table(const ProjectResult& result, const ReportData& data) {
  Table t{"Equations used and their sources", {"source", "form", "used for"}, {false, false, false}, {}};
  t.keys = {false, false, false};
  // Each (equation, form) once, in the order first met, with the subsystems that use it.
  std::vector<std::pair<std::pair<std::string, std::string>, std::vector<std::string>>> used;
  for (const auto& s : result.sifs)
    for (const auto& sub : s.subsystems) {
      if (sub.equation.empty()) continue;
      const auto key = std::make_pair(sub.equation, annex_b_form(sub));
      auto it = std::find_if(used.begin(), used.end(), [&](const auto& u) { return u.first == key; });
      if (it == used.end()) it = used.insert(used.end(), {key, {}});
      it->second.push_back(s.id + " " + sub.name);
    }
  for (const auto& [key, users] : used) t.rows.push_back(cells({key.first, key.second, joined(users, ", ")}));
  if (!used.empty())
    t.rows.push_back(cells({"symbols, IEC 61508-6:2010 B.3.2.2",
                            "tCE = (λDU/λD)(T1/2 + MRT) + (λDD/λD)·MTTR; tGE, tG2E: T1/3, T1/4 in place of T1/2; "
                            "X = (1−βD)λDD + (1−β)λDU; CCF = βD·λDD·MTTR + β·λDU(T1/2 + MRT)",
                            "the forms above"}));
  if (!result.sifs.empty()) {
    t.rows.push_back(cells({"IEC 61508-6:2010 B.2.2",
                            "SIF PFDavg (PFH) = sum over its subsystems in series "
                            "(rare-event approximation)",
                            "every SIF"}));
    t.rows.push_back(cells({"IEC 61508-1:2010 Tables 2 and 3; IEC 61511-1:2016 Tables 4 and 5",
                            "SIL bands of PFDavg, PFH and RRF", "every SIF"}));
  }
  const auto any = [&](auto has) { return std::any_of(data.sifs.begin(), data.sifs.end(), has); };
  if (any([](const SifReportData& d) { return d.pfd_curve.has_value(); }))
    t.rows.push_back(cells({"sifter curve.hpp, from the Annex B group data (common practice)",
                            "channel PFD(t) = Σ share·λDU·((t mod T) + MRT) + λDD·MTTR over its test intervals; group: "
                            "binomial over the channels of (1−β), (1−βD) rates, plus the β, βD terms",
                            "the PFD(t) figures"}));
  if (any([](const SifReportData& d) { return d.interval_sweep.has_value(); }))
    t.rows.push_back(cells({"sifter interval_curve.hpp",
                            "PFDavg re-computed with every proof-test interval of the SIF times a factor; the longest "
                            "allowed factor by bisection",
                            "the PFDavg against interval figures"}));
  if (!result.scenarios.empty())
    t.rows.push_back(cells({"CCPS, Layer of Protection Analysis, 2001",
                            "frequency = IEF × enabling conditions × PFD of each credited layer × conditional "
                            "modifiers; required PFD = tolerable frequency / frequency without the SIF",
                            "every scenario"}));
  return t;
}

Table shared_table(const ProjectResult& result) {
  Table t{"Shared equipment: check its independence", {"tag", "shared as", "relied on by"}, {false, false, false}, {}};
  for (const auto& c : result.shared_components)
    t.rows.push_back(cells({c.component, "SIF component", joined(c.sifs, ", ")}));
  for (const auto& d : result.shared_devices) t.rows.push_back(cells({d.tag, "device", joined(d.users, ", ")}));
  return t;
}

}  // namespace sifter::report
