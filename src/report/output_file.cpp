// Atomic output files: temporary file in the same folder, then rename.
#include "sifter/report/output_file.hpp"

#include <unistd.h>

#include <csignal>
#include <cstdio>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <iostream>
#include <memory>
#include <random>

#include "sifter/model/diagnostics.hpp"

namespace sifter::report {
namespace fs = std::filesystem;

namespace {

// The temporary files alive now, for the signal handler to remove: fixed storage, because a
// handler may call only async-signal-safe functions (unlink, signal, raise; POSIX.1-2017
// 2.4.3, seen), not allocate or lock.
constexpr std::size_t kMaxLiveTemps = 16;
constexpr std::size_t kMaxTempPath = 4096;
char g_live_temps[kMaxLiveTemps][kMaxTempPath];
volatile std::sig_atomic_t g_live_used[kMaxLiveTemps];

extern "C" void remove_temps_and_die(int sig) {
  for (std::size_t i = 0; i < kMaxLiveTemps; ++i)
    if (g_live_used[i]) ::unlink(g_live_temps[i]);
  std::signal(sig, SIG_DFL);
  std::raise(sig);
}

void install_handlers_once() {
  static const bool installed = [] {
    std::signal(SIGINT, remove_temps_and_die);
    std::signal(SIGTERM, remove_temps_and_die);
    return true;
  }();
  (void)installed;
}

void track_temp(const std::string& path) {
  install_handlers_once();
  if (path.size() >= kMaxTempPath) return;
  for (std::size_t i = 0; i < kMaxLiveTemps; ++i)
    if (!g_live_used[i]) {
      std::memcpy(g_live_temps[i], path.c_str(), path.size() + 1);
      g_live_used[i] = 1;
      return;
    }
}

void untrack_temp(const std::string& path) {
  for (std::size_t i = 0; i < kMaxLiveTemps; ++i)
    if (g_live_used[i] && path == g_live_temps[i]) g_live_used[i] = 0;
}

}  // namespace

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
  track_temp(temp_);
  file_.open(temp_, std::ios::binary | std::ios::trunc);
  if (!file_)
    throw OutputError("cannot write " + path_ + ": the folder " + folder.string() +
                      " is not writable or does not exist");
}

AtomicOutput::~AtomicOutput() {
  if (committed_ || temp_.empty()) return;  // nothing to clean for stdout or a device
  file_.close();
  std::error_code ec;
  fs::remove(temp_, ec);
  untrack_temp(temp_);
}

std::ostream& AtomicOutput::stream() { return path_ == "-" ? static_cast<std::ostream&>(to_stdout_) : file_; }

void AtomicOutput::finish_writing() {
  if (finished_ || path_ == "-") {
    finished_ = true;
    return;
  }
  finished_ = true;
  file_.flush();
  const bool written = static_cast<bool>(file_);
  file_.close();
  if (written && !file_.fail()) return;
  committed_ = true;
  if (temp_.empty()) throw OutputError("cannot write " + path_ + ": writing failed");
  std::error_code ec;
  fs::remove(temp_, ec);
  untrack_temp(temp_);
  throw OutputError("cannot write " + path_ + ": writing failed (disk full?)");
}

void AtomicOutput::commit() {
  finish_writing();
  if (path_ == "-") {
    std::cout << to_stdout_.str();
    std::cout.flush();
    committed_ = true;
    return;
  }
  committed_ = true;
  if (temp_.empty()) return;  // a device, written directly
  std::error_code ec;
  fs::rename(temp_, write_to_, ec);
  untrack_temp(temp_);
  if (ec) {
    std::error_code ignored;
    fs::remove(temp_, ignored);
    throw OutputError("cannot write " + path_ + ": " + ec.message());
  }
}

void commit_all(const std::vector<AtomicOutput*>& outputs) {
  for (auto* o : outputs)
    if (o) o->finish_writing();
  for (auto* o : outputs)
    if (o) o->commit();
}

void write_outputs(const std::vector<std::pair<std::string, std::string>>& outputs) {
  std::vector<std::unique_ptr<AtomicOutput>> files;
  for (const auto& [path, content] : outputs) {
    if (path.empty()) continue;
    files.push_back(std::make_unique<AtomicOutput>(path));
    files.back()->stream() << content;
  }
  std::vector<AtomicOutput*> all;
  for (auto& f : files) all.push_back(f.get());
  commit_all(all);
}

void write_output(const std::string& path, const std::string& content) {
  AtomicOutput out(path);
  out.stream() << content;
  out.commit();
}

void refuse_overwriting_inputs(const std::vector<std::string>& outputs, const std::vector<std::string>& inputs) {
  // The same file under two spellings ("a.json", "./a.json") is the same output.
  auto same = [](const std::string& a, const std::string& b) {
    std::error_code ec;
    if (fs::exists(a, ec) && fs::exists(b, ec)) return fs::equivalent(a, b, ec);
    std::error_code ea, eb;
    const auto ca = fs::weakly_canonical(a, ea), cb = fs::weakly_canonical(b, eb);
    return !ea && !eb && ca == cb;
  };
  for (std::size_t k = 0; k < outputs.size(); ++k) {
    const auto& o = outputs[k];
    if (o.empty() || o == "-") continue;
    for (std::size_t m = k + 1; m < outputs.size(); ++m)
      if (!outputs[m].empty() && outputs[m] != "-" && same(o, outputs[m]))
        throw UsageError("refusing to write " + o +
                         " twice: two outputs of this run name the same file; choose "
                         "another name for one of them");
    std::error_code ec;
    for (const auto& i : inputs) {
      if (fs::exists(o, ec) && fs::equivalent(o, i, ec))
        throw UsageError("refusing to write " + o + ": it is an input of this run; choose another output name");
    }
  }
}

}  // namespace sifter::report
