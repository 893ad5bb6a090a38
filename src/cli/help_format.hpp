#pragma once
// Help text that fits an 80-column terminal: CLI11's layout, with every description, the
// program's description and the footer wrapped at word boundaries.
#include <CLI/CLI.hpp>
#include <string>

namespace sifter::cli {

/// Wraps `text` at spaces so that no line is longer than `width` (a word longer than the width
/// stays whole); the line breaks already in the text are kept. Each line is wrapped as the
/// terminal writers wrap prose (report::wrap): an item that starts with "- " hangs under its text.
std::string wrap_words(const std::string& text, std::size_t width);

/// The formatter of every command's --help: set on the program before its commands are added,
/// so that they inherit it.
class NarrowHelp : public CLI::Formatter {
 public:
  static constexpr std::size_t kWidth = 80;

  std::string make_option_desc(const CLI::Option* opt) const override;
  std::string make_subcommand(const CLI::App* sub) const override;
  std::string make_description(const CLI::App* app) const override;
  std::string make_footer(const CLI::App* app) const override;

 private:
  [[nodiscard]] std::size_t description_width() const;
};

}  // namespace sifter::cli
