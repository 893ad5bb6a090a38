#pragma once
// Catalogues of malformed inputs: a folder of NAME.json with NAME.expected beside each.
#include <algorithm>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include "sifter/input/load.hpp"

namespace sifter::testing {

/// The names (without .json) of the projects in a catalogue folder, sorted.
inline std::vector<std::string> catalogue_names(const std::filesystem::path& dir) {
  std::vector<std::string> names;
  for (const auto& e : std::filesystem::directory_iterator(dir))
    if (e.path().extension() == ".json") names.push_back(e.path().stem().string());
  std::sort(names.begin(), names.end());
  return names;
}

/// The loader's message for dir/NAME.json, loaded from inside dir so that messages name the
/// files as a user typed them; "no error" when it loads.
inline std::string catalogue_message(const std::filesystem::path& dir, const std::string& name) {
  const auto previous = std::filesystem::current_path();
  std::filesystem::current_path(dir);
  std::string message = "no error";
  try {
    load_project_file(name + ".json");
  } catch (const InputError& e) {
    message = e.what();
  }
  std::filesystem::current_path(previous);
  return message;
}

/// The expected message of dir/NAME (NAME.expected without its last line break). With
/// SIFTER_REGENERATE_EXPECTED set, `actual` is written there first (review the diff).
inline std::string catalogue_expected(const std::filesystem::path& dir, const std::string& name,
                                      const std::string& actual) {
  const auto file = dir / (name + ".expected");
  if (std::getenv("SIFTER_REGENERATE_EXPECTED")) std::ofstream(file) << actual << "\n";
  std::ifstream in(file, std::ios::binary);
  std::ostringstream s;
  s << in.rdbuf();
  std::string expected = s.str();
  if (!expected.empty() && expected.back() == '\n') expected.pop_back();
  return expected;
}

}  // namespace sifter::testing
