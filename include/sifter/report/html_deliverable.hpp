#pragma once
/// The HTML of the deliverable's parts shared by the report and the SRS: document control on
/// the cover, the print footer, the component-data section, a SIF's requirements and subsystem
/// parameters, and warnings named by SIF, scenario or component id.
#include <string>

#include "sifter/report/deliverable_tables.hpp"

namespace sifter::report {

/// The style class of a cell's tone ("good", "bad", "neutral"; empty when plain).
const char* tone_class(Tone tone);
/// A table as every HTML document draws it (caption, header, tone classes), every text escaped;
/// a table without a caption has no caption element.
std::string html_table(const Table& table);
/// The extra style rules of these parts (signature block, print footer, open items).
const char* deliverable_css();
/// Document number, revision and date, the signature block and the revision history; a note
/// saying none is stated when the project has no "document".
std::string document_control_html(const DeliverableData& data);
/// Style rules that print a footer on every page (CSS page-margin boxes): the kind of document,
/// its number and revision at the left, "page N of M" at the right. The text is a CSS string with
/// every quote, backslash, angle bracket, ampersand and control character escaped, so that no
/// text of the project can end the string or the style sheet.
std::string print_footer_css(const DeliverableData& data, const std::string& kind);
/// Text as the content of a double-quoted CSS string (escapes as above).
std::string css_string(const std::string& text);
/// The component-data section (id "component-data").
std::string component_data_html(const DeliverableData& data);
/// A SIF's stated requirements, their checks, the response budget and its subsystem parameters.
std::string sif_requirements_html(const SifResult& sif, const SifDeliverable& data);
/// A warning's place by id: "/sifs/2/target" reads "SIF-403 (target)", "/components/4" reads
/// the component's id; other places stay as written.
std::string place_name(const ProjectResult& result, const DeliverableData& data, const std::string& where);

}  // namespace sifter::report
