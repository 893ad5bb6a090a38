// Numbers and SIL levels in words: the one spelling used by the engines' messages and the writers.
#include "sifter/model/vocabulary.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>
#include <string>

#include "sifter/model/quantity.hpp"

namespace sifter {

std::string format_number(double value) {
  if (value == 0.0) return "0";
  if (!std::isfinite(value)) return std::isnan(value) ? "nan" : (value > 0 ? "inf" : "-inf");
  std::array<char, 48> buf{};
  const double a = std::fabs(value);
  if (a >= 1e-3 && a < 1e6) {
    const int decimals = std::max(0, 2 - static_cast<int>(std::floor(std::log10(a))));
    std::snprintf(buf.data(), buf.size(), "%.*f", decimals, value);
    std::string s = buf.data();
    if (s.find('.') != std::string::npos) {
      while (s.back() == '0') s.pop_back();
      if (s.back() == '.') s.pop_back();
    }
    return s;
  }
  // "2.50e-07" -> "2.5e-7", "2.00e+06" -> "2e+6"
  std::snprintf(buf.data(), buf.size(), "%.2e", value);
  std::string s = buf.data();
  const auto e = s.find('e');
  std::string mantissa = s.substr(0, e);
  while (mantissa.back() == '0') mantissa.pop_back();
  if (mantissa.back() == '.') mantissa.pop_back();
  const int exponent = std::stoi(s.substr(e + 1));
  return mantissa + (exponent > 0 ? "e+" : "e") + std::to_string(exponent);
}

std::string format_seconds(double seconds) {
  char buf[32];
  if (seconds < 120.0)
    std::snprintf(buf, sizeof buf, "%.3g s", seconds);
  else if (seconds < 2.0 * kSecondsPerHour)
    std::snprintf(buf, sizeof buf, "%.3g min", seconds / 60.0);
  else
    std::snprintf(buf, sizeof buf, "%.3g h", seconds / kSecondsPerHour);
  return buf;
}

std::string sil_words(int sil) { return sil == 0 ? "below SIL 1" : "SIL " + std::to_string(sil); }

std::string sil_number(int sil) { return sil == 0 ? "below 1" : std::to_string(sil); }

}  // namespace sifter
