// Specification of the outputs: written whole or not at all, never over an input.
#include "sifter/report/output_file.hpp"

#include <gtest/gtest.h>
#include <sys/wait.h>
#include <unistd.h>

#include <csignal>
#include <filesystem>
#include <fstream>

#include "sifter/model/diagnostics.hpp"
#include "support/cli_support.hpp"

namespace sifter {
namespace {

namespace fs = std::filesystem;
using testing::fresh_folder;
using testing::slurp;

std::size_t entries_in(const fs::path& dir) {
  return static_cast<std::size_t>(std::distance(fs::directory_iterator(dir), fs::directory_iterator()));
}

TEST(OutputFile, AWriteReplacesTheOldFileWhole) {
  const auto dir = fresh_folder("out_replace");
  std::ofstream(dir / "r.json") << "old";
  report::write_output((dir / "r.json").string(), "new content");
  EXPECT_EQ(slurp(dir / "r.json"), "new content");
  EXPECT_EQ(entries_in(dir), 1u);  // no temporary file left
}

TEST(OutputFile, AnInterruptedWriteLeavesTheOldFileAndNoTemporaryFile) {
  const auto dir = fresh_folder("out_interrupted");
  std::ofstream(dir / "r.json") << "old results";
  {
    report::AtomicOutput out((dir / "r.json").string());
    out.stream() << "half of the new";
    EXPECT_EQ(entries_in(dir), 2u);  // the old file and the temporary one
    // A writer fails here (an exception unwinds): no commit.
  }
  EXPECT_EQ(slurp(dir / "r.json"), "old results");
  EXPECT_EQ(entries_in(dir), 1u);
}

TEST(OutputFile, AProcessKilledWhileWritingLeavesTheOldFile) {
  const auto dir = fresh_folder("out_killed");
  std::ofstream(dir / "r.json") << "old results";
  const pid_t child = ::fork();
  ASSERT_GE(child, 0);
  if (child == 0) {
    report::AtomicOutput out((dir / "r.json").string());
    out.stream() << std::string(1 << 20, 'x');
    out.stream().flush();
    ::raise(SIGKILL);  // killed before the rename: no destructor, no commit
    ::_exit(0);
  }
  int status = 0;
  ::waitpid(child, &status, 0);
  ASSERT_TRUE(WIFSIGNALED(status));
  EXPECT_EQ(slurp(dir / "r.json"), "old results");
}

TEST(OutputFile, AFolderThatCannotBeWrittenIsAnOutputErrorAndLeavesNothing) {
  // /proc/self takes no new files, for root too; a plain file cannot hold one either.
  EXPECT_THROW(report::write_output("/proc/self/sifter_results.json", "x"), OutputError);
  const auto dir = fresh_folder("out_not_a_folder");
  std::ofstream(dir / "plain") << "a file, not a folder";
  EXPECT_THROW(report::write_output((dir / "plain" / "r.json").string(), "x"), OutputError);
  EXPECT_EQ(entries_in(dir), 1u);
  EXPECT_THROW(report::write_output((dir / "missing" / "r.json").string(), "x"), OutputError);
}

TEST(OutputFile, AReadOnlyFolderIsAnOutputErrorAndKeepsTheOldFile) {
  const auto dir = fresh_folder("out_read_only");
  std::ofstream(dir / "r.json") << "old";
  fs::permissions(dir, fs::perms::owner_read | fs::perms::owner_exec | fs::perms::group_read | fs::perms::group_exec |
                           fs::perms::others_read | fs::perms::others_exec);
  // Root ignores folder permissions: the attempt runs in a child that has become "nobody".
  const pid_t child = ::fork();
  ASSERT_GE(child, 0);
  if (child == 0) {
    constexpr uid_t kNobody = 65534;
    if (::geteuid() == 0 && (::setgid(kNobody) != 0 || ::setuid(kNobody) != 0)) ::_exit(3);
    try {
      report::write_output((dir / "r.json").string(), "new");
    } catch (const OutputError&) {
      ::_exit(0);
    }
    ::_exit(1);
  }
  int status = 0;
  ::waitpid(child, &status, 0);
  fs::permissions(dir, fs::perms::owner_all);
  ASSERT_TRUE(WIFEXITED(status));
  EXPECT_EQ(WEXITSTATUS(status), 0) << "1: the write succeeded; 3: could not drop root";
  EXPECT_EQ(slurp(dir / "r.json"), "old");
  EXPECT_EQ(entries_in(dir), 1u);
}

TEST(OutputFile, ARenameOntoAFolderFailsAndLeavesTheFolderAndNoTemporaryFile) {
  const auto dir = fresh_folder("out_onto_folder");
  fs::create_directories(dir / "r.json");
  std::ofstream(dir / "r.json" / "inside") << "kept";
  EXPECT_THROW(report::write_output((dir / "r.json").string(), "x"), OutputError);
  EXPECT_EQ(slurp(dir / "r.json" / "inside"), "kept");
  EXPECT_EQ(entries_in(dir), 1u);
}

TEST(OutputFile, ADeviceIsWrittenDirectlyAndNeverReplaced) {
  // A rename onto /dev/null would put a regular file in its place (and root may do it).
  report::write_output("/dev/null", "discarded");
  EXPECT_TRUE(fs::is_character_file("/dev/null"));
  std::size_t left = 0;
  for (const auto& e : fs::directory_iterator("/dev"))
    left += e.path().filename().string().rfind(".null.tmp-", 0) == 0 ? 1 : 0;
  EXPECT_EQ(left, 0u);
}

TEST(OutputFile, ThroughASymbolicLinkTheLinkedFileIsReplacedAndTheLinkKept) {
  const auto dir = fresh_folder("out_symlink");
  std::ofstream(dir / "real.json") << "old";
  fs::create_symlink(dir / "real.json", dir / "link.json");
  report::write_output((dir / "link.json").string(), "new");
  EXPECT_TRUE(fs::is_symlink(dir / "link.json"));
  EXPECT_EQ(slurp(dir / "real.json"), "new");
  EXPECT_EQ(entries_in(dir), 2u);
}

TEST(OutputFile, TheInputIsNeverAnOutputUnderAnyName) {
  const auto dir = fresh_folder("out_input");
  std::ofstream(dir / "p.json") << "{}";
  fs::create_symlink(dir / "p.json", dir / "link.json");
  fs::create_hard_link(dir / "p.json", dir / "hard.json");
  const std::string input = (dir / "p.json").string();
  for (const auto& name :
       {input, (dir / "." / "p.json").string(), (dir / "link.json").string(), (dir / "hard.json").string()})
    EXPECT_THROW(report::refuse_overwriting_inputs({name}, {input}), UsageError) << name;
  EXPECT_NO_THROW(report::refuse_overwriting_inputs({(dir / "other.json").string(), "-", ""}, {input}));
}

}  // namespace
}  // namespace sifter
