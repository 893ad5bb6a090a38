// The safety requirements specification written out: a self-contained HTML page or Markdown.
#include "sifter/report/html_deliverable.hpp"
#include "sifter/report/html_style.hpp"
#include "sifter/report/markdown.hpp"
#include "sifter/report/srs.hpp"
#include "sifter/report/svg.hpp"

namespace sifter::report {
namespace {

std::string esc(const std::string& text) { return escape_html(text); }

std::string title_of(const ProjectResult& r) { return r.title.empty() ? r.file : r.title; }

std::string srs_anchor(std::size_t i) { return "srs-" + std::to_string(i + 1); }

std::string blocks_html(const std::vector<SrsBlock>& blocks) {
  std::string out;
  for (const auto& b : blocks) {
    switch (b.kind) {
      case SrsBlock::Kind::kHeading:
        out += "<h3>" + esc(b.text) + "</h3>\n";
        break;
      case SrsBlock::Kind::kParagraph:
        out += "<p>" + esc(b.text) + "</p>\n";
        break;
      case SrsBlock::Kind::kTable:
        out += html_table(b.table);
        break;
      case SrsBlock::Kind::kList:
      case SrsBlock::Kind::kOpenItems:
        out += b.kind == SrsBlock::Kind::kOpenItems ? "<ul class=\"open-items\">\n" : "<ul>\n";
        for (const auto& i : b.items) out += "<li>" + esc(i) + "</li>\n";
        out += "</ul>\n";
        break;
    }
  }
  return out;
}

std::string blocks_markdown(const std::vector<SrsBlock>& blocks) {
  std::string out;
  for (const auto& b : blocks) {
    switch (b.kind) {
      case SrsBlock::Kind::kHeading:
        out += "### " + escape_markdown(b.text) + "\n\n";
        break;
      case SrsBlock::Kind::kParagraph:
        out += escape_markdown(b.text) + "\n\n";
        break;
      case SrsBlock::Kind::kTable:
        out += markdown_table(b.table);
        break;
      case SrsBlock::Kind::kList:
      case SrsBlock::Kind::kOpenItems:
        for (const auto& i : b.items)
          out += std::string(b.kind == SrsBlock::Kind::kOpenItems ? "- [ ] " : "- ") + escape_markdown(i) + "\n";
        out += "\n";
        break;
    }
  }
  return out;
}

}  // namespace

std::string render_srs_html(const ProjectResult& r, const DeliverableData& d, const SrsOptions& o) {
  std::string out = "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n";
  out += "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n";
  out += "<title>" + esc(title_of(r)) + ": safety requirements specification</title>\n";
  out += "<style>" + std::string(html_style()) + deliverable_css() +
         print_footer_css(d, "Safety requirements specification") + "</style>\n</head>\n<body>\n";
  out += "<header>\n<p class=\"kind\">Safety requirements specification of the safety instrumented functions</p>\n";
  out += "<h1>" + esc(title_of(r)) + "</h1>\n<dl class=\"meta\">\n";
  out += "<dt>date of the run</dt><dd>" + esc(o.date) + "</dd>\n";
  out += "<dt>input file</dt><dd>" + esc(r.file) + "</dd>\n";
  out += "<dt>SHA-256 of the input</dt><dd class=\"mono\">" + esc(r.sha256) + "</dd>\n";
  out += "<dt>tool</dt><dd>sifter " + esc(o.tool_version) + "</dd>\n</dl>\n";
  out += document_control_html(d) + "</header>\n";
  out += "<aside class=\"caution\"><strong>Caution</strong><p>" + esc(kCaution) + "</p></aside>\n";
  out += "<nav class=\"contents\"><h3>Contents</h3><ol>\n";
  for (auto i : o.sifs) out += "<li><a href=\"#" + srs_anchor(i) + "\">" + esc(r.sifs[i].id) + "</a></li>\n";
  out += "</ol></nav>\n";
  const ComponentRows rows(d.components);
  for (auto i : o.sifs) {
    const SifResult& s = r.sifs[i];
    out += "<section class=\"sif\" id=\"" + srs_anchor(i) + "\">\n<h2>" + esc(s.id) +
           (s.title.empty() ? "" : ": " + esc(s.title)) + "</h2>\n";
    out += blocks_html(srs_sif_blocks(r, d, rows, i)) + "</section>\n";
  }
  out += "<footer>Written by sifter " + esc(o.tool_version) + " on " + esc(o.date) + " from " + esc(r.file) + ". " +
         esc(kCaution) + "</footer>\n</body>\n</html>\n";
  return out;
}

std::string render_srs_markdown(const ProjectResult& r, const DeliverableData& d, const SrsOptions& o) {
  std::string out = "# " + escape_markdown(title_of(r)) +
                    "\n\nSafety requirements specification of the safety "
                    "instrumented functions\n\n";
  out += "- date of the run: " + escape_markdown(o.date) + "\n- input file: " + escape_markdown(r.file) +
         "\n- SHA-256 of the input: `" + r.sha256 + "`\n- tool: sifter " + escape_markdown(o.tool_version) + "\n\n";
  if (d.document) {
    out += "Document " + escape_markdown(d.document->number) + ", revision " + escape_markdown(d.document->revision) +
           (d.document->date.empty() ? "" : ", " + escape_markdown(d.document->date)) + "\n\n";
    out += markdown_table(signature_table(*d.document));
    if (!d.document->history.empty()) out += markdown_table(revision_table(*d.document));
  } else {
    out += "*No document control stated.*\n\n";
  }
  out += "> **Caution.** " + escape_markdown(kCaution) + "\n\n";
  const ComponentRows rows(d.components);
  for (auto i : o.sifs) {
    const SifResult& s = r.sifs[i];
    out += "## " + escape_markdown(s.id) + (s.title.empty() ? "" : ": " + escape_markdown(s.title)) + "\n\n";
    out += blocks_markdown(srs_sif_blocks(r, d, rows, i));
  }
  return out;
}

}  // namespace sifter::report
