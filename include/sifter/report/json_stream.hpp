#pragma once
/// A JSON text written as it goes: no tree, numbers in shortest round-trip form, every number
/// checked finite as it is written.
#include <cstdint>
#include <optional>
#include <ostream>
#include <string>
#include <string_view>
#include <vector>

#include "sifter/results/shared_text.hpp"

namespace sifter::report {

/// Compact (no spaces, one line) or indented by two spaces per level, as nlohmann's dump(2).
enum class JsonLayout { kCompact, kPretty };

/// Writes one JSON value to a stream, in order: keys and values are given as they are to
/// appear. Structural mistakes (a value where a key is due) are programmer errors (asserts).
class JsonStream {
 public:
  explicit JsonStream(std::ostream& out, JsonLayout layout = JsonLayout::kCompact);
  /// A stream of elements only, for an array `array_depth` levels deep (the array counted),
  /// after other elements unless `first_element`: its text, given to elements() of the stream
  /// writing that array, is byte for byte what that stream would write for the same elements.
  JsonStream(std::ostream& out, JsonLayout layout, std::size_t array_depth, bool first_element);
  ~JsonStream();  ///< flushes what is buffered
  JsonStream(const JsonStream&) = delete;
  JsonStream& operator=(const JsonStream&) = delete;

  JsonStream& begin_object();
  JsonStream& end_object();
  JsonStream& begin_array();
  JsonStream& end_array();
  /// The key of the next member of the current object.
  JsonStream& key(std::string_view name);

  JsonStream& value(std::string_view text);
  JsonStream& value(const char* text) { return value(std::string_view(text)); }
  JsonStream& value(const std::string& text) { return value(std::string_view(text)); }
  JsonStream& value(bool b);
  JsonStream& value(int n);
  JsonStream& value(long long n);
  /// A finite double (throws the project's internal Error otherwise, naming `what`); written
  /// by std::to_chars in its shortest round-trip form, with ".0" kept on whole numbers so that
  /// a reader still sees a floating-point number.
  JsonStream& number(double v, const char* what = "number");
  JsonStream& null();
  JsonStream& value(const std::optional<int>& v) { return v ? value(*v) : null(); }
  JsonStream& value(const std::optional<bool>& v) { return v ? value(*v) : null(); }
  JsonStream& number(const std::optional<double>& v, const char* what) { return v ? number(*v, what) : null(); }
  /// An array of strings.
  JsonStream& value(const std::vector<std::string>& texts);
  JsonStream& value(const std::vector<SharedText>& texts);

  /// Appends elements written apart by an elements-only stream (above) as elements of the
  /// current array.
  JsonStream& elements(std::string_view written);

  /// Writes out what is buffered.
  void flush();

  [[nodiscard]] JsonLayout layout() const { return pretty_ ? JsonLayout::kPretty : JsonLayout::kCompact; }
  /// How many arrays and objects are open.
  [[nodiscard]] std::size_t depth() const { return levels_.size(); }

 private:
  void before_value();
  void newline();
  void escaped(std::string_view text);
  void escape_one(char c);

  std::ostream& out_;
  bool pretty_;
  std::string buffer_;
  struct Level {
    bool object = false;
    bool empty = true;
  };
  std::vector<Level> levels_;
  bool after_key_ = false;
};

}  // namespace sifter::report
