// SVG drawing helpers: escaping, the canvas, scales and axes of the report's figures.
#include "sifter/report/svg.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "sifter/model/format.hpp"

namespace sifter::report {

std::string escape_html(std::string_view text) {
  std::string out;
  out.reserve(text.size());
  for (char c : text) {
    switch (c) {
      case '&':
        out += "&amp;";
        break;
      case '<':
        out += "&lt;";
        break;
      case '>':
        out += "&gt;";
        break;
      case '"':
        out += "&quot;";
        break;
      case '\'':
        out += "&#39;";
        break;
      default:
        out += c;
    }
  }
  return out;
}

namespace svg {
namespace {

const char* anchor_name(Anchor a) {
  switch (a) {
    case Anchor::kStart:
      return "start";
    case Anchor::kMiddle:
      return "middle";
    case Anchor::kEnd:
      return "end";
  }
  return "start";
}

std::string points_text(const Points& points) {
  std::string out;
  for (const auto& [x, y] : points) out += (out.empty() ? "" : " ") + coord(x) + "," + coord(y);
  return out;
}

std::string cls_attr(std::string_view cls) {
  return cls.empty() ? std::string() : " class=\"" + escape_html(cls) + "\"";
}

}  // namespace

std::string shortened(const std::string& text, std::size_t max_chars) {
  if (text.size() <= max_chars) return text;
  std::size_t cut = max_chars > 0 ? max_chars - 1 : 0;
  while (cut > 0 && (static_cast<unsigned char>(text[cut]) & 0xC0) == 0x80) --cut;  // not inside a character
  return text.substr(0, cut) + "…";
}

std::string coord(double value) {
  checked(value, "drawing coordinate");
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.2f", value);
  std::string s = buf;
  while (!s.empty() && s.back() == '0') s.pop_back();
  if (!s.empty() && s.back() == '.') s.pop_back();
  return s == "-0" ? "0" : s;
}

Canvas::Canvas(double width, double height) : width_(width), height_(height) {}

void Canvas::rect(double x, double y, double w, double h, std::string_view cls) {
  body_ += "<rect x=\"" + coord(x) + "\" y=\"" + coord(y) + "\" width=\"" + coord(std::max(w, 0.0)) + "\" height=\"" +
           coord(std::max(h, 0.0)) + "\"" + cls_attr(cls) + "/>";
}

void Canvas::line(double x1, double y1, double x2, double y2, std::string_view cls) {
  body_ += "<line x1=\"" + coord(x1) + "\" y1=\"" + coord(y1) + "\" x2=\"" + coord(x2) + "\" y2=\"" + coord(y2) + "\"" +
           cls_attr(cls) + "/>";
}

void Canvas::polyline(const Points& points, std::string_view cls) {
  if (points.size() < 2) return;
  body_ += "<polyline points=\"" + points_text(points) + "\"" + cls_attr(cls) + "/>";
}

void Canvas::polygon(const Points& points, std::string_view cls) {
  if (points.size() < 3) return;
  body_ += "<polygon points=\"" + points_text(points) + "\"" + cls_attr(cls) + "/>";
}

void Canvas::circle(double cx, double cy, double r, std::string_view cls) {
  body_ += "<circle cx=\"" + coord(cx) + "\" cy=\"" + coord(cy) + "\" r=\"" + coord(r) + "\"" + cls_attr(cls) + "/>";
}

void Canvas::text(double x, double y, std::string_view text, std::string_view cls, Anchor anchor) {
  body_ += "<text x=\"" + coord(x) + "\" y=\"" + coord(y) + "\" text-anchor=\"" + anchor_name(anchor) + "\"" +
           cls_attr(cls) + ">" + escape_html(text) + "</text>";
}

void Canvas::rotated_text(double x, double y, double degrees, std::string_view text, std::string_view cls,
                          Anchor anchor) {
  body_ += "<text x=\"" + coord(x) + "\" y=\"" + coord(y) + "\" text-anchor=\"" + anchor_name(anchor) +
           "\" transform=\"rotate(" + coord(degrees) + " " + coord(x) + " " + coord(y) + ")\"" + cls_attr(cls) + ">" +
           escape_html(text) + "</text>";
}

std::string Canvas::render(std::string_view figure, std::string_view label) const {
  // Inline SVG in HTML5 needs no namespace declaration, and the report names no outside resource.
  return "<svg class=\"fig\" data-figure=\"" + escape_html(figure) + "\" role=\"img\" aria-label=\"" +
         escape_html(label) + "\" viewBox=\"0 0 " + coord(width_) + " " + coord(height_) + "\" width=\"" +
         coord(width_) + "\" height=\"" + coord(height_) + "\"><title>" + escape_html(label) + "</title>" + body_ +
         "</svg>";
}

Scale::Scale(double lo, double hi, double px_lo, double px_hi, bool log)
    : lo_(lo), hi_(hi), px_lo_(px_lo), px_hi_(px_hi), log_(log) {}

double Scale::operator()(double value) const {
  double u = 0.0;
  if (log_) {
    const double v = std::max(value, lo_);
    u = (std::log10(v) - std::log10(lo_)) / (std::log10(hi_) - std::log10(lo_));
  } else {
    u = hi_ > lo_ ? (value - lo_) / (hi_ - lo_) : 0.0;
  }
  return px_lo_ + std::clamp(u, 0.0, 1.0) * (px_hi_ - px_lo_);
}

double decade_floor(double value) { return std::pow(10.0, std::floor(std::log10(value) + 1e-9)); }
double decade_ceil(double value) { return std::pow(10.0, std::ceil(std::log10(value) - 1e-9)); }

std::pair<double, double> log_range(const std::vector<double>& values, int decades, const std::vector<double>& keep) {
  double lo = 0.0, hi = 0.0;
  auto widen = [&](double v) {
    if (!(v > 0.0) || !std::isfinite(v)) return;
    lo = lo == 0.0 ? v : std::min(lo, v);
    hi = std::max(hi, v);
  };
  for (double v : values) widen(v);
  double keep_lo = 0.0;
  for (double v : keep)
    if (v > 0.0 && std::isfinite(v)) {
      widen(v);
      keep_lo = keep_lo == 0.0 ? v : std::min(keep_lo, v);
    }
  if (hi <= 0.0) return {1e-6, 1.0};
  hi = decade_ceil(hi * 1.0001);  // strictly above: a line on a decade never merges with the frame
  lo = std::max(decade_floor(lo), hi * std::pow(10.0, -decades));
  if (keep_lo > 0.0) lo = std::min(lo, decade_floor(keep_lo));
  if (lo >= hi) lo = hi / 10.0;
  return {lo, hi};
}

std::vector<double> decade_ticks(double lo, double hi) {
  std::vector<double> out;
  for (double e = std::round(std::log10(lo)); e <= std::log10(hi) + 1e-9; e += 1.0) out.push_back(std::pow(10.0, e));
  return out;
}

std::vector<double> linear_ticks(double lo, double hi, int count) {
  const double raw = (hi - lo) / std::max(count, 1);
  const double mag = decade_floor(raw);
  double step = mag;
  for (double m : {1.0, 2.0, 5.0, 10.0})
    if (m * mag >= raw) {
      step = m * mag;
      break;
    }
  std::vector<double> out;
  for (double v = std::ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) out.push_back(v);
  return out;
}

std::string power_of_ten_label(double value) {
  static const char* const kDigits[] = {"⁰", "¹", "²", "³", "⁴", "⁵", "⁶", "⁷", "⁸", "⁹"};
  const long e = std::lround(std::log10(value));
  if (e == 0) return "1";
  if (e == 1) return "10";
  std::string exponent = e < 0 ? "⁻" : "";
  for (char c : std::to_string(std::labs(e))) exponent += kDigits[c - '0'];
  return "10" + exponent;
}

void draw_axes(Canvas& canvas, const Plot& plot, const Axis& x, const Axis& y) {
  const double bottom = plot.top + plot.height;
  const double right = plot.left + plot.width;
  for (std::size_t i = 0; i < x.ticks.size(); ++i) {
    const double px = plot.x(x.ticks[i]);
    canvas.line(px, plot.top, px, bottom, "grid");
    canvas.line(px, bottom, px, bottom + 4, "ax");
    if (i < x.labels.size()) canvas.text(px, bottom + 16, x.labels[i], "tick", Anchor::kMiddle);
  }
  for (std::size_t i = 0; i < y.ticks.size(); ++i) {
    const double py = plot.y(y.ticks[i]);
    canvas.line(plot.left, py, right, py, "grid");
    canvas.line(plot.left - 4, py, plot.left, py, "ax");
    if (i < y.labels.size()) canvas.text(plot.left - 7, py + 4, y.labels[i], "tick", Anchor::kEnd);
  }
  canvas.rect(plot.left, plot.top, plot.width, plot.height, "frame");
  if (!x.title.empty()) canvas.text(plot.left + plot.width / 2, bottom + 36, x.title, "axis-title", Anchor::kMiddle);
  if (!y.title.empty())
    canvas.rotated_text(plot.left - 52, plot.top + plot.height / 2, -90, y.title, "axis-title", Anchor::kMiddle);
}

void legend_line(Canvas& canvas, double x, double y, std::string_view cls, std::string_view words) {
  canvas.line(x, y - 4, x + 28, y - 4, cls);
  canvas.text(x + 34, y, words, "legend");
}

}  // namespace svg
}  // namespace sifter::report
