#pragma once
/// The JSON tree of a text, built from simdjson's parse where that gives the very tree
/// nlohmann's parser gives (loader internals).
#include <nlohmann/json.hpp>
#include <optional>
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
std::optional<nlohmann::json> fast_json_tree(std::string_view text, int max_depth);

}  // namespace sifter::detail
