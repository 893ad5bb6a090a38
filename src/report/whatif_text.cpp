// Terminal text of the what-if commands.
#include "sifter/report/whatif_text.hpp"

#include <algorithm>
#include <cstdio>

#include "sifter/model/format.hpp"
#include "sifter/model/vocabulary.hpp"
#include "sifter/report/terminal.hpp"
#include "sifter/report/text_table.hpp"

namespace sifter::report {
namespace {

const char* measure_name(DemandMode mode) { return mode == DemandMode::kLow ? "PFDavg" : "PFH"; }

std::string measure_text(double v, DemandMode mode) { return sci(v) + (mode == DemandMode::kLow ? "" : "/h"); }

std::string verdict(const std::optional<bool>& meets) {
  if (!meets) return "not judged";
  return *meets ? "meets" : "FALLS SHORT";
}

std::string notes_block(const std::vector<std::string>& notes, std::size_t width) {
  if (notes.empty()) return "";
  std::string out = "  notes\n";
  for (const auto& n : notes) out += wrap("- " + n, prose_width(width) - 4, "    ");
  return out;
}

std::string hours_and_months(Duration d) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.6g h (%.4g mo, %.3g yr)", checked(d.hours, "interval"), d.hours / kHoursPerMonth,
                d.years());
  return buf;
}

std::string hours_text(double hours) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.6g", checked(hours, "hours"));
  return buf;
}

std::string names(const std::vector<std::string>& items) {
  std::string out;
  for (const auto& i : items) out += (out.empty() ? "'" : ", '") + i + "'";
  return out;
}

// "  label        text", the text wrapped under itself.
std::string labelled(const std::string& label, const std::string& text, std::size_t width) {
  constexpr std::size_t kLabelWidth = 13;
  const std::string body = wrap(text, prose_width(width) - 2 - kLabelWidth, "");
  std::string out;
  std::size_t start = 0;
  bool first = true;
  while (start < body.size()) {
    const std::size_t end = body.find('\n', start);
    const std::string line = body.substr(start, end - start);
    out += "  " +
           (first ? label + std::string(kLabelWidth - std::min(kLabelWidth - 1, label.size()), ' ')
                  : std::string(kLabelWidth, ' ')) +
           line + "\n";
    first = false;
    start = end + 1;
  }
  return out;
}

std::string ending(std::size_t width) { return "\n" + wrapped_caution(prose_width(width)); }

}  // namespace

std::string what_if_value(double value, const std::string& unit) {
  checked(value, "value");
  if (unit == "h") return format_duration(Duration{value});
  if (unit == "x") return plain(value) + "x";
  if (unit == "/h") return sci(value) + "/h";
  if (unit == "/yr") return sci(value) + "/yr";
  return value != 0.0 && value < 0.001 ? sci(value) : percent(value);
}

std::string render_interval(const IntervalResult& r, std::size_t width) {
  const DemandMode mode = r.requirement.mode;
  const std::string m = measure_name(mode);
  std::string out = "Longest proof-test interval of " + r.sif + "\n";
  out += labelled("varied",
                  r.subsystem ? "subsystem '" + *r.subsystem + "'"
                              : "all subsystems with channels, tested together: " + names(r.varied),
                  width);
  std::string req = r.requirement.basis;
  if (r.margin > 0.0) req += "; margin " + percent(r.margin) + ": " + m + " at most " + measure_text(r.allowed, mode);
  out += labelled("requirement", req, width);
  std::string now;
  for (std::size_t i = 0; i < r.varied.size(); ++i)
    now += (i ? ", " : "") + (r.varied.size() > 1 ? r.varied[i] + " " : "") + format_duration(r.current_intervals[i]);
  out += labelled("now", m + " " + measure_text(r.measure_now, mode) + " with interval " + now, width);
  out += "\n";
  // Just inside a band edge the figure rounds to the edge itself; say which side it is on.
  const std::string inside = r.requirement.band_edge && r.margin == 0.0 ? " (just inside the band)" : "";
  switch (r.outcome) {
    case IntervalOutcome::kNone:
      out += "  longest      NONE: no proof-test interval meets the requirement\n";
      break;
    case IntervalOutcome::kWholeMission:
      out += "  longest      the whole mission time, " + hours_and_months(r.longest) + "\n";
      out += "               " + m + " " + measure_text(r.measure_at_longest, mode) + "\n";
      break;
    case IntervalOutcome::kFound:
      out += "  longest      " + hours_and_months(r.longest) + "\n";
      out += "               " + m + " " + measure_text(r.measure_at_longest, mode) + inside + "\n";
      break;
  }
  if (r.outcome != IntervalOutcome::kNone) {
    out += "  whole months " + std::to_string(r.whole_months) + " mo";
    if (r.measure_at_whole_months)
      out += ": " + m + " " + measure_text(*r.measure_at_whole_months, mode);
    else
      out += " (less than one month)";
    out += "\n";
  }
  out += "  interval 0   " + m + " " + measure_text(r.measure_at_zero, mode) +
         " (the terms the interval does not touch)\n";
  return out + notes_block(r.notes, width) + ending(width);
}

std::string render_sweep(const SweepResult& r, std::size_t width) {
  const bool low = r.mode == DemandMode::kLow;
  const bool duration = is_duration(r.parameter);
  std::string out = fit_line("Sweep of " + to_string(r.parameter) + " for " + r.sif + ", " +
                                 (r.subsystem ? "subsystem '" + *r.subsystem + "'" : "subsystems " + names(r.varied)),
                             prose_width(width), "", "  ");
  if (!r.points.empty()) {
    const auto req = governing_requirement(r.points.front().result);
    out += labelled("requirement", req ? req->basis : std::string("none (not judged)"), width) + "\n";
  }
  std::vector<std::string> header{to_string(r.parameter)};
  if (duration) header.push_back("[h]");
  for (const char* h : {low ? "PFDavg" : "PFH [1/h]", "RRF", "SIL prob", "SIL achieved", "verdict"})
    header.emplace_back(h);
  TextTable t(header, std::vector<bool>(header.size(), true));
  for (const auto& p : r.points) {
    const SifResult& s = p.result;
    std::vector<std::string> row;
    if (duration) {
      row.push_back(format_duration(Duration{p.value}));
      row.push_back(hours_text(p.value));
    } else {
      row.push_back(what_if_value(p.value, r.parameter == SweepParameter::kLambdaDuFactor ? "x" : ""));
    }
    row.push_back(sci_or_dash(low ? s.pfd_avg : s.pfh_per_hour));
    row.push_back(low && s.rrf ? plain(*s.rrf) : "-");
    row.push_back(sil_number(s.sil_probability));
    row.push_back(sil_number(s.sil_achieved));
    row.push_back(verdict(s.meets_target));
    t.add_row(row);
  }
  out += t.render("  ", width);
  return out + notes_block(r.notes, width) + ending(width);
}

std::string render_compare(const CompareResult& r, std::size_t width) {
  const bool low = r.mode == DemandMode::kLow;
  std::string out =
      fit_line("Votes compared for " + r.sif + ", subsystem '" + r.subsystem + "'", prose_width(width), "", "  ");
  if (!r.rows.empty()) {
    const auto req = governing_requirement(r.rows.front().result);
    out += labelled("requirement", req ? req->basis : std::string("none (not judged)"), width) + "\n";
  }
  TextTable t({"vote", low ? "PFDavg sub" : "PFH sub", low ? "PFDavg SIF" : "PFH SIF", "RRF", "SIL prob", "HFT",
               "SIL arch sub/SIF", "trips/yr", "MTTF [yr]", "verdict"},
              {false, true, true, true, true, true, true, true, true, true});
  for (const auto& row : r.rows) {
    const SifResult& s = row.result;
    const SubsystemResult& sub = s.subsystems.at(r.subsystem_index);
    t.add_row({row.vote + (row.current ? " (now)" : ""), sci_or_dash(low ? sub.pfd_avg : sub.pfh_per_hour),
               sci_or_dash(low ? s.pfd_avg : s.pfh_per_hour), low && s.rrf ? plain(*s.rrf) : "-",
               sil_number(s.sil_probability), sub.hft ? std::to_string(*sub.hft) : "-",
               sil_number(sub.sil_architecture) + " / " + sil_number(s.sil_architecture),
               sci(s.spurious_trip_rate_per_yr), s.mttf_spurious_yr ? plain(*s.mttf_spurious_yr) : "-",
               verdict(s.meets_target)});
  }
  out += t.render("  ", width);
  std::vector<std::string> notes = r.notes;
  notes.push_back(
      "PFDavg, SIL arch: of the subsystem and of the SIF; trips/yr and MTTF: spurious trips of the whole "
      "SIF, " +
      std::string(kSpuriousTripSource));
  return out + notes_block(notes, width) + ending(width);
}

std::string render_sensitivity(const SensitivityResult& r, std::size_t width) {
  const char* m = measure_name(r.mode);
  std::string out = fit_line("Sensitivity of " + r.sif + ": " + m + " " + measure_text(r.base, r.mode) +
                                 ", each input divided and multiplied by " + plain(r.factor),
                             prose_width(width), "", "  ");
  if (r.requirement) out += labelled("requirement", r.requirement->basis, width);
  out += "\n";
  double widest = 0.0;
  for (const auto& in : r.inputs) widest = std::max(widest, in.swing);
  constexpr int kBarWidth = 16;
  TextTable t({"input", "low", "high", "at low", "at high", "swing", ""}, {false, true, true, true, true, true, false});
  for (const auto& in : r.inputs) {
    const int bar = widest > 0.0 ? static_cast<int>(kBarWidth * in.swing / widest + 0.5) : 0;
    t.add_row({in.name, what_if_value(in.low_value, in.unit),
               what_if_value(in.high_value, in.unit) + (in.clamped ? "*" : ""), sci(in.at_low), sci(in.at_high),
               sci(in.swing), std::string(static_cast<std::size_t>(bar), '#')});
  }
  out += t.render("  ", width);
  std::vector<std::string> notes = r.notes;
  for (const auto& in : r.inputs)
    if (in.clamped) {
      notes.push_back("* held at 1: a fraction cannot exceed it");
      break;
    }
  return out + notes_block(notes, width) + ending(width);
}

}  // namespace sifter::report
