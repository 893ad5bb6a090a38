// The streaming JSON writer of the results: one pass, no tree, numbers by std::to_chars.
#include "sifter/report/json_stream.hpp"

#include <cassert>
#include <charconv>
#include <cstdint>
#include <cstdio>
#include <cstring>

#include "sifter/model/format.hpp"

namespace sifter::report {
namespace {
// Written out in pieces of about this size, so that a register's results never sit whole in memory.
constexpr std::size_t kFlushBytes = std::size_t{1} << 16;
}  // namespace

JsonStream::JsonStream(std::ostream& out, JsonLayout layout) : out_(out), pretty_(layout == JsonLayout::kPretty) {
  buffer_.reserve(2 * kFlushBytes);
}

JsonStream::JsonStream(std::ostream& out, JsonLayout layout, std::size_t array_depth, bool first_element)
    : JsonStream(out, layout) {
  assert(array_depth > 0);
  levels_.assign(array_depth, Level{false, false});
  levels_.back().empty = first_element;
}

JsonStream::~JsonStream() { flush(); }

JsonStream& JsonStream::elements(std::string_view written) {
  assert(!levels_.empty() && !levels_.back().object && !after_key_);
  if (written.empty()) return *this;
  flush();  // what was written before them, then the elements straight to the output
  out_.write(written.data(), static_cast<std::streamsize>(written.size()));
  levels_.back().empty = false;
  return *this;
}

void JsonStream::flush() {
  out_.write(buffer_.data(), static_cast<std::streamsize>(buffer_.size()));
  buffer_.clear();
}

void JsonStream::newline() {
  if (!pretty_) return;
  buffer_ += '\n';
  buffer_.append(2 * levels_.size(), ' ');
}

// Before any value: a comma and line break inside arrays; nothing after a key.
void JsonStream::before_value() {
  if (after_key_) {
    after_key_ = false;
    return;
  }
  if (levels_.empty()) return;
  assert(!levels_.back().object && "a value inside an object needs its key first");
  if (!levels_.back().empty) buffer_ += ',';
  levels_.back().empty = false;
  newline();
}

JsonStream& JsonStream::key(std::string_view name) {
  assert(!levels_.empty() && levels_.back().object && !after_key_);
  if (!levels_.back().empty) buffer_ += ',';
  levels_.back().empty = false;
  newline();
  escaped(name);
  buffer_ += pretty_ ? ": " : ":";
  after_key_ = true;
  return *this;
}

JsonStream& JsonStream::begin_object() {
  before_value();
  buffer_ += '{';
  levels_.push_back({true, true});
  return *this;
}

JsonStream& JsonStream::begin_array() {
  before_value();
  buffer_ += '[';
  levels_.push_back({false, true});
  return *this;
}

JsonStream& JsonStream::end_object() {
  assert(!levels_.empty() && levels_.back().object && !after_key_);
  const bool empty = levels_.back().empty;
  levels_.pop_back();
  if (!empty) newline();
  buffer_ += '}';
  if (buffer_.size() >= kFlushBytes) flush();
  return *this;
}

JsonStream& JsonStream::end_array() {
  assert(!levels_.empty() && !levels_.back().object);
  const bool empty = levels_.back().empty;
  levels_.pop_back();
  if (!empty) newline();
  buffer_ += ']';
  return *this;
}

// RFC 8259 section 7: quote, backslash and control characters escaped; UTF-8 passes through
// (the loader accepts only valid UTF-8, so every text here is valid).
namespace {
bool needs_escape(char c) { return c == '"' || c == '\\' || static_cast<unsigned char>(c) < 0x20; }

// The first byte at or after `from` that must be escaped, or text.size(). Eight bytes are
// tested at once (a word has a byte below 0x20, a quote or a backslash exactly when these
// masks are non-zero; bytes of 0x80 and above never match); the byte itself is then found
// one at a time.
std::size_t first_to_escape(std::string_view text, std::size_t from) {
  constexpr std::uint64_t kOnes = 0x0101010101010101ULL;
  constexpr std::uint64_t kHigh = 0x8080808080808080ULL;
  std::size_t i = from;
  for (; i + 8 <= text.size(); i += 8) {
    std::uint64_t w = 0;
    std::memcpy(&w, text.data() + i, 8);
    const std::uint64_t quote = w ^ (kOnes * '"');
    const std::uint64_t backslash = w ^ (kOnes * '\\');
    const std::uint64_t hits = ((w - kOnes * 0x20) | (quote - kOnes) | (backslash - kOnes)) & ~w & kHigh;
    if (hits != 0) break;
  }
  while (i < text.size() && !needs_escape(text[i])) ++i;
  return i;
}
}  // namespace

void JsonStream::escaped(std::string_view text) {
  buffer_ += '"';
  // Runs of characters that pass through unchanged are appended whole (most texts are one run).
  for (std::size_t from = 0;;) {
    const std::size_t i = first_to_escape(text, from);
    buffer_.append(text.data() + from, i - from);
    if (i == text.size()) break;
    escape_one(text[i]);
    from = i + 1;
  }
  buffer_ += '"';
}

void JsonStream::escape_one(char c) {
  const auto u = static_cast<unsigned char>(c);
  if (c == '"')
    buffer_ += "\\\"";
  else if (c == '\\')
    buffer_ += "\\\\";
  else if (c == '\n')
    buffer_ += "\\n";
  else if (c == '\t')
    buffer_ += "\\t";
  else if (c == '\r')
    buffer_ += "\\r";
  else if (c == '\b')
    buffer_ += "\\b";
  else if (c == '\f')
    buffer_ += "\\f";
  else {
    char buf[8];
    std::snprintf(buf, sizeof buf, "\\u%04x", u);
    buffer_ += buf;
  }
}

JsonStream& JsonStream::value(std::string_view text) {
  before_value();
  escaped(text);
  return *this;
}

JsonStream& JsonStream::value(bool b) {
  before_value();
  buffer_ += b ? "true" : "false";
  return *this;
}

JsonStream& JsonStream::value(int n) { return value(static_cast<long long>(n)); }

JsonStream& JsonStream::value(long long n) {
  before_value();
  char buf[24];
  const auto end = std::to_chars(buf, buf + sizeof buf, n).ptr;
  buffer_.append(buf, end);
  return *this;
}

JsonStream& JsonStream::number(double v, const char* what) {
  checked(v, what);
  before_value();
  if (v == 0.0) v = 0.0;  // no "-0"
  char buf[32];
  const auto end = std::to_chars(buf, buf + sizeof buf, v).ptr;
  const std::string_view text(buf, static_cast<std::size_t>(end - buf));
  buffer_ += text;
  if (text.find_first_of(".e") == std::string_view::npos) buffer_ += ".0";
  return *this;
}

JsonStream& JsonStream::null() {
  before_value();
  buffer_ += "null";
  return *this;
}

JsonStream& JsonStream::value(const std::vector<std::string>& texts) {
  begin_array();
  for (const auto& t : texts) value(t);
  return end_array();
}

JsonStream& JsonStream::value(const std::vector<SharedText>& texts) {
  begin_array();
  for (const auto& t : texts) value(t.str());
  return end_array();
}

}  // namespace sifter::report
