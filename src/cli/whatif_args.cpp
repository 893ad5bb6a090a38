// Command-line values shared by the what-if commands.
#include "whatif_args.hpp"

#include <cctype>
#include <charconv>
#include <cmath>
#include <iostream>

#include "sifter/model/diagnostics.hpp"
#include "sifter/model/printable.hpp"
#include "sifter/model/quantity.hpp"
#include "sifter/report/output_file.hpp"

namespace sifter::cli {
namespace {

std::optional<double> read_number(std::string_view text) {
  while (!text.empty() && std::isspace(static_cast<unsigned char>(text.front()))) text.remove_prefix(1);
  while (!text.empty() && std::isspace(static_cast<unsigned char>(text.back()))) text.remove_suffix(1);
  double v = 0.0;
  const char* first = text.data();
  const char* last = text.data() + text.size();
  auto [ptr, ec] = std::from_chars(first, last, v);
  if (ec != std::errc() || ptr != last || !std::isfinite(v)) return std::nullopt;
  return v;
}

// A vote on the command line: the loader's syntax, and K <= N <= 8.
std::optional<Vote> read_vote(const std::string& text) {
  auto v = parse_vote(text);
  if (!v || v->k > v->n || v->n > kMaxChannels) return std::nullopt;
  return v;
}

}  // namespace

std::size_t sif_index(const Project& project, const std::string& id) {
  std::string known;
  for (std::size_t i = 0; i < project.sifs.size(); ++i) {
    if (project.sifs[i].id == id) return i;
    known += (known.empty() ? "" : ", ") + project.sifs[i].id;
  }
  throw UsageError("--sif: no SIF \"" + id + "\" in " + project.file +
                   "; its SIFs are: " + (known.empty() ? std::string("none") : known));
}

std::optional<std::size_t> subsystem_index(const Sif& sif, const std::string& name) {
  if (name.empty()) return std::nullopt;
  std::string known;
  for (std::size_t i = 0; i < sif.subsystems.size(); ++i) {
    if (sif.subsystems[i].name == name) return i;
    known += (known.empty() ? "\"" : ", \"") + sif.subsystems[i].name + "\"";
  }
  throw UsageError("--subsystem: " + sif.id + " has no subsystem \"" + name + "\"; its subsystems are: " + known);
}

double number_arg(const std::string& option, const std::string& text) {
  if (auto v = read_number(text)) return *v;
  throw UsageError(option + ": expected a number, found \"" + text + "\"");
}

double fraction_arg(const std::string& option, const std::string& text) {
  std::optional<double> v = read_number(text);
  if (!v) {
    auto p = parse_percent(text);
    v = p.value;
  }
  if (!v) throw UsageError(option + ": expected a fraction such as 0.05 or \"5%\", found \"" + text + "\"");
  if (*v < 0.0 || *v > 1.0)
    throw UsageError(option + ": a fraction lies from 0 to 1 (0% to 100%), found \"" + text + "\"");
  return *v;
}

double duration_arg(const std::string& option, const std::string& text) {
  auto d = parse_duration(text);
  if (!d.value)
    throw UsageError(option + ": expected a duration, found \"" + text + "\" (" + d.problem + "); " + d.hint);
  return d.value->hours;
}

double sweep_value_arg(SweepParameter parameter, const std::string& option, const std::string& text) {
  switch (parameter) {
    case SweepParameter::kProofTestInterval:
    case SweepParameter::kMttr:
      return duration_arg(option, text);
    case SweepParameter::kBeta:
    case SweepParameter::kProofTestCoverage:
      return fraction_arg(option, text);
    case SweepParameter::kLambdaDuFactor:
      return number_arg(option, text);
  }
  return 0.0;
}

std::vector<Vote> votes_arg(const std::string& text) {
  std::vector<Vote> out;
  std::size_t start = 0;
  while (start <= text.size()) {
    const std::size_t comma = text.find(',', start);
    std::string item = text.substr(start, comma == std::string::npos ? std::string::npos : comma - start);
    while (!item.empty() && item.front() == ' ') item.erase(item.begin());
    while (!item.empty() && item.back() == ' ') item.pop_back();
    auto v = read_vote(item);
    if (!v)
      throw UsageError("--votes: expected votes such as 1oo1,1oo2,2oo3 (K from 1 to N, N at most " +
                       std::to_string(kMaxChannels) + "; 1oo2D), found \"" + item + "\"");
    out.push_back(*v);
    if (comma == std::string::npos) break;
    start = comma + 1;
  }
  return out;
}

void emit(const std::string& json_path, const std::string& json_text, const std::string& text) {
  if (!json_path.empty()) report::write_output(json_path, json_text);
  if (json_path != "-") std::cout << escape_controls(text);
}

}  // namespace sifter::cli
