// The --xlsx workbook: results laid out as sheets; libxlsxwriter does the file format.
#include "sifter/report/xlsx.hpp"

#include <unistd.h>
#include <xlsxwriter.h>

#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <functional>
#include <iterator>
#include <optional>
#include <sstream>

#include "sifter/model/diagnostics.hpp"
#include "sifter/model/format.hpp"
#include "sifter/report/tables.hpp"

namespace sifter::report {
namespace {

// Excel holds at most 32,767 characters in a cell (libxlsxwriter refuses longer strings).
constexpr std::size_t kMaxCellBytes = 32767;

bool is_number(const std::string& text) {
  if (text.empty()) return false;
  char* end = nullptr;
  std::strtod(text.c_str(), &end);
  return end == text.c_str() + text.size();
}

struct Column {
  const char* header;  ///< with its unit in brackets where it has one
  double width;        ///< in characters, as the spreadsheet counts them
};

// One sheet being written: a cursor over rows, typed cell writers, errors collected.
class Sheet {
 public:
  Sheet(lxw_worksheet* sheet, lxw_format* header, lxw_format* sci) : sheet_(sheet), header_(header), sci_(sci) {}

  void headers(lxw_row_t row, const std::vector<Column>& columns) {
    for (std::size_t c = 0; c < columns.size(); ++c) {
      const auto col = static_cast<lxw_col_t>(c);
      check(worksheet_write_string(sheet_, row, col, columns[c].header, header_));
      check(worksheet_set_column(sheet_, col, col, columns[c].width, nullptr));
    }
    worksheet_freeze_panes(sheet_, row + 1, 0);
    row_ = row + 1;
  }
  void text(const std::string& value) {
    const std::string safe = spreadsheet_text(value);
    if (safe.size() > kMaxCellBytes)
      throw OutputError("cannot write the workbook: a text of " + std::to_string(safe.size()) +
                        " bytes is longer than a spreadsheet cell holds (32767)");
    if (!safe.empty()) check(worksheet_write_string(sheet_, row_, col_, safe.c_str(), nullptr));
    ++col_;
  }
  void number(const std::optional<double>& value, bool scientific = false) {
    if (value)
      check(worksheet_write_number(sheet_, row_, col_, checked(*value, "workbook value"), scientific ? sci_ : nullptr));
    ++col_;
  }
  void integer(const std::optional<int>& value) { number(value ? std::optional<double>(*value) : std::nullopt); }
  void boolean(const std::optional<bool>& value) {
    if (value) check(worksheet_write_boolean(sheet_, row_, col_, *value ? 1 : 0, nullptr));
    ++col_;
  }
  void next_row() {
    ++row_;
    col_ = 0;
  }
  lxw_worksheet* raw() { return sheet_; }

 private:
  void check(lxw_error error) {
    if (error != LXW_NO_ERROR) throw OutputError(std::string("cannot write the workbook: ") + lxw_strerror(error));
  }
  lxw_worksheet* sheet_;
  lxw_format* header_;
  lxw_format* sci_;
  lxw_row_t row_ = 0;
  lxw_col_t col_ = 0;
};

std::string verdict(const std::optional<bool>& meets) {
  if (!meets) return "not judged";
  return *meets ? "meets target" : "falls short";
}

std::string joined(const std::vector<std::string>& items, const char* separator) {
  std::string out;
  for (const auto& i : items) out += (out.empty() ? "" : separator) + i;
  return out;
}

std::string channels_text(const std::vector<std::vector<std::string>>& channels) {
  std::vector<std::string> each;
  for (const auto& ch : channels) each.push_back(joined(ch, "+"));
  return joined(each, ", ");
}

void sif_summary(Sheet& s, const ProjectResult& r) {
  s.headers(3, {{"SIF", 12},
                {"title", 40},
                {"demand mode", 11},
                {"PFDavg [-]", 11},
                {"PFH [1/h]", 11},
                {"PFDavg exact [-]", 11},
                {"PFH exact [1/h]", 11},
                {"RRF [-]", 9},
                {"required RRF [-]", 10},
                {"required PFD [-]", 11},
                {"required PFH [1/h]", 11},
                {"SIL required", 8},
                {"SIL probability", 8},
                {"SIL architecture", 8},
                {"SIL systematic", 8},
                {"SIL achieved", 8},
                {"verdict", 13},
                {"limited by", 50},
                {"spurious trips [1/yr]", 11},
                {"scenarios", 20}});
  for (const auto& x : r.sifs) {
    s.text(x.id);
    s.text(x.title);
    s.text(to_string(x.demand_mode));
    s.number(x.pfd_avg, true);
    s.number(x.pfh_per_hour, true);
    s.number(x.pfd_avg_exact, true);
    s.number(x.pfh_exact_per_hour, true);
    s.number(x.rrf);
    s.number(x.required_rrf);
    s.number(x.required_pfd, true);
    s.number(x.required_pfh_per_hour, true);
    s.integer(x.sil_required);
    s.integer(x.sil_probability);
    s.integer(x.sil_architecture);
    s.integer(x.sil_systematic);
    s.integer(x.sil_achieved);
    s.text(verdict(x.meets_target));
    s.text(limits_words(x));
    s.number(x.spurious_trip_rate_per_yr, true);
    s.text(joined(x.scenarios, ", "));
    s.next_row();
  }
}

void subsystems(Sheet& s, const ProjectResult& r) {
  s.headers(0, {{"SIF", 12},
                {"subsystem", 24},
                {"role", 8},
                {"vote", 8},
                {"channels", 30},
                {"PFDavg [-]", 11},
                {"PFH [1/h]", 11},
                {"PFDavg exact [-]", 11},
                {"PFH exact [1/h]", 11},
                {"share of the SIF [-]", 10},
                {"lambda_DU of a channel [1/h]", 12},
                {"lambda_DD of a channel [1/h]", 12},
                {"lambda_SU of a channel [1/h]", 12},
                {"lambda_SD of a channel [1/h]", 12},
                {"proof-test interval [h]", 10},
                {"beta effective [-]", 9},
                {"beta_D effective [-]", 9},
                {"HFT", 5},
                {"SFF [-]", 8},
                {"SIL architecture", 8},
                {"SC", 5},
                {"spurious trips [1/yr]", 11},
                {"equation", 40}});
  for (const auto& x : r.sifs)
    for (const auto& sub : x.subsystems) {
      s.text(x.id);
      s.text(sub.name);
      s.text(to_string(sub.role));
      s.text(sub.vote);
      s.text(channels_text(sub.channels));
      s.number(sub.pfd_avg, true);
      s.number(sub.pfh_per_hour, true);
      s.number(sub.pfd_avg_exact, true);
      s.number(sub.pfh_exact_per_hour, true);
      s.number(sub.share);
      s.number(sub.channel_rates.lambda_du.per_hour, true);
      s.number(sub.channel_rates.lambda_dd.per_hour, true);
      s.number(sub.channel_rates.lambda_su.per_hour, true);
      s.number(sub.channel_rates.lambda_sd.per_hour, true);
      s.number(sub.proof_test_interval.hours);
      s.number(sub.beta_effective);
      s.number(sub.beta_d_effective);
      s.integer(sub.hft);
      s.number(sub.sff);
      s.integer(sub.sil_architecture);
      s.integer(sub.systematic_capability);
      s.number(sub.spurious_trip_rate_per_yr, true);
      s.text(sub.equation);
      s.next_row();
    }
}

void lopa_worksheet(Sheet& s, const ProjectResult& r) {
  s.headers(0, {{"scenario", 12},
                {"consequence", 12},
                {"step", 12},
                {"cause", 8},
                {"item", 10},
                {"title", 40},
                {"value [1/yr for cause and target rows, else -]", 14},
                {"credited", 9},
                {"frequency after the step [1/yr]", 12},
                {"required RRF [-]", 10},
                {"note", 60}});
  for (const auto& sc : r.scenarios)
    for (const auto& row : sc.worksheet) {
      s.text(sc.id);
      s.text(row.consequence);
      s.text(to_string(row.step));
      s.text(row.cause);
      s.text(row.item);
      s.text(row.title);
      s.number(row.value);
      s.boolean(row.credited);
      s.number(row.frequency_per_yr, true);
      s.number(row.gap);
      s.text(row.note);
      s.next_row();
    }
}

void components_sheet(Sheet& s, const std::vector<Component>& components) {
  s.headers(0, {{"component", 14},
                {"library model", 20},
                {"lambda_DU [1/h]", 12},
                {"lambda_DD [1/h]", 12},
                {"lambda_SU [1/h]", 12},
                {"lambda_SD [1/h]", 12},
                {"element type", 8},
                {"SC", 5},
                {"SFF declared [-]", 9},
                {"data confidence [-]", 9}});
  for (const auto& c : components) {
    s.text(c.id);
    s.text(c.model);
    s.number(c.rates.lambda_du.per_hour, true);
    s.number(c.rates.lambda_dd.per_hour, true);
    s.number(c.rates.lambda_su.per_hour, true);
    s.number(c.rates.lambda_sd.per_hour, true);
    s.text(c.element_type ? (*c.element_type == ElementType::kA ? "A" : "B") : "");
    s.integer(c.systematic_capability);
    s.number(c.sff_declared);
    s.number(c.data_confidence);
    s.next_row();
  }
}

// The requirement checks of each SIF (response time, spurious trip limit, proof-test interval), as
// `check --json` gives them in `requirement_checks`: value and limit in the unit the check's name ends with.
void requirement_checks(Sheet& s, const ProjectResult& r) {
  s.headers(0, {{"SIF", 12}, {"check", 24}, {"ok", 6}, {"value", 14}, {"limit", 14}, {"message", 60}});
  for (const auto& sif : r.sifs)
    for (const auto& c : sif.requirement_checks) {
      s.text(sif.id);
      s.text(c.check);
      s.boolean(c.ok);
      s.number(c.value, true);
      s.number(c.limit, true);
      s.text(c.message);
      s.next_row();
    }
}

// libxlsxwriter writes to a named file: build the workbook in a private temporary folder and
// read the bytes back, so that the caller writes them through AtomicOutput.
class TempFolder {
 public:
  TempFolder() {
    std::string pattern = (std::filesystem::temp_directory_path() / "sifter-xlsx-XXXXXX").string();
    if (!::mkdtemp(pattern.data())) throw OutputError("cannot write the workbook: no temporary folder");
    path_ = pattern;
  }
  ~TempFolder() {
    std::error_code ec;
    std::filesystem::remove_all(path_, ec);
  }
  TempFolder(const TempFolder&) = delete;
  TempFolder& operator=(const TempFolder&) = delete;
  [[nodiscard]] const std::string& path() const { return path_; }

 private:
  std::string path_;
};

}  // namespace

std::string spreadsheet_text(const std::string& text) {
  if (text.empty()) return text;
  const char first = text.front();
  const bool formula_like =
      first == '=' || first == '+' || first == '-' || first == '@' || first == '\t' || first == '\r';
  return formula_like && !is_number(text) ? "'" + text : text;
}

std::string workbook_xlsx(const ProjectResult& result, const std::vector<Component>& components) {
  TempFolder folder;
  const std::string file = folder.path() + "/workbook.xlsx";
  lxw_workbook_options options{};
  options.tmpdir = const_cast<char*>(folder.path().c_str());  // the C API takes a char*, never writes it
  lxw_workbook* book = workbook_new_opt(file.c_str(), &options);
  if (!book) throw OutputError("cannot write the workbook: the spreadsheet library could not start one");
  lxw_format* header = workbook_add_format(book);
  format_set_bold(header);
  format_set_text_wrap(header);
  format_set_align(header, LXW_ALIGN_VERTICAL_TOP);
  lxw_format* sci = workbook_add_format(book);
  format_set_num_format(sci, "0.00E+00");
  lxw_format* caution = workbook_add_format(book);
  format_set_bold(caution);

  std::vector<Sheet> sheets;
  for (const char* name : kWorkbookSheets) sheets.emplace_back(workbook_add_worksheet(book, name), header, sci);
  try {
    lxw_worksheet* first = sheets[0].raw();
    worksheet_write_string(first, 0, 0, spreadsheet_text(std::string("CAUTION: ") + kCaution).c_str(), caution);
    const std::string source = "sifter " SIFTER_VERSION " check of " + result.file + " (SHA-256 " + result.sha256 + ")";
    worksheet_write_string(first, 1, 0, spreadsheet_text(source).c_str(), nullptr);
    if (!result.title.empty()) worksheet_write_string(first, 2, 0, spreadsheet_text(result.title).c_str(), nullptr);
    sif_summary(sheets[0], result);
    subsystems(sheets[1], result);
    lopa_worksheet(sheets[2], result);
    components_sheet(sheets[3], components);
    requirement_checks(sheets[4], result);
  } catch (...) {
    workbook_close(book);
    throw;
  }
  if (const lxw_error error = workbook_close(book); error != LXW_NO_ERROR)
    throw OutputError(std::string("cannot write the workbook: ") + lxw_strerror(error));
  std::ifstream in(file, std::ios::binary);
  std::string bytes((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  if (!in && !in.eof()) throw OutputError("cannot write the workbook: reading it back failed");
  return bytes;
}

}  // namespace sifter::report
