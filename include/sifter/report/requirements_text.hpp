#pragma once
/// The terminal's lines on a SIF's stated requirements: response time and each computed check.
#include <cstddef>
#include <string>

#include "sifter/report/text_table.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::report {

/// "  requirements" and one wrapped line per check ("[ok]" or "[FAILS]"), within the terminal's
/// `width` and at most 96 columns; empty when the SIF states no requirement and no response
/// time is known.
std::string requirements_lines(const SifResult& s, std::size_t width = kProseWidth);

}  // namespace sifter::report
