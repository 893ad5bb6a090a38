#pragma once
/// Texts that many results say word for word, held once.
#include <memory>
#include <mutex>
#include <ostream>
#include <string>
#include <string_view>
#include <unordered_map>
#include <vector>

namespace sifter {

/// An immutable text that many results may hold word for word (a SIF's assumptions: the method
/// it was computed by, the defaults it took), read as the std::string it is. Copies share one
/// string; a TextPool makes equal texts built apart share one too.
class SharedText {
 public:
  SharedText() = default;
  // Implicit, so that the engines state an assumption as the string they build.
  SharedText(std::string text)  // NOLINT(google-explicit-constructor)
      : text_(std::make_shared<const std::string>(std::move(text))) {}
  SharedText(const char* text) : SharedText(std::string(text)) {}  // NOLINT(google-explicit-constructor)

  [[nodiscard]] const std::string& str() const& { return text_ ? *text_ : empty(); }
  operator const std::string&() const& { return str(); }  // NOLINT(google-explicit-constructor)
  // A temporary's string may be its last holder: read it only from a SharedText that lives on.
  const std::string& str() const&& = delete;
  operator const std::string&() const&& = delete;
  /// Whether the two hold the very same string (not only equal words).
  [[nodiscard]] bool shares_with(const SharedText& other) const { return text_ == other.text_; }

 private:
  static const std::string& empty() {
    static const std::string nothing;
    return nothing;
  }
  std::shared_ptr<const std::string> text_;
};

// Compared as views: a std::string would convert to a SharedText and call these again.
inline bool operator==(const SharedText& a, const SharedText& b) {
  return std::string_view(a.str()) == std::string_view(b.str());
}
inline bool operator==(const SharedText& a, std::string_view b) {  // either way round (C++20)
  return std::string_view(a.str()) == b;
}
inline bool operator==(const SharedText& a, const std::string& b) { return a == std::string_view(b); }
inline bool operator==(const SharedText& a, const char* b) { return a == std::string_view(b); }
inline std::ostream& operator<<(std::ostream& out, const SharedText& text) { return out << text.str(); }

/// A SIF's assumptions, in the order they were stated.
using Assumptions = std::vector<SharedText>;

/// Makes equal texts share one string, so that a register's thousands of SIFs hold each of
/// their few distinct assumptions once. Safe to use from several threads.
class TextPool {
 public:
  /// Replaces each text by the pool's string of the same words, adding those it lacks.
  void share(std::vector<SharedText>& texts) {
    const std::lock_guard<std::mutex> lock(mutex_);
    for (auto& t : texts) {
      auto [it, added] = held_.try_emplace(std::string_view(t.str()), t);
      if (!added) t = it->second;
    }
  }
  [[nodiscard]] std::size_t size() const {
    const std::lock_guard<std::mutex> lock(mutex_);
    return held_.size();
  }

 private:
  mutable std::mutex mutex_;
  std::unordered_map<std::string_view, SharedText> held_;  // keys view the strings held
};

}  // namespace sifter
