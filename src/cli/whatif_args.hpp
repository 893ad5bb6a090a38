#pragma once
// Command-line values shared by the what-if commands: picking a SIF and a subsystem, reading
// fractions, durations and votes, and writing the outputs.
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "sifter/analysis/whatif.hpp"
#include "sifter/model/model.hpp"

namespace sifter::cli {

/// The index of the SIF with this id; a UsageError listing the project's ids otherwise.
std::size_t sif_index(const Project& project, const std::string& id);

/// The index of the named subsystem of the SIF (empty name: none); a UsageError listing the
/// SIF's subsystems otherwise.
std::optional<std::size_t> subsystem_index(const Sif& sif, const std::string& name);

/// A number for an option; UsageError naming the option when it is not one.
double number_arg(const std::string& option, const std::string& text);

/// A fraction for an option: 0.05 or "5%".
double fraction_arg(const std::string& option, const std::string& text);

/// A duration for an option, "6 mo", "8 h", "2 yr" (parse_duration), in hours.
double duration_arg(const std::string& option, const std::string& text);

/// A sweep value for an option in the parameter's own terms: a duration, a fraction or a factor.
double sweep_value_arg(SweepParameter parameter, const std::string& option, const std::string& text);

/// Votes written "1oo1,1oo2,2oo3" (or "1oo2D"); UsageError on any other text.
std::vector<Vote> votes_arg(const std::string& text);

/// Writes the JSON (when a path is given) and prints the text unless the JSON goes to stdout.
/// Everything is rendered by the caller first, so that a failure leaves no partial output.
void emit(const std::string& json_path, const std::string& json_text, const std::string& text);

}  // namespace sifter::cli
