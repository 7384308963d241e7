// Case files: a full generated case, the defaults of minimal cases, general cases, amplitudes,
// the steel table and the JSON echo. Inputs are the schema of docs/spec/interface.md;
// expected values are the inputs themselves (or the documented defaults in io/case_file.hpp).
#include "io/amplitude.hpp"
#include "io/case_echo.hpp"
#include "io/case_file.hpp"
#include "tests/io/io_test_support.hpp"
#include "tests/test_support.hpp"

namespace rotcap {
namespace {

using testing::data_file;
using testing::expect_input_error;

// A general case whose mesh is the test plate (relative to tests/data, like a case file there).
CaseInput general_case(const std::string& body) {
  return parse_case_text("[model]\nmesh = \"io_two_region_plate.msh\"\nthickness = 8.0\n"
                         "[[support]]\ngroup = \"clamped\"\nfix = [\"ux\", \"uy\", \"uz\"]\n"
                         "[[load]]\ngroup = \"tip\"\nforce = [0.0, 0.0, -1.0]\n[steel]\ncurve = \"elastic\"\n" + body,
                         data_file("inline_general.toml"));
}

const char* kMinimalGenerated = R"(
[section]
depth = 300
flange_width = 150
flange_thickness = 10.7
web_thickness = 7.1
[steel]
fy = 355
fu = 490
[member]
setup = "cantilever"
length = 1500
)";

TEST(CaseFile, ReadsEveryTableOfAGeneratedCase) {
  const CaseInput c = read_case_file(data_file("io_cantilever.toml"));
  EXPECT_EQ(c.kind, ModelKind::generated);
  EXPECT_EQ(c.title, "Car-park floor girder, hogging hinge over the interior column");
  EXPECT_EQ(c.zone.section.h, 450.0);
  EXPECT_EQ(c.zone.section.b, 190.0);
  EXPECT_EQ(c.zone.section.tf, 14.6);
  EXPECT_EQ(c.zone.section.tw, 9.4);
  EXPECT_EQ(c.steel.E, 210000.0);
  EXPECT_EQ(c.steel.fy, 355.0);
  EXPECT_EQ(c.steel.fu, 490.0);
  EXPECT_EQ(c.steel.kind, SteelCurveKind::quadlinear);
  EXPECT_EQ(c.zone.setup, HingeSetup::cantilever);
  EXPECT_EQ(c.zone.length, 2000.0);
  EXPECT_EQ(c.zone.stiffeners, StiffenerPlacement::supports_and_loads);
  ASSERT_EQ(c.zone.lateral_restraints.size(), 2u);
  EXPECT_EQ(c.zone.lateral_restraints[1].x, 1000.0);
  EXPECT_EQ(c.zone.lateral_restraints[1].flange, RestrainedFlange::top);
  EXPECT_EQ(c.imperfection.local, LocalImperfection::buckling_mode);
  EXPECT_EQ(c.imperfection.local_amplitude.base, "b");
  EXPECT_EQ(c.imperfection.local_amplitude.divisor, 200.0);
  EXPECT_EQ(c.imperfection.global_amplitude.base, "L");
  EXPECT_EQ(c.imperfection.global_amplitude.divisor, 1000.0);
  EXPECT_EQ(c.residual_stress, ResidualStressKind::hot_rolled);
  EXPECT_EQ(c.zone.flange_elements, 8);
  EXPECT_EQ(c.zone.web_elements, 10);
  EXPECT_EQ(c.layers.layers, 5);
  EXPECT_EQ(c.analysis.control, Control::arc_length);
  EXPECT_EQ(c.analysis.max_rotation, 0.15);
  EXPECT_EQ(c.analysis.stop_below, 0.75);
  EXPECT_EQ(c.analysis.path.max_steps, 500);
  EXPECT_EQ(c.buckling.modes, 6);
  EXPECT_EQ(c.output.fields_every, 5);
}

TEST(CaseFile, FillsTheDocumentedDefaultsOfAMinimalGeneratedCase) {
  const CaseInput c = parse_case_text(kMinimalGenerated, "minimal.toml");
  EXPECT_EQ(c.title, "");
  EXPECT_EQ(c.steel.E, 210000.0);
  EXPECT_EQ(c.steel.nu, 0.3);
  EXPECT_EQ(c.steel.kind, SteelCurveKind::quadlinear);
  EXPECT_EQ(c.zone.axial_load_ratio, 0.0);
  EXPECT_TRUE(c.zone.lateral_restraints.empty());
  EXPECT_EQ(c.imperfection.local, LocalImperfection::buckling_mode);
  EXPECT_EQ(c.imperfection.local_amplitude.text, "b/200");
  EXPECT_EQ(c.imperfection.global_amplitude.text, "L/1000");
  EXPECT_EQ(c.residual_stress, ResidualStressKind::none);
  EXPECT_EQ(c.zone.flange_elements, 18);  // the demo mesh study's converged level (io/case_input.hpp)
  EXPECT_EQ(c.zone.web_elements, 23);
  EXPECT_EQ(c.layers.layers, 5);
  const AnalysisInput& a = c.analysis;
  EXPECT_EQ(a.control, Control::arc_length);
  EXPECT_EQ(a.path.force_tolerance, 1e-6);
  EXPECT_EQ(a.path.displacement_tolerance, 1e-4);
  EXPECT_EQ(a.path.max_iterations, 20);
  EXPECT_EQ(a.path.first_step, 0.05);     // generated models: steps from the curve (io/case_file.hpp)
  EXPECT_EQ(a.path.min_step_ratio, 1e-4);
  EXPECT_EQ(a.path.target_iterations, 6);
  EXPECT_EQ(a.path.max_step_ratio, 20.0);
  EXPECT_EQ(a.path.step_rule, StepRule::curve);
  EXPECT_EQ(a.path.curve.plastic_step, 0.1);
  EXPECT_EQ(a.path.curve.turning_step, 10.0);
  EXPECT_EQ(c.layers.material_substeps, 4);
  EXPECT_EQ(a.arc_length_form, ArcLength::Form::Cylindrical);
  EXPECT_FALSE(a.max_load_factor.has_value());
  EXPECT_EQ(c.buckling.modes, 4);
  EXPECT_EQ(c.output.fields_every, 5);
}

TEST(CaseFile, ReadsAGeneralCaseWithItsOwnDefaults) {
  const CaseInput c = general_case("");
  EXPECT_EQ(c.kind, ModelKind::general);
  EXPECT_EQ(c.analysis.control, Control::linear);
  EXPECT_EQ(c.imperfection.local, LocalImperfection::none);
  EXPECT_EQ(c.imperfection.global_amplitude.resolve(1000.0), 0.0);
  EXPECT_EQ(c.model.thickness.value(), 8.0);
  ASSERT_EQ(c.supports.size(), 1u);
  EXPECT_TRUE(c.supports[0].fixed[static_cast<int>(Dof::uz)]);
  EXPECT_FALSE(c.supports[0].fixed[static_cast<int>(Dof::rx)]);
  ASSERT_EQ(c.loads.size(), 1u);
  EXPECT_EQ(c.loads[0].force[2], -1.0);
  EXPECT_EQ(c.loads[0].moment[1], 0.0);
  // Load control lands on max_load_factor = 1 unless told otherwise.
  EXPECT_EQ(general_case("[analysis]\ncontrol = \"load\"\n").analysis.max_load_factor.value(), 1.0);
}

TEST(CaseFile, ReadsDisplacementControlAndMonitors) {
  const CaseInput c = general_case(
      "[analysis]\ncontrol = \"displacement\"\ncontrol_dof = { group = \"tip\", dof = \"uz\" }\n"
      "max_displacement = -20.0\nrecord_dofs = [{ group = \"corner\", dof = \"ry\" }]\n");
  ASSERT_TRUE(c.analysis.control_dof.has_value());
  EXPECT_EQ(c.analysis.control_dof->group, "tip");
  EXPECT_EQ(c.analysis.control_dof->dof, Dof::uz);
  EXPECT_EQ(c.analysis.max_displacement.value(), -20.0);
  ASSERT_EQ(c.analysis.record_dofs.size(), 1u);
  EXPECT_EQ(c.analysis.record_dofs[0].dof, Dof::ry);
  EXPECT_EQ(c.analysis.record_dofs[0].line, 16);  // the record_dofs line of the inline text
}

TEST(CaseFile, ResolvesTheMeshAgainstTheCaseFilesFolder) {
  const CaseInput c = read_case_file(data_file("io_two_region_plate.toml"));
  EXPECT_EQ(c.model.mesh_as_written, "io_two_region_plate.msh");
  EXPECT_EQ(c.model.mesh, data_file("io_two_region_plate.msh").lexically_normal());
  ASSERT_EQ(c.thickness.size(), 2u);
  EXPECT_EQ(c.thickness[1].group, "thick");
  EXPECT_EQ(c.thickness[1].value, 10.0);
  EXPECT_EQ(c.layers.layers, 7);
  EXPECT_EQ(c.analysis.control, Control::arc_length);
  EXPECT_EQ(c.analysis.max_load_factor.value(), 2.0);
}

TEST(CaseFile, ReadsATrueStressTableAndStiffenerPositions) {
  std::string text = kMinimalGenerated;
  text.replace(text.find("fu = 490"), 8,
               "curve = \"table\"\ntable = [[355.0, 0.0], [355.0, 0.015], [480.0, 0.10]]");
  text += "stiffeners = [0.0, 750.0, 1500]\nstiffener_thickness = 12\n";
  const CaseInput c = parse_case_text(text, "table.toml");
  ASSERT_EQ(c.steel.table.size(), 3u);
  EXPECT_EQ(c.steel.table[2][0], 480.0);
  EXPECT_EQ(c.steel.table[2][1], 0.10);
  EXPECT_EQ(c.zone.stiffeners, StiffenerPlacement::positions);
  ASSERT_EQ(c.zone.stiffener_positions.size(), 3u);
  EXPECT_EQ(c.zone.stiffener_positions[1], 750.0);
  EXPECT_EQ(c.zone.stiffener_thickness.value(), 12.0);
}

TEST(CaseFile, TakesTheDimensionsOfADesignationFromTheSectionTable) {
  std::string text = kMinimalGenerated;
  text.replace(text.find("depth = 300"), text.find("[steel]") - text.find("depth = 300"),
               "designation = \"ipe450\"\n");
  const CaseInput c = parse_case_text(text, "ipe.toml");
  // IPE 450 of EN 10365 (Euronorm 19-57): h 450, b 190, tw 9.4, tf 14.6, r 21 mm.
  EXPECT_EQ(c.zone.section.designation, "IPE 450");
  EXPECT_EQ(c.zone.section.h, 450.0);
  EXPECT_EQ(c.zone.section.b, 190.0);
  EXPECT_EQ(c.zone.section.tw, 9.4);
  EXPECT_EQ(c.zone.section.tf, 14.6);
  EXPECT_EQ(c.zone.section.r, 21.0);
  EXPECT_EQ(to_json(c)["section"]["designation"], "IPE 450");
  EXPECT_TRUE(to_json(parse_case_text(kMinimalGenerated, "p.toml"))["section"]["designation"].is_null());
}

TEST(Amplitude, ParsesRatiosAndRejectsEverythingElse) {
  const auto a = parse_amplitude("b/200");
  ASSERT_TRUE(a.has_value());
  EXPECT_EQ(a->kind, Amplitude::Kind::ratio);
  EXPECT_EQ(a->base, "b");
  EXPECT_EQ(a->divisor, 200.0);
  EXPECT_CLOSE(a->resolve(190.0), 0.95, 1e-15, 0.0);  // 190 / 200
  const auto b = parse_amplitude(" L / 1000 ");
  ASSERT_TRUE(b.has_value());
  EXPECT_EQ(b->base, "L");
  EXPECT_EQ(b->divisor, 1000.0);
  EXPECT_TRUE(parse_amplitude("h/150.5").has_value());
  for (const char* bad : {"b/0", "b/-200", "x/200", "b/", "/200", "200", "b/200mm", "b//200", "b/nan", ""})
    EXPECT_FALSE(parse_amplitude(bad).has_value()) << bad;
  EXPECT_EQ(amplitude_mm(2.5).resolve(1e6), 2.5);
}

TEST(CaseEcho, EchoesTheInputsWithDefaults) {
  const nlohmann::json g = to_json(read_case_file(data_file("io_cantilever.toml")));
  EXPECT_EQ(g["kind"], "generated");
  EXPECT_EQ(g["section"]["depth"], 450.0);
  EXPECT_EQ(g["steel"]["curve"], "quadlinear");
  EXPECT_EQ(g["member"]["setup"], "cantilever");
  EXPECT_EQ(g["restraints"]["lateral"][1]["flange"], "top");
  EXPECT_EQ(g["imperfection"]["local_amplitude"], "b/200");
  EXPECT_EQ(g["residual_stress"]["pattern"], "hot_rolled");
  EXPECT_EQ(g["analysis"]["max_iterations"], 20);
  EXPECT_EQ(g["analysis"]["max_rotation"], 0.15);
  EXPECT_FALSE(g.contains("model"));
  EXPECT_EQ(nlohmann::json::parse(g.dump()), g);

  const nlohmann::json m = to_json(read_case_file(data_file("io_two_region_plate.toml")));
  EXPECT_EQ(m["kind"], "general");
  EXPECT_EQ(m["model"]["mesh"], "io_two_region_plate.msh");
  EXPECT_TRUE(m["model"]["thickness"].is_null());
  EXPECT_EQ(m["thickness"][0]["group"], "thin");
  EXPECT_EQ(m["support"][0]["fix"].size(), 6u);
  EXPECT_EQ(m["load"][1]["moment"][1], 5.0e4);
  EXPECT_EQ(m["analysis"]["record_dofs"][1]["dof"], "ry");
  EXPECT_EQ(m["imperfection"]["global_amplitude"], 0.0);
  EXPECT_FALSE(m.contains("section"));
}

TEST(CaseEcho, ReadsItsOwnEchoBackToTheSameCase) {
  // `rotcap report` rebuilds the case from summary.json's echo with the case-file reader itself.
  for (const char* file : {"io_cantilever.toml", "io_two_region_plate.toml"}) {
    const CaseInput c = read_case_file(data_file(file));
    const nlohmann::json echo = to_json(c);
    const CaseInput back = case_from_echo(echo, data_file("summary.json"));
    EXPECT_EQ(to_json(back), echo) << file;
  }
  const CaseInput named = parse_case_text(
      "[section]\ndesignation = \"HEB 300\"\n[steel]\nfy = 355\nfu = 490\n[member]\nsetup = \"four_point\"\n"
      "length = 3000\nload_spacing = 1000\n",
      data_file("inline.toml"));
  const nlohmann::json echo = to_json(named);
  EXPECT_EQ(echo["section"]["depth"], 300.0);  // the echo shows the table's dimensions
  const CaseInput back = case_from_echo(echo, data_file("summary.json"));
  EXPECT_EQ(back.zone.section.designation, "HEB 300");
  EXPECT_EQ(back.zone.load_spacing, 1000.0);
  EXPECT_EQ(to_json(back), echo);
}

TEST(CaseFile, EchoShowsOnlyTheSteelKeysTheCurveUses) {
  const nlohmann::json g = to_json(general_case(""));
  EXPECT_FALSE(g["steel"].contains("fy"));  // elastic: no yield strength
  EXPECT_FALSE(g["steel"].contains("fu"));
  const CaseInput t = parse_case_text(
      "[model]\nmesh = \"io_two_region_plate.msh\"\nthickness = 8.0\n"
      "[[support]]\ngroup = \"clamped\"\nfix = [\"ux\", \"uy\", \"uz\"]\n"
      "[[load]]\ngroup = \"tip\"\nforce = [0.0, 0.0, -1.0]\n"
      "[steel]\ncurve = \"table\"\ntable = [[300.0, 0.0], [400.0, 0.1]]\n",
      data_file("inline_general.toml"));
  EXPECT_EQ(t.steel.fy, 300.0);  // a table without fy: its first stress
  EXPECT_FALSE(to_json(t)["steel"].contains("fu"));
}

TEST(CaseFile, OwnersValidateTheirOptionsAndTheErrorNamesTheKeysLine) {
  const std::string base(kMinimalGenerated);
  // PathOptions::validate (solver/path), at the line of analysis.first_step.
  expect_input_error([&] { parse_case_text(base + "[analysis]\nfirst_step = -1\n", data_file("a.toml")); },
                     {"a.toml:14: analysis.first_step: found -1"});
  // SteelModel validate (materials): nu of a steel, 0 <= nu < 0.5.
  std::string with_nu = base;
  with_nu.replace(with_nu.find("fu = 490"), 8, "fu = 490\nnu = -0.1");
  expect_input_error([&] { parse_case_text(with_nu, data_file("b.toml")); }, {"b.toml:10: steel.nu: found -0.1"});
  // HingeZoneSpec validate (model): stiffener positions in order, each at its own line.
  expect_input_error([&] { parse_case_text(base + "stiffeners = [\n  500,\n  400,\n]\n", data_file("c.toml")); },
                     {"c.toml:15: member.stiffeners[1]: found 400 mm; expected strictly increasing"});
}

TEST(CaseFile, ReadsARotationDemandInEitherForm) {
  const std::string base(kMinimalGenerated);
  const CaseInput a = parse_case_text(base + "[demand]\nplastic_rotation_mrad = 30\n", data_file("d.toml"));
  ASSERT_TRUE(a.demand.has_value());
  EXPECT_EQ(a.demand->kind, RotationDemand::Kind::plastic_rotation);
  EXPECT_CLOSE(a.demand->required, 0.030, 1e-15, 0.0);  // stored in rad
  EXPECT_EQ(to_json(a)["demand"]["plastic_rotation_mrad"], 30.0);
  const CaseInput b = parse_case_text(base + "[demand]\nrotation_capacity = 3\n", data_file("d.toml"));
  EXPECT_EQ(b.demand->kind, RotationDemand::Kind::rotation_capacity);
  EXPECT_EQ(b.demand->required, 3.0);
  EXPECT_FALSE(parse_case_text(base, data_file("d.toml")).demand.has_value());
  EXPECT_FALSE(to_json(parse_case_text(base, data_file("d.toml"))).contains("demand"));
}

TEST(CaseFile, RejectsADemandThatIsEmptyDoubleOrImplausible) {
  const std::string base(kMinimalGenerated);
  expect_input_error([&] { parse_case_text(base + "[demand]\n", data_file("e.toml")); },
                     {"e.toml:", "an empty [demand] table"});
  expect_input_error(
      [&] { parse_case_text(base + "[demand]\nplastic_rotation_mrad = 30\nrotation_capacity = 3\n", data_file("e.toml")); },
      {"demand.rotation_capacity: found both"});
  expect_input_error([&] { parse_case_text(base + "[demand]\nplastic_rotation_mrad = 0.03\nunit = 1\n", data_file("e.toml")); },
                     {"demand.unit"});
  expect_input_error([&] { parse_case_text(base + "[demand]\nplastic_rotation_mrad = -5\n", data_file("e.toml")); },
                     {"demand.plastic_rotation_mrad: found -5", "milliradians"});
  expect_input_error([&] { general_case("[demand]\nrotation_capacity = 3\n"); }, {"demand"});
}

}  // namespace
}  // namespace rotcap
