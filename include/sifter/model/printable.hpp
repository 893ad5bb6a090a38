#pragma once
/// Text from user input made safe to show: control characters written out as escapes.
#include <string>
#include <string_view>

namespace sifter {

/// `text` with every control character shown escaped, so that user text (titles, ids, notes)
/// cannot move the cursor, rewrite a line or send terminal commands: C0 characters other than
/// line feed and tab and DEL as "\x1b", C1 characters (U+0080..U+009F, UTF-8 C2 80..C2 9F,
/// U+009B included) as "\u009b". An escape sequence loses its ESC and so prints as plain text.
/// ECMA-48 (5th ed., 1991) 5.2-5.3 defines the C0 and C1 sets (seen).
std::string escape_controls(std::string_view text);

/// A CSV cell that a spreadsheet would read as a formula (first character = + - @, tab or CR)
/// and that is not a number gets a leading apostrophe (common practice for spreadsheet exports).
std::string neutralise_formula(std::string_view cell);

}  // namespace sifter
