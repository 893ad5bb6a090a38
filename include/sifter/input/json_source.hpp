#pragma once
/// A JSON text read from a file, checked for structure before parsing, and located by pointer.
#include <cstddef>
#include <functional>
#include <string>
#include <string_view>
#include <vector>

#include "sifter/model/diagnostics.hpp"

namespace sifter {

/// Limits that keep hostile input bounded in time and memory.
inline constexpr std::size_t kMaxInputBytes = 256u * 1024u * 1024u;  ///< larger files are refused
inline constexpr int kMaxNestingDepth = 64;                          ///< project files need about 6 levels
inline constexpr std::size_t kMaxReportedProblems = 100;             ///< problems kept per run; the rest are counted

/// A line and column, both 1-based.
struct TextPosition {
  int line = 0;
  int column = 0;
};

/// Problems the structural scan finds that a JSON parser accepts or handles badly:
/// nesting deeper than kMaxNestingDepth and keys given twice in one object.
struct StructureProblem {
  std::string pointer;
  TextPosition position;
  std::string expected;
  std::string found;
  std::string hint;
};

/// Scans JSON text without building it: reports the structural problems above, and calls
/// `visit` (if set) with the JSON pointer and position of every value (for object members,
/// the position of the key). Stops quietly at syntax errors: the parser reports those.
std::vector<StructureProblem> scan_json_structure(
    std::string_view text, const std::function<void(const std::string&, TextPosition)>& visit = {});

/// Positions of the given JSON pointers in the text (one scan); unknown pointers fall back to
/// their nearest located parent.
std::vector<TextPosition> locate_pointers(std::string_view text, const std::vector<std::string>& pointers);

/// The line and column of a byte offset.
TextPosition position_of_offset(std::string_view text, std::size_t offset);

/// Escapes one reference token of a JSON pointer (RFC 6901: "~" -> "~0", "/" -> "~1").
std::string escape_pointer_token(std::string_view token);

}  // namespace sifter
