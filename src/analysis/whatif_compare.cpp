// Compare votes: the same subsystem re-voted with identical channels, verified as check would.
#include <algorithm>

#include "analysis/whatif_parts.hpp"
#include "sifter/analysis/whatif.hpp"
#include "sifter/model/format.hpp"

namespace sifter {
namespace {

// Keeps the first channels and adds copies of channel 0 (components copied with derived ids).
void revote(Project& project, Subsystem& sub, const Vote& vote) {
  const Channel first = sub.channels.front();
  sub.channels.resize(std::min<std::size_t>(sub.channels.size(), static_cast<std::size_t>(vote.n)));
  while (sub.channels.size() < static_cast<std::size_t>(vote.n)) {
    Channel copy = first;
    copy.pointer = "(copy of " + first.pointer + ")";
    for (std::size_t i = 0; i < copy.components.size(); ++i) {
      copy.components[i] = detail::copy_component(project, first.components[i]);
      copy.component_ids[i] = project.components[copy.components[i]].id;
    }
    sub.channels.push_back(std::move(copy));
  }
  sub.vote = vote;
}

bool same_vote(const Vote& a, const Vote& b) { return a.k == b.k && a.n == b.n && a.diagnostic == b.diagnostic; }

}  // namespace

bool vote_is_redundant(const Vote& vote) { return vote.k < vote.n || vote.diagnostic; }

CompareResult compare_votes(const WhatIf& what_if, std::size_t sif, std::size_t subsystem,
                            const std::vector<Vote>& votes, std::optional<double> beta) {
  const Project& base = what_if.project();
  const Sif& s = base.sifs.at(sif);
  const Subsystem& sub = s.subsystems.at(subsystem);
  if (sub.is_vendor() || sub.channels.empty())
    throw UsageError("subsystem " + detail::quoted_name(sub.name) + " of " + s.id +
                     " is a figure from the safety manual; it has no channels to re-vote");
  if (beta && !(*beta >= 0.0 && *beta <= 1.0)) throw UsageError("beta must be a fraction from 0 to 1");
  for (const auto& v : votes)
    if (vote_is_redundant(v) && !beta && sub.beta <= 0.0)
      throw UsageError("subsystem " + detail::quoted_name(sub.name) + " has no beta, and the redundant vote " +
                       v.text() + " needs one: give a common-cause fraction with --beta (for example --beta 5%)");

  CompareResult out;
  out.sif = s.id;
  out.subsystem = sub.name;
  out.subsystem_index = subsystem;
  for (const auto& v : votes) {
    Project p = base;
    Subsystem& target = p.sifs[sif].subsystems[subsystem];
    if (beta) {
      if (target.beta_d_defaulted || target.beta <= 0.0) target.beta_d = *beta;
      target.beta = *beta;
    }
    revote(p, target, v);
    out.rows.push_back({v.text(), same_vote(v, sub.vote), what_if.verify(p, sif)});
  }
  out.mode = out.rows.empty() ? s.demand_mode() : out.rows.front().result.demand_mode;
  out.notes.push_back("channels beyond the subsystem's own are identical copies of channel 0, with components " +
                      std::string("named <id>~2, <id>~3, ...; a smaller vote keeps the first channels"));
  if (beta)
    out.notes.push_back("beta " + sifter::figure(*beta * 100) + "% used for every vote" +
                        (sub.beta_d_defaulted || sub.beta <= 0.0 ? " (beta_D the same)" : "; beta_D as stated"));
  else
    out.notes.push_back("beta " + sifter::figure(sub.beta * 100) + "% and beta_D " + sifter::figure(sub.beta_d * 100) +
                        "% as in the project");
  if (sub.ccf_scaling == CcfScaling::kIec61508TableD5)
    out.notes.push_back("beta scaled per vote by IEC 61508-6:2010 Table D.5 where it has a cell");
  return out;
}

}  // namespace sifter
