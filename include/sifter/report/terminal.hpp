#pragma once
/// The terminal summary of `sifter check`.
#include <cstddef>
#include <string>
#include <vector>

#include "sifter/results/project.hpp"

namespace sifter::report {

/// Above this many SIFs `check` prints one line per SIF (and per scenario) instead of full
/// blocks: a register of hundreds of functions then reads on a few screens.
inline constexpr std::size_t kSummaryAboveSifs = 20;

/// How the terminal summary is laid out.
struct TerminalOptions {
  std::size_t width = 100;        ///< columns of the terminal; tables and text fit inside
  std::vector<std::string> sifs;  ///< show only these SIFs (full blocks) and the scenarios that feed them
  bool summary = false;           ///< one line per SIF even on a small project
};

/// Whether the text of a project of `sifs` SIFs shows full blocks, the scenarios' LOPA worksheets
/// among them (a small project, or SIFs chosen by id), rather than one line per SIF and scenario.
bool shows_full_blocks(std::size_t sifs, const TerminalOptions& options);

/// Plain text fitted to `options.width`; verdicts in words so that it reads without colour.
/// Ends with the counts, the SIFs and scenarios that fall short (of the whole project, also
/// when filtered) and the caution.
std::string render_terminal(const ProjectResult& result, const TerminalOptions& options = {});

/// One SIF's block of the summary.
std::string render_sif(const SifResult& sif, std::size_t width = 100);

/// The caution, wrapped to the given width.
std::string wrapped_caution(std::size_t width = 96);

}  // namespace sifter::report
