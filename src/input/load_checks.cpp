// Cross-section plausibility decided once in loading: the demand mode of a SIF's figures and
// target, and its signal path (see plausibility.hpp).
#include <algorithm>
#include <set>
#include <sstream>
#include <vector>

#include "input/load_parts.hpp"
#include "sifter/input/plausibility.hpp"

namespace sifter::detail {

void check_project_plausibility(LoadContext& ctx, const Project& project) {
  // A SIF that no scenario credits keeps its stated (or the default low) mode; one that a
  // scenario credits without a stated mode takes it from the LOPA, and is checked there.
  std::set<std::string> credited;
  for (const auto& s : project.scenarios)
    for (const auto& l : s.layers)
      if (!l.sif.empty()) credited.insert(l.sif);
  for (const auto& sif : project.sifs) {
    for (auto& w : signal_path_warnings(sif)) ctx.warn(w.where, std::move(w.message));
    if (!sif.demand_mode_stated && credited.count(sif.id)) continue;
    const std::string basis = sif.demand_mode_stated ? "stated" : "not stated; low demand assumed";
    for (const auto& p : demand_mode_mismatches(sif, sif.demand_mode(), basis))
      ctx.error(0, p.pointer, p.expected, p.found, p.hint);
  }
}

namespace {

// What a component's identity rests on for diversity: its library model, maker and every datum
// the engines read; its id, tag, notes and in-service date say nothing of what it is.
std::string identity(const Component& c) {
  std::ostringstream o;
  o.precision(17);
  const auto& r = c.rates;
  o << c.model << '\x1f' << c.manufacturer << '\x1f' << r.lambda_du.per_hour << ' ' << r.lambda_dd.per_hour << ' '
    << r.lambda_su.per_hour << ' ' << r.lambda_sd.per_hour << '\x1f'
    << (c.element_type ? (*c.element_type == ElementType::kA ? "A" : "B") : "-") << '\x1f'
    << c.systematic_capability.value_or(-1) << ' ' << c.sff_declared.value_or(-1.0) << ' '
    << c.data_confidence.value_or(-1.0) << ' ' << (c.uncertainty ? c.uncertainty->error_factor : -1.0) << '\x1f'
    << (c.field_data ? std::to_string(c.field_data->failures) + " " + std::to_string(c.field_data->device_hours.hours) +
                           " " + std::to_string(c.field_data->confidence)
                     : "-")
    << '\x1f' << (c.prior_use ? c.prior_use->sil : -1) << ' ' << (c.response_time ? c.response_time->hours : -1.0)
    << '\x1f' << c.data_source_line();
  return o.str();
}

}  // namespace

void check_diverse_groups(LoadContext& ctx, const Project& project) {
  for (const auto& sif : project.sifs)
    for (const auto& sub : sif.subsystems) {
      if (!sub.diverse || sub.is_vendor() || sub.channels.size() < 2) continue;
      // A channel is the multiset of its components' identities (series order does not matter).
      std::vector<std::vector<std::string>> channels;
      for (const auto& ch : sub.channels) {
        std::vector<std::string> ids;
        for (std::size_t index : ch.components) ids.push_back(identity(project.components.at(index)));
        std::sort(ids.begin(), ids.end());
        channels.push_back(std::move(ids));
      }
      const bool identical =
          std::all_of(channels.begin(), channels.end(), [&](const auto& c) { return c == channels.front(); });
      if (!identical) continue;
      std::string names;
      for (std::size_t i = 0; i < sub.channels.size(); ++i) {
        std::string channel;
        for (const auto& id : sub.channels[i].component_ids) channel += (channel.empty() ? "" : "+") + id;
        names += (i == 0 ? "" : i + 1 == sub.channels.size() ? " and " : ", ") + channel;
      }
      const Component& first = project.components.at(sub.channels.front().components.front());
      const std::string same = first.model.empty()
                                   ? "the same failure data"
                                   : "the same library model \"" + first.model + "\" and no field that differs";
      ctx.error(0, sub.pointer + "/diverse",
                "channels that differ in what they are (IEC 61508-2:2010 7.4.3: diversity for SC N+1)",
                "identical channels " + names + ": " + same,
                "diversity shows as a different \"model\", \"manufacturer\" or technology (and so different "
                "failure data) in each channel; a diversity note alone does not make identical devices diverse. "
                "If they are the same device, remove \"diverse\"");
    }
}

}  // namespace sifter::detail
