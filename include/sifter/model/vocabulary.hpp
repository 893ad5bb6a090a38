#pragma once
/// Numbers and SIL levels in words, for the messages the engines write and for the writers:
/// one spelling of each wherever it appears.
#include <string>

namespace sifter {

/// Formats a number for findings and notes: three significant digits, plain between 1e-3 and
/// 1e5 ("0.01", "20000"), otherwise "2.5e-7" or "2e+6".
std::string format_number(double value);

/// A time in seconds as people write it: "11.5 s", "2 min", "1.5 h".
std::string format_seconds(double seconds);

/// A SIL in words: "below SIL 1" for 0, else "SIL 2".
std::string sil_words(int sil);

/// A SIL in a column headed "SIL": "below 1" for 0, else "2".
std::string sil_number(int sil);

}  // namespace sifter
