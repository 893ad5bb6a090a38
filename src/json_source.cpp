// A structural scan of JSON text: depth, duplicate keys and the position of every value.
#include "sifter/json_source.hpp"

#include <algorithm>
#include <unordered_map>
#include <unordered_set>

namespace sifter {

std::string escape_pointer_token(std::string_view token) {
  std::string out;
  out.reserve(token.size());
  for (char c : token) {
    if (c == '~') out += "~0";
    else if (c == '/') out += "~1";
    else out += c;
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

// A cursor over the text that keeps its line and column as it moves.
class Cursor {
 public:
  explicit Cursor(std::string_view text) : text_(text) {}
  [[nodiscard]] bool done() const { return i_ >= text_.size(); }
  [[nodiscard]] char peek() const { return done() ? '\0' : text_[i_]; }
  [[nodiscard]] TextPosition position() const { return pos_; }
  void advance() {
    if (done()) return;
    if (text_[i_] == '\n') {
      ++pos_.line;
      pos_.column = 1;
    } else if ((static_cast<unsigned char>(text_[i_]) & 0xC0) != 0x80) {
      ++pos_.column;
    }
    ++i_;
  }
  void skip_space() {
    while (!done() && (peek() == ' ' || peek() == '\n' || peek() == '\r' || peek() == '\t')) advance();
  }
  // Reads a JSON string at the cursor (which is on the opening quote); false on bad syntax.
  // Escapes are decoded enough to build pointers: \uXXXX outside ASCII is kept as written.
  bool read_string(std::string& out) {
    out.clear();
    advance();
    while (!done()) {
      char c = peek();
      if (c == '"') {
        advance();
        return true;
      }
      if (c == '\\') {
        advance();
        char e = peek();
        switch (e) {
          case 'n': out += '\n'; break;
          case 't': out += '\t'; break;
          case 'r': out += '\r'; break;
          case 'b': out += '\b'; break;
          case 'f': out += '\f'; break;
          case 'u': out += "\\u"; break;
          default: out += e; break;
        }
        advance();
        continue;
      }
      out += c;
      advance();
    }
    return false;
  }
  void skip_scalar() {
    while (!done()) {
      char c = peek();
      if (c == ',' || c == '}' || c == ']' || c == ' ' || c == '\n' || c == '\r' || c == '\t') return;
      advance();
    }
  }

 private:
  std::string_view text_;
  std::size_t i_ = 0;
  TextPosition pos_{1, 1};
};

struct Frame {
  bool is_object = false;
  std::size_t index = 0;
  std::size_t pointer_length = 0;  // length of the pointer of this container
  std::unordered_set<std::string> keys;
};

}  // namespace

std::vector<StructureProblem> scan_json_structure(
    std::string_view text, const std::function<void(const std::string&, TextPosition)>& visit) {
  std::vector<StructureProblem> problems;
  Cursor cur(text);
  std::vector<Frame> stack;
  std::string pointer;
  std::string key;
  bool expect_value = true;  // otherwise: expect a separator or a closing bracket

  cur.skip_space();
  if (visit) visit(pointer, cur.position());
  while (true) {
    cur.skip_space();
    if (cur.done()) return problems;
    if (expect_value) {
      const char c = cur.peek();
      if (c == '{' || c == '[') {
        if (static_cast<int>(stack.size()) >= kMaxNestingDepth) {
          // Name the place by its first levels only; the full pointer would be unreadable.
          std::size_t cut = 0;
          for (int level = 0; level < 6 && cut != std::string::npos; ++level) cut = pointer.find('/', cut + 1);
          const std::string shown = cut == std::string::npos ? pointer : pointer.substr(0, cut) + "/...";
          problems.push_back({shown, cur.position(),
                              "nesting no deeper than " + std::to_string(kMaxNestingDepth) + " levels",
                              "deeper nesting", "a project file needs only a few levels; check the brackets"});
          return problems;
        }
        Frame f;
        f.is_object = c == '{';
        f.pointer_length = pointer.size();
        stack.push_back(std::move(f));
        cur.advance();
        cur.skip_space();
        if (cur.peek() == (c == '{' ? '}' : ']')) {
          cur.advance();
          stack.pop_back();
          expect_value = false;
          continue;
        }
        if (c == '[') {
          pointer += "/0";
          if (visit) visit(pointer, cur.position());
          continue;
        }
        // An object: read its first key below.
      } else if (c == '"') {
        std::string ignored;
        if (!cur.read_string(ignored)) return problems;
        expect_value = false;
        continue;
      } else {
        cur.skip_scalar();
        expect_value = false;
        continue;
      }
    } else {
      if (stack.empty()) return problems;  // trailing text: the parser reports it
      Frame& top = stack.back();
      const char c = cur.peek();
      pointer.resize(top.pointer_length);
      if (c == (top.is_object ? '}' : ']')) {
        cur.advance();
        stack.pop_back();
        continue;
      }
      if (c != ',') return problems;
      cur.advance();
      cur.skip_space();
      if (!top.is_object) {
        ++top.index;
        pointer += "/" + std::to_string(top.index);
        if (visit) visit(pointer, cur.position());
        expect_value = true;
        continue;
      }
    }
    // Read an object member's key, then expect its value.
    cur.skip_space();
    if (cur.peek() != '"') return problems;
    const TextPosition key_pos = cur.position();
    if (!cur.read_string(key)) return problems;
    Frame& obj = stack.back();
    pointer.resize(obj.pointer_length);
    pointer += "/" + escape_pointer_token(key);
    if (!obj.keys.insert(key).second) {
      problems.push_back({pointer, key_pos, "each key once in an object", "\"" + key + "\" a second time",
                          "remove one of the two; a JSON reader would silently keep only the last"});
    }
    if (visit) visit(pointer, key_pos);
    cur.skip_space();
    if (cur.peek() != ':') return problems;
    cur.advance();
    expect_value = true;
  }
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
