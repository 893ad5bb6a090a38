#pragma once
/// The loader's part for the "pressure" and "options" sections and data maturity (internals).
#include "input/json_reader.hpp"
#include "sifter/engines/pressure.hpp"
#include "sifter/model/model.hpp"

namespace sifter::detail {

/// Reads an optional "status": "estimate" | "vendor" | "as_built" (default vendor).
DataStatus read_status(ObjectReader& r);

/// Reads "pressure" and "options" (their scenario references are checked later).
void read_pressure(LoadContext& ctx, const Json& root, Project& project);

/// Screens the pressure section, appends the generated scenarios to project.scenarios (so
/// that every engine sees them as it sees a written one), and checks the options' references.
/// Call once the rest of the project loaded without problems.
std::optional<PressureScreening> screen_and_generate(LoadContext& ctx, Project& project);

}  // namespace sifter::detail
