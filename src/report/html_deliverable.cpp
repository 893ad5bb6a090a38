// The deliverable's HTML parts shared by the report and the SRS.
#include "sifter/report/html_deliverable.hpp"

#include <cstdio>
#include <cstdlib>

#include "sifter/report/svg.hpp"

namespace sifter::report {
namespace {

std::string esc(const std::string& text) { return escape_html(text); }

// "/sifs/12/subsystems/1" -> {12, "/subsystems/1"}; nullopt when `where` does not start with `head`.
std::optional<std::pair<std::size_t, std::string>> index_after(const std::string& where, const std::string& head) {
  if (where.rfind(head, 0) != 0) return std::nullopt;
  const std::size_t start = head.size();
  std::size_t end = start;
  while (end < where.size() && where[end] >= '0' && where[end] <= '9') ++end;
  if (end == start || end - start > 9) return std::nullopt;
  return std::pair{static_cast<std::size_t>(std::strtoul(where.substr(start, end - start).c_str(), nullptr, 10)),
                   where.substr(end)};
}

}  // namespace

const char* tone_class(Tone tone) {
  switch (tone) {
    case Tone::kGood:
      return "good";
    case Tone::kBad:
      return "bad";
    case Tone::kNeutral:
      return "neutral";
    case Tone::kPlain:
      return "";
  }
  return "";
}

std::string html_table(const Table& t) {
  std::string out =
      t.caption.empty() ? "<table>\n<thead><tr>" : "<table>\n<caption>" + esc(t.caption) + "</caption>\n<thead><tr>";
  for (std::size_t i = 0; i < t.header.size(); ++i) {
    const bool num = i < t.numeric.size() && t.numeric[i];
    out += std::string(num ? "<th class=\"num\">" : "<th>") + esc(t.header[i]) + "</th>";
  }
  out += "</tr></thead>\n<tbody>\n";
  for (const auto& row : t.rows) {
    out += "<tr>";
    for (std::size_t i = 0; i < row.size(); ++i) {
      const bool key = t.keys.empty() ? i == 0 : i < t.keys.size() && t.keys[i];
      std::string cls = i < t.numeric.size() && t.numeric[i] ? "num" : key ? "key" : "";
      const std::string tone = tone_class(row[i].tone);
      if (!tone.empty()) cls += (cls.empty() ? "" : " ") + tone;
      out += (cls.empty() ? "<td>" : "<td class=\"" + cls + "\">") + esc(row[i].text) + "</td>";
    }
    out += "</tr>\n";
  }
  return out + "</tbody>\n</table>\n";
}

const char* deliverable_css() {
  return R"css(
.doc-control { border: 1.5px solid var(--ink); padding: 2mm 4mm; margin: 3mm 0 4mm; }
.doc-control .doc-id { font-size: 12pt; font-weight: 700; margin: 0 0 1mm; }
table.signatures td { height: 11mm; }
td.bad.open, .open-items li { color: var(--bad); }
table.wide { font-size: 8pt; }
table.wide td { overflow-wrap: anywhere; }
@media print {
  section.components { break-before: page; }
  body.compact section.sif, body.compact section.scenario { break-before: auto; }
  /* The register: smaller type, tighter spacing, smaller drawings, tables that may continue on
     the next page (a row never splits), so that a SIF takes well under two A4 pages. */
  body.compact { font-size: 8.5pt; line-height: 1.3; }
  body.compact table, body.compact .caution { break-inside: auto; }
  body.compact tr { break-inside: avoid; }
  body.compact svg.fig { max-height: 50mm; }
  body.compact h2 { font-size: 12.5pt; }
  body.compact h3 { margin: 3mm 0 1mm; font-size: 10pt; }
  body.compact section { margin-top: 5mm; }
  body.compact table { margin: 1mm 0 2.5mm; font-size: 8pt; }
  body.compact th, body.compact td { padding-top: 0.5mm; padding-bottom: 0.5mm; }
  body.compact figure { margin: 1.5mm 0 2.5mm; }
  body.compact .verdict { font-size: 10.5pt; margin: 1mm 0; padding: 1mm 2.5mm; }
  body.compact ul li { margin-bottom: 0.3mm; }
}
)css";
}

std::string document_control_html(const DeliverableData& data) {
  if (!data.document)
    return "<p class=\"absent\">No document control stated: give the project a \"document\" with its number, "
           "revision, date and who prepared, checked and approved it.</p>\n";
  const DocumentControl& d = *data.document;
  std::string out = "<div class=\"doc-control\">\n<p class=\"doc-id\">Document " + esc(d.number) + ", revision " +
                    esc(d.revision) + (d.date.empty() ? "" : ", " + esc(d.date)) + "</p>\n";
  std::string table = html_table(signature_table(d));
  table.replace(0, 7, "<table class=\"signatures\">");
  out += table;
  if (!d.history.empty()) out += html_table(revision_table(d));
  return out + "</div>\n";
}

std::string css_string(const std::string& text) {
  std::string out;
  for (const char ch : text) {
    const auto c = static_cast<unsigned char>(ch);
    if (c == '"' || c == '\\' || c == '<' || c == '>' || c == '&' || c < 0x20 || c == 0x7f) {
      char buf[8];
      std::snprintf(buf, sizeof buf, "\\%X ", static_cast<unsigned>(c));  // a hex escape ends at its space
      out += buf;
    } else {
      out += ch;
    }
  }
  return out;
}

// Chromium prints the page-margin boxes of CSS Paged Media on every page (a position: fixed
// element is not placed reliably on every printed page: it went missing on long prints).
std::string print_footer_css(const DeliverableData& data, const std::string& kind) {
  std::string text = kind;
  if (data.document)
    text += " · document " + data.document->number + " revision " + data.document->revision;
  else
    text += " · no document number stated";
  const std::string box =
      "font-family: sans-serif; font-size: 7.5pt; color: #4d4d4d; vertical-align: top; "
      "padding-top: 2.5mm;";
  return "\n@page { @bottom-left { content: \"" + css_string(text) + "\"; " + box +
         " }\n  @bottom-right { content: \"page \" counter(page) \" of \" counter(pages); " + box + " } }\n";
}

std::string component_data_html(const DeliverableData& data) {
  std::string out = "<section class=\"components\" id=\"component-data\">\n<h2>Component data</h2>\n";
  out +=
      "<p class=\"facts\">Every component of the project with the failure data the figures used and their "
      "source. A component without a source is flagged: its data cannot be traced.</p>\n";
  std::string table = html_table(component_data_table(data));
  table.replace(0, 7, "<table class=\"wide\">");
  return out + table + "</section>\n";
}

std::string sif_requirements_html(const SifResult& sif, const SifDeliverable& data) {
  std::string out;
  out += html_table(subsystem_parameters_table(sif, data));
  if (!sif.requirement_checks.empty() || sif.response_time_s) {
    out += "<h3>Stated requirements</h3>\n";
    if (!sif.requirement_checks.empty()) out += html_table(requirement_checks_table(sif));
    if (sif.response_time_s) out += html_table(response_budget_table(sif));
  }
  return out;
}

std::string place_name(const ProjectResult& result, const DeliverableData& data, const std::string& where) {
  if (auto s = index_after(where, "/sifs/"); s && s->first < result.sifs.size()) {
    const SifResult& sif = result.sifs[s->first];
    if (auto sub = index_after(s->second, "/subsystems/"); sub && sub->first < sif.subsystems.size())
      return sif.id + ", subsystem '" + sif.subsystems[sub->first].name + "'" +
             (sub->second.empty() ? "" : " (" + sub->second.substr(1) + ")");
    return sif.id + (s->second.empty() ? "" : " (" + s->second.substr(1) + ")");
  }
  if (auto s = index_after(where, "/scenarios/"); s && s->first < result.scenarios.size())
    return result.scenarios[s->first].id + (s->second.empty() ? "" : " (" + s->second.substr(1) + ")");
  if (auto c = index_after(where, "/components/"); c && c->first < data.components.size())
    return data.components[c->first].id + (c->second.empty() ? "" : " (" + c->second.substr(1) + ")");
  return where;
}

}  // namespace sifter::report
