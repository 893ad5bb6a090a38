// Number formatting for the writers.
#include "sifter/report/format.hpp"

#include <cmath>
#include <cstdio>

#include "sifter/model/diagnostics.hpp"

namespace sifter::report {

double checked(double value, const char* what) {
  if (!std::isfinite(value))
    throw Error(std::string("internal error: a non-finite ") + what + " reached an output; please report it",
                ExitCode::kInternal);
  return value;
}

std::string sci(double value) {
  checked(value, "number");
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.2e", value);
  return buf;
}

std::string plain(double value) {
  checked(value, "number");
  char buf[32];
  std::snprintf(buf, sizeof buf, std::fabs(value) < 1e5 ? "%.4g" : "%.3g", value);
  return buf;
}

std::string percent(double fraction) {
  checked(fraction, "percentage");
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f%%", fraction * 100.0);
  return buf;
}

std::string sci_or_dash(const std::optional<double>& value) { return value ? sci(*value) : "-"; }

}  // namespace sifter::report
