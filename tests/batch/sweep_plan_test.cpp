// Sweep plans without runs: grid and zip expansion, the case text of each combination as the case
// reader reads it, the bad plans (exit 2 material: the message names plan, key and value), and the
// imperfection keys the study sets (mode, sign).
#include "io/case_file.hpp"
#include "io/case_overrides.hpp"
#include "io/input_error.hpp"
#include "io/sweep_plan.hpp"
#include "tests/test_support.hpp"

#include <gtest/gtest.h>

#include <cstdlib>
#include <fstream>

namespace fs = std::filesystem;
using namespace rotcap;

namespace {

fs::path data_dir() {
  const char* env = std::getenv("ROTCAP_SOURCE_DIR");
  return (env ? fs::path(env) : fs::current_path()) / "tests/data/batch";
}

/// A plan written next to the tiny base case (a temporary file, removed by the caller's scope).
struct PlanFile {
  fs::path path;
  PlanFile(const std::string& name, const std::string& text) : path(fs::temp_directory_path() / name) {
    std::ofstream(path) << "base = \"" << (data_dir() / "tiny_cantilever.toml").string() << "\"\n" << text;
  }
  ~PlanFile() { fs::remove(path); }
};

std::string error_of(const fs::path& plan) {
  try {
    expand_sweep_plan(read_sweep_plan(plan));
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

}  // namespace

TEST(SweepPlan, GridTakesEveryCombinationWithTheFirstAxisOutermost) {
  const PlanFile plan("rotcap_grid_plan.toml",
                      "[[axis]]\nkey = \"section.designation\"\nvalues = [\"IPE 100\", \"HEA 120\"]\n"
                      "[[axis]]\nkey = \"steel.fy\"\nvalues = [235, 355.0, 460.0]\n");
  const std::vector<PlannedCase> cases = expand_sweep_plan(read_sweep_plan(plan.path));
  ASSERT_EQ(cases.size(), 6u);
  EXPECT_EQ(cases[0].name, "001_IPE_100_235");
  EXPECT_EQ(cases[5].name, "006_HEA_120_460.0");
  EXPECT_EQ(cases[2].input.zone.section.designation, "IPE 100");
  EXPECT_EQ(cases[2].input.steel.fy, 460.0);
  EXPECT_EQ(cases[3].input.zone.section.designation, "HEA 120");
  EXPECT_EQ(cases[3].input.steel.fy, 235.0);
  // Keys the plan does not touch keep the base's values.
  EXPECT_EQ(cases[4].input.zone.length, 480.0);
  EXPECT_EQ(cases[4].input.zone.flange_elements, 4);
}

TEST(SweepPlan, ZipTakesTheIthValuesTogether) {
  const PlanFile plan("rotcap_zip_plan.toml",
                      "combine = \"zip\"\n[[axis]]\nkey = \"member.length\"\nvalues = [400.0, 600.0]\n"
                      "[[axis]]\nkey = \"imperfection.local_amplitude\"\nvalues = [\"b/100\", 0.5]\n");
  const std::vector<PlannedCase> cases = expand_sweep_plan(read_sweep_plan(plan.path));
  ASSERT_EQ(cases.size(), 2u);
  EXPECT_EQ(cases[1].input.zone.length, 600.0);
  EXPECT_EQ(cases[1].input.imperfection.local_amplitude.millimetres, 0.5);
  EXPECT_EQ(cases[0].input.imperfection.local_amplitude.text, "b/100");
}

TEST(SweepPlan, ZipAxesOfDifferentLengthsAreAnError) {
  const PlanFile plan("rotcap_zip_bad_plan.toml",
                      "combine = \"zip\"\n[[axis]]\nkey = \"member.length\"\nvalues = [400.0, 600.0]\n"
                      "[[axis]]\nkey = \"steel.fy\"\nvalues = [355.0]\n");
  const std::string e = error_of(plan.path);
  EXPECT_NE(e.find("axis[1].values: found 1 values; expected 2 values"), std::string::npos) << e;
}

TEST(SweepPlan, BadPlansNameThePlanTheKeyAndTheValue) {
  std::string e = error_of(data_dir() / "bad_unknown_key_plan.toml");
  EXPECT_NE(e.find("bad_unknown_key_plan.toml:"), std::string::npos) << e;
  EXPECT_NE(e.find("section.designationn: found \"IPE 100\""), std::string::npos) << e;
  e = error_of(data_dir() / "bad_empty_axis_plan.toml");
  EXPECT_NE(e.find("axis[1].values: found an empty array"), std::string::npos) << e;
  e = error_of(data_dir() / "bad_combination_plan.toml");
  EXPECT_NE(e.find("member.length: found 200.0 in case 004_HEB_300_200.0"), std::string::npos) << e;
  EXPECT_NE(e.find("section.designation = \"HEB 300\""), std::string::npos) << e;
}

TEST(CaseOverrides, APathThroughAValueIsAnError) {
  const std::vector<CaseOverride> o{{"title.x", override_number(1.0)}};
  try {
    apply_case_overrides("title = \"t\"\n", "base.toml", o);
    FAIL() << "no error";
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("title.x: found title is a value, not a table"), std::string::npos) << e.what();
  }
}

TEST(CaseOverrides, RemovalAndNumbersReadBackExactly) {
  const std::vector<CaseOverride> o{{"imperfection.mode", override_removal()}, {"steel.fy", override_number(0.1 + 0.2)}};
  const std::string text = apply_case_overrides("[imperfection]\nmode = 2\n[steel]\nfy = 1\n", "base.toml", o);
  EXPECT_EQ(text.find("mode = 2"), std::string::npos) << text;
  EXPECT_NE(text.find("fy = 0.30000000000000004"), std::string::npos) << text;
}

// imperfection.mode and imperfection.sign, the keys the study's variants set (io/case_file.hpp).
namespace {

std::string case_error(const std::string& imperfection) {
  const std::string text = "[section]\ndesignation = \"IPE 120\"\n[steel]\nfy = 355.0\nfu = 490.0\n"
                           "[member]\nsetup = \"cantilever\"\nlength = 480.0\n[imperfection]\n" + imperfection;
  try {
    parse_case_text(text, "imperfection_case.toml");
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

}  // namespace

TEST(ImperfectionKeys, ModeAndSignAreReadAndDefaultToTheLowestModeAsComputed) {
  const std::string base = "[section]\ndesignation = \"IPE 120\"\n[steel]\nfy = 355.0\nfu = 490.0\n"
                           "[member]\nsetup = \"cantilever\"\nlength = 480.0\n";
  const CaseInput plain = parse_case_text(base, "plain.toml");
  EXPECT_EQ(plain.imperfection.mode, 1);
  EXPECT_EQ(plain.imperfection.sign, 1);
  const CaseInput set = parse_case_text(base + "[imperfection]\nmode = 3\nsign = -1\n", "set.toml");
  EXPECT_EQ(set.imperfection.mode, 3);
  EXPECT_EQ(set.imperfection.sign, -1);
  const CaseInput half = parse_case_text(base + "[imperfection]\nlocal = \"half_sine\"\nsign = -1\n", "half.toml");
  EXPECT_EQ(half.imperfection.sign, -1);
}

TEST(ImperfectionKeys, BadValuesNameTheKeyAndWhatIsExpected) {
  std::string e = case_error("sign = 0\n");
  EXPECT_NE(e.find("imperfection.sign: found 0; expected 1 (the pattern as computed) or -1 (reversed)"), std::string::npos) << e;
  e = case_error("mode = 0\n");
  EXPECT_NE(e.find("imperfection.mode: found 0; expected an integer >= 1"), std::string::npos) << e;
  e = case_error("local = \"half_sine\"\nmode = 2\n");
  EXPECT_NE(e.find("imperfection.mode"), std::string::npos) << e;
  EXPECT_NE(e.find("only with local = \"buckling_mode\""), std::string::npos) << e;
  e = case_error("local = \"none\"\nsign = -1\n");
  EXPECT_NE(e.find("imperfection.sign"), std::string::npos) << e;
}
