// The terminal's lines on a SIF's stated requirements.
#include "sifter/report/requirements_text.hpp"

#include <algorithm>

#include "sifter/model/format.hpp"
#include "sifter/model/vocabulary.hpp"
#include "sifter/report/text_table.hpp"

namespace sifter::report {

std::string requirements_lines(const SifResult& s, std::size_t width) {
  if (s.requirement_checks.empty() && !s.response_time_s) return "";
  const std::size_t text_width = prose_width(width) - 4;  // after the indent
  std::string out = "  requirements\n";
  if (s.response_time_s && !s.response_time_limit_s)
    out += wrap("response time " + format_seconds(*s.response_time_s) + " (no process safety time stated)", text_width,
                "    ");
  for (const auto& c : s.requirement_checks)
    out += wrap(std::string(c.ok ? "[ok] " : "[FAILS] ") + c.message, text_width, "    ");
  return out;
}

}  // namespace sifter::report
