// Reading in-service records (sifter-records/1 JSON or CSV) and checking them against the project.
#include <algorithm>
#include <filesystem>
#include <fstream>
#include <functional>
#include <sstream>

#include "input/json_reader.hpp"
#include "input/parse_source.hpp"
#include "sifter/input/json_source.hpp"
#include "sifter/model/records.hpp"

namespace sifter {
namespace {
using detail::Json;

// The fields of one event as written, before they are checked.
struct RawEvent {
  std::string date, component, event, result, found_by, note;
  bool has_result = false, has_found_by = false;
};

enum class Field { kDate, kComponent, kEvent, kResult, kFoundBy };

// Reports a problem at one field of the event being checked.
using Report =
    std::function<void(Field, const std::string& expected, const std::string& found, const std::string& hint)>;

std::string quote_text(const std::string& text) { return "\"" + text + "\""; }

// Checks against the project and the dates; the component ids are looked up by name.
class RecordChecker {
 public:
  RecordChecker(const Project& project, CivilDate as_of) : project_(project), as_of_(as_of) {
    for (std::size_t i = 0; i < project.components.size(); ++i) index_.emplace(project.components[i].id, i);
    for (const auto& c : project.components) ids_.push_back(c.id);
  }

  std::optional<std::size_t> component(const std::string& id, Field field, const Report& report) const {
    auto it = index_.find(id);
    if (it != index_.end()) return it->second;
    const std::string near = nearest(id, ids_);
    report(field, "a component of the project", quote_text(id),
           near.empty() ? "the project's components are listed under /components" : "did you mean \"" + near + "\"?");
    return std::nullopt;
  }

  std::optional<CivilDate> date(const std::string& text, Field field, const Report& report) const {
    const auto d = parse_iso_date(text);
    if (!d) {
      report(field, "a date written YYYY-MM-DD (ISO 8601)", quote_text(text),
             "a real calendar day between 1900 and 2999, e.g. 2024-02-29");
      return std::nullopt;
    }
    if (*d > as_of_) {
      report(field, "a date on or before the as-of date " + to_iso(as_of_), quote_text(text),
             "records after the as-of date belong to a later review; --as-of moves it");
      return std::nullopt;
    }
    return d;
  }

  // The event, or nothing when any of its fields is wrong (each problem is reported).
  std::optional<ServiceEvent> event(const RawEvent& raw, const std::map<std::size_t, CivilDate>& in_service,
                                    const Report& report) const {
    ServiceEvent e;
    bool ok = true;
    const auto date = this->date(raw.date, Field::kDate, report);
    const auto component = this->component(raw.component, Field::kComponent, report);
    ok = date && component;
    static const std::map<std::string, EventKind> kKinds = {{"proof_test", EventKind::kProofTest},
                                                            {"demand", EventKind::kDemand},
                                                            {"spurious_trip", EventKind::kSpuriousTrip},
                                                            {"repair", EventKind::kRepair}};
    auto kind = kKinds.find(raw.event);
    if (kind == kKinds.end()) {
      report(Field::kEvent, "one of \"proof_test\", \"demand\", \"spurious_trip\", \"repair\"", quote_text(raw.event),
             "");
      return std::nullopt;
    }
    e.kind = kind->second;
    if (!check_result(raw, e, report)) ok = false;
    if (!check_found_by(raw, e, report)) ok = false;
    if (date && component) {
      auto since = in_service.find(*component);
      if (since == in_service.end()) {
        report(Field::kComponent, "an in-service date for " + raw.component, "none",
               "give it under \"in_service_since\" in the records or on the component in the project");
        ok = false;
      } else if (*date < since->second) {
        report(Field::kDate, "a date on or after " + raw.component + "'s in-service date " + to_iso(since->second),
               quote_text(raw.date), "check the date, or the in-service date if the device was in service earlier");
        ok = false;
      }
    }
    if (!ok) return std::nullopt;
    e.date = *date;
    e.component = raw.component;
    e.component_index = *component;
    e.note = raw.note;
    return e;
  }

  [[nodiscard]] CivilDate as_of() const { return as_of_; }

 private:
  static bool check_result(const RawEvent& raw, ServiceEvent& e, const Report& report) {
    static const std::map<std::string, EventResult> kResults = {{"pass", EventResult::kPass},
                                                                {"fail_dangerous", EventResult::kFailDangerous},
                                                                {"fail_safe", EventResult::kFailSafe}};
    const bool needs = e.kind == EventKind::kProofTest || e.kind == EventKind::kDemand;
    if (!raw.has_result) {
      if (!needs) {
        if (e.kind == EventKind::kSpuriousTrip) e.result = EventResult::kFailSafe;
        return true;
      }
      report(Field::kResult, "a result for a " + to_string(e.kind) + ": \"pass\", \"fail_dangerous\" or \"fail_safe\"",
             "none", "say what the device did");
      return false;
    }
    auto it = kResults.find(raw.result);
    if (it == kResults.end()) {
      report(Field::kResult, "one of \"pass\", \"fail_dangerous\", \"fail_safe\"", quote_text(raw.result), "");
      return false;
    }
    if (e.kind == EventKind::kSpuriousTrip && it->second != EventResult::kFailSafe) {
      report(Field::kResult, "\"fail_safe\" (or no result) for a spurious trip", quote_text(raw.result),
             "a dangerous failure is recorded as a proof_test or demand event");
      return false;
    }
    e.result = it->second;
    return true;
  }

  static bool check_found_by(const RawEvent& raw, ServiceEvent& e, const Report& report) {
    static const std::map<std::string, FoundBy> kFoundBy = {
        {"proof_test", FoundBy::kProofTest}, {"demand", FoundBy::kDemand}, {"diagnostics", FoundBy::kDiagnostics}};
    const FoundBy own = e.kind == EventKind::kProofTest ? FoundBy::kProofTest
                        : e.kind == EventKind::kDemand  ? FoundBy::kDemand
                                                        : FoundBy::kDiagnostics;
    e.found_by = own;
    if (!raw.has_found_by) return true;
    auto it = kFoundBy.find(raw.found_by);
    if (it == kFoundBy.end()) {
      report(Field::kFoundBy, "one of \"proof_test\", \"demand\", \"diagnostics\"", quote_text(raw.found_by), "");
      return false;
    }
    const bool own_kind = e.kind == EventKind::kProofTest || e.kind == EventKind::kDemand;
    if (own_kind && it->second != own && it->second != FoundBy::kDiagnostics) {
      report(Field::kFoundBy, quote_text(to_string(own)) + " or \"diagnostics\" for a " + to_string(e.kind) + " event",
             quote_text(raw.found_by), "record the failure under the event that found it");
      return false;
    }
    e.found_by = it->second;
    return true;
  }

  const Project& project_;
  CivilDate as_of_;
  std::map<std::string, std::size_t> index_;
  std::vector<std::string> ids_;
};

// In-service dates stated on the project's components.
std::map<std::size_t, CivilDate> project_in_service(const Project& project) {
  std::map<std::size_t, CivilDate> out;
  for (std::size_t i = 0; i < project.components.size(); ++i)
    if (auto d = parse_iso_date(project.components[i].in_service_since)) out.emplace(i, *d);
  return out;
}

// ---- JSON ---------------------------------------------------------------------------------

const char* key_of(Field f) {
  switch (f) {
    case Field::kDate:
      return "date";
    case Field::kComponent:
      return "component";
    case Field::kEvent:
      return "event";
    case Field::kResult:
      return "result";
    case Field::kFoundBy:
      return "found_by";
  }
  return "";
}

void read_json_in_service(detail::LoadContext& ctx, const Json& root, const RecordChecker& checker,
                          std::map<std::size_t, CivilDate>& in_service) {
  auto it = root.find("in_service_since");
  if (it == root.end()) return;
  if (!it->is_object()) {
    ctx.error(0, "/in_service_since", "an object of component tags and dates", detail::describe(*it));
    return;
  }
  for (const auto& [tag, value] : it->items()) {
    const std::string pointer = "/in_service_since/" + escape_pointer_token(tag);
    auto report = [&](Field, const std::string& expected, const std::string& found, const std::string& hint) {
      ctx.error(0, pointer, expected, found, hint);
    };
    if (!value.is_string()) {
      ctx.error(0, pointer, "a date written YYYY-MM-DD (ISO 8601)", detail::describe(value));
      continue;
    }
    const auto component = checker.component(tag, Field::kComponent, report);
    const auto date = checker.date(value.get<std::string>(), Field::kDate, report);
    if (component && date) in_service[*component] = *date;
  }
}

std::vector<ServiceEvent> read_json_events(detail::LoadContext& ctx, const Json& events, const RecordChecker& checker,
                                           const std::map<std::size_t, CivilDate>& in_service,
                                           const std::string& file) {
  std::vector<ServiceEvent> out;
  if (!events.is_array()) {
    ctx.error(0, "/events", "an array of events", detail::describe(events));
    return out;
  }
  for (std::size_t i = 0; i < events.size(); ++i) {
    const std::string pointer = "/events/" + std::to_string(i);
    detail::ObjectReader r(ctx, events[i], pointer, 0, "an event");
    if (!r.is_object()) continue;
    RawEvent raw;
    const auto date = r.string("date", true), component = r.string("component", true), event = r.string("event", true);
    const auto result = r.string("result"), found_by = r.string("found_by");
    raw.note = r.string("note").value_or("");
    r.finish();
    if (!date || !component || !event) continue;
    raw.date = *date, raw.component = *component, raw.event = *event;
    raw.has_result = result.has_value(), raw.result = result.value_or("");
    raw.has_found_by = found_by.has_value(), raw.found_by = found_by.value_or("");
    auto report = [&](Field f, const std::string& expected, const std::string& found, const std::string& hint) {
      ctx.error(0, r.at(key_of(f)), expected, found, hint);
    };
    if (auto e = checker.event(raw, in_service, report)) {
      e->where = file + ":" + pointer;
      out.push_back(std::move(*e));
    }
  }
  return out;
}

ServiceRecords load_json(const std::string& text, const std::string& name, const Project& project, CivilDate as_of) {
  detail::LoadContext ctx;
  ctx.sources.push_back({name, text});
  ServiceRecords out;
  out.file = name;
  out.as_of = as_of;
  auto root = detail::parse_source(ctx, 0);
  if (!root) throw InputError(ctx.located());
  detail::ObjectReader top(ctx, *root, "", 0, "a records file");
  if (!top.is_object()) throw InputError(ctx.located());
  if (auto format = top.string("format", true); format && *format != kRecordsFormat)
    ctx.error(0, "/format", quote_text(kRecordsFormat), quote_text(*format),
              "this version of sifter reads sifter-records/1");
  out.title = top.string("title").value_or("");
  top.allow({"note", "author", "revision"});
  top.member("in_service_since");
  const RecordChecker checker(project, as_of);
  out.in_service_since = project_in_service(project);
  read_json_in_service(ctx, *root, checker, out.in_service_since);
  if (const Json* events = top.require("events", "an array of events"))
    out.events = read_json_events(ctx, *events, checker, out.in_service_since, name);
  top.finish();
  if (!ctx.problems.empty()) throw InputError(ctx.located());
  return out;
}

// ---- CSV ----------------------------------------------------------------------------------

// One CSV record: its fields and the row (line) it starts on.
struct CsvRow {
  int row = 0;
  std::vector<std::string> fields;
};

// RFC 4180 fields: commas separate, double quotes enclose, "" inside quotes is one quote; lines
// end in LF or CRLF. Returns false with the row of an unclosed quote.
bool split_csv(const std::string& text, std::vector<CsvRow>& rows, int& bad_row) {
  CsvRow current{1, {}};
  std::string field;
  bool quoted_field = false, in_quotes = false, row_has_content = false;
  int line = 1;
  auto end_field = [&] {
    current.fields.push_back(field);
    field.clear();
    quoted_field = false;
  };
  auto end_row = [&] {
    end_field();
    if (row_has_content) rows.push_back(current);
    current = CsvRow{line, {}};
    row_has_content = false;
  };
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    if (in_quotes) {
      if (c == '"' && i + 1 < text.size() && text[i + 1] == '"')
        field += '"', ++i;
      else if (c == '"')
        in_quotes = false;
      else {
        if (c == '\n') ++line;
        field += c;
      }
      continue;
    }
    if (c == '"' && field.empty() && !quoted_field)
      in_quotes = quoted_field = row_has_content = true;
    else if (c == ',')
      end_field(), row_has_content = true;
    else if (c == '\r' && i + 1 < text.size() && text[i + 1] == '\n')
      continue;
    else if (c == '\n')
      ++line, end_row();
    else
      field += c, row_has_content = true;
  }
  if (in_quotes) {
    bad_row = current.row;
    return false;
  }
  end_row();
  return true;
}

using CsvProblems = std::vector<Diagnostic>;

// The header row: known column names, each once; the first three required.
std::map<std::string, std::size_t> csv_columns(const CsvRow& header, const std::string& name, CsvProblems& problems) {
  static const std::vector<std::string> kColumns = {"date", "component", "event", "result", "found_by", "note"};
  std::map<std::string, std::size_t> at;
  for (std::size_t c = 0; c < header.fields.size(); ++c) {
    const std::string& h = header.fields[c];
    if (std::find(kColumns.begin(), kColumns.end(), h) == kColumns.end() || at.count(h))
      problems.push_back({name, header.row, static_cast<int>(c + 1), "",
                          "a column among date, component, event, result, found_by, note (each once)", quote_text(h),
                          "the first row names the columns"});
    else
      at[h] = c;
  }
  for (const char* required : {"date", "component", "event"})
    if (!at.count(required))
      problems.push_back(
          {name, header.row, 1, "", std::string("a column \"") + required + "\" in the header", "none", ""});
  return at;
}

// Reads the rows after the header: in-service rows first, so that events may come in any order.
class CsvReader {
 public:
  CsvReader(const std::string& name, const std::map<std::string, std::size_t>& at, const RecordChecker& checker,
            CsvProblems& problems)
      : name_(name), at_(at), checker_(checker), problems_(problems) {}

  void read(const std::vector<CsvRow>& rows, ServiceRecords& out) {
    std::vector<const CsvRow*> events;
    for (std::size_t i = 1; i < rows.size(); ++i) {
      const CsvRow& r = rows[i];
      if (r.fields.size() != rows[0].fields.size()) {
        problem(r.row, 1, std::to_string(rows[0].fields.size()) + " fields as in the header",
                std::to_string(r.fields.size()), "quote a field that contains a comma");
        continue;
      }
      bool present = false;
      if (cell(r, "event", present) != "in_service") {
        events.push_back(&r);
        continue;
      }
      const Report report = reporter(r);
      const auto component = checker_.component(cell(r, "component", present), Field::kComponent, report);
      const auto date = checker_.date(cell(r, "date", present), Field::kDate, report);
      if (component && date) out.in_service_since[*component] = *date;
    }
    for (const CsvRow* r : events) {
      RawEvent raw;
      bool present = false;
      raw.date = cell(*r, "date", present);
      raw.component = cell(*r, "component", present);
      raw.event = cell(*r, "event", present);
      raw.result = cell(*r, "result", raw.has_result);
      raw.found_by = cell(*r, "found_by", raw.has_found_by);
      raw.note = cell(*r, "note", present);
      if (auto e = checker_.event(raw, out.in_service_since, reporter(*r))) {
        e->where = name_ + ":row " + std::to_string(r->row);
        out.events.push_back(std::move(*e));
      }
    }
  }

 private:
  void problem(int row, int column, const std::string& expected, const std::string& found, const std::string& hint) {
    if (problems_.size() < kMaxReportedProblems) problems_.push_back({name_, row, column, "", expected, found, hint});
  }
  std::string cell(const CsvRow& r, const std::string& column, bool& present) const {
    auto it = at_.find(column);
    present = it != at_.end() && it->second < r.fields.size() && !r.fields[it->second].empty();
    return present ? r.fields[it->second] : std::string();
  }
  int column_of(Field f) const {
    auto it = at_.find(key_of(f));
    return it == at_.end() ? 1 : static_cast<int>(it->second + 1);
  }
  Report reporter(const CsvRow& r) {
    return [this, row = r.row](Field f, const std::string& expected, const std::string& found,
                               const std::string& hint) { problem(row, column_of(f), expected, found, hint); };
  }

  const std::string& name_;
  const std::map<std::string, std::size_t>& at_;
  const RecordChecker& checker_;
  CsvProblems& problems_;
};

ServiceRecords load_csv(const std::string& text, const std::string& name, const Project& project, CivilDate as_of) {
  CsvProblems problems;
  std::vector<CsvRow> rows;
  int bad_row = 0;
  if (!split_csv(text, rows, bad_row))
    throw InputError({{name, bad_row, 1, "", "a closing double quote", "the end of the file",
                       "a quoted field runs to the end of the file"}});
  if (rows.empty())
    throw InputError(
        {{name, 1, 1, "", "a header row: date,component,event,result,found_by,note", "an empty file", ""}});
  const auto at = csv_columns(rows[0], name, problems);
  if (!problems.empty()) throw InputError(problems);
  ServiceRecords out;
  out.file = name;
  out.as_of = as_of;
  out.in_service_since = project_in_service(project);
  const RecordChecker checker(project, as_of);
  CsvReader(name, at, checker, problems).read(rows, out);
  if (!problems.empty()) throw InputError(problems);
  return out;
}

bool is_csv_name(const std::string& name) {
  const std::string ext = std::filesystem::path(name).extension().string();
  return ext == ".csv" || ext == ".CSV";
}

}  // namespace

ServiceRecords load_records_text(const std::string& text, const std::string& name, const Project& project,
                                 CivilDate as_of) {
  ServiceRecords out = is_csv_name(name) ? load_csv(text, name, project, as_of) : load_json(text, name, project, as_of);
  std::stable_sort(out.events.begin(), out.events.end(),
                   [](const ServiceEvent& a, const ServiceEvent& b) { return a.date < b.date; });
  return out;
}

ServiceRecords load_records_file(const std::string& path, const Project& project, CivilDate as_of) {
  std::error_code ec;
  auto refuse = [&](const std::string& expected, const std::string& found, const std::string& hint) {
    throw InputError({Diagnostic{path, 0, 0, "", expected, found, hint}});
  };
  if (!std::filesystem::is_regular_file(path, ec))
    refuse("a readable records file", "no file at \"" + path + "\"", "check the path");
  if (std::filesystem::file_size(path, ec) > kMaxInputBytes)
    refuse("a file of at most " + std::to_string(kMaxInputBytes / (1024 * 1024)) + " MiB", "a larger file",
           "split the records by year");
  std::ifstream in(path, std::ios::binary);
  if (!in) refuse("a readable file", "\"" + path + "\" cannot be opened", "check its permissions");
  std::ostringstream buf;
  buf << in.rdbuf();
  return load_records_text(buf.str(), path, project, as_of);
}

}  // namespace sifter
