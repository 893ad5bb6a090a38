// The JSON tree of a text through simdjson, with nlohmann's parse as the arbiter of every doubt.
#include "input/json_tree.hpp"

#include <simdjson.h>

#include <cstdint>
#include <future>
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/cores.hpp"

namespace sifter::detail {
namespace {

using Json = nlohmann::json;

// A \u escape of a surrogate (U+D800..U+DFFF): "\ud", then 8..f. A backslash escaped by
// another backslash ("\\ud8") only makes the check cautious, never wrong.
bool has_surrogate_escape(std::string_view text) {
  for (std::size_t i = text.find('\\'); i != std::string_view::npos; i = text.find('\\', i + 1)) {
    if (i + 3 >= text.size() || text[i + 1] != 'u' || (text[i + 2] != 'd' && text[i + 2] != 'D')) continue;
    const char c = text[i + 3];
    if ((c >= '8' && c <= '9') || (c >= 'a' && c <= 'f') || (c >= 'A' && c <= 'F')) return true;
  }
  return false;
}

// An integer written "-0": nlohmann keeps it signed, simdjson's tree holds a plain 0 and no
// longer tells. Seen anywhere (inside a string too) it only makes the parse cautious.
bool has_negative_zero_integer(std::string_view text) {
  for (std::size_t i = text.find("-0"); i != std::string_view::npos; i = text.find("-0", i + 2)) {
    const char next = i + 2 < text.size() ? text[i + 2] : '\0';
    if (next != '.' && next != 'e' && next != 'E' && !(next >= '0' && next <= '9')) return true;
  }
  return false;
}

// Builds the nlohmann value of one simdjson element; false when a doubt sends the text back to
// nlohmann's parser.
class TreeBuilder {
 public:
  // `depth`: the levels open around what it builds; `on_two_cores`: a long array directly
  // under the root is built on two cores (the sub-builders it starts build on one).
  TreeBuilder(int max_depth, int depth, bool on_two_cores)
      : max_depth_(max_depth), depth_(depth), on_two_cores_(on_two_cores) {}

  bool build(simdjson::dom::element e, Json& out) {
    using Type = simdjson::dom::element_type;
    switch (e.type()) {
      case Type::OBJECT:
        return deeper() && object(e.get_object().value_unsafe(), out) && shallower();
      case Type::ARRAY:
        return deeper() && array(e.get_array().value_unsafe(), out) && shallower();
      case Type::STRING:
        out = std::string(e.get_string().value_unsafe());
        return true;
      case Type::INT64: {  // nlohmann keeps a non-negative integer unsigned, a negative one signed
        const std::int64_t v = e.get_int64().value_unsafe();
        if (v >= 0)
          out = static_cast<std::uint64_t>(v);
        else
          out = v;
        return true;
      }
      case Type::UINT64:
        out = static_cast<std::uint64_t>(e.get_uint64().value_unsafe());
        return true;
      case Type::DOUBLE:
        out = e.get_double().value_unsafe();
        return true;
      case Type::BOOL:
        out = e.get_bool().value_unsafe();
        return true;
      case Type::NULL_VALUE:
        out = nullptr;
        return true;
    }
    return false;
  }

 private:
  // A container opened beyond the limit declines, as the structure scan refuses it.
  bool deeper() { return ++depth_ <= max_depth_; }
  bool shallower() {
    --depth_;
    return true;
  }

  // A key given twice declines: the structure scan reports it with its place.
  bool object(simdjson::dom::object o, Json& out) {
    out = Json::object();
    auto& members = out.get_ref<Json::object_t&>();
    for (const auto field : o) {
      auto [at, fresh] = members.try_emplace(std::string(field.key));
      if (!fresh || !build(field.value, at->second)) return false;
    }
    return true;
  }

  bool array(simdjson::dom::array a, Json& out) {
    out = Json::array();
    auto& items = out.get_ref<Json::array_t&>();
    if (on_two_cores_ && depth_ == 2 && a.size() >= kTwoCoresFrom) return array_on_two_cores(a, items);
    items.reserve(a.size());
    for (const auto element : a)
      if (!build(element, items.emplace_back())) return false;
    return true;
  }

  // A register's sections (components, SIFs, scenarios): the first half of the elements built
  // on a second thread, the second half here, each into its own place, so that the tree is the
  // one built on one core.
  bool array_on_two_cores(simdjson::dom::array a, Json::array_t& items) {
    std::vector<simdjson::dom::element> elements;
    elements.reserve(a.size());
    for (const auto element : a) elements.push_back(element);
    items.resize(elements.size());
    auto part = [this, &elements, &items](std::size_t from, std::size_t to) {
      TreeBuilder builder(max_depth_, depth_, false);
      for (std::size_t i = from; i < to; ++i)
        if (!builder.build(elements[i], items[i])) return false;
      return true;
    };
    const std::size_t half = elements.size() / 2;
    auto first = alongside(0, [&part, half] { return part(0, half); });
    const bool second = part(half, elements.size());
    return first.get() && second;
  }

  static constexpr std::size_t kTwoCoresFrom = 4096;  ///< elements; below, a thread costs more than it saves

  int max_depth_;
  int depth_;
  bool on_two_cores_;
};

}  // namespace

static_assert(kParserPadding >= simdjson::SIMDJSON_PADDING, "the padding simdjson reads past a text");

void reserve_parser_padding(std::string& text) {
  const std::size_t size = text.size();
  text.reserve(size + kParserPadding);
  text.append(kParserPadding, '\0');  // within the capacity just reserved: no reallocation
  text.resize(size);
}

std::optional<Json> fast_json_tree(std::string_view text, int max_depth, std::size_t readable_beyond) {
  if (has_surrogate_escape(text) || has_negative_zero_integer(text)) return std::nullopt;
  simdjson::dom::parser parser;
  simdjson::dom::element root;
  // A text with its padding is parsed where it lies (a register's text is not copied again).
  std::optional<simdjson::padded_string> copy;
  if (readable_beyond < kParserPadding) copy.emplace(text);
  const auto input = copy ? simdjson::padded_string_view(*copy)
                          : simdjson::padded_string_view(text.data(), text.size(), text.size() + readable_beyond);
  const auto parsed = parser.parse(input);
  if (parsed.get(root) != simdjson::SUCCESS) return std::nullopt;
  Json out;
  if (!TreeBuilder(max_depth, 0, thread_budget(0) > 1).build(root, out)) return std::nullopt;
  return out;
}

}  // namespace sifter::detail
