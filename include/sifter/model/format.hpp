#pragma once
/// Numbers for people, shared by the engines' messages and the writers: finite values only,
/// compact scientific notation.
///
/// One formatter per kind of quantity, used wherever such a number is written for people:
///
/// | kind                          | formatter                          | example        |
/// |-------------------------------|------------------------------------|----------------|
/// | probability, PFD, PFDavg      | `probability()` (= `sci()`)        | 4.10e-05       |
/// | frequency per year            | `per_year()`                       | 1.00e-04/yr    |
/// | PFH, rate per hour            | `per_hour()` (= `format_rate()`)   | 2.50e-07/h     |
/// | RRF, plain magnitude          | `rrf()` (= `plain()`)              | 833            |
/// | ratio (simplified / exact)    | `ratio()`                          | 1.004          |
/// | duration                      | `format_duration()` (quantity.hpp) | 8.76 h, 1 yr   |
/// | percentage                    | `percent()`                        | 3.4%           |
/// | pressure                      | `format_pressure()` (pressure_units.hpp) | 12.50 barg |
/// | any other figure in a message | `figure()`                         | 0.5134         |
#include <optional>
#include <string>

namespace sifter {

/// A probability (PFD, PFDavg, a layer's PFD): sci().
std::string probability(double p);
/// A frequency per year: "1.00e-04/yr".
std::string per_year(double per_yr);
/// A rate or PFH per hour: "2.50e-07/h".
std::string per_hour(double per_hour);
/// A risk reduction factor: plain().
std::string rrf(double value);
/// A ratio of two figures, three decimals: "1.004". Every ratio shown uses this one.
std::string ratio(double value);
/// Any other figure in a message, four significant digits: "0.5134", "1.5e+04".
std::string figure(double value);

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

}  // namespace sifter
