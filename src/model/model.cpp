// The model's own functions: votes, readable names of its enumerations, the lambda_du that field
// data give, and the votes Table D.5 covers.
#include "sifter/model/model.hpp"

#include <algorithm>
#include <boost/math/distributions/chi_squared.hpp>
#include <cassert>
#include <cctype>

namespace sifter {

std::optional<Vote> parse_vote(std::string_view text) {
  Vote v;
  std::size_t i = 0;
  // Reads every digit; the value saturates at 1000 (far above any vote) so that it cannot overflow.
  auto read_int = [&](int& out) {
    if (i >= text.size() || !std::isdigit(static_cast<unsigned char>(text[i]))) return false;
    out = 0;
    for (; i < text.size() && std::isdigit(static_cast<unsigned char>(text[i])); ++i)
      out = std::min(1000, out * 10 + (text[i] - '0'));
    return out >= 1;
  };
  if (!read_int(v.k)) return std::nullopt;
  if (text.compare(i, 2, "oo") != 0) return std::nullopt;
  i += 2;
  if (!read_int(v.n)) return std::nullopt;
  if (i < text.size() && text[i] == 'D') {
    v.diagnostic = true;
    ++i;
  }
  if (i != text.size()) return std::nullopt;
  if (v.diagnostic && !(v.k == 1 && v.n == 2)) return std::nullopt;
  return v;
}

std::string to_string(Role role) {
  switch (role) {
    case Role::kSensor:
      return "sensor";
    case Role::kLogic:
      return "logic";
    case Role::kFinal:
      return "final";
  }
  return "sensor";
}

std::string to_string(DemandMode mode) { return mode == DemandMode::kLow ? "low" : "high"; }

std::string to_string(ConstraintBasis basis) {
  switch (basis) {
    case ConstraintBasis::kIec61511:
      return "iec61511";
    case ConstraintBasis::kRoute1H:
      return "route_1h";
    case ConstraintBasis::kRoute2H:
      return "route_2h";
  }
  return "iec61511";
}

std::string to_string(LayerKind kind) {
  switch (kind) {
    case LayerKind::kBpcsFunction:
      return "bpcs_function";
    case LayerKind::kOperatorResponse:
      return "operator_response";
    case LayerKind::kReliefDevice:
      return "relief_device";
    case LayerKind::kMechanical:
      return "mechanical";
    case LayerKind::kSif:
      return "sif";
    case LayerKind::kOther:
      return "other";
  }
  return "other";
}

}  // namespace sifter

namespace sifter {

std::string describe(const DataSource& source) {
  if (source.kind.empty()) return source.text;
  std::string out = source.kind == "fmeda" ? "FMEDA" : source.kind;
  if (!source.document.empty()) out += ": " + source.document;
  if (!source.revision.empty()) out += " rev " + source.revision;
  if (!source.date.empty()) out += ", " + source.date;
  return out;
}

Rate lambda_du_from_field_data(const FieldData& data) {
  assert(data.failures >= 0 && data.device_hours.hours > 0.0);
  assert(data.confidence > 0.0 && data.confidence < 1.0);
  // Time-truncated observation: the upper bound takes 2n + 2 degrees of freedom, one failure
  // more than counted, as if the next one were about to happen.
  const boost::math::chi_squared chi2(2.0 * data.failures + 2.0);
  return Rate{boost::math::quantile(chi2, data.confidence) / (2.0 * data.device_hours.hours)};
}

bool table_d5_covers(int k, int n) { return k >= 1 && k <= n && (n <= 5 || k == n); }

}  // namespace sifter
