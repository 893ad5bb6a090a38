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

AtomicOutput::AtomicOutput(std::string path) : path_(std::move(path)) {
  if (path_ == "-") return;
  std::error_code ec;
  const auto status = fs::status(path_, ec);
  if (!ec && fs::exists(status) && !fs::is_regular_file(status) && !fs::is_directory(status)) {
    // A device or a pipe (/dev/null, /dev/stdout): nothing to keep whole, and a rename would
    // replace the device itself. Write to it directly.
    file_.open(path_, std::ios::binary);
    if (!file_) throw OutputError("cannot write " + path_);
    return;
  }
  // Through a symbolic link, the file it names is replaced and the link kept.
  fs::path target(path_);
  if (fs::is_symlink(fs::symlink_status(target, ec)) && fs::exists(status)) target = fs::canonical(target, ec);
  write_to_ = target.string();
  const fs::path folder = target.has_parent_path() ? target.parent_path() : fs::path(".");
  std::random_device rd;
  temp_ = (folder / ("." + target.filename().string() + ".tmp-" + std::to_string(::getpid()) + "-" +
                     std::to_string(rd() % 1000000)))
              .string();
  file_.open(temp_, std::ios::binary | std::ios::trunc);
  if (!file_)
    throw OutputError("cannot write " + path_ + ": the folder " + folder.string() + " is not writable or does not exist");
}

AtomicOutput::~AtomicOutput() {
  if (committed_ || temp_.empty()) return;  // nothing to clean for stdout or a device
  file_.close();
  std::error_code ec;
  fs::remove(temp_, ec);
}

std::ostream& AtomicOutput::stream() { return path_ == "-" ? static_cast<std::ostream&>(to_stdout_) : file_; }

void AtomicOutput::commit() {
  if (path_ == "-") {
    std::cout << to_stdout_.str();
    std::cout.flush();
    committed_ = true;
    return;
  }
  file_.flush();
  const bool written = static_cast<bool>(file_);
  file_.close();
  std::error_code ec;
  if (temp_.empty()) {  // a device, written directly
    committed_ = true;
    if (!written) throw OutputError("cannot write " + path_ + ": writing failed");
    return;
  }
  if (!written || file_.fail()) {
    fs::remove(temp_, ec);
    committed_ = true;
    throw OutputError("cannot write " + path_ + ": writing failed (disk full?)");
  }
  fs::rename(temp_, write_to_, ec);
  committed_ = true;
  if (ec) {
    std::error_code ignored;
    fs::remove(temp_, ignored);
    throw OutputError("cannot write " + path_ + ": " + ec.message());
  }
}

void write_output(const std::string& path, const std::string& content) {
  AtomicOutput out(path);
  out.stream() << content;
  out.commit();
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
