#pragma once
/// Writing outputs whole or not at all.
#include <string>
#include <vector>

namespace sifter::report {

/// Writes `content` to `path` through a temporary file in the same folder renamed into place,
/// so an interrupted run leaves the old file or none, never half of one. "-" writes to stdout.
/// Throws OutputError when the folder cannot be written.
void write_output(const std::string& path, const std::string& content);

/// Throws UsageError when an output path names one of the inputs (the tool never overwrites
/// what it reads).
void refuse_overwriting_inputs(const std::vector<std::string>& outputs, const std::vector<std::string>& inputs);

}  // namespace sifter::report
