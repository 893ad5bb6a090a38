// One CSV row per SIF with its key results (RFC 4180).
#include "sifter/report/csv.hpp"

#include <cstdio>

#include "sifter/model/format.hpp"
#include "sifter/report/tables.hpp"
#include "sifter/report/worksheet.hpp"

namespace sifter::report {
namespace {

std::string number(const std::optional<double>& v) {
  if (!v) return "";
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.6g", checked(*v, "CSV value"));
  return buf;
}

std::string integer(const std::optional<int>& v) { return v ? std::to_string(*v) : ""; }

std::string verdict(const std::optional<bool>& meets) {
  if (!meets) return "not judged";
  return *meets ? "meets target" : "falls short";
}

}  // namespace

std::string sif_csv(const ProjectResult& result) {
  std::string out =
      "sif,title,demand_mode,pfd_avg,pfh_per_hour,rrf,required_rrf,required_pfd,sil_required,sil_probability,"
      "sil_architecture,sil_systematic,sil_achieved,meets_target,verdict,limited_by\r\n";
  for (const auto& s : result.sifs) {
    out += csv_field(s.id) + "," + csv_field(s.title) + "," + to_string(s.demand_mode) + "," + number(s.pfd_avg) + "," +
           number(s.pfh_per_hour) + "," + number(s.rrf) + "," + number(s.required_rrf) + "," + number(s.required_pfd) +
           "," + integer(s.sil_required) + "," + std::to_string(s.sil_probability) + "," +
           std::to_string(s.sil_architecture) + "," + std::to_string(s.sil_systematic) + "," +
           std::to_string(s.sil_achieved) + "," + (s.meets_target ? (*s.meets_target ? "true" : "false") : "") + "," +
           verdict(s.meets_target) + "," + csv_field(limits_words(s)) + "\r\n";
  }
  return out;
}

}  // namespace sifter::report
