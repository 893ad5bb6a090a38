#pragma once
// The results of a project as `check --json` writes them, without what names the input file,
// so that two spellings of one project can be compared whole.
#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>
#include <string>

#include "sifter/analysis/verify.hpp"
#include "sifter/input/load.hpp"
#include "sifter/report/json_results.hpp"

namespace sifter::testing {

/// Drops the keys that say where a value came from (file, hash, template), not what it is.
inline void drop_provenance(nlohmann::json& j) {
  if (j.is_object()) {
    for (const char* key : {"file", "sha256", "template"}) j.erase(key);
    for (auto& [_, v] : j.items()) drop_provenance(v);
  } else if (j.is_array()) {
    for (auto& v : j) drop_provenance(v);
  }
}

/// `check --json` of a project (without the exact cross-check, which the results do not need to agree).
inline nlohmann::json comparable_results(const LoadedProject& loaded) {
  VerifyOptions options;
  options.exact = false;
  nlohmann::json j = report::results_json(verify_project(loaded, options));
  drop_provenance(j);
  return j;
}

inline nlohmann::json comparable_results(const std::string& path) {
  return comparable_results(load_project_file(path));
}

inline std::string slurp_text(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

}  // namespace sifter::testing
