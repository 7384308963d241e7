#pragma once
// The generated hinge-zone model of a case ([section] + [member] + [restraints] + [mesh]) and the
// derived data `rotcap check` prints: section properties of the plate model and of the real
// section, EN 1993-1-1 Table 5.2 classes with the limits used, Mel, Mp, theta_p (beam theory).
#include "io/case_input.hpp"
#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/section/i_section.hpp"
#include "model/section/section_class.hpp"

#include <string>
#include <vector>

namespace rotcap::app {

struct HingeCase {
  HingeZoneSpec spec;
  HingeZoneModel zone;
  ISection section;
  SectionProperties real;           ///< with root fillets (r = 0: same plates, no centre-line overlap)
  SectionClassification classification;
  double mel = 0.0;                 ///< fy Wel,y of the plate model [N mm]
  double mp_real = 0.0;             ///< fy Wpl,y of the real section [N mm]
  double theta_p_beam = 0.0;        ///< beam-theory rotation at Mp [rad] (bending only)
  double theta_p_shear = 0.0;       ///< what shear deformation adds to it (Timoshenko) [rad]
  std::vector<std::string> description;
};

/// The model of a case read by read_case_file (which validated the spec).
HingeCase build_hinge_case(const CaseInput& input);

}  // namespace rotcap::app
