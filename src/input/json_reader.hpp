#pragma once
/// Strict reading of JSON objects into model fields, collecting every problem (loader internals).
#include <boost/container/small_vector.hpp>
#include <initializer_list>
#include <memory>
#include <nlohmann/json.hpp>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "sifter/model/diagnostics.hpp"
#include "sifter/model/quantity.hpp"

namespace sifter::detail {

using Json = nlohmann::json;

/// A problem whose place is known by file and pointer; positions are filled in at the end.
struct PendingDiagnostic {
  int source = 0;  ///< index into LoadContext::sources
  Diagnostic diagnostic;
};

/// A text the loader read, kept to locate pointers in it when reporting.
struct SourceText {
  std::string path;
  std::string text;
};

class DeferredSections;  // json_tree.hpp

/// What every loading step shares: the texts read, the problems and the warnings found.
struct LoadContext {
  std::vector<SourceText> sources;
  /// The project's long sections, built element by element as they are read (section_item);
  /// null when the project's tree holds them whole.
  std::shared_ptr<DeferredSections> deferred;
  std::vector<PendingDiagnostic> problems;
  std::vector<Warning> warnings;
  std::size_t problems_not_kept = 0;      ///< beyond kMaxReportedProblems, only counted
  std::size_t follow_ons_suppressed = 0;  ///< problems that follow only from one already reported

  /// A problem already reported in `source` at `pointer` or below it (a root cause).
  [[nodiscard]] bool has_problem_under(int source, const std::string& pointer) const;
  /// A library named under "libraries" could not be read, parsed or checked.
  [[nodiscard]] bool libraries_failed() const;

  void error(int source, const std::string& pointer, std::string expected, std::string found, std::string hint = {});
  void warn(const std::string& pointer, std::string message);
  /// Turns the pending problems into diagnostics with line and column.
  [[nodiscard]] std::vector<Diagnostic> located() const;
};

/// Element `i` of the project's root section `section` (the array `items`), built into the tree
/// first when that section is deferred: every reader of a project's "components", "sifs" and
/// "scenarios" takes its elements through this.
Json& section_item(const LoadContext& ctx, std::string_view section, Json& items, std::size_t i);

/// "the number 8", "the string \"8 hrs\"", "an object", ... for messages.
std::string describe(const Json& value);

/// Reads the members of one JSON object; every read marks a key as known, and finish()
/// reports the keys nobody asked for, with the nearest known key as a hint. It holds the keys
/// it has read as views of the tree: see mark_present for what that asks of the caller.
class ObjectReader {
 public:
  ObjectReader(LoadContext& ctx, const Json& value, std::string pointer, int source, std::string what);

  [[nodiscard]] bool is_object() const { return is_object_; }
  [[nodiscard]] const std::string& pointer() const { return pointer_; }
  [[nodiscard]] std::string at(std::string_view key) const;
  [[nodiscard]] bool has(std::string_view key) const;
  [[nodiscard]] int source() const { return source_; }
  [[nodiscard]] LoadContext& context() const { return ctx_; }

  /// The raw member, marked known; nullptr when absent.
  const Json* member(std::string_view key);
  /// Reports the member as missing when required and absent.
  const Json* require(std::string_view key, const std::string& expected);

  std::optional<std::string> string(std::string_view key, bool required = false);
  std::optional<double> number(std::string_view key, bool required = false);
  std::optional<int> integer(std::string_view key, int lo, int hi, bool required = false);
  std::optional<bool> boolean(std::string_view key);
  /// A fraction 0..1 written 0.05 or "5%".
  std::optional<double> fraction(std::string_view key, bool required = false);
  /// A probability in [0, 1] (a plain number).
  std::optional<double> probability(std::string_view key, bool required = false);
  std::optional<Rate> rate(std::string_view key, bool required = false);
  std::optional<Duration> duration(std::string_view key, bool required = false);
  /// A string among the allowed ones.
  std::optional<std::string> choice(std::string_view key, std::initializer_list<const char*> allowed,
                                    bool required = false);
  /// An array of strings (absent = empty).
  std::vector<std::string> strings(std::string_view key);
  /// Marks keys that are accepted and ignored (comments, notes kept for people).
  void allow(std::initializer_list<const char*> keys);

  /// Reports every member that no read asked for.
  void finish();

 private:
  void type_error(std::string_view key, const std::string& expected, const Json& found, const std::string& hint = {});

  LoadContext& ctx_;
  const Json& value_;
  std::string pointer_;
  int source_;
  std::string what_;
  bool is_object_;
  /// Marks a key asked for and absent (or allowed): kept as text, for the hint of finish().
  void mark_known(std::string_view key);
  /// Marks a member asked for and present: its key is kept as a view of the tree's own key,
  /// which lives as long as that member stays in the object. So while a reader lives, no
  /// member it has read may be erased and its object may not be assigned anew; to release a
  /// large member's value early, assign null to it (the key stays), as the loader does.
  void mark_present(const Json::const_iterator& member);
  /// True, with the key marked known, when the key is optional and `found` (what present()
  /// gave) is null: absent, or the reader's value is not an object (reported already).
  bool absent_and_optional(std::string_view key, const Json* found, bool required);
  const Json* present(std::string_view key);
  /// The keys asked for, present or not, sorted and without repeats (for a message).
  [[nodiscard]] std::vector<std::string> known_keys() const;
  /// A key asked for, present or not, or allowed.
  [[nodiscard]] bool is_marked(std::string_view key) const;

  /// The i-th key marked by text.
  [[nodiscard]] std::string_view named(std::size_t i) const;

  // The keys asked for, held on the stack: a component's reader asks about 40, and a reader
  // is made for every object of a register, so lists on the heap would cost allocations per
  // object, one of more than 1 KiB (the kind that makes glibc sweep its small free blocks).
  static constexpr std::size_t kPresentKeysHeld = 40;
  static constexpr std::size_t kNamedKeysHeld = 24;
  static constexpr std::size_t kNamedTextHeld = 512;                            ///< bytes of key text
  boost::container::small_vector<std::string_view, kPresentKeysHeld> present_;  ///< views of the tree's keys
  /// Keys asked for and absent, or allowed: their texts one after another in named_text_,
  /// each found by its offset and size.
  boost::container::small_vector<std::pair<std::size_t, std::size_t>, kNamedKeysHeld> named_;
  boost::container::small_vector<char, kNamedTextHeld> named_text_;
};

}  // namespace sifter::detail
