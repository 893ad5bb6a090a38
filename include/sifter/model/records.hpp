#pragma once
/// In-service records of a plant's safety devices: proof tests, real demands, spurious trips and
/// repairs, each dated and tied to a component of the project (`sifter-records/1` JSON or CSV).
#include <cstddef>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/civil_date.hpp"
#include "sifter/model/model.hpp"

namespace sifter {

/// The format name of a records file in JSON.
inline constexpr const char* kRecordsFormat = "sifter-records/1";

/// What happened.
enum class EventKind { kProofTest, kDemand, kSpuriousTrip, kRepair };
/// What the device did: it worked, it failed dangerously, it failed safely (tripped).
enum class EventResult { kPass, kFailDangerous, kFailSafe };
/// How a failure came to light.
enum class FoundBy { kProofTest, kDemand, kDiagnostics };

/// "proof_test", "demand", "spurious_trip", "repair".
std::string to_string(EventKind kind);
/// "pass", "fail_dangerous", "fail_safe".
std::string to_string(EventResult result);
/// "proof_test", "demand", "diagnostics".
std::string to_string(FoundBy found_by);

/// One dated event on one component.
struct ServiceEvent {
  CivilDate date;
  std::string component;            ///< the tag as written
  std::size_t component_index = 0;  ///< into Project::components
  EventKind kind = EventKind::kProofTest;
  std::optional<EventResult> result;
  FoundBy found_by = FoundBy::kProofTest;  ///< stated, or the event's own kind (diagnostics for a repair)
  std::string note;
  std::string where;  ///< "records.json:/events/3" or "records.csv:row 4", for people
  /// A dangerous failure found by a proof test or a demand: the failures that count against
  /// lambda_DU (failures the diagnostics find are detected ones).
  [[nodiscard]] bool counts_as_undetected_failure() const {
    return result == EventResult::kFailDangerous && found_by != FoundBy::kDiagnostics;
  }
};

/// The records of a plant up to an as-of date, validated against its project.
struct ServiceRecords {
  std::string file;
  std::string title;
  CivilDate as_of;
  std::map<std::size_t, CivilDate> in_service_since;  ///< by index into Project::components
  std::vector<ServiceEvent> events;                   ///< in date order (stable for equal dates)
};

/// Reads a records file (JSON `sifter-records/1`, or CSV when the name ends in .csv) and checks
/// it against the project: every component known, every date a real ISO 8601 date on or after
/// the component's in-service date and on or before `as_of`. Throws InputError with every
/// problem (file:line:column and JSON pointer, or file.csv:row:column); nothing is computed.
/// In-service dates come from the records, else from the project's components.
ServiceRecords load_records_file(const std::string& path, const Project& project, CivilDate as_of);

/// The same from text in memory; `name` ending in .csv selects CSV.
ServiceRecords load_records_text(const std::string& text, const std::string& name, const Project& project,
                                 CivilDate as_of);

}  // namespace sifter
