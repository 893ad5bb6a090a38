#pragma once
/// The JSON tree of a text, built from simdjson's parse where that gives the very tree
/// nlohmann's parser gives (loader internals).
#include <cstddef>
#include <initializer_list>
#include <memory>
#include <nlohmann/json.hpp>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

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

/// The elements of a project's long sections (arrays directly under the root object, such as
/// "sifs"), kept as the fast parse read them and built into the tree one at a time, when a
/// reader first asks for one (section_item): a register's sections are then never held as a
/// whole tree, and each element's tree is built, read and freed while it is in cache. The tree
/// holds such a section as an array of as many nulls, each the place its element is built in.
/// The parse's document is kept until this is destroyed.
///
/// A section's elements are built by one thread at a time (the loader reads each section on one
/// thread); different sections may be built on different threads at once.
class DeferredSections {
 public:
  DeferredSections();
  ~DeferredSections();
  DeferredSections(const DeferredSections&) = delete;
  DeferredSections& operator=(const DeferredSections&) = delete;

  /// Whether the root's `section` is held here.
  [[nodiscard]] bool holds(std::string_view section) const;
  /// Builds element `i` of `section` into `place` (its null in the tree), the very tree the
  /// whole parse would have held there; does nothing if it was built already, or if `section`
  /// is not held here.
  void build(std::string_view section, std::size_t i, nlohmann::json& place);
  /// Whether element `i` of `section` is an object whose member `array_key` is an array holding
  /// an object with the member `key` (a SIF's subsystem naming a template), read without
  /// building the element.
  [[nodiscard]] bool has_item_with(std::string_view section, std::size_t i, std::string_view array_key,
                                   std::string_view key) const;

  struct Parse;  ///< the parse's document and the sections' elements (json_tree.cpp)

 private:
  friend std::optional<nlohmann::json> fast_json_tree_deferring(std::string_view, int, std::size_t,
                                                                std::initializer_list<std::string_view>,
                                                                std::shared_ptr<DeferredSections>&);
  std::unique_ptr<Parse> parse_;
};

/// fast_json_tree, with the root's arrays named in `sections` held back in `deferred` (set to
/// null when the text holds none of them, or when it returns nullopt). Returns nullopt exactly
/// where fast_json_tree does: a duplicate key or a depth beyond `max_depth` inside a held
/// section is found by a walk of the parse, without building.
std::optional<nlohmann::json> fast_json_tree_deferring(std::string_view text, int max_depth,
                                                       std::size_t readable_beyond,
                                                       std::initializer_list<std::string_view> sections,
                                                       std::shared_ptr<DeferredSections>& deferred);

/// The bytes the parser may read past the end of a text (simdjson's padding).
inline constexpr std::size_t kParserPadding = 64;

/// Makes the text's buffer hold kParserPadding zeroed bytes past its end (any spare capacity
/// beyond them is left as it is), so that the fast parse reads it where it lies. Reallocates
/// only when its capacity is short of that (a file read by the loader never is); never
/// changes the text.
void reserve_parser_padding(std::string& text);

}  // namespace sifter::detail
