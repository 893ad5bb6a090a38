#pragma once
// The assessment of one subsystem's constraints, shared by the constraints sources
// (src/engines/constraints*.cpp); not part of the public API.
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "sifter/engines/constraints.hpp"

namespace sifter::detail {

// Collects the caps and notes of one subsystem while its rules are applied.
class Assessment {
 public:
  Assessment(const Subsystem& subsystem, SubsystemConstraints& out)
      : s_(subsystem), out_(out), name_(quoted(subsystem.name)) {}

  void cap(CapKind kind, CapCause cause, int sil, std::optional<std::string> element, std::string reason) {
    out_.caps.push_back(Cap{kind, cause, sil, std::move(element), std::move(reason)});
  }
  void note(std::string text) { notes_.push_back(std::move(text)); }

  void vendor();
  void group(const std::vector<Component>& components);
  void certificate();
  void finish();

 private:
  void collect_elements(const std::vector<Component>& components);
  void fault_tolerance_cap(const std::string& subject);
  void route_1h();
  std::optional<Cap> parallel_combination(const std::string& in, int hft) const;
  void route_2h_elements();
  void systematic();

  const Subsystem& s_;
  SubsystemConstraints& out_;
  std::string name_;  // quoted subsystem name
  std::vector<std::string> notes_;
  const std::vector<Component>* components_ = nullptr;
};

}  // namespace sifter::detail
