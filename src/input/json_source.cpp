// A structural scan of JSON text: depth, duplicate keys and the position of every value.
#include "sifter/input/json_source.hpp"

#include <algorithm>
#include <cstdint>
#include <deque>
#include <unordered_map>
#include <unordered_set>

namespace sifter {

std::string escape_pointer_token(std::string_view token) {
  std::string out;
  out.reserve(token.size());
  for (char c : token) {
    if (c == '~')
      out += "~0";
    else if (c == '/')
      out += "~1";
    else
      out += c;
  }
  return out;
}

TextPosition position_of_offset(std::string_view text, std::size_t offset) {
  TextPosition p{1, 1};
  offset = std::min(offset, text.size());
  for (std::size_t i = 0; i < offset; ++i) {
    if (text[i] == '\n') {
      ++p.line;
      p.column = 1;
    } else if ((static_cast<unsigned char>(text[i]) & 0xC0) != 0x80) {
      ++p.column;  // count characters, not UTF-8 continuation bytes
    }
  }
  return p;
}

namespace {

// Line and column of offsets met in increasing order, in one pass over the text overall.
class PositionTracker {
 public:
  explicit PositionTracker(std::string_view text) : text_(text) {}
  TextPosition at(std::size_t offset) {
    if (offset < offset_) {  // not expected, but stay correct
      offset_ = 0;
      pos_ = {1, 1};
    }
    offset = std::min(offset, text_.size());
    for (; offset_ < offset; ++offset_) {
      if (text_[offset_] == '\n') {
        ++pos_.line;
        pos_.column = 1;
      } else if ((static_cast<unsigned char>(text_[offset_]) & 0xC0) != 0x80) {
        ++pos_.column;  // count characters, not UTF-8 continuation bytes
      }
    }
    return pos_;
  }

 private:
  std::string_view text_;
  std::size_t offset_ = 0;
  TextPosition pos_{1, 1};
};

void append_utf8(std::string& out, std::uint32_t cp) {
  if (cp < 0x80) {
    out += static_cast<char>(cp);
  } else if (cp < 0x800) {
    out += static_cast<char>(0xC0 | (cp >> 6));
    out += static_cast<char>(0x80 | (cp & 0x3F));
  } else if (cp < 0x10000) {
    out += static_cast<char>(0xE0 | (cp >> 12));
    out += static_cast<char>(0x80 | ((cp >> 6) & 0x3F));
    out += static_cast<char>(0x80 | (cp & 0x3F));
  } else {
    out += static_cast<char>(0xF0 | (cp >> 18));
    out += static_cast<char>(0x80 | ((cp >> 12) & 0x3F));
    out += static_cast<char>(0x80 | ((cp >> 6) & 0x3F));
    out += static_cast<char>(0x80 | (cp & 0x3F));
  }
}

// A cursor over the text; positions are computed only where they are asked for.
class Cursor {
 public:
  explicit Cursor(std::string_view text) : text_(text) {}
  [[nodiscard]] bool done() const { return i_ >= text_.size(); }
  [[nodiscard]] char peek() const { return done() ? '\0' : text_[i_]; }
  [[nodiscard]] std::size_t offset() const { return i_; }
  void advance() { ++i_; }
  void skip_space() {
    while (i_ < text_.size() && (text_[i_] == ' ' || text_[i_] == '\n' || text_[i_] == '\r' || text_[i_] == '\t')) ++i_;
  }
  // Reads a JSON string at the cursor (on the opening quote) into `out`, decoded as a JSON
  // reader decodes it (escapes, \uXXXX and surrogate pairs), so that "b\u0065ta" and "beta"
  // are the same key; false on bad syntax. A string without escapes is only viewed, not copied.
  bool read_string(std::string_view& out, std::string& buffer) {
    ++i_;
    const std::size_t begin = i_;
    while (i_ < text_.size() && text_[i_] != '"' && text_[i_] != '\\') ++i_;
    if (i_ >= text_.size()) return false;
    if (text_[i_] == '"') {
      out = text_.substr(begin, i_ - begin);
      ++i_;
      return true;
    }
    buffer.assign(text_.substr(begin, i_ - begin));
    while (i_ < text_.size()) {
      const char c = text_[i_];
      if (c == '"') {
        ++i_;
        out = buffer;
        return true;
      }
      if (c != '\\') {
        buffer += c;
        ++i_;
        continue;
      }
      if (++i_ >= text_.size()) return false;
      if (!read_escape(buffer)) return false;
    }
    return false;
  }
  void skip_scalar() {
    while (i_ < text_.size()) {
      const char c = text_[i_];
      if (c == ',' || c == '}' || c == ']' || c == ' ' || c == '\n' || c == '\r' || c == '\t') return;
      ++i_;
    }
  }

 private:
  // Decodes the escape after a backslash (the cursor on its letter) into `buffer`; false on bad syntax.
  bool read_escape(std::string& buffer) {
    const char e = text_[i_++];
    switch (e) {
      case 'n':
        buffer += '\n';
        break;
      case 't':
        buffer += '\t';
        break;
      case 'r':
        buffer += '\r';
        break;
      case 'b':
        buffer += '\b';
        break;
      case 'f':
        buffer += '\f';
        break;
      case 'u': {
        std::uint32_t cp = 0;
        if (!read_hex4(cp)) return false;
        if (cp >= 0xD800 && cp <= 0xDBFF && i_ + 1 < text_.size() && text_[i_] == '\\' && text_[i_ + 1] == 'u') {
          const std::size_t back = i_;
          i_ += 2;
          std::uint32_t low = 0;
          if (read_hex4(low) && low >= 0xDC00 && low <= 0xDFFF)
            cp = 0x10000 + ((cp - 0xD800) << 10) + (low - 0xDC00);
          else
            i_ = back;  // a lone surrogate: the parser refuses the text anyway
        }
        append_utf8(buffer, cp);
        break;
      }
      default:
        buffer += e;
        break;
    }
    return true;
  }
  bool read_hex4(std::uint32_t& out) {
    if (i_ + 4 > text_.size()) return false;
    out = 0;
    for (int k = 0; k < 4; ++k) {
      const char h = text_[i_++];
      out <<= 4;
      if (h >= '0' && h <= '9')
        out |= static_cast<std::uint32_t>(h - '0');
      else if (h >= 'a' && h <= 'f')
        out |= static_cast<std::uint32_t>(h - 'a' + 10);
      else if (h >= 'A' && h <= 'F')
        out |= static_cast<std::uint32_t>(h - 'A' + 10);
      else
        return false;
    }
    return true;
  }

  std::string_view text_;
  std::size_t i_ = 0;
};

// The keys seen in one object: a short list searched in place, a hash set once it grows, so
// that an object of a million keys stays linear.
class KeySet {
 public:
  // False when the key was there already.
  bool insert(std::string_view key, std::deque<std::string>& arena, bool owned) {
    if (owned) key = arena.emplace_back(key);
    if (large_.empty()) {
      if (std::find(small_.begin(), small_.end(), key) != small_.end()) return false;
      if (small_.size() < kSmall) {
        small_.push_back(key);
        return true;
      }
      large_.insert(small_.begin(), small_.end());
      small_.clear();
    }
    return large_.insert(key).second;
  }

 private:
  static constexpr std::size_t kSmall = 16;
  std::vector<std::string_view> small_;
  std::unordered_set<std::string_view> large_;
};

struct Frame {
  bool is_object = false;
  std::size_t index = 0;  // current element of an array
  std::string key;        // current member of an object (decoded)
  KeySet keys;
};

// The pointer of the current place, from the frames (built only when needed).
std::string pointer_of(const std::vector<Frame>& stack, std::size_t levels) {
  std::string pointer;
  for (std::size_t i = 0; i < std::min(levels, stack.size()); ++i)
    pointer += "/" + (stack[i].is_object ? escape_pointer_token(stack[i].key) : std::to_string(stack[i].index));
  return pointer;
}

// The structure scan, one step per method: a container opened, a scalar, a separator or a
// closing bracket, an object member's key.
class StructureScanner {
 public:
  StructureScanner(std::string_view text, const std::function<void(const std::string&, TextPosition)>& visit)
      : text_(text), visit_(visit), cur_(text), positions_(text) {}

  std::vector<StructureProblem> run() {
    cur_.skip_space();
    seen(cur_.offset());
    while (true) {
      cur_.skip_space();
      if (cur_.done()) return finish();
      const Step step = expect_value_ ? value() : after_value();
      if (step == Step::kStop) return finish();
      if (step == Step::kNext) continue;
      if (!member_key()) return finish();
    }
  }

 private:
  enum class Step { kNext, kKey, kStop };

  void seen(std::size_t offset) {
    if (visit_) visit_(pointer_, positions_.at(offset));
  }

  std::vector<StructureProblem> finish() {
    PositionTracker located(text_);  // problems were found in text order
    for (std::size_t i = 0; i < problems_.size(); ++i) problems_[i].position = located.at(problem_offsets_[i]);
    return std::move(problems_);
  }

  Step value() {
    const char c = cur_.peek();
    if (c == '"') {
      std::string_view ignored;
      if (!cur_.read_string(ignored, buffer_)) return Step::kStop;
      expect_value_ = false;
      return Step::kNext;
    }
    if (c != '{' && c != '[') {
      cur_.skip_scalar();
      expect_value_ = false;
      return Step::kNext;
    }
    if (static_cast<int>(stack_.size()) >= kMaxNestingDepth) {
      // Name the place by its first levels only; the full pointer would be unreadable.
      const std::string shown = pointer_of(stack_, 6) + (stack_.size() > 6 ? "/..." : "");
      problems_.push_back({shown,
                           {},
                           "nesting no deeper than " + std::to_string(kMaxNestingDepth) + " levels",
                           "deeper nesting",
                           "a project file needs only a few levels; check the brackets"});
      problem_offsets_.push_back(cur_.offset());
      return Step::kStop;
    }
    Frame& f = stack_.emplace_back();
    f.is_object = c == '{';
    cur_.advance();
    cur_.skip_space();
    if (cur_.peek() == (c == '{' ? '}' : ']')) {
      cur_.advance();
      stack_.pop_back();
      expect_value_ = false;
      return Step::kNext;
    }
    if (c == '[') {
      if (visit_) pointer_ += "/0";
      seen(cur_.offset());
      return Step::kNext;
    }
    return Step::kKey;  // an object: read its first key
  }

  Step after_value() {
    if (stack_.empty()) return Step::kStop;  // trailing text: the parser reports it
    Frame& top = stack_.back();
    const char c = cur_.peek();
    if (visit_) pointer_.resize(pointer_.rfind('/') == std::string::npos ? 0 : pointer_.rfind('/'));
    if (c == (top.is_object ? '}' : ']')) {
      cur_.advance();
      stack_.pop_back();
      return Step::kNext;
    }
    if (c != ',') return Step::kStop;
    cur_.advance();
    cur_.skip_space();
    if (top.is_object) return Step::kKey;
    ++top.index;
    if (visit_) pointer_ += "/" + std::to_string(top.index);
    seen(cur_.offset());
    expect_value_ = true;
    return Step::kNext;
  }

  // Reads an object member's key, then expects its value; false ends the scan.
  bool member_key() {
    cur_.skip_space();
    if (cur_.peek() != '"') return false;
    const std::size_t key_offset = cur_.offset();
    std::string_view key;
    if (!cur_.read_string(key, buffer_)) return false;
    Frame& obj = stack_.back();
    obj.key.assign(key);
    const bool decoded = key.data() == buffer_.data();
    if (!obj.keys.insert(key, arena_, decoded)) {
      problems_.push_back({pointer_of(stack_, stack_.size()),
                           {},
                           "each key once in an object",
                           "\"" + obj.key + "\" a second time",
                           "remove one of the two; a JSON reader would silently keep only the last"});
      problem_offsets_.push_back(key_offset);
      if (problems_.size() >= kMaxReportedProblems) return false;  // enough to refuse the file
    }
    if (visit_) pointer_ += "/" + escape_pointer_token(obj.key);
    seen(key_offset);
    cur_.skip_space();
    if (cur_.peek() != ':') return false;
    cur_.advance();
    expect_value_ = true;
    return true;
  }

  std::string_view text_;
  const std::function<void(const std::string&, TextPosition)>& visit_;
  Cursor cur_;
  PositionTracker positions_;
  std::vector<StructureProblem> problems_;
  std::vector<std::size_t> problem_offsets_;
  std::vector<Frame> stack_;
  std::deque<std::string> arena_;  // keys that needed decoding
  std::string buffer_;
  bool expect_value_ = true;  // otherwise: expect a separator or a closing bracket
  // With a visitor the pointer is kept up to date as the scan moves; without, it is built
  // from the frames only for a problem.
  std::string pointer_;
};

}  // namespace

std::vector<StructureProblem> scan_json_structure(std::string_view text,
                                                  const std::function<void(const std::string&, TextPosition)>& visit) {
  return StructureScanner(text, visit).run();
}

std::vector<TextPosition> locate_pointers(std::string_view text, const std::vector<std::string>& pointers) {
  std::unordered_map<std::string, TextPosition> wanted;
  for (const auto& p : pointers) {
    // Every prefix may serve as a fallback.
    std::string prefix = p;
    while (true) {
      wanted.emplace(prefix, TextPosition{});
      const auto slash = prefix.rfind('/');
      if (slash == std::string::npos) break;
      prefix.resize(slash);
    }
  }
  scan_json_structure(text, [&](const std::string& pointer, TextPosition pos) {
    auto it = wanted.find(pointer);
    if (it != wanted.end() && it->second.line == 0) it->second = pos;
  });
  std::vector<TextPosition> out;
  out.reserve(pointers.size());
  for (const auto& p : pointers) {
    std::string prefix = p;
    TextPosition found{};
    while (true) {
      auto it = wanted.find(prefix);
      if (it != wanted.end() && it->second.line > 0) {
        found = it->second;
        break;
      }
      const auto slash = prefix.rfind('/');
      if (slash == std::string::npos) break;
      prefix.resize(slash);
    }
    out.push_back(found);
  }
  return out;
}

}  // namespace sifter
