// `sifter export`: a project file as the CSV tables that `sifter import` reads back.
#include <filesystem>
#include <fstream>
#include <sstream>

#include "input/load_reuse.hpp"
#include "input/table_layout.hpp"
#include "sifter/input/csv_text.hpp"
#include "sifter/input/json_comments.hpp"
#include "sifter/input/load.hpp"
#include "sifter/input/project_tables.hpp"

namespace sifter {
namespace fs = std::filesystem;
using detail::CellKind;
using detail::Json;
using detail::TableLayout;

namespace {

std::string text_of(const Json& v) { return v.is_string() ? v.get<std::string>() : v.dump(); }

std::string join(const std::vector<std::string>& parts, const std::string& sep) {
  std::string out;
  for (const auto& p : parts) out += (out.empty() ? "" : sep) + p;
  return out;
}

// A JSON value as the cell `sifter import` reads back into the same value.
std::string cell_of(CellKind kind, const Json& v) {
  switch (kind) {
    case CellKind::kText:
    case CellKind::kValue:
      return text_of(v);
    case CellKind::kBool:
      return v.is_boolean() ? (v.get<bool>() ? "true" : "false") : text_of(v);
    case CellKind::kList: {
      std::vector<std::string> parts;
      for (const auto& s : v) parts.push_back(text_of(s));
      return join(parts, "; ");
    }
    case CellKind::kChannels: {
      std::vector<std::string> parts;
      for (const auto& ch : v) {
        if (!ch.is_array()) {
          parts.push_back(text_of(ch));
          continue;
        }
        std::vector<std::string> series;
        for (const auto& e : ch) series.push_back(text_of(e));
        parts.push_back(join(series, "+"));
      }
      return join(parts, "; ");
    }
    case CellKind::kConsequences: {
      std::vector<std::string> parts;
      for (const auto& c : v)
        parts.push_back(text_of(c.value("category", Json(""))) + ":" + text_of(c.value("severity", Json(""))));
      return join(parts, "; ");
    }
  }
  return text_of(v);
}

const Json* at_path(const Json& object, const std::string& path) {
  const Json* v = &object;
  std::size_t start = 0;
  while (true) {
    const auto slash = path.find('/', start);
    const std::string key = path.substr(start, slash == std::string::npos ? std::string::npos : slash - start);
    if (!v->is_object() || !v->contains(key)) return nullptr;
    v = &(*v)[key];
    if (slash == std::string::npos) return v;
    start = slash + 1;
  }
}

// Rows of one table; cells are filled by header.
class TableWriter {
 public:
  explicit TableWriter(const TableLayout& layout) : layout_(layout) {
    std::vector<std::string> header;
    for (const auto& c : layout.columns) header.push_back(c.header);
    text_ = csv_line(header);
  }
  std::vector<std::string> blank() const { return std::vector<std::string>(layout_.columns.size()); }
  void set(std::vector<std::string>& row, const std::string& header, const std::string& value) const {
    row[static_cast<std::size_t>(layout_.index(header))] = value;
  }
  // The columns `only` (all when empty) from an object.
  void fill(std::vector<std::string>& row, const Json& object, const std::vector<std::string>& only = {}) const {
    for (const auto& c : layout_.columns) {
      if (c.path.empty() || (!only.empty() && std::find(only.begin(), only.end(), c.header) == only.end())) continue;
      // An object is never one cell: a structured data_source fills its own columns instead.
      if (const Json* v = at_path(object, c.path); v && !v->is_object()) set(row, c.header, cell_of(c.kind, *v));
    }
  }
  void add(const std::vector<std::string>& row) { text_ += csv_line(row); }
  TableText done() const { return {layout_.file, text_}; }

 private:
  const TableLayout& layout_;
  std::string text_;
};

std::string read_text(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream buf;
  buf << in.rdbuf();
  return buf.str();
}

const Json& items(const Json& object, const char* key) {
  static const Json empty = Json::array();
  auto it = object.find(key);
  return it != object.end() && it->is_array() ? *it : empty;
}

void export_project(const Json& root, const std::string& project_path, const std::string& dir,
                    std::vector<TableText>& out) {
  TableWriter t(detail::table_layout("project.csv"));
  for (const auto& s : detail::project_settings()) {
    const Json* v = at_path(root, s.path);
    if (!v) continue;
    if (s.kind != CellKind::kList) {
      auto row = t.blank();
      t.set(row, "setting", s.name);
      t.set(row, "value", text_of(*v));
      t.add(row);
      continue;
    }
    for (const auto& lib : *v) {  // libraries: relative to the tables' folder
      const fs::path base = fs::absolute(fs::path(project_path).parent_path());
      const fs::path abs = fs::weakly_canonical(base / lib.get<std::string>());
      fs::path rel = abs.lexically_relative(fs::weakly_canonical(fs::absolute(dir)));
      auto row = t.blank();
      t.set(row, "setting", s.name);
      t.set(row, "value", (rel.empty() ? abs : rel).generic_string());
      t.add(row);
    }
  }
  out.push_back(t.done());
  TableWriter revisions(detail::table_layout("revisions.csv"));
  if (const Json* history = at_path(root, "document/history"); history && history->is_array())
    for (const auto& h : *history) {
      auto row = revisions.blank();
      revisions.fill(row, h);
      revisions.add(row);
    }
  out.push_back(revisions.done());
}

void export_sections(const Json& root, std::vector<TableText>& out) {
  TableWriter comp(detail::table_layout("components.csv"));
  for (const auto& c : items(root, "components")) {
    auto row = comp.blank();
    comp.fill(row, c);
    comp.add(row);
  }
  out.push_back(comp.done());
  TableWriter crit(detail::table_layout("risk_criteria.csv"));
  if (auto rc = root.find("risk_criteria"); rc != root.end())
    for (auto cat = rc->begin(); cat != rc->end(); ++cat)
      for (auto sev = cat->begin(); sev != cat->end(); ++sev) {
        auto row = crit.blank();
        crit.set(row, "category", cat.key());
        crit.set(row, "severity", sev.key());
        crit.set(row, "tolerable_frequency", text_of(sev.value()));
        crit.add(row);
      }
  out.push_back(crit.done());
  TableWriter sifs(detail::table_layout("sifs.csv")), subs(detail::table_layout("subsystems.csv"));
  TableWriter reqs(detail::table_layout("requirements.csv"));
  for (const auto& s : items(root, "sifs")) {
    auto row = sifs.blank();
    sifs.fill(row, s);
    sifs.add(row);
    if (s.contains("requirements")) {
      auto r = reqs.blank();
      reqs.set(r, "sif", text_of(s.value("id", Json(""))));
      reqs.fill(r, s);
      reqs.add(r);
    }
    for (const auto& sub : items(s, "subsystems")) {
      auto r = subs.blank();
      subs.set(r, "sif", text_of(s.value("id", Json(""))));
      subs.fill(r, sub);
      subs.add(r);
    }
  }
  out.push_back(sifs.done());
  out.push_back(reqs.done());
  out.push_back(subs.done());
}

void export_scenarios(const Json& root, std::vector<TableText>& out) {
  TableWriter sc(detail::table_layout("scenarios.csv")), ly(detail::table_layout("layers.csv"));
  for (const auto& s : items(root, "scenarios")) {
    const std::string sid = text_of(s.value("id", Json("")));
    for (const auto& c : items(s, "causes")) {
      auto row = sc.blank();
      sc.set(row, "scenario", sid);
      sc.fill(row, s, {"scenario_title", "node", "deviation", "consequences", "target_frequency", "scenario_note"});
      sc.fill(row, c, {"cause", "cause_title", "frequency", "devices", "note"});
      sc.add(row);
    }
    auto entry = [&](const std::string& kind, const Json& o, const std::string& cause = {}) {
      auto row = ly.blank();
      ly.set(row, "scenario", sid);
      ly.set(row, "entry", kind);
      if (!cause.empty()) ly.set(row, "cause", cause);
      auto only = detail::layer_entry_columns(kind);
      ly.fill(row, o, only);
      if (kind == "layer")
        if (const Json* a = at_path(o, "applies_to_causes")) ly.set(row, "applies_to", cell_of(CellKind::kList, *a));
      ly.add(row);
    };
    for (const auto& l : items(s, "layers")) entry(l.contains("sif") ? "sif" : "layer", l);
    for (const auto& m : items(s, "modifiers")) entry("modifier", m);
    for (const auto& c : items(s, "causes"))
      for (const auto& e : items(c, "enabling")) entry("enabling", e, text_of(c.value("id", Json(""))));
    for (const auto& n : items(s, "not_credited")) entry("not_credited", n);
  }
  out.push_back(sc.done());
  out.push_back(ly.done());
}

}  // namespace

std::vector<TableText> export_project_tables(const std::string& project_path, const std::string& dir) {
  (void)load_project_file(project_path);  // refuses a bad project with its own messages
  std::string text = read_text(project_path);
  (void)blank_json_comments(text);
  Json root = Json::parse(text);
  // Templates and catalogue entries are written out in full: a table row holds every value.
  detail::LoadContext ctx;
  ctx.sources.push_back({project_path, text});
  detail::ObjectReader top(ctx, root, "", 0, "a project");
  (void)detail::expand_reuse(ctx, root, top);
  std::vector<TableText> out;
  export_project(root, project_path, dir, out);
  export_sections(root, out);
  export_scenarios(root, out);
  return out;
}

}  // namespace sifter
