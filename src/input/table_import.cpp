// `sifter import`: CSV tables into a project file; every problem is placed at file.csv:row:column.
#include <algorithm>
#include <filesystem>
#include <fstream>
#include <map>
#include <nlohmann/json.hpp>
#include <set>
#include <sstream>

#include "input/json_reader.hpp"
#include "input/table_import_cells.hpp"
#include "input/table_layout.hpp"
#include "sifter/input/csv_text.hpp"
#include "sifter/input/json_source.hpp"
#include "sifter/input/load.hpp"
#include "sifter/input/project_tables.hpp"
#include "sifter/model/diagnostics.hpp"

namespace sifter {
namespace fs = std::filesystem;
using OJson = nlohmann::ordered_json;
using detail::cell_value;
using detail::CellKind;
using detail::TableLayout;
using detail::trim_cell;

namespace {

struct Place {
  std::string file;
  int row = 0;
  int column = 0;
  std::string header;
};

struct Table;

// Where a cell of a table sits, kept for every cell read (a register has millions): the table
// and the header are referred to, not copied, and turned into a Place only for a message.
struct CellPlace {
  const Table* table = nullptr;
  int row = 0;
  int column = 0;
  int header = 0;  // index into the table layout's columns
};

// One table read: its rows and, for each layout column, where it sits in the file (-1: absent).
struct Table {
  const TableLayout* layout = nullptr;
  std::string path;
  CsvRows rows;
  std::vector<int> at;
};

class Importer {
 public:
  Importer(std::string dir, std::string output) : dir_(std::move(dir)), output_(std::move(output)) {}

  std::string run() {
    read_tables();
    OJson root = OJson::object();
    root["format"] = kProjectFormat;
    read_project(root);
    read_revisions(root);
    read_components(root);
    read_criteria(root);
    read_sifs(root);
    read_requirements(root);
    read_subsystems(root);
    read_scenarios(root);
    read_layers(root);
    if (!problems_.empty()) throw InputError(problems_);
    const std::string text = root.dump(2) + "\n";
    check_with_loader(text);
    return text;
  }

 private:
  void problem(const Place& p, std::string expected, std::string found, std::string hint = {}) {
    Diagnostic d;
    d.file = p.file;
    d.line = p.row;
    d.column = p.column;
    d.pointer = p.header.empty() ? "" : "column \"" + p.header + "\"";
    d.expected = std::move(expected);
    d.found = std::move(found);
    d.hint = std::move(hint);
    problems_.push_back(std::move(d));
  }

  void read_tables() {
    std::error_code ec;
    if (!fs::is_directory(dir_, ec)) {
      problem({dir_, 0, 0, ""}, "a folder of CSV tables", "no folder at \"" + dir_ + "\"", "check the path");
      throw InputError(problems_);
    }
    std::vector<fs::path> files;
    for (const auto& e : fs::directory_iterator(dir_)) files.push_back(e.path());
    std::sort(files.begin(), files.end());
    std::string known;
    for (const auto& t : detail::table_layouts()) known += (known.empty() ? "" : ", ") + t.file;
    for (const auto& f : files) {
      if (f.extension() != ".csv") continue;  // a README or the workbook itself may sit beside the tables
      const std::string name = f.filename().string();
      const auto& layouts = detail::table_layouts();
      auto layout = std::find_if(layouts.begin(), layouts.end(), [&](const TableLayout& t) { return t.file == name; });
      if (layout == layouts.end()) {
        problem({f.string(), 0, 0, ""}, "a table of the layout (" + known + ")", "\"" + name + "\"",
                "rename the file, or move it out of the folder");
        continue;
      }
      read_table(*layout, f);
    }
    if (tables_.empty() && problems_.empty())
      problem({dir_, 0, 0, ""}, "CSV tables of the layout (" + known + ")", "none",
              "sifter export PROJECT --csv-dir DIR writes a set to start from");
  }

  void read_table(const TableLayout& layout, const fs::path& file) {
    std::ifstream in(file, std::ios::binary);
    std::ostringstream buf;
    buf << in.rdbuf();
    Table t;
    t.layout = &layout;
    t.path = file.string();
    if (auto bad = parse_csv(buf.str(), t.rows)) {
      problem({t.path, bad->row, bad->column, ""}, "CSV text (RFC 4180)", bad->found, "close the quoted cell");
      return;
    }
    t.at.assign(layout.columns.size(), -1);
    const std::vector<std::string> header = t.rows.empty() ? std::vector<std::string>{} : t.rows[0];
    std::vector<std::string> names;
    for (const auto& c : layout.columns) names.push_back(c.header);
    for (std::size_t i = 0; i < header.size(); ++i) {
      const std::string h = trim_cell(header[i]);
      const int k = layout.index(h);
      const bool empty_column = h.empty() && std::all_of(t.rows.begin(), t.rows.end(), [&](const auto& r) {
                                  return r.size() <= i || trim_cell(r[i]).empty();
                                });
      if (empty_column) continue;
      if (k < 0) {
        const std::string near = nearest(h, names);
        problem({t.path, 1, static_cast<int>(i) + 1, h}, "a column of " + layout.file, "the header \"" + h + "\"",
                near.empty() ? "the layout is in data/csv-tables.md" : "did you mean \"" + near + "\"?");
      } else if (t.at[static_cast<std::size_t>(k)] >= 0) {
        problem({t.path, 1, static_cast<int>(i) + 1, h}, "each column once", "\"" + h + "\" a second time");
      } else {
        t.at[static_cast<std::size_t>(k)] = static_cast<int>(i);
      }
    }
    for (std::size_t k = 0; k < layout.columns.size(); ++k)
      if (layout.columns[k].required && t.at[k] < 0)
        problem({t.path, 1, 1, layout.columns[k].header}, "a column \"" + layout.columns[k].header + "\"", "none",
                "add it to the header row; the layout is in data/csv-tables.md");
    tables_[layout.file] = std::move(t);
  }

  // The data rows of a table (spreadsheet rows 2 and on), skipping rows left empty.
  template <typename Fn>
  void for_rows(const std::string& file, Fn fn) {
    auto it = tables_.find(file);
    if (it == tables_.end()) return;
    const Table& t = it->second;
    if (std::any_of(t.layout->columns.begin(), t.layout->columns.end(), [&](const auto& c) {
          return c.required && t.at[static_cast<std::size_t>(t.layout->index(c.header))] < 0;
        }))
      return;  // reported once at the header
    for (std::size_t r = 1; r < t.rows.size(); ++r) {
      const auto& row = t.rows[r];
      if (std::all_of(row.begin(), row.end(), [](const std::string& c) { return trim_cell(c).empty(); })) continue;
      const std::size_t width = t.rows[0].size();
      for (std::size_t c = width; c < row.size(); ++c)
        if (!trim_cell(row[c]).empty())
          problem({t.path, static_cast<int>(r) + 1, static_cast<int>(c) + 1, ""}, "a cell under a header",
                  "\"" + row[c] + "\" beyond the last column");
      fn(t, static_cast<int>(r));
    }
  }

  std::string cell(const Table& t, int row, const std::string& header) const {
    const int k = t.layout->index(header);
    const int c = t.at[static_cast<std::size_t>(k)];
    const auto& cells = t.rows[static_cast<std::size_t>(row)];
    if (c < 0 || static_cast<std::size_t>(c) >= cells.size()) return "";
    return restore_formula_text(trim_cell(cells[static_cast<std::size_t>(c)]));
  }

  CellPlace cell_place(const Table& t, int row, const std::string& header) const {
    const int k = t.layout->index(header);
    const int c = t.at[static_cast<std::size_t>(k)];
    return {&t, row + 1, c < 0 ? 1 : c + 1, k};
  }

  Place place(const Table& t, int row, const std::string& header) const {
    const int k = t.layout->index(header);
    const int c = t.at[static_cast<std::size_t>(k)];
    return {t.path, row + 1, c < 0 ? 1 : c + 1, header};
  }

  // Sets a member at a path ("partial_stroke/interval") and records where its cell is.
  void put(OJson& object, const std::string& pointer, const std::string& path, OJson value, const CellPlace& at) {
    OJson* target = &object;
    std::string p = pointer;
    std::size_t start = 0;
    while (true) {
      const auto slash = path.find('/', start);
      const std::string key = path.substr(start, slash == std::string::npos ? std::string::npos : slash - start);
      p += "/" + escape_pointer_token(key);
      if (slash == std::string::npos) {
        places_[p] = at;
        if (!value.is_null()) (*target)[key] = std::move(value);
        return;
      }
      places_.try_emplace(p, at);
      if (value.is_null()) {
        start = slash + 1;
        continue;  // an empty cell: only its place is recorded
      }
      target = &(*target)[key];
      start = slash + 1;
    }
  }

  // The columns of one row into an object at `pointer`; `only` limits the columns (layers.csv).
  OJson row_object(const Table& t, int row, const std::string& pointer, const std::vector<std::string>& only = {}) {
    OJson o = OJson::object();
    places_[pointer] = cell_place(t, row, t.layout->columns.front().header);
    for (const auto& c : t.layout->columns) {
      if (c.path.empty()) continue;
      if (!only.empty() && std::find(only.begin(), only.end(), c.header) == only.end()) continue;
      const std::string text = cell(t, row, c.header);
      put(o, pointer, c.path, text.empty() ? OJson() : cell_value(c.kind, text), cell_place(t, row, c.header));
    }
    return o;
  }

  void read_project(OJson& root) {
    std::set<std::string> seen;
    for_rows("project.csv", [&](const Table& t, int row) {
      const std::string name = cell(t, row, "setting");
      const std::string text = cell(t, row, "value");
      const auto& settings = detail::project_settings();
      auto s = std::find_if(settings.begin(), settings.end(), [&](const auto& x) { return x.name == name; });
      if (s == settings.end()) {
        std::vector<std::string> names;
        for (const auto& x : settings) names.push_back(x.name);
        std::string all;
        for (const auto& n : names) all += (all.empty() ? "" : ", ") + n;
        problem(place(t, row, "setting"), "a setting of project.csv (" + all + ")", "\"" + name + "\"");
        return;
      }
      if (s->kind != CellKind::kList && !seen.insert(name).second) {
        problem(place(t, row, "setting"), "each setting once", "\"" + name + "\" a second time");
        return;
      }
      if (text.empty()) return;
      if (s->kind == CellKind::kList) {  // a library: relative to the tables, rewritten for the output
        const fs::path lib = fs::path(text).is_absolute() ? fs::path(text) : fs::path(dir_) / text;
        const fs::path out_dir = fs::absolute(fs::path(output_).parent_path());
        fs::path rel = fs::weakly_canonical(fs::absolute(lib)).lexically_relative(fs::weakly_canonical(out_dir));
        if (rel.empty()) rel = fs::absolute(lib);
        root["libraries"].push_back(rel.generic_string());
        places_["/libraries/" + std::to_string(root["libraries"].size() - 1)] = cell_place(t, row, "value");
        return;
      }
      put(root, "", s->path, cell_value(s->kind, text), cell_place(t, row, "value"));
    });
  }

  // document/history: one row per revision, in the order of the rows.
  void read_revisions(OJson& root) {
    for_rows("revisions.csv", [&](const Table& t, int row) {
      OJson& history = root["document"]["history"];
      history.push_back(row_object(t, row, "/document/history/" + std::to_string(history.size())));
    });
  }

  void read_components(OJson& root) {
    const std::vector<std::string> structured = {"data_source_kind", "data_source_document", "data_source_revision",
                                                 "data_source_date", "data_source_note"};
    for_rows("components.csv", [&](const Table& t, int row) {
      const std::string p = "/components/" + std::to_string(root["components"].size());
      if (!cell(t, row, "data_source").empty())
        for (const auto& h : structured)
          if (!cell(t, row, h).empty()) {
            problem(place(t, row, h), "an empty cell where the data_source cell holds the source as text",
                    "\"" + cell(t, row, h) + "\"",
                    "state the source either as text in data_source or in the data_source_* columns, not both");
            return;
          }
      root["components"].push_back(row_object(t, row, p));
    });
  }

  void read_criteria(OJson& root) {
    for_rows("risk_criteria.csv", [&](const Table& t, int row) {
      const std::string category = cell(t, row, "category"), severity = cell(t, row, "severity");
      const std::string freq = cell(t, row, "tolerable_frequency");
      if (category.empty() || severity.empty()) {
        problem(place(t, row, category.empty() ? "category" : "severity"), "a consequence category and a severity",
                "an empty cell");
        return;
      }
      const std::string p = "/risk_criteria/" + escape_pointer_token(category) + "/" + escape_pointer_token(severity);
      if (root.contains("risk_criteria") && root["risk_criteria"].contains(category) &&
          root["risk_criteria"][category].contains(severity)) {
        problem(place(t, row, "severity"), "each category and severity once",
                "\"" + category + "\" \"" + severity + "\" a second time");
        return;
      }
      places_.try_emplace("/risk_criteria/" + escape_pointer_token(category), cell_place(t, row, "category"));
      places_[p] = cell_place(t, row, "tolerable_frequency");
      root["risk_criteria"][category][severity] = cell_value(CellKind::kValue, freq);
    });
  }

  void read_sifs(OJson& root) {
    for_rows("sifs.csv", [&](const Table& t, int row) {
      const std::string p = "/sifs/" + std::to_string(root["sifs"].size());
      sif_index_.emplace(cell(t, row, "id"), root["sifs"].size());
      root["sifs"].push_back(row_object(t, row, p));
    });
  }

  // A reference to another table's row: the id must be there; the hint names the nearest.
  bool refers(const Table& t, int row, const std::string& header, const std::map<std::string, std::size_t>& ids,
              const std::string& what) {
    const std::string id = cell(t, row, header);
    if (ids.count(id)) return true;
    std::vector<std::string> names;
    for (const auto& [name, _] : ids) names.push_back(name);
    const std::string near = nearest(id, names);
    problem(place(t, row, header), what, "\"" + id + "\"",
            near.empty() ? "add its row first" : "did you mean \"" + near + "\"?");
    return false;
  }

  void read_subsystems(OJson& root) {
    for_rows("subsystems.csv", [&](const Table& t, int row) {
      if (!refers(t, row, "sif", sif_index_, "the id of a SIF in sifs.csv")) return;
      OJson& sif = root["sifs"][sif_index_[cell(t, row, "sif")]];
      const std::string p = "/sifs/" + std::to_string(sif_index_[cell(t, row, "sif")]) + "/subsystems/" +
                            std::to_string(sif["subsystems"].size());
      sif["subsystems"].push_back(row_object(t, row, p));
    });
  }

  // requirements.csv: one row per SIF that states requirements, into the SIF's "requirements".
  void read_requirements(OJson& root) {
    std::set<std::string> seen;
    for_rows("requirements.csv", [&](const Table& t, int row) {
      if (!refers(t, row, "sif", sif_index_, "the id of a SIF in sifs.csv")) return;
      const std::string id = cell(t, row, "sif");
      if (!seen.insert(id).second) {
        problem(place(t, row, "sif"), "one row per SIF", "\"" + id + "\" a second time",
                "write all of a SIF's requirements on one row");
        return;
      }
      const std::string p = "/sifs/" + std::to_string(sif_index_[id]);
      OJson& sif = root["sifs"][sif_index_[id]];
      places_[p + "/requirements"] = cell_place(t, row, "sif");
      sif["requirements"] = OJson::object();
      for (const auto& c : t.layout->columns) {
        if (c.path.empty()) continue;
        const std::string text = cell(t, row, c.header);
        put(sif, p, c.path, text.empty() ? OJson() : cell_value(c.kind, text), cell_place(t, row, c.header));
      }
    });
  }

  void read_scenarios(OJson& root) {
    const std::vector<std::string> shared = {"scenario_title",   "node",         "deviation", "consequences",
                                             "target_frequency", "scenario_note"};
    for_rows("scenarios.csv", [&](const Table& t, int row) {
      const std::string id = cell(t, row, "scenario");
      auto [it, first] = scenario_index_.emplace(id, root["scenarios"].size());
      const std::string p = "/scenarios/" + std::to_string(it->second);
      if (first) {
        OJson s = OJson::object();
        places_[p] = cell_place(t, row, "scenario");
        put(s, p, "id", id, cell_place(t, row, "scenario"));
        for (const auto& h : shared) {
          const auto& c = t.layout->columns[static_cast<std::size_t>(t.layout->index(h))];
          const std::string text = cell(t, row, h);
          put(s, p, c.path, text.empty() ? OJson() : cell_value(c.kind, text), cell_place(t, row, h));
          scenario_cells_[id][h] = text;
        }
        root["scenarios"].push_back(s);
      } else {
        for (const auto& h : shared) {
          const std::string text = cell(t, row, h);
          if (!text.empty() && text != scenario_cells_[id][h])
            problem(place(t, row, h), "the " + h + " of scenario " + id + " as on its first row, or an empty cell",
                    "\"" + text + "\"", "a scenario's own cells are written once per scenario");
        }
      }
      OJson& s = root["scenarios"][it->second];
      const std::string cp = p + "/causes/" + std::to_string(s["causes"].size());
      cause_index_[id].emplace(cell(t, row, "cause"), s["causes"].size());
      s["causes"].push_back(row_object(t, row, cp, {"cause", "cause_title", "frequency", "devices", "note"}));
    });
  }

  void read_layers(OJson& root) {
    for_rows("layers.csv", [&](const Table& t, int row) {
      if (!refers(t, row, "scenario", scenario_index_, "the id of a scenario in scenarios.csv")) return;
      const std::string sid = cell(t, row, "scenario");
      const std::string entry = cell(t, row, "entry");
      const auto allowed = detail::layer_entry_columns(entry);
      if (allowed.empty()) {
        problem(place(t, row, "entry"), "an entry: layer, sif, modifier, enabling or not_credited",
                "\"" + entry + "\"");
        return;
      }
      for (const auto& c : t.layout->columns) {
        if (c.header == "scenario" || c.header == "entry") continue;
        const std::string text = cell(t, row, c.header);
        if (!text.empty() && std::find(allowed.begin(), allowed.end(), c.header) == allowed.end()) {
          std::string list;
          for (const auto& a : allowed) list += (list.empty() ? "" : ", ") + a;
          problem(place(t, row, c.header), "an empty cell on a " + entry + " row", "\"" + text + "\"",
                  "a " + entry + " row fills: " + list);
        }
      }
      OJson& s = root["scenarios"][scenario_index_[sid]];
      std::string p = "/scenarios/" + std::to_string(scenario_index_[sid]);
      std::string key = entry == "sif" || entry == "layer" ? "layers" : entry == "modifier" ? "modifiers" : entry;
      OJson* list = &s;
      if (entry == "enabling") {
        if (!refers(t, row, "cause", cause_index_[sid], "the id of a cause of scenario " + sid + " in scenarios.csv"))
          return;
        const std::size_t k = cause_index_[sid][cell(t, row, "cause")];
        p += "/causes/" + std::to_string(k);
        list = &s["causes"][k];
      }
      OJson& items = (*list)[key];
      p += "/" + key + "/" + std::to_string(items.size());
      std::vector<std::string> filled = allowed;
      filled.erase(std::remove(filled.begin(), filled.end(), "cause"), filled.end());
      OJson o = row_object(t, row, p, filled);
      if (entry == "layer" && o.contains("applies_to")) {  // a layer's applies_to names causes
        o["applies_to_causes"] = o["applies_to"];
        o.erase("applies_to");
        places_[p + "/applies_to_causes"] = cell_place(t, row, "applies_to");
      }
      items.push_back(std::move(o));
    });
  }

  // The loader checks the whole project; its problems are placed back at the cells they came from.
  void check_with_loader(const std::string& text) {
    const std::string base = fs::path(output_).parent_path().string();
    try {
      (void)load_project_text(text, output_, base.empty() ? "." : base);
    } catch (const InputError& e) {
      std::vector<Diagnostic> out;
      for (Diagnostic d : e.diagnostics()) {
        if (d.file == output_) {
          std::string p = d.pointer;
          auto found = places_.end();
          while (true) {
            found = places_.find(p);
            if (found != places_.end() || p.empty()) break;
            p = p.substr(0, p.rfind('/'));
          }
          if (found != places_.end()) {
            const CellPlace& at = found->second;
            d.file = at.table->path;
            d.line = at.row;
            d.column = at.column;
            d.pointer = "column \"" + at.table->layout->columns[static_cast<std::size_t>(at.header)].header + "\"";
          } else {
            d.file = dir_;
            d.line = d.column = 0;
          }
        }
        out.push_back(std::move(d));
      }
      throw InputError(out, e.follow_ons_suppressed());
    }
  }

  std::string dir_, output_;
  std::vector<Diagnostic> problems_;
  std::map<std::string, Table> tables_;
  std::map<std::string, CellPlace> places_;
  std::map<std::string, std::size_t> sif_index_, scenario_index_;
  std::map<std::string, std::map<std::string, std::size_t>> cause_index_;
  std::map<std::string, std::map<std::string, std::string>> scenario_cells_;
};

}  // namespace

std::string import_project_tables(const std::string& dir, const std::string& output_path) {
  return Importer(dir, output_path).run();
}

}  // namespace sifter
