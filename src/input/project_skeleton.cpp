// The commented starting project of `sifter init`; the README's worked example is this text.
#include "sifter/input/project_skeleton.hpp"

#include <string_view>

namespace sifter {
namespace {

// One text with two kinds of titles: @NAME@ marks a title that the plain skeleton replaces by
// what belongs there.
constexpr std::string_view kProject =
    R"json(// A sifter project file (sifter-project/1). Comments like this one are allowed and ignored.
// INVENTED EXAMPLE DATA: replace every tag, rate, interval and frequency with your own.
{
  // Where an editor finds the schema: point it at data/schema/ of your copy of sifter.
  "$schema": "sifter-project-1.schema.json",
  "format": "sifter-project/1",
  "title": "@TITLE@",
  "note": "Invented data made by sifter init; not for design.",
  "constraints": "iec61511",  // iec61511 (default), route_1h or route_2h

  // Values every subsystem takes unless it says otherwise.
  "defaults": {
    "proof_test_interval": "1 yr",
    "mttr": "8 h",            // mean time to restoration after a detected failure
    "mission_time": "20 yr"
  },

  // Component models kept in their own file, named below with "model".
  "libraries": ["@LIBRARY@"],

  // Every field device and logic solver, by tag: a library model, or the rates themselves.
  "components": [
    {"id": "LT-101A", "model": "level-transmitter"},
    {"id": "LT-101B", "model": "level-transmitter"},
    {"id": "LS-10", "lambda_du": "20 FIT", "lambda_dd": "980 FIT", "lambda_sd": "1500 FIT",
     "element_type": "B", "systematic_capability": 3, "data_source": "invented for the example"},
    {"id": "SOV-101", "model": "solenoid-valve"},
    {"id": "XV-101", "model": "shutoff-valve"}
  ],

  // Subsystems used in several SIFs, written once; a SIF names one with "template".
  "subsystem_templates": {
    "logic-solver": {"role": "logic", "vote": "1oo1", "channels": ["LS-10"]}
  },

  // Safety instrumented functions: subsystems in series, each a voting group of channels.
  "sifs": [
    {
      "id": "SIF-101",
      "title": "@SIF_TITLE@",
      "demand_mode": "low",
      "target": {"sil": 2},   // or {"rrf": 300}, {"pfd_avg": 3e-3}; or leave it to the LOPA
      "subsystems": [
        {"name": "level sensing", "role": "sensor", "vote": "1oo2",
         "channels": ["LT-101A", "LT-101B"], "beta": "5%"},
        {"name": "logic solver", "template": "logic-solver"},
        {"name": "inlet valve", "role": "final", "vote": "1oo1",
         "channels": [["SOV-101", "XV-101"]],   // a channel of elements in series
         "proof_test_interval": "6 mo"}         // overrides the default
      ]
    }
  ],

  // Tolerable frequency for each consequence category and severity.
  "risk_criteria": {
    "safety": {"3": "1e-4/yr", "4": "1e-5/yr"}
  },

  // Protection layers used in several scenarios, written once; a scenario names one with "layer".
  "layer_catalogue": [
    {"id": "ALM-101", "title": "high level alarm, operator stops the feed", "kind": "operator_response",
     "pfd": 0.1, "response_time": "10 min", "time_available": "1 h", "devices": ["LT-100"]}
  ],

  // Layer of protection analysis: causes, enabling conditions, modifiers and layers.
  "scenarios": [
    {
      "id": "LOPA-101",
      "title": "@SCENARIO_TITLE@",
      "consequences": [{"category": "safety", "severity": 3}],
      "causes": [
        {"id": "C1", "title": "feed level valve fails open", "frequency": "0.1/yr", "devices": ["LV-100"]},
        {"id": "C2", "title": "upstream separator carries over", "frequency": "0.02/yr"}
      ],
      "modifiers": [{"title": "person present near the compressor", "probability": 0.5}],
      "layers": [
        // This alarm sees only the feed valve's failure, so it is credited against C1 alone.
        {"layer": "ALM-101", "applies_to_causes": ["C1"]},
        {"sif": "SIF-101"}   // the SIF under assessment: its computed PFDavg is credited
      ]
    }
  ],

  "lopa": {"operator_time_multiple": 2}  // time available must be at least 2 x the response time
}
)json";

constexpr std::string_view kLibrary = R"json(// A sifter component library (sifter-library/1), written by sifter init.
// INVENTED, ILLUSTRATIVE FIGURES: use your suppliers' safety manuals or your own field data.
{
  "format": "sifter-library/1",
  "title": "Component models of the example (invented data)",
  "models": [
    {"id": "level-transmitter", "title": "Level transmitter (invented)",
     "lambda_du": "90 FIT", "lambda_dd": "560 FIT", "lambda_sd": "200 FIT", "lambda_su": "80 FIT",
     "element_type": "B", "systematic_capability": 3, "data_source": "invented for the example"},
    {"id": "solenoid-valve", "title": "Solenoid pilot valve, de-energise to trip (invented)",
     "lambda_du": "250 FIT", "lambda_su": "500 FIT",
     "element_type": "A", "systematic_capability": 3, "data_source": "invented for the example"},
    {"id": "shutoff-valve", "title": "Shut-off valve with spring-return actuator (invented)",
     "lambda_du": "600 FIT", "lambda_su": "800 FIT",
     "element_type": "A", "systematic_capability": 3, "data_source": "invented for the example"}
  ]
}
)json";

void replace(std::string& text, std::string_view mark, const std::string& with) {
  const auto at = text.find(mark);
  if (at != std::string::npos) text.replace(at, mark.size(), with);
}

}  // namespace

std::string project_skeleton(const std::string& library_file, bool example) {
  std::string text(kProject);
  replace(text, "@LIBRARY@", library_file);
  replace(
      text, "@TITLE@",
      example ? "Unit 10: compressor suction drum (invented example)" : "Name of the unit or project (write yours)");
  replace(
      text, "@SIF_TITLE@",
      example ? "High-high level in the suction drum closes the feed valve" : "What the SIF senses and what it does");
  replace(text, "@SCENARIO_TITLE@",
          example ? "Liquid carried into the compressor on high drum level"
                  : "The hazard scenario: cause, deviation and consequence");
  return text;
}

std::string library_skeleton() { return std::string(kLibrary); }

}  // namespace sifter
