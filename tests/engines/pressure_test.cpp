// Specification of the overpressure screening: units, hydrostatics, pump curves, the graph,
// the bands at their edges, generated scenarios, data maturity and the options comparison.
#include "sifter/engines/pressure.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>
#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>

#include "sifter/analysis/maturity.hpp"
#include "sifter/analysis/options.hpp"
#include "sifter/analysis/verify.hpp"
#include "sifter/input/load.hpp"

namespace sifter {
namespace {

constexpr double kRelTol = 1e-12;
constexpr double kHandTol = 1e-6;  // values worked by hand to seven figures

/// The simplified engine alone: the exact cross-check is not what these tests specify.
VerifyOptions without_exact() {
  VerifyOptions o;
  o.exact = false;
  return o;
}

LoadedProject load_inline(const std::string& text) {
  return load_project_text(text, "inline.json", std::string(SIFTER_SOURCE_DIR) + "/examples");
}

LoadedProject load_example(const std::string& name) {
  return load_project_file(std::string(SIFTER_SOURCE_DIR) + "/examples/" + name);
}

// --- Units: exact definitions ------------------------------------------------------------

TEST(PressureUnits, PsiGaugeIsSixThousandEightHundredNinetyFourPascalPerPsi) {
  // 1 psi = 6894.757 Pa (NIST SP 811, seen); 1 bar = 1e5 Pa.
  EXPECT_NEAR(parse_pressure("100 psig").value->bar_gauge, 6.894757, kHandTol);
  EXPECT_NEAR(parse_pressure("1200 kPag").value->bar_gauge, 12.0, kHandTol);
  EXPECT_NEAR(parse_pressure("1.2 MPag").value->bar_gauge, 12.0, kHandTol);
}

TEST(PressureUnits, AbsoluteIsStoredAsGaugeLessOneStandardAtmosphere) {
  // gauge + 1.01325 bar = absolute (standard atmosphere, exact by definition).
  const auto p = parse_pressure("13.01325 bara").value;
  ASSERT_TRUE(p);
  EXPECT_NEAR(p->bar_gauge, 12.0, kHandTol);
  EXPECT_EQ(p->written, PressureBasis::kAbsolute);
  EXPECT_NEAR(parse_pressure("100 psia").value->bar_gauge, 6.894757 - 1.01325, kHandTol);
}

TEST(PressureUnits, BarWithoutGaugeOrAbsoluteIsRefusedWithAHint) {
  const auto p = parse_pressure("12 bar");
  EXPECT_FALSE(p.value);
  EXPECT_EQ(p.problem, "\"bar\" without saying gauge or absolute");
  EXPECT_EQ(p.hint, "add g (gauge) or a (absolute): \"barg\"; absolute = gauge + 1.01325 bar");
}

TEST(PressureUnits, FeetAreExactlyPointThreeZeroFourEightMetres) {
  EXPECT_NEAR(parse_length("100 ft").value->metres, 30.48, kHandTol);  // international foot, exact
  EXPECT_FALSE(parse_density("0 kg/m3").value);
  EXPECT_FALSE(parse_flow("-1 m3/h").value);
}

// --- Hydrostatics and pumps ----------------------------------------------------------------

TEST(Hydrostatics, TenMetresOfWaterAtOneTonnePerCubicMetreIsPointNineEightBar) {
  // rho g h = 1000 x 9.80665 x 10 Pa = 0.980665 bar; g standard gravity (ISO 80000-3, seen).
  EXPECT_NEAR(static_head_bar(Density{1000.0}, Length{10.0}), 0.980665, kHandTol);
  EXPECT_NEAR(static_head_bar(Density{1000.0}, Length{-10.0}), -0.980665, kHandTol);
}

TEST(PumpCurve, HeadAndFlowAreReadByLinearInterpolation) {
  const std::vector<CurvePoint> curve{{{0}, {100}}, {{20}, {90}}, {{40}, {70}}};
  EXPECT_NEAR(*curve_head_m(curve, 30.0), 80.0, kHandTol);  // halfway between 90 and 70
  EXPECT_NEAR(*curve_flow_m3_per_hour(curve, 80.0), 30.0, kHandTol);
  EXPECT_NEAR(*curve_flow_m3_per_hour(curve, 95.0), 10.0, kHandTol);
  EXPECT_EQ(*curve_flow_m3_per_hour(curve, 120.0), 0.0);  // above shutoff: no flow
  EXPECT_FALSE(curve_flow_m3_per_hour(curve, 60.0));      // beyond the curve's end
  EXPECT_FALSE(curve_head_m(curve, 41.0));
}

TEST(PumpCurve, ShutoffHeadScalesWithTheSquareOfTheSpeed) {
  // Affinity laws (textbook pump hydraulics): H ~ N^2. 100 m at 1.1 x speed is 121 m.
  PressureSource pump;
  pump.suction_max = Pressure{2.0};
  pump.density_max = Density{1000.0};
  pump.curve = {{{0}, {100}}, {{50}, {80}}};
  pump.speed_max_ratio = 1.1;
  EXPECT_NEAR(source_max_pressure_barg(pump), 2.0 + 1000.0 * 9.80665 * 121.0 / 1e5, 1e-9);
}

TEST(PumpCurve, EstimatedShutoffIsRatedDifferentialPlusMargin) {
  PressureSource pump;
  pump.rated_differential = Length{120.0};
  pump.shutoff_margin = 0.2;
  EXPECT_NEAR(shutoff_head_m(pump), 144.0, kHandTol);
  EXPECT_TRUE(pump.shutoff_estimated());
}

// --- Bands at their edges ------------------------------------------------------------------

TEST(OverpressureBands, EachEdgeBelongsToTheLowerBandAndOneUlpAboveToTheNext) {
  const double acc = 0.10, test = 1.43;
  EXPECT_EQ(category_for_ratio(1.0, acc, test), OverpressureCategory::kNone);
  EXPECT_EQ(category_for_ratio(std::nextafter(1.0, 2.0), acc, test), OverpressureCategory::kMinor);
  const double minor_edge = 1.0 + acc;
  EXPECT_EQ(category_for_ratio(std::nextafter(minor_edge, 0.0), acc, test), OverpressureCategory::kMinor);
  EXPECT_EQ(category_for_ratio(minor_edge, acc, test), OverpressureCategory::kMinor);
  EXPECT_EQ(category_for_ratio(std::nextafter(minor_edge, 2.0), acc, test), OverpressureCategory::kLeakPossible);
  EXPECT_EQ(category_for_ratio(test, acc, test), OverpressureCategory::kLeakPossible);
  EXPECT_EQ(category_for_ratio(std::nextafter(test, 2.0), acc, test), OverpressureCategory::kRupturePossible);
}

// --- The graph -------------------------------------------------------------------------------

PressureSection two_sources() {
  PressureSection s;
  PressureSource pump;
  pump.id = "P1";
  pump.suction_max = Pressure{1.0};
  pump.density_max = Density{1000.0};
  pump.curve = {{{0}, {100}}, {{10}, {90}}};
  PressureSource gas;
  gas.id = "G1";
  gas.kind = PressureSource::Kind::kFixed;
  gas.pressure = Pressure{15.0};
  s.sources = {pump, gas};
  PressureEquipment a, b, c;
  a.id = "A";
  b.id = "B";
  c.id = "C";
  for (auto* e : {&a, &b, &c}) {
    e->mawp = Pressure{10.0};
    e->test_pressure = Pressure{14.3};
  }
  b.elevation = Length{-10.0};
  s.equipment = {a, b, c};
  s.connections = {{"P1", "A", ""}, {"A", "B", ""}, {"G1", "B", ""}};
  return s;
}

TEST(PressureGraph, TheHighestReachingSourceGovernsAndItsPathIsNamed) {
  const auto r = screen_pressure(two_sources());
  ASSERT_EQ(r.equipment.size(), 2u);
  // A: pump only, 1 + rho g 100 m = 1 + 9.80665 bar.
  EXPECT_EQ(r.equipment[0].id, "A");
  EXPECT_NEAR(r.equipment[0].max_pressure_barg, 10.80665, kHandTol);
  // B: the pump gives 10.80665 + 0.980665 (10 m lower) = 11.787315; the gas 15 governs.
  EXPECT_EQ(r.equipment[1].source, "G1");
  EXPECT_NEAR(r.equipment[1].max_pressure_barg, 15.0, kHandTol);
  EXPECT_EQ(r.equipment[1].path, (std::vector<std::string>{"G1", "B"}));
  EXPECT_EQ(r.not_reached, std::vector<std::string>{"C"});
}

TEST(PressureGraph, ThePumpPathThroughTwoItemsIsNamedWhenItGoverns) {
  auto s = two_sources();
  s.sources[1].pressure = Pressure{5.0};
  const auto r = screen_pressure(s);
  EXPECT_EQ(r.equipment[1].source, "P1");
  EXPECT_EQ(r.equipment[1].path, (std::vector<std::string>{"P1", "A", "B"}));
  EXPECT_NEAR(r.equipment[1].max_pressure_barg, 11.787315, kHandTol);
}

TEST(PressureGraph, ACycleIsReportedAsAPathOfIds) {
  auto s = two_sources();
  s.connections.push_back({"B", "A", ""});
  EXPECT_EQ(connection_cycle(s), (std::vector<std::string>{"A", "B", "A"}));
  EXPECT_TRUE(connection_cycle(two_sources()).empty());
}

// --- Present value ----------------------------------------------------------------------------

TEST(PresentValue, AnnuityFactorAtSevenPercentOverTwentyYears) {
  // A (1 - (1 + r)^-n) / r (textbook engineering economics); by hand 1.07^20 = 3.8696845,
  // (1 - 1/3.8696845) / 0.07 = 10.594014.
  EXPECT_NEAR(present_value_of_annuity(1000.0, 0.07, 20.0), 10594.014, 1e-3);
  EXPECT_NEAR(present_value_of_annuity(1000.0, 0.0, 20.0), 20000.0, kHandTol);
}

// --- The example: estimate, vendor curve, generated scenario, maturity, options ----------

TEST(PressureExample, TheVendorCurvePutsTheMeteringSkidAboveItsMawp) {
  const auto loaded = load_example("unit70_booster.json");
  ASSERT_TRUE(loaded.pressure);
  const auto& items = loaded.pressure->equipment;
  ASSERT_EQ(items.size(), 3u);
  // M-702: 4 barg + 1020 x 9.80665 x (175 m + 6 m) Pa = 4 + 18.1053 = 22.1053 barg (by hand).
  EXPECT_EQ(items[1].id, "M-702");
  EXPECT_NEAR(items[1].max_pressure_barg, 4.0 + 1020.0 * 9.80665 * 181.0 / 1e5, 1e-9);
  EXPECT_EQ(items[1].category, OverpressureCategory::kLeakPossible);
  EXPECT_EQ(items[2].source, "P-701");  // the pump beats the nitrogen header at V-703
  EXPECT_FALSE(items[1].preliminary());
  EXPECT_EQ(loaded.pressure->generated, std::vector<std::string>{"OP-M-702-by-P-701"});
}

TEST(PressureExample, AnEstimatedShutoffMarksTheItemsPreliminaryAndGeneratesNothing) {
  const auto loaded = load_example("unit70_booster_estimate.json");
  ASSERT_TRUE(loaded.pressure);
  for (const auto& e : loaded.pressure->equipment) {
    EXPECT_TRUE(e.preliminary()) << e.id;
    EXPECT_EQ(e.category, OverpressureCategory::kNone) << e.id;
  }
  EXPECT_EQ(loaded.pressure->equipment[1].estimates.front(),
            "shutoff head of P-701 estimated as rated differential 120 m + 20 %");
  EXPECT_TRUE(loaded.pressure->generated.empty());
}

TEST(PressureExample, AGeneratedScenarioGivesTheSameLopaResultAsTheSameScenarioWrittenByHand) {
  const auto loaded = load_example("unit70_booster.json");
  const auto generated = verify_project(loaded, without_exact());
  // The same scenario written by hand in the project file, without the pressure section.
  std::ifstream in(std::string(SIFTER_SOURCE_DIR) + "/examples/unit70_booster.json");
  std::stringstream text;
  text << in.rdbuf();
  nlohmann::json j = nlohmann::json::parse(text.str());
  j.erase("pressure");
  j.erase("options");
  j["scenarios"] = nlohmann::json::parse(R"([{"id": "by-hand", "title": "Skid overpressure written by hand",
      "consequences": [{"category": "safety", "severity": 3}],
      "causes": [{"id": "blocked-outlet", "frequency": "0.1/yr"}],
      "layers": [{"sif": "SIF-701"}]}])");
  const auto by_hand = verify_project(load_inline(j.dump()), without_exact());
  ASSERT_EQ(generated.scenarios.size(), 1u);
  ASSERT_EQ(by_hand.scenarios.size(), 1u);
  const auto& a = generated.scenarios[0];
  const auto& b = by_hand.scenarios[0];
  EXPECT_TRUE(a.generated);
  EXPECT_FALSE(b.generated);
  EXPECT_NEAR(a.required_rrf, b.required_rrf, kRelTol * b.required_rrf);
  EXPECT_NEAR(a.required_rrf, 2000.0, 1e-9);  // 0.1/yr over 5e-5/yr
  EXPECT_EQ(a.required_sil, b.required_sil);
  EXPECT_EQ(a.meets_target, b.meets_target);
  EXPECT_EQ(generated.sifs[0].sil_required, by_hand.sifs[0].sil_required);
}

TEST(Maturity, AnEstimateInASourceMarksTheItemItsScenarioAndTheSifItFeeds) {
  std::ifstream in(std::string(SIFTER_SOURCE_DIR) + "/examples/unit70_booster.json");
  std::stringstream text;
  text << in.rdbuf();
  nlohmann::json j = nlohmann::json::parse(text.str());
  j["pressure"]["sources"][0]["status"] = "estimate";
  const auto loaded = load_inline(j.dump());
  const auto r = verify_project(loaded, without_exact());
  EXPECT_TRUE(r.pressure->equipment[1].preliminary());
  ASSERT_EQ(r.scenarios.size(), 1u);
  EXPECT_TRUE(r.scenarios[0].preliminary);
  EXPECT_EQ(r.scenarios[0].preliminary_because, std::vector<std::string>{"source P-701 (status estimate)"});
  EXPECT_TRUE(r.sifs[0].preliminary);
  EXPECT_EQ(r.sifs[0].preliminary_because,
            std::vector<std::string>{"requirement from scenario OP-M-702-by-P-701: source P-701 (status estimate)"});
  EXPECT_FALSE(r.sifs[1].preliminary);
  EXPECT_FALSE(preliminary_verdicts(r).empty());
}

class ExampleOptions : public ::testing::Test {
 protected:
  static void SetUpTestSuite() {
    options_ =
        new ScenarioOptions(compare_options(load_example("unit70_booster.json"), "OP-M-702-by-P-701", without_exact()));
  }
  static void TearDownTestSuite() { delete options_; }
  static const OptionResult& option(const std::string& id) {
    for (const auto& o : options_->options)
      if (o.id == id) return o;
    throw std::runtime_error("no option " + id);
  }
  static ScenarioOptions* options_;
};
ScenarioOptions* ExampleOptions::options_ = nullptr;

TEST_F(ExampleOptions, AReRateAtTheMaximumPressureRemovesTheScenarioAndCostsItsCapitalOnly) {
  const auto& o = option("rerate-M-702");
  EXPECT_TRUE(o.feasible);
  EXPECT_TRUE(o.makes_tolerable);
  EXPECT_EQ(o.lifecycle_cost, 180000.0);  // by hand: capex only
}

TEST_F(ExampleOptions, AReliefValveTooBigForItsReceiverIsInfeasibleWithTheNumbers) {
  // Relieving at 19.5 x 1.1 = 21.45 barg leaves (21.45 - 4 - 0.600167) / 0.1000278 = 168.45 m
  // for the pump: between 172 m at 20 m3/h and 165 m at 40 m3/h, i.e. 30.1 m3/h (by hand).
  const auto& o = option("PSV-702");
  EXPECT_FALSE(o.feasible);
  EXPECT_NE(o.reason.find("takes 30.1 m3/h from P-701"), std::string::npos) << o.reason;
  EXPECT_NE(o.reason.find("more than the 20 m3/h drain drum D-790 takes"), std::string::npos) << o.reason;
  // Costs by hand: 25000 + (500 + 1500 / 2 yr) x 10.594014 = 25000 + 1250 x 10.594014.
  EXPECT_NEAR(o.lifecycle_cost, 25000.0 + 1250.0 * 10.594014, 1e-2);
}

TEST_F(ExampleOptions, ASifOnAnSc2LogicSolverUnderASil3NeedIsInfeasibleAndSaysSo) {
  const auto& o = option("SIF-701-existing");
  EXPECT_FALSE(o.feasible);
  EXPECT_NE(o.reason.find("against SIL 3 required"), std::string::npos) << o.reason;
  EXPECT_NE(o.reason.find("systematic 2"), std::string::npos) << o.reason;
}

TEST_F(ExampleOptions, FeasibleAndTolerableOptionsRankFirstByCost) {
  ASSERT_EQ(options_->options.size(), 4u);
  const auto& first = options_->options[0];
  EXPECT_TRUE(first.feasible && first.makes_tolerable);
  for (std::size_t i = 1; i < options_->options.size(); ++i) {
    const auto& a = options_->options[i - 1];
    const auto& b = options_->options[i];
    const int ga = a.feasible ? (a.makes_tolerable ? 0 : 1) : 2, gb = b.feasible ? (b.makes_tolerable ? 0 : 1) : 2;
    EXPECT_TRUE(ga < gb || (ga == gb && a.lifecycle_cost <= b.lifecycle_cost));
  }
}

TEST_F(ExampleOptions, ASifOptionCostsItsProofTestsAndSpuriousTripsAtTheSifsFigures) {
  const auto& o = option("SIF-702-hipps");
  // Subsystem intervals 1 yr, 1 yr (defaults) and 6 mo: 1 + 1 + 2 = 4 tests per year.
  EXPECT_NEAR(o.tests_per_yr, 4.0, 1e-9);
  const double factor = 10.594014;
  EXPECT_NEAR(o.lifecycle_cost, 150000.0 + (2000.0 + 4.0 * 3000.0 + o.trips_per_yr * 30000.0) * factor, 1.0);
}

TEST(Options, AReRateZeroPointOneBarShortLeavesTheScenario) {
  std::ifstream in(std::string(SIFTER_SOURCE_DIR) + "/examples/unit70_booster.json");
  std::stringstream text;
  text << in.rdbuf();
  nlohmann::json j = nlohmann::json::parse(text.str());
  const auto loaded0 = load_inline(j.dump());
  const double pmax = loaded0.pressure->equipment[1].max_pressure_barg;
  char just[32], short_[32];
  std::snprintf(just, sizeof just, "%.17g barg", pmax);
  std::snprintf(short_, sizeof short_, "%.17g barg", pmax - 0.1);
  j["options"]["alternatives"] = nlohmann::json::array(
      {{{"scenario", "OP-M-702-by-P-701"}, {"id", "just"}, {"kind", "rerate"}, {"new_mawp", just}},
       {{"scenario", "OP-M-702-by-P-701"}, {"id", "short"}, {"kind", "rerate"}, {"new_mawp", short_}}});
  const auto r = compare_options(load_inline(j.dump()), "OP-M-702-by-P-701", without_exact());
  ASSERT_EQ(r.options.size(), 2u);
  EXPECT_EQ(r.options[0].id, "just");
  EXPECT_TRUE(r.options[0].feasible);
  EXPECT_EQ(r.options[1].id, "short");
  EXPECT_FALSE(r.options[1].feasible);
  EXPECT_NE(r.options[1].reason.find("0.1 bar below the maximum credible pressure"), std::string::npos)
      << r.options[1].reason;
}

}  // namespace
}  // namespace sifter
