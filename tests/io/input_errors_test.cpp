// Malformed inputs: every one must raise InputError (never another exception, never a crash)
// whose message names the file, the key or the line, what was found and what was expected.
#include "io/case_file.hpp"
#include "io/general_model.hpp"
#include "io/gmsh_reader.hpp"
#include "tests/io/io_test_support.hpp"

namespace rotcap {
namespace {

using testing::data_file;
using testing::expect_input_error;

// A valid generated case; each test changes one thing. Line numbers matter (see comments).
const std::string kGenerated = R"([section]
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
[mesh]
layers = 5
[analysis]
max_steps = 100
)";

std::string replaced(std::string text, const std::string& from, const std::string& to) {
  const std::size_t at = text.find(from);
  EXPECT_NE(at, std::string::npos) << from;
  return text.replace(at, from.size(), to);
}

CaseInput generated(const std::string& text) { return parse_case_text(text, "beam.toml"); }

std::string general_text(const std::string& support_group = "clamped") {
  return "[model]\nmesh = \"io_two_region_plate.msh\"\nthickness = 8.0\n"
         "[[support]]\ngroup = \"" + support_group + "\"\nfix = [\"ux\", \"uy\", \"uz\"]\n"
         "[[load]]\ngroup = \"tip\"\nforce = [0.0, 0.0, -1.0]\n[steel]\ncurve = \"elastic\"\n";
}
CaseInput general(const std::string& text) { return parse_case_text(text, data_file("plate.toml")); }

TEST(InputErrors, ValidBaseCasesRead) {
  EXPECT_NO_THROW(generated(kGenerated));
  EXPECT_NO_THROW(build_general_model(general(general_text())));
}

TEST(InputErrors, UnknownKeyNamesItsLineAndTheNearestKey) {
  expect_input_error([] { generated(replaced(kGenerated, "max_steps", "max_step")); },
                     {"beam.toml:15: analysis.max_step: found an unknown key \"max_step\"",
                      "did you mean \"max_steps\"?"});
}

TEST(InputErrors, UnknownTableNamesTheNearestTable) {
  expect_input_error([] { generated(replaced(kGenerated, "[analysis]", "[anaylsis]")); },
                     {"beam.toml:14: anaylsis: found an unknown table [anaylsis]", "expected a known table (did you mean [analysis]?)"});
}

TEST(InputErrors, UnknownKeyFarFromAnyListsTheValidKeys) {
  expect_input_error([] { generated(replaced(kGenerated, "layers = 5", "layers = 5\ncolour = 3")); },
                     {"beam.toml:14: mesh.colour", "one of the keys of [mesh]", "\"flange_elements\""});
}

TEST(InputErrors, WrongTypeNamesTheTypeFoundAndExpected) {
  expect_input_error([] { generated(replaced(kGenerated, "max_steps = 100", "max_steps = \"100\"")); },
                     {"beam.toml:15: analysis.max_steps: found a string (\"100\"); expected an integer"});
  expect_input_error([] { generated(replaced(kGenerated, "depth = 300", "depth = true")); },
                     {"beam.toml:2: section.depth: found a boolean (true); expected a number"});
  expect_input_error([] { generated("mesh = 3\n" + replaced(kGenerated, "[mesh]\nlayers = 5\n", "")); },
                     {"mesh: found an integer (3); expected a table"});
}

TEST(InputErrors, NegativeThicknessNamesTheConstraint) {
  expect_input_error([] { general(replaced(general_text(), "thickness = 8.0", "thickness = -2.0")); },
                     {"plate.toml:3: model.thickness: found -2; expected thickness > 0"});
  expect_input_error(
      [] { general(general_text() + "[[thickness]]\ngroup = \"thin\"\nvalue = 0.0\n"); },
      {"plate.toml:14: thickness[0].value: found 0; expected thickness value > 0"});
}

TEST(InputErrors, MissingGroupListsTheMeshGroupsAndTheNearestOne) {
  const CaseInput c = general(general_text("clampd"));
  expect_input_error([&] { build_general_model(c); },
                     {"plate.toml:5: support[0].group: found \"clampd\" (no such physical group",
                      "\"clamped\", \"corner\", \"thick\", \"thin\" or \"tip\"",
                      "did you mean \"clamped\"?"});
}

TEST(InputErrors, MissingMeshFileNamesTheKeyAndThePath) {
  expect_input_error([] { general(replaced(general_text(), "io_two_region_plate.msh", "nope.msh")); },
                     {"plate.toml:2: model.mesh: found \"nope.msh\" (no such file:", "nope.msh",
                      "expected an existing Gmsh MSH 4.1 file"});
  expect_input_error([] { read_gmsh(data_file("nope.msh")); }, {"nope.msh: found no such file"});
  expect_input_error([] { read_case_file(data_file("nope.toml")); }, {"nope.toml: found no such file"});
}

TEST(InputErrors, TruncatedMeshNamesTheSectionAndTheEnd) {
  // The Gmsh file cut in the middle of $Nodes (after its first 40 lines).
  const std::string full = testing::read_text(data_file("io_two_region_plate.msh"));
  std::size_t cut = 0;
  for (int line = 0; line < 40; ++line) cut = full.find('\n', cut) + 1;
  const testing::ScratchFolder scratch;
  const std::filesystem::path file = scratch / "truncated.msh";
  testing::write_text(file, full.substr(0, cut));
  expect_input_error([&] { read_gmsh(file); },
                     {"truncated.msh:", "$Nodes: found the end of the file", "the file is truncated"});
  // Cut right after $EndNodes: the $Elements section is missing.
  const std::size_t end_nodes = full.find("$EndNodes\n") + 10;
  testing::write_text(file, full.substr(0, end_nodes));
  expect_input_error([&] { read_gmsh(file); }, {"truncated.msh: $Elements: found no $Elements section"});
}

// Two unit quadrangles side by side in MSH 4.1 (surface 1, no physical groups); nodes 5 and 6
// (default (2,0) and (2,1)) and the element lines are replaceable. Line numbers: node tags on
// lines 11-16, coordinates on 17-22, the element block header on 26, the elements on 27-28.
std::string two_quads(const std::string& elements = "1 1 2 3 4\n2 2 5 6 3",
                      const std::string& node5 = "2 0 0", const std::string& node6 = "2 1 0") {
  return "$MeshFormat\n4.1 0 8\n$EndMeshFormat\n"
         "$Entities\n0 0 1 0\n1 0 0 0 2 1 0 0 0\n$EndEntities\n"
         "$Nodes\n1 6 1 6\n2 1 0 6\n1\n2\n3\n4\n5\n6\n"
         "0 0 0\n1 0 0\n1 1 0\n0 1 0\n" + node5 + "\n" + node6 + "\n$EndNodes\n"
         "$Elements\n1 2 1 2\n2 1 3 2\n" + elements + "\n$EndElements\n";
}

TEST(InputErrors, ZeroAreaOrInvertedQuadNamesTheElementAndLine) {
  EXPECT_NO_THROW(parse_gmsh_text(two_quads(), "ok.msh"));
  expect_input_error([] { parse_gmsh_text(two_quads("1 1 2 3 4\n2 2 5 3 3"), "a.msh"); },
                     {"a.msh:28: $Elements: found element 2 using node 3 twice"});
  // Nodes 1, 2, 5, 6 all on y = 0.
  expect_input_error([] { parse_gmsh_text(two_quads("1 1 2 3 4\n2 1 2 5 6", "2 0 0", "3 0 0"), "b.msh"); },
                     {"b.msh:28: $Elements: found quadrangle 2 with zero area"});
  // Node 5 at (1.5, 0.9): the corner at node 5 turns against the quadrangle's normal (a dart).
  expect_input_error([] { parse_gmsh_text(two_quads("1 1 2 3 4\n2 2 5 6 3", "1.5 0.9 0"), "c.msh"); },
                     {"c.msh:28: $Elements: found quadrangle 2 inverted or non-convex at node 5",
                      "expected a convex quadrangle"});
}

TEST(InputErrors, UnsupportedElementNamesTheTypeAndLine) {
  expect_input_error([] { read_gmsh(data_file("io_triangle_plate.msh")); },
                     {"io_triangle_plate.msh:", "$Elements: found element type 2 (3-node triangle)",
                      "expected type 3 (4-node quadrangle)"});
  expect_input_error([] { parse_gmsh_text(replaced(two_quads(), "2 1 3 2", "2 1 10 2"), "q9.msh"); },
                     {"q9.msh:26: $Elements: found element type 10 (9-node second-order quadrangle)"});
}

TEST(InputErrors, EvenLayersNamesTheRule) {
  expect_input_error([] { generated(replaced(kGenerated, "layers = 5", "layers = 4")); },
                     {"beam.toml:13: mesh.layers: found 4; expected an odd number of layers, 3 <= layers <= 15"});
  expect_input_error([] { generated(replaced(kGenerated, "layers = 5", "layers = 17")); }, {"mesh.layers: found 17"});
}

TEST(InputErrors, TensionCoarseningOutOfRangeNamesTheKeyAndRange) {
  expect_input_error([] { generated(replaced(kGenerated, "layers = 5", "layers = 5\ntension_coarsening = 0.5")); },
                     {"beam.toml:14: mesh.tension_coarsening: found 0.5; expected a number from 1 (the uniform mesh) to 3"});
  expect_input_error([] { generated(replaced(kGenerated, "layers = 5", "layers = 5\ntension_coarsening = 4")); },
                     {"mesh.tension_coarsening: found 4; expected a number from 1"});
  expect_input_error([] { generated(replaced(kGenerated, "layers = 5", "layers = 5\ntension_coarsening = \"coarse\"")); },
                     {"beam.toml:14: mesh.tension_coarsening", "\"coarse\""});
}

TEST(InputErrors, FarRegionGradingOutOfRangeNamesTheKeyAndRange) {
  expect_input_error([] { generated(replaced(kGenerated, "layers = 5", "layers = 5\nfar_element_length = 0.5")); },
                     {"beam.toml:14: mesh.far_element_length: found 0.5; expected a number from 1 to 10"});
  expect_input_error([] { generated(replaced(kGenerated, "layers = 5", "layers = 5\nfar_element_length = 11")); },
                     {"mesh.far_element_length: found 11"});
  expect_input_error([] { generated(replaced(kGenerated, "layers = 5", "layers = 5\nfar_growth = 0")); },
                     {"beam.toml:14: mesh.far_growth: found 0; expected a number from 0.05 to 0.5"});
}

TEST(InputErrors, MeshGradingKeysAreGeneratedOnly) {
  expect_input_error([] { general(general_text() + "[mesh]\ntension_coarsening = 2.0\n"); },
                     {"mesh.tension_coarsening", "only mesh.layers in a general model"});
  expect_input_error([] { general(general_text() + "[mesh]\nfar_element_length = 6.0\n"); },
                     {"mesh.far_element_length", "only mesh.layers in a general model"});
  expect_input_error([] { general(general_text() + "[mesh]\nfar_growth = 0.3\n"); },
                     {"mesh.far_growth", "only mesh.layers in a general model"});
}

TEST(InputErrors, TensileStrengthBelowYieldNamesBothValues) {
  expect_input_error([] { generated(replaced(kGenerated, "fu = 490", "fu = 300")); },
                     {"beam.toml:8: steel.fu: found 300; expected fu >= fy (355)"});
}

TEST(InputErrors, AmplitudeThatDoesNotParseNamesTheForms) {
  expect_input_error(
      [] { generated(kGenerated + "[imperfection]\nlocal_amplitude = \"b/abc\"\n"); },
      {"beam.toml:17: imperfection.local_amplitude: found \"b/abc\"; expected a number in mm or a ratio",
       "\"b\", \"h\" or \"L\""});
}

TEST(InputErrors, UnknownSetupSuggestsTheNearestSetup) {
  expect_input_error([] { generated(replaced(kGenerated, "\"cantilever\"", "\"cantilevr\"")); },
                     {"beam.toml:10: member.setup: found \"cantilevr\"; expected one of \"cantilever\", "
                      "\"three_point\", \"four_point\" or \"uniform_moment\" (did you mean \"cantilever\"?)"});
}

TEST(InputErrors, ModelTogetherWithSectionIsRejected) {
  expect_input_error([] { generated(kGenerated + "[model]\nmesh = \"x.msh\"\n"); },
                     {"beam.toml:16: model: found [model] together with [section]", "not both"});
  expect_input_error([] { generated("title = \"nothing\"\n"); },
                     {"found neither [section] + [member] nor [model]"});
}

TEST(InputErrors, SectionDesignationAndPlateRulesNameTheirKeys) {
  expect_input_error([] { generated("[section]\ndesignation = \"IPE 455\"\n" + kGenerated.substr(kGenerated.find("[steel]"))); },
                     {"beam.toml:2: section.designation: found \"IPE 455\"; expected a section of the built-in table",
                      "(did you mean \"IPE 450\"?)"});
  expect_input_error([] { generated(replaced(kGenerated, "depth = 300", "designation = \"IPE 300\"\ndepth = 300")); },
                     {"beam.toml:3: section.depth: found an integer (300); expected either designation or the plate dimensions"});
  // A root radius larger than the flange outstand (150 - 7.1)/2: model/section/i_section.hpp's rule.
  expect_input_error([] { generated(replaced(kGenerated, "web_thickness = 7.1", "web_thickness = 7.1\nroot_radius = 80")); },
                     {"beam.toml:6: section.root_radius: found 80 mm; expected < 71.45 mm"});
}

TEST(InputErrors, MeshVersion22AndBinaryAreRejected) {
  expect_input_error([] { read_gmsh(data_file("io_two_region_plate_v22.msh")); },
                     {"io_two_region_plate_v22.msh:2: $MeshFormat: found MSH version 2.2; expected version 4.1"});
  expect_input_error([] { parse_gmsh_text("$MeshFormat\n4.1 1 8\n\x01\x00\x00\x00\n$EndMeshFormat\n", "bin.msh"); },
                     {"bin.msh:2: $MeshFormat: found file type 1 (binary); expected file type 0 (ASCII"});
}

TEST(InputErrors, BadNumbersUnknownNodesAndFreeNodesInMeshes) {
  const std::string good = two_quads();
  expect_input_error([&] { parse_gmsh_text(replaced(good, "2 1 0\n$EndNodes", "2 1x 0\n$EndNodes"), "n.msh"); },
                     {"n.msh:22: $Nodes: found \"1x\"; expected a finite number"});
  expect_input_error([&] { parse_gmsh_text(replaced(good, "2 2 5 6 3", "2 2 5 66 3"), "u.msh"); },
                     {"u.msh:28: $Elements: found node tag 66, which $Nodes does not define"});
  // Only quadrangle 1 left: nodes 5 and 6 are used by none (node 5's tag is on line 15).
  expect_input_error([&] { parse_gmsh_text(replaced(good, "1 2 1 2\n2 1 3 2\n1 1 2 3 4\n2 2 5 6 3",
                                                    "1 1 1 1\n2 1 3 1\n1 1 2 3 4"), "f.msh"); },
                     {"f.msh:15: $Nodes: found node 5, which no quadrangle uses"});
  expect_input_error([] { parse_gmsh_text("hello\n", "h.msh"); }, {"h.msh:1: $MeshFormat: found \"hello\""});
}

TEST(InputErrors, TomlSyntaxErrorGivesItsLine) {
  expect_input_error([] { generated(replaced(kGenerated, "length = 1500", "length = = 1500")); },
                     {"beam.toml:11: found a TOML syntax error", "expected valid TOML"});
}

TEST(InputErrors, OtherCaseFileRulesNameTheirKeys) {
  // Steel table strains must increase; a DOF name must be one of ux..rz; limits of [analysis];
  // keys that do not apply to the chosen option; general-model rules.
  std::string table = replaced(kGenerated, "fu = 490", "curve = \"table\"\ntable = [[355, 0.0], [400, 0.02], [420, 0.02]]");
  expect_input_error([&] { generated(table); },
                     {"beam.toml:9: steel.table[2]: found plastic strain 0.02 after 0.02; expected strictly increasing"});
  expect_input_error([] { generated(replaced(kGenerated, "fu = 490", "fu = 490\nhardening_modulus = 2000")); },
                     {"steel.hardening_modulus: found an integer (2000); expected no hardening_modulus with curve = \"quadlinear\""});
  expect_input_error([] { generated(replaced(kGenerated, "max_steps = 100", "stop_below = 1.5")); },
                     {"analysis.stop_below: found 1.5; expected 0 < stop_below < 1"});
  expect_input_error([] { generated(replaced(kGenerated, "max_steps = 100", "max_steps = 0")); },
                     {"analysis.max_steps: found 0; expected max_steps >= 1"});
  expect_input_error([] { generated(kGenerated + "[output]\nfields_every = 0\n"); },
                     {"output.fields_every: found 0; expected fields_every >= 1"});
  expect_input_error([] { generated(replaced(kGenerated, "max_steps = 100", "record_dofs = []")); },
                     {"analysis.record_dofs: found an array; expected it only in general models"});
  expect_input_error([] { generated(replaced(kGenerated, "\"cantilever\"", "\"four_point\"")); },
                     {"member.load_spacing: found no value; expected the distance between the two loads"});
  expect_input_error([] { generated(replaced(kGenerated, "length = 1500", "length = 1500\naxial_load_ratio = 1.0")); },
                     {"beam.toml:12: member.axial_load_ratio: found 1; expected 0 <= N/Npl < 1"});
  expect_input_error([] { generated(replaced(kGenerated, "\"cantilever\"\nlength = 1500",
                                             "\"three_point\"\nlength = 1500\naxial_load_ratio = 0.3")); },
                     {"member.axial_load_ratio: found 0.3; expected 0: an axial load applies to setup = \"cantilever\" or \"uniform_moment\" only"});
  expect_input_error([] { generated(replaced(kGenerated, "fy = 355", "nu = 0.5\nfy = 355")); },
                     {"steel.nu: found 0.5; expected 0 <= nu < 0.5"});
  expect_input_error([] { general(replaced(general_text(), "\"uz\"]", "\"uzz\"]")); },
                     {"plate.toml:6: support[0].fix[2]: found \"uzz\"", "did you mean \"uz\"?"});
  expect_input_error([] { general(general_text() + "[analysis]\ncontrol = \"displacement\"\n"); },
                     {"analysis.control_dof: found no value", "for control = \"displacement\""});
  expect_input_error([] { general(general_text() + "[mesh]\nflange_elements = 8\n"); },
                     {"mesh.flange_elements", "only mesh.layers in a general model"});
  expect_input_error([] { general(replaced(general_text(), "thickness = 8.0\n", "")); },
                     {"model.thickness: found no thickness"});
  const CaseInput edge_thickness = general(general_text() + "[[thickness]]\ngroup = \"tip\"\nvalue = 3.0\n");
  expect_input_error([&] { build_general_model(edge_thickness); },
                     {"thickness[0].group: found \"tip\", a Physical Curve; expected a Physical Surface"});
  // The key's earlier name is an error that names the new one.
  expect_input_error([] { general(general_text() + "[analysis]\nmonitor = []\n"); },
                     {"analysis.monitor: found", "record_dofs"});
  const CaseInput bad_monitor = general(general_text() + "[analysis]\nrecord_dofs = [{ group = \"tipp\", dof = \"uz\" }]\n");
  expect_input_error([&] { build_general_model(bad_monitor); },
                     {"analysis.record_dofs[0].group: found \"tipp\"", "did you mean \"tip\"?"});
}

}  // namespace
}  // namespace rotcap

namespace rotcap {
namespace {
// A misspelt REQUIRED key must be named as the unknown key it is, not reported as missing.
TEST(InputErrors, StepRuleKeysNameTheirRules) {
  expect_input_error([] { generated(replaced(kGenerated, "max_steps = 100", "plastic_step = 0")); },
                     {"beam.toml:15: analysis.plastic_step: found 0", "in (0, 1)"});
  expect_input_error([] { generated(replaced(kGenerated, "max_steps = 100", "turning_step = 90")); },
                     {"beam.toml:15: analysis.turning_step: found 90", "in (0, 45] degrees"});
  expect_input_error([] { generated(replaced(kGenerated, "max_steps = 100", "step_rule = \"curvy\"")); },
                     {"beam.toml:15: analysis.step_rule", "curvy", "curve"});
  expect_input_error([] { generated(replaced(kGenerated, "max_steps = 100", "material_substeps = 0")); },
                     {"beam.toml:15: analysis.material_substeps: found 0", "1 <= material_substeps <= 64"});
  expect_input_error([] { general(general_text() + "[analysis]\ncontrol = \"arc_length\"\nstep_rule = \"curve\"\n"); },
                     {"analysis.step_rule", "control_dof"});
}

TEST(InputErrors, MisspeltRequiredKeyIsNamedNotReportedMissing) {
  const std::string text =
      "[section]\ndepth = 300.0\nflange_width = 150.0\nflange_thickness = 10.7\nweb_thickness = 7.1\n"
      "[steel]\nfy = 355.0\nfu = 490.0\n[member]\nsetup = \"cantilever\"\nlenght = 1500.0\n";
  try {
    parse_case_text(text, "typo.toml");
    FAIL() << "no InputError";
  } catch (const InputError& e) {
    EXPECT_EQ(e.key(), "member.lenght") << e.what();
    EXPECT_NE(std::string(e.what()).find("did you mean \"length\""), std::string::npos) << e.what();
    EXPECT_EQ(e.line(), 11);
  }
}
TEST(InputErrors, ImplausibleValuesInTheFilesUnitsNameTheUnitsExpected) {
  // A yield strength in Pa, a modulus in GPa, a length in m, a rotation in mrad: each a unit slip.
  expect_input_error([] { generated(replaced(kGenerated, "fy = 355", "fy = 355e6")); },
                     {"beam.toml:7: steel.fy: found 355000000", "in MPa (N/mm2)"});
  expect_input_error([] { generated(replaced(kGenerated, "[steel]", "[steel]\nE = 210")); },
                     {"steel.E: found 210", "Young's modulus"});
  expect_input_error([] { generated(replaced(kGenerated, "length = 1500", "length = 3")); },
                     {"beam.toml:11: member.length: found 3 mm", "at least as long as its depth h = 300 mm"});
  expect_input_error([] { generated(replaced(kGenerated, "max_steps = 100", "max_rotation = 15")); },
                     {"analysis.max_rotation: found 15", "[rad]"});
}

TEST(InputErrors, SteelKeysTheCurveDoesNotUseOrThatDisagreeAreErrors) {
  expect_input_error(
      [] { generated(replaced(kGenerated, "fy = 355", "fy = 355\ncurve = \"elastic_plastic\"")); },
      {"steel.fu: found", "no fu with curve = \"elastic_plastic\""});
  expect_input_error([] {
    generated(replaced(kGenerated, "fu = 490", "curve = \"table\"\ntable = [[300.0, 0.0], [400.0, 0.1]]"));
  }, {"steel.table: found a first stress of 300 MPa", "fy = 355 MPa"});
}

TEST(InputErrors, AnUnquotedTextValueGetsAHintWithTheQuotes) {
  expect_input_error([] { generated("[section]\ndesignation = IPE 300\n"); },
                     {"beam.toml:2:", "a text value needs quotes: designation = \"IPE 300\""});
}

}  // namespace
}  // namespace rotcap
