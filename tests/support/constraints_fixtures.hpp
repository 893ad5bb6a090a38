#pragma once
// Small builders shared by the constraints tests: components, groups and vendor subsystems.
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "sifter/model/model.hpp"

namespace sifter::testing_fixtures {

inline constexpr double kFit = 1e-9;  // per hour

inline Vote vote(int k, int n, bool diagnostic = false) { return Vote{k, n, diagnostic}; }

inline FailureRates fit(double du, double dd, double su, double sd) {
  return FailureRates{Rate{du * kFit}, Rate{dd * kFit}, Rate{su * kFit}, Rate{sd * kFit}};
}

// A component whose rates give the SFF asked for (use mid-band values, away from the edges):
// lDU = (1 - sff) x 1000 FIT, the rest split evenly between lDD and lSD.
inline Component element(std::string id, std::optional<ElementType> type, double sff, std::optional<int> sc) {
  Component c;
  c.id = std::move(id);
  c.element_type = type;
  c.rates = fit((1.0 - sff) * 1000.0, 0.5 * sff * 1000.0, 0.0, 0.5 * sff * 1000.0);
  c.systematic_capability = sc;
  return c;
}

inline Subsystem group(std::string name, Vote v, std::vector<std::vector<std::size_t>> channels) {
  Subsystem s;
  s.name = std::move(name);
  s.vote = v;
  for (auto& c : channels) {
    Channel ch;
    ch.components = std::move(c);
    s.channels.push_back(std::move(ch));
  }
  return s;
}

inline Subsystem vendor(std::string name, std::optional<int> hft, std::optional<int> sc) {
  Subsystem s;
  s.name = std::move(name);
  s.vendor_pfd_avg = 1e-5;
  s.hft_declared = hft;
  s.sc_declared = sc;
  return s;
}

}  // namespace sifter::testing_fixtures
