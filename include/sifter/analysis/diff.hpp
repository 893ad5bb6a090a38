#pragma once
/// Revision comparison: what changed between two versions of a project, input by input (on the
/// resolved model, so that "0.015/yr" and "1.71e-6/h" are the same rate) and result by result,
/// for every SIF and every scenario. Pure: no I/O.
#include <optional>
#include <string>
#include <vector>

#include "sifter/analysis/verify.hpp"
#include "sifter/model/model.hpp"
#include "sifter/results/diff.hpp"

namespace sifter {

/// The items whose category, maximum pressure or maturity differ, in the new revision's order.
std::vector<EquipmentDiff> diff_equipment(const ProjectResult& old_result, const ProjectResult& new_result);

/// Compares two loaded revisions and their results (from verify_project).
ProjectDiff diff_projects(const Project& old_project, const ProjectResult& old_result, const Project& new_project,
                          const ProjectResult& new_result);

}  // namespace sifter
