// Atomic output files: temporary file in the same folder, then rename.
#include "sifter/report/output_file.hpp"

#include <unistd.h>

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iostream>
#include <random>

#include "sifter/diagnostics.hpp"

namespace sifter::report {
namespace fs = std::filesystem;

void write_output(const std::string& path, const std::string& content) {
  if (path == "-") {
    std::cout << content;
    std::cout.flush();
    return;
  }
  const fs::path target(path);
  const fs::path folder = target.has_parent_path() ? target.parent_path() : fs::path(".");
  std::random_device rd;
  const fs::path temp = folder / ("." + target.filename().string() + ".tmp-" + std::to_string(::getpid()) + "-" +
                                  std::to_string(rd() % 1000000));
  {
    std::ofstream out(temp, std::ios::binary | std::ios::trunc);
    if (!out) throw OutputError("cannot write " + path + ": the folder " + folder.string() + " is not writable or does not exist");
    out << content;
    out.flush();
    if (!out) {
      out.close();
      std::error_code ec;
      fs::remove(temp, ec);
      throw OutputError("cannot write " + path + ": writing failed (disk full?)");
    }
  }
  std::error_code ec;
  fs::rename(temp, target, ec);
  if (ec) {
    fs::remove(temp, ec);
    throw OutputError("cannot write " + path + ": " + ec.message());
  }
}

void refuse_overwriting_inputs(const std::vector<std::string>& outputs, const std::vector<std::string>& inputs) {
  for (const auto& o : outputs) {
    if (o.empty() || o == "-") continue;
    std::error_code ec;
    for (const auto& i : inputs) {
      if (fs::exists(o, ec) && fs::equivalent(o, i, ec))
        throw UsageError("refusing to write " + o + ": it is an input of this run; choose another output name");
    }
  }
}

}  // namespace sifter::report
