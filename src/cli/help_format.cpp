// Help text wrapped for an 80-column terminal.
#include "help_format.hpp"

#include <sstream>

#include "sifter/report/text_table.hpp"

namespace sifter::cli {

std::string wrap_words(const std::string& text, std::size_t width) {
  std::string out;
  std::istringstream lines(text);
  std::string line;
  bool first_line = true;
  while (std::getline(lines, line)) {
    if (!first_line) out += '\n';
    first_line = false;
    std::string wrapped = report::wrap(line, width, "");
    if (!wrapped.empty()) wrapped.pop_back();  // report::wrap ends every line with a newline
    out += wrapped;
  }
  if (!text.empty() && text.back() == '\n') out += '\n';
  return out;
}

// One column less than the width: a line that fills the terminal exactly makes some wrap twice.
std::size_t NarrowHelp::description_width() const {
  const std::size_t column = get_column_width();
  return column + 20 < kWidth ? kWidth - 1 - column : 20;
}

std::string NarrowHelp::make_option_desc(const CLI::Option* opt) const {
  return wrap_words(CLI::Formatter::make_option_desc(opt), description_width());
}

std::string NarrowHelp::make_subcommand(const CLI::App* sub) const {
  std::stringstream out;
  CLI::detail::format_help(out, sub->get_display_name(true), wrap_words(sub->get_description(), description_width()),
                           get_column_width());
  return out.str();
}

std::string NarrowHelp::make_description(const CLI::App* app) const {
  return wrap_words(CLI::Formatter::make_description(app), kWidth - 1);
}

std::string NarrowHelp::make_footer(const CLI::App* app) const {
  return wrap_words(CLI::Formatter::make_footer(app), kWidth - 1);
}

}  // namespace sifter::cli
