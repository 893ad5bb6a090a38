#pragma once
// Helpers shared by the what-if sources (src/whatif*.cpp); not part of the public API.
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"

namespace sifter::detail {

/// The subsystems a what-if acts on: the one named, else every one with channels (vendor
/// figures have no interval, rates or vote to change). Throws UsageError when none is left.
std::vector<std::size_t> subsystems_to_vary(const Sif& sif, std::optional<std::size_t> subsystem,
                                            const std::string& what);

/// "'level sensing'", how messages quote a subsystem.
std::string quoted_name(const std::string& name);

/// Replaces the components of the subsystem's channels by copies, so that changing their
/// rates touches no other subsystem; the copies get ids `<id>~<n>` that are not yet taken.
void copy_components_of(Project& project, Subsystem& subsystem);

/// Appends a copy of component `index` with a derived id and returns the copy's index.
std::size_t copy_component(Project& project, std::size_t index);

/// A component id not yet used in the project, derived from `base` ("XV-401~2").
std::string derived_component_id(const Project& project, const std::string& base);

}  // namespace sifter::detail
