#pragma once
/// The difference of two projects and their results, as results.
/// Plain data of the results contract: the standard library and the model only.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"

namespace sifter {

/// Numbers closer than this (relatively) are the same value: unit conversions round.
inline constexpr double kDiffRelTol = 1e-9;

/// A compared value: a number in the unit of its change, or a text (a vote, a target, tags).
struct DiffValue {
  std::optional<double> number;
  std::string text;  ///< used when number is empty
};

/// One input that differs between the revisions.
struct InputChange {
  std::string pointer;                 ///< JSON pointer in the new revision (the old one for what was removed)
  std::string what;                    ///< "lambda_du of XV-401", "frequency of cause C1"
  std::string unit;                    ///< "/h" component rates, "h" durations, "/yr" frequencies, "" otherwise
  std::optional<DiffValue> old_value;  ///< empty: added in the new revision
  std::optional<DiffValue> new_value;  ///< empty: removed in the new revision
};

/// One result that differs between the revisions.
struct ResultChange {
  std::string quantity;  ///< the results key: "required_rrf", "pfd_avg", "sil_achieved", "meets_target", ...
  std::optional<DiffValue> old_value;
  std::optional<DiffValue> new_value;
  std::string unit;  ///< "/yr", "/h", or empty for a pure number, a SIL or a verdict
};

/// How a verdict (meets target, tolerable) moved.
enum class VerdictChange {
  kNone,
  kWorsened,  ///< now falls short (and did not before, or is new)
  kImproved,  ///< fell short before and now meets it
  kOther,     ///< judged before and not now, or the other way round
};

/// "none", "worsened", "improved", "changed".
std::string to_string(VerdictChange change);

/// Whether a SIF or scenario is in both revisions.
enum class Presence { kBoth, kAdded, kRemoved };

/// "both", "added", "removed".
std::string to_string(Presence presence);

/// The changes of one SIF or one scenario.
struct FunctionDiff {
  std::string id;
  Presence presence = Presence::kBoth;
  std::optional<bool> old_verdict;  ///< meets target (SIF) or tolerable (scenario); empty: not judged
  std::optional<bool> new_verdict;
  VerdictChange verdict = VerdictChange::kNone;
  std::vector<InputChange> inputs;  ///< its own inputs, and for a SIF the components it uses
  std::vector<ResultChange> results;
  std::vector<std::string> related;  ///< a SIF: the scenarios feeding it whose inputs changed
  [[nodiscard]] bool changed() const { return presence != Presence::kBoth || !inputs.empty() || !results.empty(); }
};

/// How the overpressure verdict of one equipment item moved between the revisions.
struct EquipmentDiff {
  std::string id;
  std::optional<std::string> old_category;  ///< empty: not screened in that revision
  std::optional<std::string> new_category;
  std::optional<double> old_max_pressure_barg;
  std::optional<double> new_max_pressure_barg;
  bool old_preliminary = false;
  bool new_preliminary = false;
};

/// Two revisions compared.
struct ProjectDiff {
  std::string old_file;
  std::string new_file;
  /// Verdict changes first (worsened, improved, other), then other changes, then the unchanged,
  /// each group in the new revision's order.
  std::vector<FunctionDiff> sifs;
  std::vector<FunctionDiff> scenarios;
  std::vector<InputChange> project_inputs;  ///< defaults, basis, risk criteria, components no SIF uses
  std::vector<EquipmentDiff> equipment;     ///< overpressure verdicts that moved
  /// Some SIF or scenario verdict worsened.
  [[nodiscard]] bool any_worsened() const;
};

}  // namespace sifter
