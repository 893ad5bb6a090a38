// Strict, collecting reads of JSON members into typed values.
#include "input/json_reader.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "input/json_tree.hpp"
#include "sifter/input/json_source.hpp"

namespace sifter::detail {
namespace {
// A JSON -0.0 is read as zero, so that no "-0" reaches an output.
double without_negative_zero(double v) { return v == 0.0 ? 0.0 : v; }
}  // namespace

void LoadContext::error(int source, const std::string& pointer, std::string expected, std::string found,
                        std::string hint) {
  if (problems.size() >= kMaxReportedProblems) {  // a hostile file must not make a message of gigabytes
    ++problems_not_kept;
    return;
  }
  Diagnostic d;
  d.file = sources.empty() ? std::string() : sources[static_cast<std::size_t>(source)].path;
  d.pointer = pointer;
  d.expected = std::move(expected);
  d.found = std::move(found);
  d.hint = std::move(hint);
  problems.push_back({source, std::move(d)});
}

bool LoadContext::has_problem_under(int source, const std::string& pointer) const {
  return std::any_of(problems.begin(), problems.end(), [&](const PendingDiagnostic& p) {
    const std::string& at = p.diagnostic.pointer;
    return p.source == source && at.compare(0, pointer.size(), pointer) == 0 &&
           (at.size() == pointer.size() || at[pointer.size()] == '/');
  });
}

// A library that is missing, in a cycle, not JSON or without its "models" array loses every model
// it holds; a problem inside one model entry does not hide the others.
bool LoadContext::libraries_failed() const {
  return std::any_of(problems.begin(), problems.end(), [](const PendingDiagnostic& p) {
    const std::string& at = p.diagnostic.pointer;
    if (p.source == 0) return at.rfind("/libraries", 0) == 0;
    return at.empty() || at == "/models" || at.rfind("/libraries", 0) == 0;
  });
}

void LoadContext::warn(const std::string& pointer, std::string message) {
  warnings.push_back({pointer, std::move(message)});
}

std::vector<Diagnostic> LoadContext::located() const {
  std::vector<PendingDiagnostic> pending = problems;
  for (std::size_t s = 0; s < sources.size(); ++s) {
    std::vector<std::string> pointers;
    std::vector<std::size_t> which;
    for (std::size_t i = 0; i < pending.size(); ++i) {
      if (pending[i].source == static_cast<int>(s) && pending[i].diagnostic.line == 0) {
        pointers.push_back(pending[i].diagnostic.pointer);
        which.push_back(i);
      }
    }
    if (pointers.empty()) continue;
    const auto positions = locate_pointers(sources[s].text, pointers);
    for (std::size_t j = 0; j < which.size(); ++j) {
      pending[which[j]].diagnostic.line = positions[j].line;
      pending[which[j]].diagnostic.column = positions[j].column;
    }
  }
  std::vector<Diagnostic> out;
  out.reserve(pending.size() + 1);
  for (auto& p : pending) out.push_back(std::move(p.diagnostic));
  if (problems_not_kept > 0) {
    Diagnostic more;
    more.file = sources.empty() ? std::string() : sources.front().path;
    more.expected = "at most " + std::to_string(kMaxReportedProblems) + " problems reported at once";
    more.found = std::to_string(problems_not_kept) + " more";
    more.hint = "correct the problems above and run again";
    out.push_back(std::move(more));
  }
  return out;
}

Json& section_item(const LoadContext& ctx, std::string_view section, Json& items, std::size_t i) {
  if (ctx.deferred) ctx.deferred->build(section, i, items[i]);  // nothing for a section not held back
  return items[i];
}

std::string describe(const Json& value) {
  switch (value.type()) {
    case Json::value_t::null:
      return "null";
    case Json::value_t::boolean:
      return value.get<bool>() ? "true" : "false";
    case Json::value_t::string: {
      std::string s = value.get<std::string>();
      if (s.size() > 60) s = s.substr(0, 57) + "...";
      return "the string \"" + s + "\"";
    }
    case Json::value_t::number_integer:
    case Json::value_t::number_unsigned:
    case Json::value_t::number_float:
      return "the number " + value.dump();
    case Json::value_t::object:
      return "an object";
    case Json::value_t::array:
      return "an array";
    default:
      return "a value of another kind";
  }
}

ObjectReader::ObjectReader(LoadContext& ctx, const Json& value, std::string pointer, int source, std::string what)
    : ctx_(ctx),
      value_(value),
      pointer_(std::move(pointer)),
      source_(source),
      what_(std::move(what)),
      is_object_(value.is_object()) {
  if (!is_object_) ctx_.error(source_, pointer_, what_ + " (a JSON object)", describe(value));
}

// One allocation for the pointer when the key needs no escape: its size is known in advance.
std::string ObjectReader::at(std::string_view key) const {
  std::string out;
  out.reserve(pointer_.size() + 1 + key.size());
  out += pointer_;
  out += '/';
  if (key.find_first_of("~/") == std::string_view::npos)
    out += key;
  else
    out += escape_pointer_token(key);
  return out;
}

bool ObjectReader::has(std::string_view key) const { return is_object_ && value_.contains(key); }

const Json* ObjectReader::member(std::string_view key) {
  if (!is_object_) {
    mark_known(key);
    return nullptr;
  }
  auto it = value_.find(key);
  if (it == value_.end()) {
    mark_known(key);
    return nullptr;
  }
  mark_present(it);
  return &*it;
}

// The member, marked known, for the fast paths of the typed reads: a present, valid value is
// read without building any text for a message (messages are built only on a problem).
const Json* ObjectReader::present(std::string_view key) {
  if (!is_object_) return nullptr;
  auto it = value_.find(key);
  if (it == value_.end()) return nullptr;
  mark_present(it);
  return &*it;
}

const Json* ObjectReader::require(std::string_view key, const std::string& expected) {
  const Json* v = member(key);
  if (!v && is_object_)
    ctx_.error(source_, pointer_, "key \"" + std::string(key) + "\" (" + expected + ") in " + what_, "no such key");
  return v;
}

void ObjectReader::type_error(std::string_view key, const std::string& expected, const Json& found,
                              const std::string& hint) {
  ctx_.error(source_, at(key), expected, describe(found), hint);
}

std::optional<std::string> ObjectReader::string(std::string_view key, bool required) {
  const Json* v = required ? require(key, "a string") : member(key);
  if (!v) return std::nullopt;
  if (!v->is_string()) {
    type_error(key, "a string", *v);
    return std::nullopt;
  }
  return v->get<std::string>();
}

std::optional<double> ObjectReader::number(std::string_view key, bool required) {
  const Json* v = required ? require(key, "a number") : member(key);
  if (!v) return std::nullopt;
  if (!v->is_number() || !std::isfinite(v->get<double>())) {
    type_error(key, "a finite number", *v);
    return std::nullopt;
  }
  return without_negative_zero(v->get<double>());
}

std::optional<int> ObjectReader::integer(std::string_view key, int lo, int hi, bool required) {
  const Json* found = present(key);
  if (found && found->is_number_integer() && found->get<long long>() >= lo && found->get<long long>() <= hi)
    return static_cast<int>(found->get<long long>());
  if (absent_and_optional(key, found, required)) return std::nullopt;
  const std::string expected = "a whole number from " + std::to_string(lo) + " to " + std::to_string(hi);
  const Json* v = required ? require(key, expected) : member(key);
  if (!v) return std::nullopt;
  if (!v->is_number_integer() || v->get<long long>() < lo || v->get<long long>() > hi) {
    type_error(key, expected, *v);
    return std::nullopt;
  }
  return static_cast<int>(v->get<long long>());
}

std::optional<bool> ObjectReader::boolean(std::string_view key) {
  const Json* v = member(key);
  if (!v) return std::nullopt;
  if (!v->is_boolean()) {
    type_error(key, "true or false", *v);
    return std::nullopt;
  }
  return v->get<bool>();
}

std::optional<double> ObjectReader::fraction(std::string_view key, bool required) {
  const Json* found = present(key);
  if (found && found->is_number_float()) {
    const double x = found->get<double>();
    if (std::isfinite(x) && x >= 0.0 && x <= 1.0) return without_negative_zero(x);
  }
  if (absent_and_optional(key, found, required)) return std::nullopt;
  const std::string expected = "a fraction from 0 to 1, such as 0.05 or \"5%\"";
  const Json* v = required ? require(key, expected) : member(key);
  if (!v) return std::nullopt;
  std::optional<double> value;
  if (v->is_number()) value = v->get<double>();
  if (v->is_string()) value = parse_percent(v->get<std::string>()).value;
  if (!value || !std::isfinite(*value) || *value < 0.0 || *value > 1.0) {
    type_error(key, expected, *v);
    return std::nullopt;
  }
  return without_negative_zero(*value);
}

std::optional<double> ObjectReader::probability(std::string_view key, bool required) {
  const Json* found = present(key);
  if (found && found->is_number()) {
    const double x = found->get<double>();
    if (std::isfinite(x) && x >= 0.0 && x <= 1.0) return without_negative_zero(x);
  }
  if (absent_and_optional(key, found, required)) return std::nullopt;
  const std::string expected = "a probability from 0 to 1";
  const Json* v = required ? require(key, expected) : member(key);
  if (!v) return std::nullopt;
  if (!v->is_number() || !std::isfinite(v->get<double>()) || v->get<double>() < 0.0 || v->get<double>() > 1.0) {
    type_error(key, expected, *v);
    return std::nullopt;
  }
  return without_negative_zero(v->get<double>());
}

std::optional<Rate> ObjectReader::rate(std::string_view key, bool required) {
  const Json* found = present(key);
  if (found && found->is_string()) {
    auto parsed = parse_rate(found->get_ref<const std::string&>());
    if (parsed.value) return parsed.value;
  }
  if (absent_and_optional(key, found, required)) return std::nullopt;
  const std::string expected = "a rate with its unit";
  const Json* v = required ? require(key, expected) : member(key);
  if (!v) return std::nullopt;
  if (!v->is_string()) {
    type_error(key, expected, *v, "write the unit: " + std::string(kRateForms));
    return std::nullopt;
  }
  auto parsed = parse_rate(v->get<std::string>());
  if (!parsed.value) {
    type_error(key, expected + " (" + parsed.problem + ")", *v, parsed.hint);
    return std::nullopt;
  }
  return parsed.value;
}

std::optional<Duration> ObjectReader::duration(std::string_view key, bool required) {
  const Json* found = present(key);
  if (found && found->is_string()) {
    auto parsed = parse_duration(found->get_ref<const std::string&>());
    if (parsed.value) return parsed.value;
  }
  if (absent_and_optional(key, found, required)) return std::nullopt;
  const std::string expected = "a duration with its unit";
  const Json* v = required ? require(key, expected) : member(key);
  if (!v) return std::nullopt;
  if (!v->is_string()) {
    type_error(key, expected, *v, "write the unit: " + std::string(kDurationForms));
    return std::nullopt;
  }
  auto parsed = parse_duration(v->get<std::string>());
  if (!parsed.value) {
    type_error(key, expected + " (" + parsed.problem + ")", *v, parsed.hint);
    return std::nullopt;
  }
  return parsed.value;
}

std::optional<std::string> ObjectReader::choice(std::string_view key, std::initializer_list<const char*> allowed,
                                                bool required) {
  const Json* found = present(key);
  if (found && found->is_string())
    for (const char* a : allowed)
      if (found->get_ref<const std::string&>() == a) return found->get<std::string>();
  if (absent_and_optional(key, found, required)) return std::nullopt;
  std::string list;
  std::vector<std::string> names;
  for (const char* a : allowed) {
    list += (list.empty() ? "" : ", ") + std::string("\"") + a + "\"";
    names.emplace_back(a);
  }
  const std::string expected = "one of " + list;
  const Json* v = required ? require(key, expected) : member(key);
  if (!v) return std::nullopt;
  if (v->is_string() && std::find(names.begin(), names.end(), v->get<std::string>()) != names.end())
    return v->get<std::string>();
  std::string hint;
  if (v->is_string()) {
    const auto near = nearest(v->get<std::string>(), names);
    if (!near.empty()) hint = "did you mean \"" + near + "\"?";
  }
  type_error(key, expected, *v, hint);
  return std::nullopt;
}

std::vector<std::string> ObjectReader::strings(std::string_view key) {
  std::vector<std::string> out;
  const Json* v = member(key);
  if (!v) return out;
  if (!v->is_array()) {
    type_error(key, "an array of strings", *v);
    return out;
  }
  for (std::size_t i = 0; i < v->size(); ++i) {
    const Json& e = (*v)[i];
    if (!e.is_string()) {
      ctx_.error(source_, at(key) + "/" + std::to_string(i), "a string", describe(e));
      continue;
    }
    out.push_back(e.get<std::string>());
  }
  return out;
}

// A key may be marked twice; finish() removes the repeats from its hint.
void ObjectReader::mark_known(std::string_view key) {
  named_.emplace_back(named_text_.size(), key.size());
  named_text_.insert(named_text_.end(), key.begin(), key.end());
}

std::string_view ObjectReader::named(std::size_t i) const {
  return {named_text_.data() + named_[i].first, named_[i].second};
}

void ObjectReader::mark_present(const Json::const_iterator& member) { present_.emplace_back(member.key()); }

bool ObjectReader::is_marked(std::string_view key) const {
  if (std::find(present_.begin(), present_.end(), key) != present_.end()) return true;
  for (std::size_t i = 0; i < named_.size(); ++i)
    if (named(i) == key) return true;
  return false;
}

std::vector<std::string> ObjectReader::known_keys() const {
  std::vector<std::string> known(present_.begin(), present_.end());
  for (std::size_t i = 0; i < named_.size(); ++i) known.emplace_back(named(i));
  std::sort(known.begin(), known.end());
  known.erase(std::unique(known.begin(), known.end()), known.end());
  return known;
}

// The slow paths of the typed reads build their messages; an optional key that is simply
// absent needs none, so it is marked known and answered before any text is made.
bool ObjectReader::absent_and_optional(std::string_view key, const Json* found, bool required) {
  if (required || found) return false;
  mark_known(key);
  return true;
}

void ObjectReader::allow(std::initializer_list<const char*> keys) {
  for (const char* k : keys) mark_known(k);
}

void ObjectReader::finish() {
  if (!is_object_) return;
  std::vector<std::string> known;  // sorted for the hint, only when a key is unknown
  for (auto it = value_.begin(); it != value_.end(); ++it) {
    const std::string& key = it.key();
    if (is_marked(key)) continue;
    if (known.empty()) known = known_keys();
    const auto near = nearest(key, known);
    std::string hint = near.empty() ? "" : "did you mean \"" + near + "\"? ";
    std::string list;
    for (const auto& k : known) list += (list.empty() ? "" : ", ") + k;
    hint += "the keys of " + what_ + " are: " + list;
    ctx_.error(source_, at(key), "a key of " + what_, "unknown key \"" + key + "\"", hint);
  }
}

}  // namespace sifter::detail
