// Formatting of input diagnostics for people.
#include "sifter/model/diagnostics.hpp"

#include <utility>

namespace sifter {

namespace {
// Fields quote the input; a hostile input (a key of 10 MB) must not make a message of megabytes.
constexpr std::size_t kMaxFieldBytes = 400;

std::string shortened(const std::string& text) {
  if (text.size() <= kMaxFieldBytes) return text;
  std::size_t cut = kMaxFieldBytes;
  while (cut > 0 && (static_cast<unsigned char>(text[cut]) & 0xC0) == 0x80) --cut;  // keep UTF-8 whole
  return text.substr(0, cut) + "... (" + std::to_string(text.size()) + " bytes)";
}
}  // namespace

std::string format_diagnostic(const Diagnostic& d) {
  std::string out = shortened(d.file);
  if (d.line > 0) out += ":" + std::to_string(d.line) + ":" + std::to_string(d.column);
  out += ": ";
  if (!d.pointer.empty()) out += shortened(d.pointer) + ": ";
  out += "expected " + shortened(d.expected);
  if (!d.found.empty()) out += ", found " + shortened(d.found);
  if (!d.hint.empty()) out += "\n  hint: " + shortened(d.hint);
  return out;
}

namespace {
std::string summarise(const std::vector<Diagnostic>& diagnostics, std::size_t follow_ons) {
  std::string out;
  for (const auto& d : diagnostics) out += format_diagnostic(d) + "\n";
  out += std::to_string(diagnostics.size()) + (diagnostics.size() == 1 ? " problem" : " problems") + " in the input";
  if (follow_ons > 0)
    out += " (" + std::to_string(follow_ons) + (follow_ons == 1 ? " problem that follows" : " problems that follow") +
           " only from " + (diagnostics.size() == 1 ? "it" : "these") + " not shown)";
  out += "; nothing was computed or written";
  return out;
}
}  // namespace

InputError::InputError(std::vector<Diagnostic> diagnostics, std::size_t follow_ons_suppressed)
    : Error(summarise(diagnostics, follow_ons_suppressed), ExitCode::kBadInput),
      diagnostics_(std::move(diagnostics)),
      follow_ons_suppressed_(follow_ons_suppressed) {}

}  // namespace sifter
