// The model-size rule of validate(HingeZoneSpec): meshes too large to build are rejected as bad
// input (OptionError naming mesh.flange_elements) before any memory is taken. Found by replaying
// the case-file fuzz corpus through `rotcap check` (tests/fuzz): web_elements = 2^31 - 1 ended in
// an uncaught std::length_error (exit 1), flange_elements = 2^31 - 2 or length = 1e9 mm ran for
// minutes.
#include "core/option_error.hpp"
#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/section/section_table.hpp"

#include <gtest/gtest.h>

#include <functional>
#include <string>

namespace rotcap {
namespace {

HingeZoneSpec demo_like_spec() {
  HingeZoneSpec s;
  s.section = *find_section("IPE 300");
  s.setup = HingeSetup::cantilever;
  s.length = 2000.0;
  s.fy = 355.0;
  return s;
}

void expect_too_large(const std::function<void(HingeZoneSpec&)>& change) {
  HingeZoneSpec s = demo_like_spec();
  change(s);
  try {
    validate(s);
    ADD_FAILURE() << "no exception";
  } catch (const OptionError& e) {
    EXPECT_EQ(e.key(), "mesh.flange_elements");
    EXPECT_NE(e.expected().find("at most 1000000 shell elements"), std::string::npos) << e.what();
  }
}

TEST(HingeZoneSize, RejectsMeshesTooLargeToBuild) {
  expect_too_large([](HingeZoneSpec& s) { s.web_elements = 2147483647; });
  expect_too_large([](HingeZoneSpec& s) { s.flange_elements = 2147483646; });
  expect_too_large([](HingeZoneSpec& s) { s.length = 1.0e9; });
  expect_too_large([](HingeZoneSpec& s) { s.aspect = 1.0e-300; });
}

TEST(HingeZoneSize, AcceptsTheLargestMeshStudy) {
  // --mesh-scale 4 of the default mesh (72 x 92), a 2 m and an 8 m member: about 1e5 elements.
  HingeZoneSpec s = demo_like_spec();
  s.flange_elements = 72;
  s.web_elements = 92;
  EXPECT_NO_THROW(validate(s));
  s.length = 8000.0;
  EXPECT_NO_THROW(validate(s));
}

}  // namespace
}  // namespace rotcap
