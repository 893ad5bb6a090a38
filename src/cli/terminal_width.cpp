// The width of the terminal, asked of the terminal itself, then of COLUMNS.
#include "terminal_width.hpp"

#include <sys/ioctl.h>
#include <unistd.h>

#include <charconv>
#include <cstdlib>
#include <string_view>

namespace sifter::cli {

std::size_t terminal_width() {
  constexpr std::size_t kDefault = 100;  // when nothing says: a pipe, a file, a CI log
  winsize size{};
  if (::isatty(STDOUT_FILENO) && ::ioctl(STDOUT_FILENO, TIOCGWINSZ, &size) == 0 && size.ws_col > 0) return size.ws_col;
  if (const char* columns = std::getenv("COLUMNS")) {
    const std::string_view text(columns);
    std::size_t value = 0;
    const auto [end, error] = std::from_chars(text.data(), text.data() + text.size(), value);
    if (error == std::errc() && end == text.data() + text.size() && value > 0) return value;
  }
  return kDefault;
}

}  // namespace sifter::cli
