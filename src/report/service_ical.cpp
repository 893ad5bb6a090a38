// The due proof tests as iCalendar (RFC 5545): CRLF lines folded at 75 octets, escaped TEXT.
#include "sifter/report/service.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::report {

std::string escape_ical_text(std::string_view text) {
  // RFC 5545 3.3.11: "\\" for a backslash, "\;" "\," for the separators, "\n" for a line break.
  std::string out;
  for (char c : text) {
    switch (c) {
      case '\\':
        out += "\\\\";
        break;
      case ';':
        out += "\\;";
        break;
      case ',':
        out += "\\,";
        break;
      case '\n':
        out += "\\n";
        break;
      case '\r':
        break;
      default:
        out += c;
    }
  }
  return out;
}

std::string fold_ical_line(std::string_view line) {
  // RFC 5545 3.1: lines SHOULD NOT be longer than 75 octets excluding the line break; a long
  // line is split by CRLF followed by one space, which counts towards the next line's 75.
  constexpr std::size_t kMaxOctets = 75;
  std::string out;
  std::size_t start = 0, limit = kMaxOctets;
  while (line.size() - start > limit) {
    std::size_t cut = start + limit;
    while (cut > start && (static_cast<unsigned char>(line[cut]) & 0xC0) == 0x80) --cut;  // whole UTF-8 characters
    out.append(line.substr(start, cut - start));
    out += "\r\n ";
    start = cut;
    limit = kMaxOctets - 1;  // the leading space is the continuation line's first octet
  }
  out.append(line.substr(start));
  return out + "\r\n";
}

std::string service_ics(const ServiceResult& r) {
  std::string out;
  auto line = [&](const std::string& text) { out += fold_ical_line(text); };
  line("BEGIN:VCALENDAR");
  line("VERSION:2.0");
  line("PRODID:-//sifter//proof-test schedule//EN");
  line("CALSCALE:GREGORIAN");
  line("METHOD:PUBLISH");
  // DTSTAMP is the as-of date at midnight UTC, so that the same records give the same file.
  const std::string stamp = to_basic_iso(r.as_of) + "T000000Z";
  for (const auto& row : r.schedule) {
    std::string sifs;
    for (const auto& s : row.sifs) sifs += (sifs.empty() ? "" : ", ") + s;
    line("BEGIN:VEVENT");
    line("UID:" + escape_ical_text(row.component) + "-" + to_basic_iso(row.next_due) + "@sifter-proof-test");
    line("DTSTAMP:" + stamp);
    line("DTSTART;VALUE=DATE:" + to_basic_iso(row.next_due));
    line("DTEND;VALUE=DATE:" + to_basic_iso(add_days(row.next_due, 1)));
    line("SUMMARY:" + escape_ical_text(std::string(row.overdue ? "OVERDUE: " : "") + "proof test of " + row.component +
                                       " (" + sifs + ")"));
    line("DESCRIPTION:" +
         escape_ical_text(
             "Proof test of " + row.component + " for " + sifs + "; interval " +
             format_duration(Duration{row.interval_hours}) + "; last test " +
             (row.last_test ? to_iso(*row.last_test) : "none (in service since " + to_iso(row.in_service_since) + ")") +
             "; due " + to_iso(row.next_due) + (row.overdue ? ", OVERDUE on " + to_iso(r.as_of) : "") + ".\n" +
             kCaution));
    line("CATEGORIES:proof test,safety instrumented function");  // a list: the comma separates
    line("TRANSP:TRANSPARENT");
    line("END:VEVENT");
  }
  line("END:VCALENDAR");
  return out;
}

}  // namespace sifter::report
