// SectionAssignment: one elastic section per distinct thickness, checked against the model.
#include "solver/section_assignment.hpp"

#include "materials/elastic_shell_section.hpp"
#include "tests/solver/plate_mesh.hpp"
#include "tests/test_support.hpp"

#include <stdexcept>

namespace rotcap {
namespace {

TEST(SectionAssignment, OneElasticSectionPerDistinctThickness) {
  ShellModel m = testing::rectangular_plate(4.0, 1.0, 4, 1, 10.0);
  m.elements[1].thickness = 14.6;
  m.elements[3].thickness = 14.6;
  const SectionAssignment s = SectionAssignment::elastic(m, 210000.0, 0.3);
  EXPECT_EQ(s.section_count(), 2);
  EXPECT_EQ(s.element_count(), 4);
  EXPECT_EQ(s.index(0), s.index(2));
  EXPECT_EQ(s.index(1), s.index(3));
  EXPECT_NE(s.index(0), s.index(1));
  EXPECT_EQ(s.of(1).thickness(), 14.6);
  EXPECT_EQ(s.of(0).thickness(), 10.0);
  EXPECT_EQ(s.of(0).youngs_modulus(), 210000.0);
  EXPECT_CLOSE(s.of(0).shear_modulus(), 210000.0 / 2.6, 1e-15, 0.0);
  EXPECT_NO_THROW(s.check(m));
  m.elements[2].thickness = 12.0;  // no longer matches its section
  EXPECT_THROW(s.check(m), std::invalid_argument);
}

TEST(SectionAssignment, RejectsInvalidMaterialAndIndices) {
  const ShellModel m = testing::rectangular_plate(1.0, 1.0, 1, 1, 1.0);
  EXPECT_THROW(SectionAssignment::elastic(m, -1.0, 0.3), std::invalid_argument);
  EXPECT_THROW(SectionAssignment::elastic(m, 1.0, 0.5), std::invalid_argument);
  SectionAssignment s;
  EXPECT_THROW(s.assign(0, 0), std::invalid_argument);  // no section yet
  s.add_section(std::make_unique<ElasticShellSection>(1.0, 0.0, 1.0));
  s.assign(2, 0);
  EXPECT_EQ(s.element_count(), 3);
  EXPECT_EQ(s.index(0), -1);
  EXPECT_THROW(s.check(m), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
