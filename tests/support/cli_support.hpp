#pragma once
// Running the sifter program from tests, as a user would.
#include <sys/wait.h>

#include <array>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>

namespace sifter::testing {

struct RunResult {
  int exit_code = -1;
  std::string out;  ///< stdout
  std::string err;  ///< stderr
};

inline std::string slurp(const std::filesystem::path& p) {
  std::ifstream in(p, std::ios::binary);
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

/// Runs `sifter ARGS` from the source folder; stdout and stderr are kept apart. `environment`
/// is put before the program on the shell's command line ("NAME=value ...").
inline RunResult run_sifter(const std::string& args, const std::string& environment = "") {
  static int counter = 0;
  const auto err_file = std::filesystem::temp_directory_path() /
                        ("sifter_cli_err_" + std::to_string(::getpid()) + "_" + std::to_string(counter++));
  const std::string cmd = std::string("cd '") + SIFTER_SOURCE_DIR + "' && " + environment + " '" + SIFTER_BINARY +
                          "' " + args + " 2>'" + err_file.string() + "'";
  RunResult r;
  FILE* pipe = ::popen(cmd.c_str(), "r");
  if (!pipe) return r;
  std::array<char, 4096> buf{};
  size_t n = 0;
  while ((n = std::fread(buf.data(), 1, buf.size(), pipe)) > 0) r.out.append(buf.data(), n);
  const int status = ::pclose(pipe);
  r.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  r.err = slurp(err_file);
  std::filesystem::remove(err_file);
  return r;
}

/// A fresh, empty temporary folder for a test's outputs.
inline std::filesystem::path fresh_folder(const std::string& name) {
  const auto dir = std::filesystem::temp_directory_path() / ("sifter_test_" + name + "_" + std::to_string(::getpid()));
  std::filesystem::remove_all(dir);
  std::filesystem::create_directories(dir);
  return dir;
}

}  // namespace sifter::testing
