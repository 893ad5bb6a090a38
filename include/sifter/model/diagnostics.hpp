#pragma once
/// Problems found in user input, with their place, and the error hierarchy that maps to exit codes.
#include <stdexcept>
#include <string>
#include <vector>

namespace sifter {

/// Exit statuses of the command-line program.
enum class ExitCode : int {
  kAllMet = 0,     ///< every SIF meets its target
  kShortfall = 1,  ///< at least one SIF (or scenario) falls short
  kBadInput = 2,   ///< the input or the command line is wrong; nothing was written
  kInternal = 3,   ///< a defect in sifter itself
};

/// One problem in an input file: where it is, what was expected, what was found, and a hint.
struct Diagnostic {
  std::string file;
  int line = 0;         ///< 1-based; 0 when unknown
  int column = 0;       ///< 1-based; 0 when unknown
  std::string pointer;  ///< RFC 6901 JSON pointer, e.g. "/sifs/0/subsystems/0/beta"
  std::string expected;
  std::string found;
  std::string hint;
};

/// Renders a diagnostic as "file:line:column: /pointer: expected …, found …\n  hint: …".
std::string format_diagnostic(const Diagnostic& d);

/// A problem in the SIF structure (found by the plant graph or the plausibility checks), with the pointer of the place
/// it concerns.
struct GraphProblem {
  std::string pointer;
  std::string expected;
  std::string found;
  std::string hint;
};

/// A plausibility remark on valid input: computed on, but shown to the reviewer.
struct Warning {
  std::string where;  ///< JSON pointer (or SIF/scenario id) of what it concerns
  std::string message;
};

/// The base of every error sifter reports to a person; caught once in main.
class Error : public std::runtime_error {
 public:
  Error(const std::string& message, ExitCode code) : std::runtime_error(message), code_(code) {}
  [[nodiscard]] ExitCode exit_code() const { return code_; }

 private:
  ExitCode code_;
};

/// The input files hold one or more problems; all of them are carried.
class InputError : public Error {
 public:
  explicit InputError(std::vector<Diagnostic> diagnostics, std::size_t follow_ons_suppressed = 0);
  [[nodiscard]] const std::vector<Diagnostic>& diagnostics() const { return diagnostics_; }
  /// Problems not shown because they follow only from one of those shown (one root cause, one message).
  [[nodiscard]] std::size_t follow_ons_suppressed() const { return follow_ons_suppressed_; }

 private:
  std::vector<Diagnostic> diagnostics_;
  std::size_t follow_ons_suppressed_ = 0;
};

/// The command line is wrong (unknown SIF id, bad option value).
class UsageError : public Error {
 public:
  explicit UsageError(const std::string& message) : Error(message, ExitCode::kBadInput) {}
};

/// An output could not be written.
class OutputError : public Error {
 public:
  explicit OutputError(const std::string& message) : Error(message, ExitCode::kBadInput) {}
};

/// The known word nearest to an unknown one (edit distance at most 3), or empty: the "did you
/// mean" of a hint.
std::string nearest(const std::string& word, const std::vector<std::string>& known);

}  // namespace sifter
