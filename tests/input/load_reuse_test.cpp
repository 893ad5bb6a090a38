// Subsystem templates, the layer catalogue and "applies_to_causes": the spelling changes, the results do not.
#include <gtest/gtest.h>

#include <cmath>

#include "sifter/analysis/verify.hpp"
#include "sifter/input/load.hpp"
#include "support/results_support.hpp"

namespace sifter {
namespace {

const std::string kData = std::string(SIFTER_TEST_DATA) + "/reuse/";
constexpr double kArithmeticRelTol = 1e-12;  // a product of three factors, no iteration

std::string message_of(const std::string& text) {
  try {
    (void)load_project_text(text, "p.json", kData);
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

const ScenarioResult& scenario(const ProjectResult& r, const std::string& id) {
  for (const auto& s : r.scenarios)
    if (s.id == id) return s;
  throw std::runtime_error("no scenario " + id);
}

TEST(LoadReuse, TemplatesAndCatalogueGiveTheResultsOfTheExpandedTwin) {
  const auto with = testing::comparable_results(kData + "with_templates.json");
  const auto expanded = testing::comparable_results(kData + "expanded.json");
  EXPECT_EQ(with.dump(2), expanded.dump(2));
}

TEST(LoadReuse, ResultsNameTheTemplateEachSubsystemWasBuiltFrom) {
  const auto loaded = load_project_file(kData + "with_templates.json");
  VerifyOptions o;
  o.exact = false;
  const auto j = report::results_json(verify_project(loaded, o));
  EXPECT_EQ(j["sifs"][0]["subsystems"][0]["template"], nullptr);
  EXPECT_EQ(j["sifs"][0]["subsystems"][1]["template"], "logic");
  EXPECT_EQ(j["sifs"][1]["subsystems"][2]["template"], "valve-pair");
  // The override wins over the template: SIF-2 tests its valves every year, SIF-1 every two.
  EXPECT_DOUBLE_EQ(loaded.project.sifs[0].subsystems[2].proof_test_interval.hours, 2 * kHoursPerYear);
  EXPECT_DOUBLE_EQ(loaded.project.sifs[1].subsystems[2].proof_test_interval.hours, kHoursPerYear);
  EXPECT_EQ(loaded.project.scenarios[1].layers[0].catalogue_id, "PSV-1");
  EXPECT_EQ(loaded.project.scenarios[1].layers[0].pfd, 0.02);
}

// By hand: C1 0.1/yr x alarm 0.1 x relief 0.01 = 1e-4/yr; C2 0.05/yr x relief 0.01 = 5e-4/yr
// (the alarm does not apply to C2); the scenario without the SIF is 6e-4/yr. Crediting the
// alarm against both causes would give 1.5e-4/yr.
TEST(LoadReuse, ALayerLimitedToOneCauseIsCreditedOnlyAgainstIt) {
  VerifyOptions o;
  o.exact = false;
  const auto r = verify_project(load_project_file(kData + "with_templates.json"), o);
  const auto& s = scenario(r, "S-1");
  ASSERT_EQ(s.causes.size(), 2u);
  EXPECT_NEAR(s.causes[0].frequency_without_sif_per_yr, 1e-4, 1e-4 * kArithmeticRelTol);
  EXPECT_NEAR(s.causes[1].frequency_without_sif_per_yr, 5e-4, 5e-4 * kArithmeticRelTol);
  EXPECT_NEAR(s.frequency_without_sif_per_yr, 6e-4, 6e-4 * kArithmeticRelTol);
  EXPECT_NEAR(s.required_rrf, 60.0, 60.0 * kArithmeticRelTol);
}

constexpr const char* kTwoSifs = R"({"format": "sifter-project/1",
  "defaults": {"proof_test_interval": "1 yr", "mttr": "8 h"},
  "components": [{"id": "A", "lambda_du": "100 FIT"}, {"id": "B", "lambda_du": "100 FIT"}],
  "subsystem_templates": {"pair": {"role": "sensor", "vote": "1oo2", "channels": ["A", "B"], "beta": "150%"}},
  "sifs": [{"id": "S1", "subsystems": [{"name": "s", "template": "pair"}]},
           {"id": "S2", "subsystems": [{"name": "s", "template": "pair"}]}]})";

TEST(LoadReuse, AProblemInATemplateIsReportedOnceAtTheTemplate) {
  EXPECT_EQ(message_of(kTwoSifs),
            "p.json:4:94: /subsystem_templates/pair/beta: expected a fraction from 0 to 1, such as 0.05 or \"5%\", "
            "found the string \"150%\"\n"
            "1 problem in the input (1 problem that follows only from it not shown); nothing was computed or written");
}

TEST(LoadReuse, AnUnknownTemplateIsOneMessageWithTheNearestName) {
  std::string text = kTwoSifs;
  text.replace(text.find("150%"), 4, "5%");
  text.replace(text.rfind("\"pair\""), 6, "\"pairs\"");
  EXPECT_EQ(message_of(text),
            "p.json:6:54: /sifs/1/subsystems/0/template: expected the name of an entry of \"subsystem_templates\", "
            "found the string \"pairs\"\n  hint: did you mean \"pair\"?\n"
            "1 problem in the input (2 problems that follow only from it not shown); nothing was computed or written");
}

TEST(LoadReuse, AppliesToCausesNamesCausesOfTheScenario) {
  std::string text = R"({"format": "sifter-project/1",
  "scenarios": [{"id": "S", "target_frequency": "1e-4/yr", "causes": [{"id": "C1", "frequency": "0.1/yr"}],
    "layers": [{"id": "L", "kind": "mechanical", "pfd": 0.1, "applies_to_causes": ["C2"]}]}]})";
  EXPECT_EQ(message_of(text),
            "p.json:3:84: /scenarios/0/layers/0/applies_to_causes/0: expected the id of a cause of scenario S, found "
            "\"C2\"\n  hint: the causes are: C1\n"
            "1 problem in the input; nothing was computed or written");
}

}  // namespace
}  // namespace sifter
