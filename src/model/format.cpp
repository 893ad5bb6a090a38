// Numbers for people: one formatter per kind of quantity.
#include "sifter/model/format.hpp"

#include <cmath>
#include <cstdio>

#include "sifter/model/diagnostics.hpp"
#include "sifter/model/quantity.hpp"

namespace sifter {

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

std::string probability(double p) { return sci(p); }

std::string per_year(double per_yr) { return sci(per_yr) + "/yr"; }

std::string per_hour(double per_hour) { return format_rate(Rate{checked(per_hour, "rate")}); }

std::string rrf(double value) { return plain(value); }

std::string ratio(double value) {
  checked(value, "ratio");
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.3f", value);
  return buf;
}

std::string figure(double value) {
  checked(value, "figure");
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.4g", value);
  return buf;
}

std::string sci_or_dash(const std::optional<double>& value) { return value ? sci(*value) : "-"; }

}  // namespace sifter
