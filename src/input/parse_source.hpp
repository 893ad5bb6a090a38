#pragma once
/// The one parse of every JSON input the loaders read (loader internals).
#include <optional>

#include "input/json_reader.hpp"

namespace sifter::detail {

/// Parses the text already read into ctx.sources[source] into a JSON tree. A UTF-8 byte-order
/// mark is refused; comments are blanked in place (the one place they are handled, before any
/// parser); a text the structure scan would pass gets the fast tree, any other the scan's
/// problems or nlohmann's message. Every problem goes to ctx, located in that source; returns
/// nothing when there is one.
std::optional<Json> parse_source(LoadContext& ctx, int source);

}  // namespace sifter::detail
