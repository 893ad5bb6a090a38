#pragma once
/// The tables of the report, built once as plain text cells so that the HTML and Markdown
/// writers show the same cells. They format; they compute nothing about the results.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/vocabulary.hpp"
#include "sifter/results/project.hpp"
#include "sifter/results/report.hpp"

namespace sifter::report {

/// How a cell reads besides its words: a verdict is also told by colour in HTML.
enum class Tone { kPlain, kGood, kBad, kNeutral };

/// One cell: its text (words and, for verdicts, a symbol) and its tone.
struct Cell {
  std::string text;
  Tone tone = Tone::kPlain;
};

/// A table: a caption, a header and rows of the same width.
struct Table {
  std::string caption;
  std::vector<std::string> header;
  std::vector<bool> numeric;  ///< right-aligned columns
  std::vector<std::vector<Cell>> rows;
  std::vector<bool> keys = {};  ///< columns of short keys (ids, tags) kept on one line; empty: the first one
};

/// "✔ meets target", "✘ falls short" or "– not judged": words and a symbol, so that a verdict
/// reads without colour.
Cell sif_verdict(const std::optional<bool>& meets);
/// "✔ tolerable", "✘ not tolerable" or "– not judged".
Cell scenario_verdict(const std::optional<bool>& meets);
/// The limits of a SIF in a few words: "architecture at valve (XV-1): SIL 1; ...".
std::string limits_words(const SifResult& sif);
/// What keeps a SIF at its achieved SIL: its limits (kind, subsystem, element), else the
/// results that give the achieved SIL.
std::string limited_by(const SifResult& sif, const SifReportData& data);

/// Every SIF: mode, required and achieved SIL, PFDavg or PFH, RRF, verdict, what limits it.
Table sif_summary_table(const ProjectResult& result, const ReportData& data);
/// Every scenario: its SIF, frequency without the SIF, target, required RRF and SIL, the
/// frequency with the SIF, verdict.
Table scenario_summary_table(const ProjectResult& result);
/// The tolerable frequencies by category and severity.
Table risk_criteria_table(const RiskCriteria& criteria);
/// The three SILs of a SIF, the achieved and required SIL, which result limits it, the verdict.
Table sil_table(const SifResult& sif, const SifReportData& data);
/// The subsystems of a SIF with their figures and constraints.
Table subsystem_table(const SifResult& sif);
/// Present and longest allowed proof-test interval of each subsystem.
Table interval_table(const IntervalSweep& sweep);
/// The sensitivity rows as a table.
Table sensitivity_table(const std::vector<SensitivityRow>& rows);
/// The Monte Carlo summary.
Table uncertainty_table(const UncertaintyResult& u);
/// A scenario's worksheet: one row per step.
Table worksheet_table(const ScenarioResult& scenario);
/// Each equation used, written out, and what it was used for; also those behind the figures.
Table equations_table(const ProjectResult& result, const ReportData& data);
/// Components several SIFs share and devices several SIFs or scenarios rely on.
Table shared_table(const ProjectResult& result);

}  // namespace sifter::report
