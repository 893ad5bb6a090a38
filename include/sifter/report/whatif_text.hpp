#pragma once
/// Terminal text of the what-if commands; each ends with the caution. `width` is the terminal's
/// (the CLI passes its width); prose stops at 96 columns, tables give way as check's do.
#include <cstddef>
#include <string>

#include "sifter/results/whatif.hpp"

namespace sifter::report {

/// `sifter interval`: the requirement, today's figure, the longest interval and the months.
std::string render_interval(const IntervalResult& result, std::size_t width = 96);

/// `sifter sweep`: one row per value with PFDavg (or PFH), RRF, SIL and the verdict.
std::string render_sweep(const SweepResult& result, std::size_t width = 96);

/// `sifter compare`: one row per vote, side by side.
std::string render_compare(const CompareResult& result, std::size_t width = 96);

/// `sifter sensitivity`: the tornado table, widest swing first, with a bar per input.
std::string render_sensitivity(const SensitivityResult& result, std::size_t width = 96);

/// A what-if value for people: a duration in its natural unit, a fraction in percent, a
/// factor as "2x", a rate per hour in scientific notation.
std::string what_if_value(double value, const std::string& unit);

}  // namespace sifter::report
