// The deliverable's HTML parts shared by the report and the SRS.
#include "sifter/report/html_deliverable.hpp"

#include <cstdlib>

#include "sifter/report/svg.hpp"

namespace sifter::report {
namespace {

std::string esc(const std::string& text) { return escape_html(text); }

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

std::string html_table(const Table& t) {
  std::string out = "<table>\n<caption>" + esc(t.caption) + "</caption>\n<thead><tr>";
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
.doc-footer { display: none; }
table.wide { font-size: 8pt; }
table.wide td { overflow-wrap: anywhere; }
@media print {
  .doc-footer { display: block; position: fixed; bottom: -10mm; left: 0; right: 0; font-size: 8pt;
                color: var(--muted); border-top: 0.5px solid var(--rule); padding-top: 1mm; background: #ffffff; }
  section.components { break-before: page; }
  body.compact section.sif, body.compact section.scenario { break-before: auto; }
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

std::string print_footer_html(const DeliverableData& data, const std::string& kind) {
  std::string text = kind;
  if (data.document)
    text += " · document " + data.document->number + " revision " + data.document->revision;
  else
    text += " · no document number stated";
  return "<div class=\"doc-footer\">" + esc(text) + "</div>\n";
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
