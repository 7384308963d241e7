// Loading setups: the factory, the input rules and the setup-specific formulas of each class.
#include "model/setups/loading_setup.hpp"
#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/section/section_table.hpp"
#include "tests/test_support.hpp"

#include <stdexcept>

namespace rotcap {
namespace {

constexpr HingeSetup kAll[] = {HingeSetup::cantilever, HingeSetup::three_point, HingeSetup::four_point,
                               HingeSetup::uniform_moment};

TEST(LoadingSetup, FactoryMakesTheClassOfEverySetup) {
  static_assert(std::size(kAll) == kHingeSetupCount);
  for (HingeSetup s : kAll) {
    EXPECT_EQ(make_loading_setup(s)->kind(), s);
    EXPECT_EQ(loading_setup(s).kind(), s);
    EXPECT_EQ(&loading_setup(s), &loading_setup(s));  // shared instance
  }
}

TEST(LoadingSetup, NamesAreTheCaseFileSpellings) {
  EXPECT_STREQ(loading_setup(HingeSetup::cantilever).name(), "cantilever");
  EXPECT_STREQ(loading_setup(HingeSetup::three_point).name(), "three_point");
  EXPECT_STREQ(loading_setup(HingeSetup::four_point).name(), "four_point");
  EXPECT_STREQ(loading_setup(HingeSetup::uniform_moment).name(), "uniform_moment");
}

TEST(LoadingSetup, InputRulesFollowTheSetup) {
  EXPECT_EQ(setup_names_where(&LoadingSetup::needs_load_spacing), "\"four_point\"");
  EXPECT_EQ(setup_names_where(&LoadingSetup::allows_axial_load), "\"cantilever\" or \"uniform_moment\"");
  EXPECT_EQ(setup_names_where(&LoadingSetup::allows_support_choice), "\"cantilever\"");
}

TEST(LoadingSetup, ModelAnswersWithTheSetupOfItsField) {
  HingeZoneModel m;
  for (HingeSetup s : kAll) {
    m.setup = s;
    EXPECT_EQ(m.loading().kind(), s);
  }
}

TEST(LoadingSetup, RotationIntegralCoefficients) {
  // model/laws/hinge_laws.hpp: (L, 0) cantilever and three_point, (2a, L - 2a) four_point, (0, L) uniform_moment.
  const double L = 3000.0, a = 1000.0;
  EXPECT_EQ(loading_setup(HingeSetup::cantilever).rotation_integral(L, 0.0).c1, L);
  EXPECT_EQ(loading_setup(HingeSetup::three_point).rotation_integral(L, 0.0).c2, 0.0);
  const RotationIntegral f = loading_setup(HingeSetup::four_point).rotation_integral(L, a);
  EXPECT_EQ(f.c1, 2.0 * a);
  EXPECT_EQ(f.c2, L - 2.0 * a);
  EXPECT_THROW(loading_setup(HingeSetup::four_point).rotation_integral(L, 0.6 * L), std::invalid_argument);
  EXPECT_EQ(loading_setup(HingeSetup::uniform_moment).rotation_integral(L, 0.0).c2, L);
  EXPECT_TRUE(loading_setup(HingeSetup::uniform_moment).no_hardening_hinge_law().has_value());
  EXPECT_FALSE(loading_setup(HingeSetup::cantilever).no_hardening_hinge_law().has_value());
}

TEST(LoadingSetup, HingeSectionsAndCompressionFlange) {
  HingeZoneSpec spec;
  spec.section = *find_section("IPE 300");
  spec.length = 3000.0;
  for (HingeSetup s : kAll) {
    spec.setup = s;
    spec.load_spacing = s == HingeSetup::four_point ? 1000.0 : 0.0;
    const HingeZoneModel h = build_hinge_zone(spec);
    const std::vector<double> x = h.loading().hinge_sections(h);
    switch (s) {
      case HingeSetup::cantilever: EXPECT_EQ(x, std::vector<double>{0.0}); break;
      case HingeSetup::four_point: EXPECT_EQ(x, (std::vector<double>{1000.0, 2000.0})); break;
      default: EXPECT_EQ(x, std::vector<double>{1500.0});
    }
    EXPECT_EQ(h.loading().top_flange_in_compression(), s != HingeSetup::cantilever);
  }
}

TEST(LoadingSetup, ShearRotationAtMpIsTimoshenkosShearDeflectionInTheRotationDefinition) {
  // Shear deflection of a beam segment carrying shear V over a length s: V s / (G Av) (Timoshenko
  // beam theory, e.g. Timoshenko & Gere, Mechanics of Materials, from memory). Each setup turns
  // that deflection into its hinge rotation the way apply() defines theta.
  HingeZoneModel m;
  m.plastic_moment = 600e6;  // N mm
  m.span = 2000.0;
  m.shear_span = 700.0;
  const double GAv = 80769.0 * 3904.0;  // N
  m.setup = HingeSetup::cantilever;     // V = Mp / L over L; theta = delta / L
  EXPECT_CLOSE(m.loading().shear_rotation_at_mp(m, GAv), (m.plastic_moment / m.span) * m.span / GAv / m.span, 1e-14, 0.0);
  m.setup = HingeSetup::three_point;    // P = 4 Mp / L, V = P / 2 over L / 2; theta = 4 delta / L
  const double P3 = 4.0 * m.plastic_moment / m.span;
  EXPECT_CLOSE(m.loading().shear_rotation_at_mp(m, GAv), 4.0 * (0.5 * P3 * 0.5 * m.span / GAv) / m.span, 1e-14, 0.0);
  m.setup = HingeSetup::four_point;     // P = Mp / a, V = P over a; theta = 2 delta / a
  const double P4 = m.plastic_moment / m.shear_span;
  EXPECT_CLOSE(m.loading().shear_rotation_at_mp(m, GAv), 2.0 * (P4 * m.shear_span / GAv) / m.shear_span, 1e-14, 0.0);
  m.setup = HingeSetup::uniform_moment;  // no shear force
  EXPECT_EQ(m.loading().shear_rotation_at_mp(m, GAv), 0.0);
}

}  // namespace
}  // namespace rotcap
