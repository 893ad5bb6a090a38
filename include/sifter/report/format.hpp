#pragma once
/// Number formatting shared by the writers: finite values only, compact scientific notation.
#include <optional>
#include <string>

namespace sifter::report {

/// "4.10e-05" (three significant digits); throws an internal Error on NaN or infinity, so
/// that no non-finite number ever reaches an output.
std::string sci(double value);
/// "833" or "1.2e+04": a risk reduction factor or another plain magnitude, 3 digits.
std::string plain(double value);
/// "3.4%".
std::string percent(double fraction);
/// sci(), or "-" when empty.
std::string sci_or_dash(const std::optional<double>& value);
/// Fails loudly on a non-finite number (a defect, never a user error).
double checked(double value, const char* what);

}  // namespace sifter::report
