// The architecture block drawing of a SIF and the frequency staircase of a scenario.
#include "sifter/report/diagrams.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <optional>

#include "sifter/model/format.hpp"
#include "sifter/report/svg.hpp"

namespace sifter::report {
namespace {

using svg::Anchor;
using svg::Canvas;

// Layout of the block drawing, in pixels.
constexpr double kElementH = 24.0, kElementGap = 18.0, kChannelGap = 10.0, kPad = 16.0, kBadgeH = 26.0;
// With these, a group's vertical centre is the midpoint of its first and last channel.
constexpr double kGroupGap = 46.0, kMarginX = 30.0, kHeadH = 40.0;

double text_px(const std::string& s) { return svg::kCharPx * static_cast<double>(s.size()); }

double element_w(const std::string& tag) { return std::max(56.0, text_px(tag) + 16.0); }

double channel_w(const std::vector<std::string>& channel) {
  double w = 0.0;
  for (const auto& tag : channel) w += element_w(tag);
  return w + kElementGap * static_cast<double>(channel.empty() ? 0 : channel.size() - 1);
}

struct GroupBox {
  double w = 0.0, h = 0.0;
};

GroupBox group_box(const SubsystemResult& s) {
  double inner = text_px(s.vote) + 24.0;
  for (const auto& ch : s.channels) inner = std::max(inner, channel_w(ch) + 2 * kElementGap);
  if (s.channels.empty()) inner = std::max(inner, text_px("supplier's figure") + 16.0);
  const double rows = static_cast<double>(std::max<std::size_t>(s.channels.size(), 1));
  const double name_w = text_px(svg::shortened(s.name, 40)) + 8.0;  // the name is written above the box
  return {std::max(inner + 2 * kPad, name_w), kBadgeH + rows * (kElementH + kChannelGap) + kPad};
}

std::string role_words(Role role) {
  switch (role) {
    case Role::kSensor:
      return "sensors";
    case Role::kLogic:
      return "logic solver";
    case Role::kFinal:
      return "final elements";
  }
  return "";
}

void arrow(Canvas& c, double x1, double x2, double y) {
  c.line(x1, y, x2 - 7, y, "wire");
  c.polygon({{x2, y}, {x2 - 8, y - 4}, {x2 - 8, y + 4}}, "arrow");
}

// One group at (x, y): the box, its vote, its channels in parallel between two rails.
void draw_group(Canvas& c, const SubsystemResult& s, const GroupBox& box, double x, double y) {
  c.text(x + box.w / 2, 14, role_words(s.role), "role", Anchor::kMiddle);
  c.text(x + box.w / 2, 30, svg::shortened(s.name, 40), "label", Anchor::kMiddle);
  c.rect(x, y, box.w, box.h, "group");
  c.rect(x + 8, y + 6, text_px(s.vote) + 12, 17, "badge");
  c.text(x + 14, y + 19, s.vote, "badge-text");
  if (s.channels.empty()) {
    c.text(x + box.w / 2, y + kBadgeH + kElementH / 2 + 4, "supplier's figure", "note", Anchor::kMiddle);
    return;
  }
  const double left_rail = x + kPad, right_rail = x + box.w - kPad;
  const double first = y + kBadgeH + kElementH / 2;
  const double last = first + static_cast<double>(s.channels.size() - 1) * (kElementH + kChannelGap);
  c.line(x, y + box.h / 2, left_rail, y + box.h / 2, "wire");
  c.line(right_rail, y + box.h / 2, x + box.w, y + box.h / 2, "wire");
  if (s.channels.size() > 1) {
    c.line(left_rail, first, left_rail, last, "wire");
    c.line(right_rail, first, right_rail, last, "wire");
  }
  for (std::size_t k = 0; k < s.channels.size(); ++k) {
    const double mid = first + static_cast<double>(k) * (kElementH + kChannelGap);
    double ex = x + (box.w - channel_w(s.channels[k])) / 2;
    c.line(left_rail, mid, ex, mid, "wire");
    for (std::size_t e = 0; e < s.channels[k].size(); ++e) {
      const std::string& tag = s.channels[k][e];
      if (e > 0) c.line(ex - kElementGap, mid, ex, mid, "wire");
      c.rect(ex, mid - kElementH / 2, element_w(tag), kElementH, "element");
      c.text(ex + element_w(tag) / 2, mid + 4, tag, "tag", Anchor::kMiddle);
      ex += element_w(tag) + kElementGap;
    }
    c.line(ex - kElementGap, mid, right_rail, mid, "wire");
  }
}

}  // namespace

std::string architecture_svg(const SifResult& sif) {
  std::vector<GroupBox> boxes;
  double width = 2 * kMarginX, tallest = 0.0;
  for (const auto& s : sif.subsystems) {
    boxes.push_back(group_box(s));
    width += boxes.back().w;
    tallest = std::max(tallest, boxes.back().h);
  }
  width += kGroupGap * static_cast<double>(boxes.empty() ? 0 : boxes.size() - 1);
  Canvas c(std::max(width, 320.0), kHeadH + tallest + 12.0);
  const double mid = kHeadH + tallest / 2;
  double x = kMarginX;
  arrow(c, 4, x, mid);
  for (std::size_t i = 0; i < boxes.size(); ++i) {
    const double top = mid - boxes[i].h / 2;
    draw_group(c, sif.subsystems[i], boxes[i], x, top);
    x += boxes[i].w;
    arrow(c, x, x + (i + 1 < boxes.size() ? kGroupGap : kMarginX - 4), mid);
    x += kGroupGap;
  }
  return c.render("architecture", "Architecture of " + sif.id);
}

namespace {

// One stepped line of the staircase: columns and the frequency after each step.
struct Stair {
  std::string name;
  std::string cls;
  std::vector<std::pair<std::size_t, double>> points;  // (column, frequency per year)
};

// Columns that belong together: a cause's steps, all causes, one consequence's steps.
struct ColumnGroup {
  std::string name;
  std::size_t first = 0, last = 0;
  std::optional<double> target_per_yr;  // consequences: the tolerable frequency
  std::optional<bool> meets_target;     // consequences: with the SIF
};

struct Staircase {
  std::vector<std::string> labels;  // one per column
  std::vector<Stair> stairs;
  std::vector<ColumnGroup> groups;
};

std::string column_label(const WorksheetRow& row) {
  switch (row.step) {
    case WorksheetStep::kCause:
      return "initiating frequency";
    case WorksheetStep::kEnabling:
      return svg::shortened(row.title, 22);
    case WorksheetStep::kLayer:
      return row.item + (row.credited ? "" : " (no credit)");
    case WorksheetStep::kSif:
      return row.item + " (assessed)";
    case WorksheetStep::kTotal:
      return "sum";
    case WorksheetStep::kModifier:
      return svg::shortened(row.title, 22);
    case WorksheetStep::kTarget:
      return "without the SIF";
    case WorksheetStep::kWithSif:
      return "with the SIF";
    case WorksheetStep::kNotCredited:
      return "";
  }
  return "";
}

// Starts a new group (and its stair) when the row's group differs from the last one.
void open_group(Staircase& st, const std::string& name, const std::string& cls, std::size_t col) {
  if (!st.groups.empty() && st.groups.back().name == name) return;
  st.groups.push_back({name, col, col, std::nullopt, std::nullopt});
  st.stairs.push_back({name, cls, {}});
}

Staircase build_staircase(const ScenarioResult& s) {
  Staircase st;
  std::optional<std::pair<std::size_t, double>> total;
  std::size_t consequence = 0;
  for (const auto& row : s.worksheet) {
    if (!row.frequency_per_yr || row.step == WorksheetStep::kNotCredited) continue;
    const std::size_t col = st.labels.size();
    st.labels.push_back(column_label(row));
    const double f = *row.frequency_per_yr;
    if (row.step == WorksheetStep::kTotal) {
      open_group(st, "all causes", "total", col);
      total = {col, f};
    } else if (row.consequence.empty() && !row.cause.empty()) {
      open_group(st, "cause " + row.cause, "sub sub-" + std::to_string(st.groups.size() % 4), col);
    } else {
      const std::size_t before = st.groups.size();
      open_group(st, row.consequence, "tail tail-" + std::to_string(consequence % 2), col);
      if (st.groups.size() != before) {
        if (total) st.stairs.back().points.push_back(*total);  // every consequence starts from the sum
        if (consequence < s.consequences.size())
          st.groups.back().meets_target = s.consequences[consequence].meets_target;
        ++consequence;
      }
      if (row.step == WorksheetStep::kTarget && row.value) st.groups.back().target_per_yr = *row.value;
    }
    st.stairs.back().points.emplace_back(col, f);
    st.groups.back().last = col;
  }
  return st;
}

constexpr double kStairLeft = 80.0, kStairTop = 30.0, kStairPlotH = 240.0, kLabelRoom = 118.0;

// A stair: a tread across each column and risers between neighbours; the step from the sum to
// a consequence further right is a thin link, so that it does not read as a step of its own.
void draw_stair(Canvas& c, const svg::Plot& p, const Stair& stair, double column_w) {
  const auto x_of = [&](std::size_t col) { return p.left + column_w * (static_cast<double>(col) + 0.5); };
  const double half = column_w * 0.35;
  svg::Points pts;
  for (std::size_t i = 0; i < stair.points.size(); ++i) {
    const auto [col, f] = stair.points[i];
    if (i > 0 && col != stair.points[i - 1].first + 1) {
      c.polyline(pts, stair.cls);
      c.line(x_of(stair.points[i - 1].first) + half, pts.back().second, x_of(col) - half, pts.back().second, "link");
      pts = {{x_of(col) - half, pts.back().second}};
    }
    pts.emplace_back(x_of(col) - half, p.y(f));  // the riser from the previous tread, or the start
    pts.emplace_back(x_of(col) + half, p.y(f));
  }
  c.polyline(pts, stair.cls);
  for (const auto& [col, f] : stair.points) c.circle(x_of(col), p.y(f), 2.6, "dot");
}

// Group captions above the plot, separators between groups, the tolerable frequency of each
// consequence across its columns and the verdict beside its last step.
void draw_groups(Canvas& c, const svg::Plot& p, const Staircase& st, double column_w) {
  for (std::size_t k = 0; k < st.groups.size(); ++k) {
    const ColumnGroup& g = st.groups[k];
    const double x1 = p.left + column_w * static_cast<double>(g.first);
    const double x2 = p.left + column_w * static_cast<double>(g.last + 1);
    if (g.first > 0) c.line(x1, p.top, x1, p.top + p.height, "separator");
    c.text((x1 + x2) / 2, p.top - 8,
           svg::shortened(g.name, std::max<std::size_t>(10, static_cast<std::size_t>((x2 - x1) / svg::kCharPx))),
           "label", Anchor::kMiddle);
    if (g.target_per_yr) {
      c.line(x1, p.y(*g.target_per_yr), x2, p.y(*g.target_per_yr), "req-line");
      // From the group's left edge, or ending at its right edge when the words would leave it.
      const std::string words = "tolerable " + sci(*g.target_per_yr);
      const bool fits = x1 + 3 + text_px(words) <= x2;
      c.text(fits ? x1 + 3 : x2 - 3, p.y(*g.target_per_yr) - 5, words, "note", fits ? Anchor::kStart : Anchor::kEnd);
    }
    if (g.meets_target) {
      const auto& last = st.stairs[k].points.back();  // groups and stairs are opened in pairs
      // Under the step, where no tolerable line runs; above it when that would leave the plot.
      const double below = p.y(last.second) + 17;
      c.text(p.left + column_w * (static_cast<double>(last.first) + 0.5),
             below < p.top + p.height - 2 ? below : p.y(last.second) - 8, *g.meets_target ? "✔" : "✘",
             *g.meets_target ? "mark-good" : "mark-bad", Anchor::kMiddle);
    }
  }
}

std::pair<double, double> stair_range(const Staircase& st) {
  std::vector<double> values, targets;
  for (const auto& stair : st.stairs)
    for (const auto& pt : stair.points) values.push_back(pt.second);
  for (const auto& g : st.groups)
    if (g.target_per_yr) targets.push_back(*g.target_per_yr);
  return svg::log_range(values, 12, targets);  // a staircase shows every step, however far down
}

}  // namespace

std::string staircase_svg(const ScenarioResult& s) {
  const Staircase st = build_staircase(s);
  const auto [lo, hi] = stair_range(st);
  const double columns = std::max<double>(1.0, static_cast<double>(st.labels.size()));
  const double column_w = std::max(40.0, (720.0 - kStairLeft - 24.0) / columns);
  const double plot_w = column_w * columns;
  const double legend_top = kStairTop + kStairPlotH + kLabelRoom;
  Canvas c(std::max(720.0, kStairLeft + plot_w + 24.0), legend_top + 14.0);
  const svg::Plot p{kStairLeft,
                    kStairTop,
                    plot_w,
                    kStairPlotH,
                    svg::Scale(0.0, 1.0, kStairLeft, kStairLeft + plot_w, false),
                    svg::Scale(lo, hi, kStairTop + kStairPlotH, kStairTop, true)};
  svg::Axis y;
  y.ticks = svg::decade_ticks(lo, hi);
  for (double t : y.ticks) y.labels.push_back(svg::power_of_ten_label(t));
  y.title = "frequency [per year, log scale]";
  svg::draw_axes(c, p, svg::Axis{}, y);
  for (std::size_t i = 0; i < st.labels.size(); ++i)
    c.rotated_text(p.left + column_w * (static_cast<double>(i) + 0.5) + 4, p.top + p.height + 12, -40, st.labels[i],
                   "tick", Anchor::kEnd);
  draw_groups(c, p, st, column_w);
  for (const auto& stair : st.stairs) draw_stair(c, p, stair, column_w);
  svg::legend_line(c, kStairLeft, legend_top, "req-line", "tolerable frequency of the consequence");
  c.text(kStairLeft + 320, legend_top, "✔ / ✘ with the SIF: tolerable / not tolerable", "legend");
  return c.render("staircase", "Frequency staircase of scenario " + s.id);
}

}  // namespace sifter::report
