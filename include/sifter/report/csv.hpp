#pragma once
/// One CSV row per SIF with its key results, for spreadsheets (RFC 4180 quoting).
#include <string>

#include "sifter/results/project.hpp"

namespace sifter::report {

/// The header and one row per SIF; numbers with six significant digits, empty where absent;
/// lines end in CRLF as RFC 4180 asks.
std::string sif_csv(const ProjectResult& result);

}  // namespace sifter::report
