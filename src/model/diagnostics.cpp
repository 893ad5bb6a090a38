// Formatting of input diagnostics for people.
#include "sifter/model/diagnostics.hpp"

#include <algorithm>
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

std::string nearest(const std::string& word, const std::vector<std::string>& known) {
  std::string best;
  std::size_t best_distance = 4;
  for (const auto& k : known) {
    // The distance is at least the difference in length: skip hopeless candidates, so that a
    // hostile 10 MB key costs one comparison of lengths, not a 10 MB x N table.
    const std::size_t length_gap = word.size() > k.size() ? word.size() - k.size() : k.size() - word.size();
    if (length_gap >= best_distance) continue;
    // Levenshtein distance, small strings only.
    std::vector<std::size_t> prev(k.size() + 1), cur(k.size() + 1);
    for (std::size_t j = 0; j <= k.size(); ++j) prev[j] = j;
    for (std::size_t i = 1; i <= word.size(); ++i) {
      cur[0] = i;
      for (std::size_t j = 1; j <= k.size(); ++j) {
        const std::size_t cost = word[i - 1] == k[j - 1] ? 0 : 1;
        cur[j] = std::min({prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + cost});
      }
      std::swap(prev, cur);
    }
    if (prev[k.size()] < best_distance) {
      best_distance = prev[k.size()];
      best = k;
    }
  }
  return best;
}

}  // namespace sifter
