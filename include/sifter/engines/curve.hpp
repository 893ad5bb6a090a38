#pragma once
/// PFD(t): the instantaneous probability of failure on demand of a SIF over its mission, as the
/// report draws it. Pure functions: no I/O.
///
/// Two engines can fill a PfdPlot: the exact time-dependent engine (markov.hpp, once wired) and
/// simplified_curve() below, a sawtooth built from the same group data as the Annex B equations.
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "sifter/engines/simplified.hpp"
#include "sifter/model/model.hpp"
#include "sifter/results/report.hpp"

namespace sifter {

/// Instantaneous PFD of one channel of a group at time t (hours), its rates scaled by
/// `undetected_factor` (lDU) and `detected_factor` (lDD): for each test slice
/// share lDU ((t mod T) + MRT), plus lDD MTTR. Its mean over T is the Annex B 1oo1 form
/// lDU (T/2 + MRT) + lDD MTTR (IEC 61508-6:2010 B.3.2.2.1). `just_before_test` takes the left
/// limit at a test instant (t mod T = T instead of 0).
double channel_pfd_at(const GroupData& group, double t_hours, bool just_before_test, double undetected_factor = 1.0,
                      double detected_factor = 1.0);

/// Instantaneous PFD of a KooN group at time t (hours): with m = N - K + 1 channel failures
/// failing it, the binomial sum over j >= m of C(N, j) q^j (1 - q)^(N - j) of the independent
/// channel PFD q (rates x (1 - beta), x (1 - beta_D)), plus the common-cause term
/// beta lDU ((t mod T) + MRT) + beta_D lDD MTTR; for m = 1 (NooN) 1 - (1 - q)^N with the whole
/// rates and no separate common-cause term, as the Annex B forms treat NooN. 1oo2D is drawn as
/// 1oo2. Its mean over a test interval reproduces the Annex B 1oo1 and 1oo2 forms exactly when
/// the rates are constant over the interval (undetected failures only for 1oo2), and 2oo3 to
/// first order in lDU T (common practice; see tests/curve_test.cpp).
double group_pfd_at(const GroupData& group, double t_hours, bool just_before_test);

/// At most this many test instants are resolved (before and after) in a curve; beyond that the
/// curve keeps only its uniform samples.
inline constexpr std::size_t kMaxCurveTestInstants = 2000;

/// One subsystem as the curve sees it: its group data, or a supplier's figure drawn flat
/// (a safety-manual PFDavg has no time profile).
struct CurveSubsystem {
  std::optional<GroupData> group;
  double flat_pfd = 0.0;  ///< the supplier's PFDavg, used when there is no group data
};

/// The sawtooth PFD(t) of every subsystem of a SIF and of the SIF (their sum, IEC 61508-6:2010
/// B.2.2 rare-event approximation) over `mission`, with `uniform_samples` (at least 2) evenly
/// spaced instants plus each test instant before and after.
PfdPlot simplified_curve(const std::vector<CurveSubsystem>& subsystems, Duration mission,
                         std::size_t uniform_samples = 400);

/// simplified_curve() for one SIF of a project: group data from group_data_for (group_model), a
/// supplier's PFDavg drawn flat, the project's mission time.
PfdPlot simplified_curve(const Project& project, const Sif& sif, std::size_t uniform_samples = 400);

}  // namespace sifter
