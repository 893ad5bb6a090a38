#pragma once
/// The JSON tree of a text, built from simdjson's parse where that gives the very tree
/// nlohmann's parser gives (loader internals).
#include <cstddef>
#include <nlohmann/json.hpp>
#include <optional>
#include <string>
#include <string_view>

namespace sifter::detail {

/// The tree `nlohmann::json::parse(text)` returns, built from simdjson's parse of the text (a
/// parser made for speed: about ten times faster on a register). Returns nullopt wherever the
/// two could differ, and then the caller parses with nlohmann, whose messages the loader
/// reports: any text simdjson refuses (among them a raw control character in a string, which
/// both refuse), a string with a \u escape of a surrogate (the two parsers could treat a lone
/// one differently), and an integer written -0 (signed in nlohmann's tree, a plain 0 in
/// simdjson's). Integers keep nlohmann's types (unsigned when not negative, signed
/// when negative; one beyond 64 bits simdjson refuses); other numbers are the correctly rounded
/// double of their text, as both parsers give. It also declines a text with a key given twice
/// in one object or with containers nested more than `max_depth` deep (the root's container is
/// level 1), the two things the structure scan (`scan_json_structure`) refuses: so a text it
/// returns a tree for is one the scan passes, and the loader runs the scan only when it
/// declines.
///
/// `readable_beyond`: how many bytes after the text may be read too (its buffer's spare
/// capacity, of which reserve_parser_padding zeroes the first kParserPadding). With at least
/// kParserPadding the text is parsed where it lies; with fewer, from a padded copy of it.
std::optional<nlohmann::json> fast_json_tree(std::string_view text, int max_depth, std::size_t readable_beyond = 0);

/// The bytes the parser may read past the end of a text (simdjson's padding).
inline constexpr std::size_t kParserPadding = 64;

/// Makes the text's buffer hold kParserPadding zeroed bytes past its end (any spare capacity
/// beyond them is left as it is), so that the fast parse reads it where it lies. Reallocates
/// only when its capacity is short of that (a file read by the loader never is); never
/// changes the text.
void reserve_parser_padding(std::string& text);

}  // namespace sifter::detail
