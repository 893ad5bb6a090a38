#pragma once
// The width the terminal summary is fitted to.
#include <cstddef>

namespace sifter::cli {

/// Columns of the terminal on stdout (TIOCGWINSZ) when it is one; else the COLUMNS variable
/// when it holds a positive number; else 100.
std::size_t terminal_width();

}  // namespace sifter::cli
