#pragma once
/// The one parse of every JSON input the loaders read (loader internals).
#include <initializer_list>
#include <optional>
#include <string_view>

#include "input/json_reader.hpp"

namespace sifter::detail {

/// Parses the text already read into ctx.sources[source] into a JSON tree. A UTF-8 byte-order
/// mark is refused; comments are blanked in place (the one place they are handled, before any
/// parser); a text the structure scan would pass gets the fast tree, any other the scan's
/// problems or nlohmann's message. Every problem goes to ctx, located in that source; returns
/// nothing when there is one.
///
/// `deferred_sections`: root arrays whose elements the fast tree builds only when a reader asks
/// (ctx.deferred, section_item); a text parsed by nlohmann's parser holds them whole.
std::optional<Json> parse_source(LoadContext& ctx, int source,
                                 std::initializer_list<std::string_view> deferred_sections = {});

}  // namespace sifter::detail
