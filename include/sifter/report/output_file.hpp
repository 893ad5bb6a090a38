#pragma once
/// Writing outputs whole or not at all.
#include <fstream>
#include <memory>
#include <ostream>
#include <sstream>
#include <string>
#include <utility>
#include <vector>

namespace sifter::report {

/// One output file, written through a temporary file in the same folder and renamed into place
/// by commit(), so an interrupted run leaves the old file or none, never half of one. Destroyed
/// without commit(), it removes the temporary file. "-" writes to stdout on commit(); a device
/// or a pipe (/dev/null) is written directly; through a symbolic link the linked file is replaced.
class AtomicOutput {
 public:
  /// Creates the temporary file; throws OutputError when the folder cannot be written.
  explicit AtomicOutput(std::string path);
  AtomicOutput(const AtomicOutput&) = delete;
  AtomicOutput& operator=(const AtomicOutput&) = delete;
  ~AtomicOutput();

  /// Where the content goes.
  std::ostream& stream();
  /// Flushes and checks that every byte was written, without renaming; throws OutputError
  /// (and removes the temporary file) on failure. commit() calls it when not yet done.
  void finish_writing();
  /// Flushes and renames the temporary file into place; throws OutputError on failure.
  void commit();

 private:
  std::string path_;
  std::string write_to_;  ///< the file renamed onto: path_, or the file a symbolic link names
  std::string temp_;      ///< empty for stdout and for devices
  std::ofstream file_;
  std::ostringstream to_stdout_;
  bool committed_ = false;
  bool finished_ = false;
};

/// Commits several outputs all or nothing: every one is finished (flushed and checked) first,
/// and only then are they renamed into place, so that one failure leaves no new file.
void commit_all(const std::vector<AtomicOutput*>& outputs);

/// Writes each (path, content) pair, all or nothing (see commit_all); empty paths are skipped.
void write_outputs(const std::vector<std::pair<std::string, std::string>>& outputs);

/// Writes `content` to `path` through an AtomicOutput. "-" writes to stdout.
/// Throws OutputError when the folder cannot be written.
void write_output(const std::string& path, const std::string& content);

/// Throws UsageError when an output path names one of the inputs (the tool never overwrites
/// what it reads: the project, its libraries, records), or when two outputs name one file.
void refuse_overwriting_inputs(const std::vector<std::string>& outputs, const std::vector<std::string>& inputs);

}  // namespace sifter::report
