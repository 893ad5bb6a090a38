// Specification of the revision comparison.
#include "sifter/analysis/diff.hpp"

#include <gtest/gtest.h>

#include "sifter/input/load.hpp"

namespace sifter {
namespace {

constexpr double kExactRelTol = 1e-12;

struct Revision {
  LoadedProject loaded;
  ProjectResult result;
};

Revision revision(const std::string& path) {
  Revision r{load_project_file(std::string(SIFTER_SOURCE_DIR) + "/" + path), {}};
  r.result = verify_project(r.loaded);
  return r;
}

Revision inline_revision(const std::string& text) {
  Revision r{load_project_text(text, "inline.json", "."), {}};
  r.result = verify_project(r.loaded);
  return r;
}

ProjectDiff diff(const Revision& a, const Revision& b) {
  return diff_projects(a.loaded.project, a.result, b.loaded.project, b.result);
}

const FunctionDiff& find(const std::vector<FunctionDiff>& items, const std::string& id) {
  for (const auto& d : items)
    if (d.id == id) return d;
  throw std::runtime_error("no " + id);
}

TEST(Diff, ARevisionComparedWithItselfHasNoChanges) {
  const auto a = revision("examples/unit40.json");
  const auto d = diff(a, a);
  for (const auto& s : d.sifs) EXPECT_FALSE(s.changed()) << s.id;
  for (const auto& s : d.scenarios) EXPECT_FALSE(s.changed()) << s.id;
  EXPECT_TRUE(d.project_inputs.empty());
  EXPECT_FALSE(d.any_worsened());
}

// tests/data/unit40_rev_b.json is examples/unit40.json with cause C1 of LOPA-401-1 at 0.5/yr
// instead of 0.1/yr (and the library path from its folder). CCPS 2001 arithmetic: (0.5 x 0.9 +
// 0.3 x 0.9 x 0.1) x 0.01 x 0.5 / 1e-5 = 238.5, up from 58.5 (see cli_test.cpp for the latter).
TEST(Diff, AChangedCauseFrequencyMovesTheRequirementOfItsSifAndNothingElse) {
  const auto d = diff(revision("examples/unit40.json"), revision("tests/data/unit40_rev_b.json"));
  EXPECT_TRUE(d.project_inputs.empty());

  const FunctionDiff& scenario = find(d.scenarios, "LOPA-401-1");
  ASSERT_EQ(scenario.inputs.size(), 1u);
  const InputChange& c = scenario.inputs[0];
  EXPECT_EQ(c.pointer, "/scenarios/0/causes/0/frequency");
  EXPECT_EQ(c.unit, "/yr");
  EXPECT_NEAR(*c.old_value->number, 0.1, 0.1 * kExactRelTol);
  EXPECT_NEAR(*c.new_value->number, 0.5, 0.5 * kExactRelTol);
  for (const char* id : {"LOPA-402-1", "LOPA-403-1"}) EXPECT_FALSE(find(d.scenarios, id).changed()) << id;

  const FunctionDiff& sif = find(d.sifs, "SIF-401");
  EXPECT_TRUE(sif.inputs.empty());  // nothing of the SIF itself changed
  EXPECT_EQ(sif.related, std::vector<std::string>{"LOPA-401-1"});
  bool rrf = false;
  for (const auto& r : sif.results) {
    if (r.quantity == "required_rrf") {
      rrf = true;
      EXPECT_NEAR(*r.old_value->number, 58.5, 58.5 * 1e-9);
      EXPECT_NEAR(*r.new_value->number, 238.5, 238.5 * 1e-9);
    }
    EXPECT_NE(r.quantity, "pfd_avg");  // the hardware did not change
  }
  EXPECT_TRUE(rrf);
  for (const char* id : {"SIF-402", "SIF-403"}) EXPECT_FALSE(find(d.sifs, id).changed()) << id;

  // SIF-401's PFDavg 4.56e-3 (RRF 219) no longer reaches RRF 238.5: its verdict worsened, and
  // it is listed first.
  EXPECT_EQ(sif.verdict, VerdictChange::kWorsened);
  EXPECT_EQ(d.sifs.front().id, "SIF-401");
  EXPECT_TRUE(d.any_worsened());
}

TEST(Diff, TheReverseChangeImprovesTheVerdictAndWorsensNothing) {
  const auto d = diff(revision("tests/data/unit40_rev_b.json"), revision("examples/unit40.json"));
  EXPECT_EQ(find(d.sifs, "SIF-401").verdict, VerdictChange::kImproved);
  EXPECT_FALSE(d.any_worsened());
}

std::string project_with(const std::string& rate, const std::string& interval) {
  return R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h" },
  "components": [ { "id": "XV-1", "lambda_du": ")" +
         rate + R"(" }, { "id": "XV-9", "lambda_du": "1e-6/h" } ],
  "sifs": [ { "id": "S1", "target": {"sil": 1}, "subsystems": [
    { "name": "valve", "role": "final", "vote": "1oo1", "channels": ["XV-1"], "proof_test_interval": ")" +
         interval +
         R"(" } ] } ]
})";
}

TEST(Diff, RatesAndDurationsAreComparedResolvedNotAsWritten) {
  // 1000 FIT = 1e-6/h and 12 mo = 1 yr = 8760 h (1 mo = 730 h): the same model.
  const auto d =
      diff(inline_revision(project_with("1e-6/h", "1 yr")), inline_revision(project_with("1000 FIT", "12 mo")));
  EXPECT_FALSE(d.sifs[0].changed());
}

TEST(Diff, AChangedComponentRateIsListedUnderItsSifInOneUnit) {
  const auto d =
      diff(inline_revision(project_with("1e-6/h", "1 yr")), inline_revision(project_with("2000 FIT", "1 yr")));
  const FunctionDiff& s = d.sifs[0];
  ASSERT_EQ(s.inputs.size(), 1u);
  EXPECT_EQ(s.inputs[0].pointer, "/components/0/lambda_du");
  EXPECT_EQ(s.inputs[0].unit, "/h");
  EXPECT_NEAR(*s.inputs[0].new_value->number, 2e-6, 2e-6 * kExactRelTol);
  ASSERT_FALSE(s.results.empty());
  EXPECT_EQ(s.results[0].quantity, "pfd_avg");
}

TEST(Diff, AComponentNoSifUsesIsAProjectInput) {
  std::string changed = project_with("1e-6/h", "1 yr");
  const std::string before = R"("XV-9", "lambda_du": "1e-6/h")";
  changed.replace(changed.find(before), before.size(), R"("XV-9", "lambda_du": "3e-6/h")");
  const auto d = diff(inline_revision(project_with("1e-6/h", "1 yr")), inline_revision(changed));
  EXPECT_FALSE(d.sifs[0].changed());
  ASSERT_EQ(d.project_inputs.size(), 1u);
  EXPECT_EQ(d.project_inputs[0].what, "lambda_du of XV-9");
}

}  // namespace
}  // namespace sifter
