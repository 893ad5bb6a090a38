#pragma once
// Helpers shared by the diff sources (src/analysis/diff*.cpp); not part of the public API.
#include <algorithm>
#include <cmath>
#include <functional>
#include <optional>
#include <set>
#include <string>
#include <unordered_map>
#include <utility>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/results/diff.hpp"

namespace sifter::detail {

inline bool same_number(double a, double b) {
  if (a == b) return true;
  return std::fabs(a - b) <= kDiffRelTol * std::max(std::fabs(a), std::fabs(b));
}

inline DiffValue number_value(double v) { return {v, {}}; }
inline DiffValue text_value(std::string s) { return {std::nullopt, std::move(s)}; }

inline std::optional<DiffValue> optional_number(const std::optional<double>& v) {
  return v ? std::optional(number_value(*v)) : std::nullopt;
}

inline bool same_value(const std::optional<DiffValue>& a, const std::optional<DiffValue>& b) {
  if (!a || !b) return !a && !b;
  if (a->number && b->number) return same_number(*a->number, *b->number);
  return !a->number && !b->number && a->text == b->text;
}

// Collects the differences of one item's fields, all under the same owner.
class Changes {
 public:
  explicit Changes(std::vector<InputChange>& out) : out_(out) {}
  void compare(const std::string& pointer, const std::string& what, const std::string& unit,
               const std::optional<DiffValue>& a, const std::optional<DiffValue>& b) {
    if (!same_value(a, b)) out_.push_back({pointer, what, unit, a, b});
  }
  void number(const std::string& pointer, const std::string& what, const std::string& unit, double a, double b) {
    compare(pointer, what, unit, number_value(a), number_value(b));
  }
  void text(const std::string& pointer, const std::string& what, const std::string& a, const std::string& b) {
    compare(pointer, what, "", text_value(a), text_value(b));
  }
  void added(const std::string& pointer, const std::string& what, const std::string& text) {
    out_.push_back({pointer, what, "", std::nullopt, text_value(text)});
  }
  void removed(const std::string& pointer, const std::string& what, const std::string& text) {
    out_.push_back({pointer, what, "", text_value(text), std::nullopt});
  }

 private:
  std::vector<InputChange>& out_;
};

inline std::string yes_no(bool b) { return b ? "true" : "false"; }

// Pairs items of two revisions by key: calls both(old, new), only_old(old), only_new(new), in
// the order of the new revision, then the old. Each side is indexed by key once (the first item
// of a key answers, as a scan would), so registers of thousands of items pair in linear time.
template <typename T, typename Key>
void pair_up(const std::vector<T>& olds, const std::vector<T>& news, Key key_of,
             const std::function<void(const T&, const T&)>& both, const std::function<void(const T&)>& only_old,
             const std::function<void(const T&)>& only_new) {
  auto index = [&](const std::vector<T>& items) {
    std::unordered_map<std::string, const T*> by_key;
    by_key.reserve(items.size());
    for (const auto& item : items) by_key.try_emplace(key_of(item), &item);
    return by_key;
  };
  const auto old_by_key = index(olds);
  const auto new_by_key = index(news);
  for (const auto& n : news) {
    if (auto o = old_by_key.find(key_of(n)); o != old_by_key.end())
      both(*o->second, n);
    else
      only_new(n);
  }
  for (const auto& o : olds)
    if (new_by_key.count(key_of(o)) == 0) only_old(o);
}

/// The differences of two revisions' inputs, one function per kind of item (src/analysis/diff_inputs.cpp).
void compare_component(Changes& c, const Component& a, const Component& b);
void compare_sif_inputs(Changes& c, const Sif& a, const Sif& b);
void compare_scenario_inputs(Changes& c, const Scenario& a, const Scenario& b);
void compare_project_inputs(Changes& c, const Project& a, const Project& b);

/// The ids of the components a SIF's subsystems use.
std::set<std::string> component_ids_of(const Sif& sif);

}  // namespace sifter::detail
