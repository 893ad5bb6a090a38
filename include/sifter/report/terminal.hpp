#pragma once
/// The terminal summary of `sifter check`.
#include <string>

#include "sifter/verify.hpp"

namespace sifter::report {

/// Plain text, 100 columns at most; verdicts in words so that it reads without colour.
std::string render_terminal(const ProjectResult& result);

/// One SIF's block of the summary.
std::string render_sif(const SifResult& sif);

/// The caution, wrapped to the given width.
std::string wrapped_caution(std::size_t width = 96);

}  // namespace sifter::report
