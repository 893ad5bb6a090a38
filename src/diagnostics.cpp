// Formatting of input diagnostics for people.
#include "sifter/diagnostics.hpp"

#include <utility>

namespace sifter {

std::string format_diagnostic(const Diagnostic& d) {
  std::string out = d.file;
  if (d.line > 0) out += ":" + std::to_string(d.line) + ":" + std::to_string(d.column);
  out += ": ";
  if (!d.pointer.empty()) out += d.pointer + ": ";
  out += "expected " + d.expected;
  if (!d.found.empty()) out += ", found " + d.found;
  if (!d.hint.empty()) out += "\n  hint: " + d.hint;
  return out;
}

namespace {
std::string summarise(const std::vector<Diagnostic>& diagnostics) {
  std::string out;
  for (const auto& d : diagnostics) out += format_diagnostic(d) + "\n";
  out += std::to_string(diagnostics.size()) +
         (diagnostics.size() == 1 ? " problem" : " problems") + " in the input; nothing was computed or written";
  return out;
}
}  // namespace

InputError::InputError(std::vector<Diagnostic> diagnostics)
    : Error(summarise(diagnostics), ExitCode::kBadInput), diagnostics_(std::move(diagnostics)) {}

}  // namespace sifter
