#pragma once
/// Drawing helpers for the inline SVG of the HTML report: escaping, a canvas, scales and axes.
/// They format; they compute nothing about the results.
#include <string>
#include <string_view>
#include <utility>
#include <vector>

namespace sifter::report {

/// Escapes text for HTML and XML content and attribute values: & < > " ' become entities.
std::string escape_html(std::string_view text);

namespace svg {

/// Advance of a 12 px sans-serif character, in pixels: how the drawings estimate text widths.
/// Conservative: the mean of bold lowercase in the widest common sans (DejaVu Sans, which
/// headless chromium on Debian uses) is about 7.4 px; the browser test measures the result.
inline constexpr double kCharPx = 7.6;

/// The text cut to at most `max_chars` bytes (never inside a UTF-8 character), with "…" when cut.
std::string shortened(const std::string& text, std::size_t max_chars);

/// A coordinate for an SVG attribute: at most two decimals, no exponent, never "-0".
std::string coord(double value);

/// How a text is anchored at its x.
enum class Anchor { kStart, kMiddle, kEnd };

/// Points of a polyline, in pixels.
using Points = std::vector<std::pair<double, double>>;

/// An SVG drawing built element by element; every text is escaped. The classes refer to the
/// report's style sheet, so that one place decides how lines and boxes look.
class Canvas {
 public:
  Canvas(double width, double height);
  void rect(double x, double y, double w, double h, std::string_view cls);
  void line(double x1, double y1, double x2, double y2, std::string_view cls);
  void polyline(const Points& points, std::string_view cls);
  void polygon(const Points& points, std::string_view cls);
  void circle(double cx, double cy, double r, std::string_view cls);
  void text(double x, double y, std::string_view text, std::string_view cls, Anchor anchor = Anchor::kStart);
  /// Text turned by `degrees` about its anchor point (negative: counter-clockwise).
  void rotated_text(double x, double y, double degrees, std::string_view text, std::string_view cls,
                    Anchor anchor = Anchor::kEnd);
  /// A tooltip-free title for screen readers and the figure's kind, as `data-figure`.
  [[nodiscard]] std::string render(std::string_view figure, std::string_view label) const;
  [[nodiscard]] double width() const { return width_; }
  [[nodiscard]] double height() const { return height_; }

 private:
  double width_;
  double height_;
  std::string body_;
};

/// Data to pixels along one axis, linear or logarithmic (base 10).
class Scale {
 public:
  Scale(double lo, double hi, double px_lo, double px_hi, bool log);
  /// The pixel of a value; on a log scale values at or below zero map to the low end.
  [[nodiscard]] double operator()(double value) const;
  [[nodiscard]] double lo() const { return lo_; }
  [[nodiscard]] double hi() const { return hi_; }
  [[nodiscard]] bool log() const { return log_; }

 private:
  double lo_, hi_, px_lo_, px_hi_;
  bool log_;
};

/// The powers of ten from lo to hi (both > 0), inclusive.
std::vector<double> decade_ticks(double lo, double hi);
/// About `count` round ticks (1, 2 or 5 times a power of ten apart) from lo to hi.
std::vector<double> linear_ticks(double lo, double hi, int count);
/// The decade at or below (floor) and at or above (ceil) a positive value.
double decade_floor(double value);
double decade_ceil(double value);
/// The decades enclosing the positive values: the floor is the decade at or below the smallest,
/// the ceiling the decade above the largest (strictly: a value on a decade, such as a required
/// PFD of 1e-2, gets the decade above it, so that its line does not merge with the frame), one
/// decade apart at least. A series that
/// dips towards zero (PFD(t) just after a proof test) would push the floor down without end, so
/// the floor is cut to `decades` below the ceiling, but never above the decade at or below any
/// of `keep` (the levels a reader must see: an average, a requirement, a band).
/// {1e-6, 1} when there is no positive value.
std::pair<double, double> log_range(const std::vector<double>& values, int decades,
                                    const std::vector<double>& keep = {});
/// "10⁻³" for a power of ten, with Unicode superscripts.
std::string power_of_ten_label(double value);

/// A plot area: where the data go, with one scale per axis.
struct Plot {
  double left = 0.0, top = 0.0, width = 0.0, height = 0.0;
  Scale x{0.0, 1.0, 0.0, 1.0, false};
  Scale y{0.0, 1.0, 1.0, 0.0, false};
};

/// The ticks and labels of one axis.
struct Axis {
  std::vector<double> ticks;
  std::vector<std::string> labels;  ///< one per tick
  std::string title;                ///< with its unit, e.g. "time since start-up [years]"
};

/// Draws the frame of a plot: grid lines at the ticks, the two axes, tick labels and titles.
void draw_axes(Canvas& canvas, const Plot& plot, const Axis& x, const Axis& y);

/// A legend entry drawn as a short sample of a line and its words, at (x, y).
void legend_line(Canvas& canvas, double x, double y, std::string_view cls, std::string_view words);

}  // namespace svg
}  // namespace sifter::report
