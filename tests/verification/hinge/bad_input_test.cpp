// Hinge verification 7: bad input to generated models, end to end through `rotcap run`: exit
// code 2, a message on stderr naming the file, the key, the value found and what is expected
// (docs/spec/interface.md: "unknown keys are an error"; io/case_file.hpp: "file:line: key: found ...;
// expected ..."), and no results folder left behind. Case files: tests/data/hinge/bad/.
#include "tests/verification/hinge/hinge_run.hpp"

#include <gtest/gtest.h>

#include <filesystem>
#include <fstream>
#include <regex>
#include <string>

namespace rotcap::testing {
namespace {

namespace fs = std::filesystem;

struct BadCase {
  const char* file;     ///< tests/data/hinge/bad/<file>.toml
  const char* pattern;  ///< ECMAScript regex the stderr must contain
};

void expect_rejected(const BadCase& c) {
  const HingeRun run = run_rotcap("run", hinge_case(std::string("bad/") + c.file + ".toml"), std::string("bad_") + c.file);
  EXPECT_EQ(run.exit_code, 2) << run.err;
  EXPECT_TRUE(std::regex_search(run.err, std::regex(c.pattern))) << "stderr: " << run.err << "\npattern: " << c.pattern;
  EXPECT_FALSE(fs::exists(run.results)) << "a results folder was left behind";
}

TEST(HingeBadInput, UnknownKeyIsNamedWithTheNearestKnownKey) {
  expect_rejected({"unknown_key", R"(unknown_key\.toml:[0-9]+: mesh\.flange_elemnts: found an unknown key.*did you mean "flange_elements")"});
}
TEST(HingeBadInput, MissingSectionDataIsNamed) {
  expect_rejected({"missing_web_thickness", R"(missing_web_thickness\.toml:[0-9]+: section\.web_thickness: found no value; expected the web thickness)"});
}
TEST(HingeBadInput, FlangeThicknessOfHalfTheDepthIsRejected) {
  expect_rejected({"thick_flange", R"(thick_flange\.toml:[0-9]+: section\.flange_thickness: found 150 mm; expected tf < h/2 = 150 mm)"});
}
TEST(HingeBadInput, NegativeLengthIsRejected) {
  expect_rejected({"negative_length", R"(negative_length\.toml:[0-9]+: member\.length: found -1200 mm; expected a finite length > 0)"});
}
TEST(HingeBadInput, RestraintOutsideTheMemberIsRejected) {
  expect_rejected({"restraint_outside", R"(restraint_outside\.toml:[0-9]+: restraints\.lateral\[0\]\.x: found 5000 mm; expected 0 <= x <= length = 1200 mm)"});
}
TEST(HingeBadInput, UnknownSetupListsTheSetups) {
  expect_rejected({"unknown_setup", R"(unknown_setup\.toml:[0-9]+: member\.setup: found "propped_cantilever"; expected one of "cantilever", "three_point", "four_point" or "uniform_moment")"});
}
TEST(HingeBadInput, AmplitudeStringThatDoesNotParseIsRejected) {
  expect_rejected({"bad_amplitude", R"(bad_amplitude\.toml:[0-9]+: imperfection\.local_amplitude: found "b/two"; expected a number in mm or a ratio)"});
}
TEST(HingeBadInput, UltimateStrengthBelowYieldIsRejected) {
  expect_rejected({"fu_below_fy", R"(fu_below_fy\.toml:[0-9]+: steel\.fu: found 300; expected fu >= fy \(355\))"});
}
TEST(HingeBadInput, EvenLayerCountIsRejected) {
  expect_rejected({"even_layers", R"(even_layers\.toml:[0-9]+: mesh\.layers: found 4; expected an odd number of layers, 3 <= layers <= 15)"});
}
TEST(HingeBadInput, OddFlangeElementCountIsRejected) {
  expect_rejected({"odd_flange_elements", R"(odd_flange_elements\.toml:[0-9]+: mesh\.flange_elements: found 5; expected an even number >= 4)"});
}
TEST(HingeBadInput, TensionCoarseningBelowOneIsRejected) {
  expect_rejected({"tension_coarsening", R"(tension_coarsening\.toml:[0-9]+: mesh\.tension_coarsening: found 0\.8; expected a number from 1 \(the uniform mesh\) to 3)"});
}
TEST(HingeBadInput, StopBelowOutOfRangeIsRejected) {
  expect_rejected({"stop_below_above_one", R"(stop_below_above_one\.toml:[0-9]+: analysis\.stop_below: found 1\.5; expected 0 < stop_below < 1)"});
}
TEST(HingeBadInput, UnknownDesignationSuggestsTheNearestSection) {
  expect_rejected({"unknown_designation", R"(unknown_designation\.toml:[0-9]+: section\.designation: found "IPE 333"; expected a section of the built-in table.*did you mean "IPE 330")"});
}
TEST(HingeBadInput, GeneralModelKeyInGeneratedModelIsRejected) {
  expect_rejected({"load_factor_in_generated", R"(load_factor_in_generated\.toml:[0-9]+: analysis\.max_load_factor: found a number \(0\.5\); expected it only in general models)"});
}

TEST(HingeBadInput, ExistingOutputFolderNeedsOverwrite) {
  const fs::path scratch = scratch_folder("bad_existing_output");
  const fs::path results = scratch / "results";
  fs::create_directories(results);
  { std::ofstream(results / "notes.txt") << "the user's own notes\n"; }
  const HingeRun run = run_rotcap("run", hinge_case("bad/valid.toml"), "bad_existing_output", "", true);
  ASSERT_EQ(run.results, results);
  EXPECT_EQ(run.exit_code, 2) << run.err;
  EXPECT_TRUE(std::regex_search(run.err, std::regex(R"(-o: found an existing output folder.*--overwrite)"))) << run.err;
  EXPECT_TRUE(fs::exists(results / "notes.txt"));
  EXPECT_FALSE(fs::exists(results / "summary.json"));
}

}  // namespace
}  // namespace rotcap::testing
