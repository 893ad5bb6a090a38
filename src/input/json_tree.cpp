// The JSON tree of a text through simdjson, with nlohmann's parse as the arbiter of every doubt.
#include "input/json_tree.hpp"

#include <simdjson.h>

#include <algorithm>
#include <boost/container/small_vector.hpp>
#include <cstdint>
#include <future>
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/cores.hpp"
#include "sifter/model/diagnostics.hpp"

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

// Whether an element's containers, opened with `depth` levels around it, stay within
// `max_depth` and hold no key twice: what TreeBuilder::build checks, walked without building.
bool fits(simdjson::dom::element e, int depth, int max_depth) {
  using Type = simdjson::dom::element_type;
  if (e.type() == Type::ARRAY) {
    if (++depth > max_depth) return false;
    const simdjson::dom::array items = e.get_array().value_unsafe();
    for (const auto item : items)
      if (!fits(item, depth, max_depth)) return false;
    return true;
  }
  if (e.type() != Type::OBJECT) return true;
  if (++depth > max_depth) return false;
  boost::container::small_vector<std::string_view, 16> keys;
  const simdjson::dom::object members = e.get_object().value_unsafe();
  for (const auto field : members) {
    keys.push_back(field.key);
    if (!fits(field.value, depth, max_depth)) return false;
  }
  std::sort(keys.begin(), keys.end());
  return std::adjacent_find(keys.begin(), keys.end()) == keys.end();
}

}  // namespace

struct DeferredSections::Parse {
  struct Section {
    std::string name;
    std::vector<simdjson::dom::element> elements;  // views into `document`
    std::vector<char> built;                       // per element: built into the tree already
  };
  // The parse's tape and strings, which the elements view: never moved (on the heap). The parser
  // that filled it, and its index of the text, are gone once the text is parsed.
  simdjson::dom::document document;
  int max_depth = 0;
  std::vector<Section> sections;

  // One look-up for both finds: `self` is a Parse or a const Parse, and so is the section it gives.
  template <typename Self>
  static auto* find_in(Self& self, std::string_view name) {
    for (auto& section : self.sections)
      if (section.name == name) return &section;
    return static_cast<decltype(&self.sections.front())>(nullptr);
  }
  Section* find(std::string_view name) { return find_in(*this, name); }
  [[nodiscard]] const Section* find(std::string_view name) const { return find_in(*this, name); }
};

namespace {

// Builds the nlohmann value of one simdjson element; false when a doubt sends the text back to
// nlohmann's parser.
class TreeBuilder {
 public:
  // `depth`: the levels open around what it builds; `on_two_cores`: a long array directly
  // under the root is built on two cores (the sub-builders it starts build on one).
  TreeBuilder(int max_depth, int depth, bool on_two_cores)
      : max_depth_(max_depth), depth_(depth), on_two_cores_(on_two_cores) {}

  // The root's arrays named in `sections` become arrays of nulls, their elements kept in `parse`.
  void defer(std::initializer_list<std::string_view> sections, DeferredSections::Parse* parse) {
    defer_.assign(sections.begin(), sections.end());
    parse_ = parse;
  }

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
      if (!fresh) return false;
      if (depth_ == 1 && parse_ != nullptr && field.value.type() == simdjson::dom::element_type::ARRAY &&
          std::find(defer_.begin(), defer_.end(), field.key) != defer_.end()) {
        if (!hold_back(field.key, field.value.get_array().value_unsafe(), at->second)) return false;
        continue;
      }
      if (!build(field.value, at->second)) return false;
    }
    return true;
  }

  // A section of the root kept as its elements, checked as build would check them; the tree
  // gets an array of as many nulls.
  bool hold_back(std::string_view name, simdjson::dom::array a, Json& out) {
    if (depth_ + 1 > max_depth_) return false;  // the section's own array, as deeper() counts it
    DeferredSections::Parse::Section section;
    section.name = std::string(name);
    section.elements.reserve(a.size());
    for (const auto element : a) {
      if (!fits(element, depth_ + 1, max_depth_)) return false;
      section.elements.push_back(element);
    }
    section.built.assign(section.elements.size(), 0);
    out = Json::array();
    out.get_ref<Json::array_t&>().resize(section.elements.size());
    parse_->sections.push_back(std::move(section));
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
  std::vector<std::string_view> defer_;  // views of the caller's names, used within its call
  DeferredSections::Parse* parse_ = nullptr;
};

// Whether simdjson's tree may stand for nlohmann's: see fast_json_tree.
bool fast_parse_fits(std::string_view text) { return !has_surrogate_escape(text) && !has_negative_zero_integer(text); }

simdjson::padded_string_view padded_input(std::string_view text, std::size_t readable_beyond,
                                          std::optional<simdjson::padded_string>& copy) {
  if (readable_beyond < kParserPadding) {
    copy.emplace(text);
    return simdjson::padded_string_view(*copy);
  }
  return simdjson::padded_string_view(text.data(), text.size(), text.size() + readable_beyond);
}

}  // namespace

static_assert(kParserPadding >= simdjson::SIMDJSON_PADDING, "the padding simdjson reads past a text");

void reserve_parser_padding(std::string& text) {
  const std::size_t size = text.size();
  text.reserve(size + kParserPadding);
  text.append(kParserPadding, '\0');  // within the capacity just reserved: no reallocation
  text.resize(size);
}

std::optional<Json> fast_json_tree(std::string_view text, int max_depth, std::size_t readable_beyond) {
  if (!fast_parse_fits(text)) return std::nullopt;
  simdjson::dom::parser parser;
  simdjson::dom::element root;
  // A text with its padding is parsed where it lies (a register's text is not copied again).
  std::optional<simdjson::padded_string> copy;
  if (parser.parse(padded_input(text, readable_beyond, copy)).get(root) != simdjson::SUCCESS) return std::nullopt;
  Json out;
  if (!TreeBuilder(max_depth, 0, thread_budget(0) > 1).build(root, out)) return std::nullopt;
  return out;
}

DeferredSections::DeferredSections() : parse_(std::make_unique<Parse>()) {}
DeferredSections::~DeferredSections() = default;

bool DeferredSections::holds(std::string_view section) const { return parse_->find(section) != nullptr; }

void DeferredSections::build(std::string_view section, std::size_t i, Json& place) {
  Parse::Section* held = parse_->find(section);
  if (held == nullptr || i >= held->elements.size() || held->built[i] != 0) return;
  held->built[i] = 1;
  // The levels open around an element: the root object and the section's array. fits() passed
  // it when the text was parsed, so the build cannot decline; if the two ever disagreed, the
  // element would be half built: an internal error, never a quietly different project.
  if (!TreeBuilder(parse_->max_depth, 2, false).build(held->elements[i], place))
    throw Error("internal error: an element of \"" + held->name +
                    "\" passed the parse's checks but could not be built; please report it",
                ExitCode::kInternal);
}

bool DeferredSections::has_item_with(std::string_view section, std::size_t i, std::string_view array_key,
                                     std::string_view key) const {
  const Parse::Section* held = parse_->find(section);
  if (held == nullptr || i >= held->elements.size()) return false;
  simdjson::dom::object element;
  simdjson::dom::array items;
  if (held->elements[i].get(element) != simdjson::SUCCESS || element.at_key(array_key).get(items) != simdjson::SUCCESS)
    return false;
  for (const auto item : items) {
    simdjson::dom::object o;
    if (item.get(o) == simdjson::SUCCESS && o.at_key(key).error() == simdjson::SUCCESS) return true;
  }
  return false;
}

std::optional<Json> fast_json_tree_deferring(std::string_view text, int max_depth, std::size_t readable_beyond,
                                             std::initializer_list<std::string_view> sections,
                                             std::shared_ptr<DeferredSections>& deferred) {
  deferred.reset();
  if (!fast_parse_fits(text)) return std::nullopt;
  auto held = std::make_shared<DeferredSections>();
  DeferredSections::Parse& parse = *held->parse_;
  parse.max_depth = max_depth;
  simdjson::dom::element root;
  {
    simdjson::dom::parser parser;
    std::optional<simdjson::padded_string> copy;  // the document keeps no view of its input
    const simdjson::padded_string_view input = padded_input(text, readable_beyond, copy);
    if (parser.parse_into_document(parse.document, input.data(), input.size(), false).get(root) != simdjson::SUCCESS)
      return std::nullopt;
  }
  Json out;
  TreeBuilder builder(max_depth, 0, thread_budget(0) > 1);
  builder.defer(sections, &parse);
  if (!builder.build(root, out)) return std::nullopt;
  if (!parse.sections.empty()) deferred = std::move(held);
  return out;
}

}  // namespace sifter::detail
