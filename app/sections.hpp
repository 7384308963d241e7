#pragma once
// The ShellSection of every element from the case's [steel] table and [mesh] layers: one section
// per distinct plate thickness. elastic_only (linear analyses, buckling) uses E and nu alone.
#include "io/case_input.hpp"
#include "materials/steel_curve.hpp"
#include "solver/section_assignment.hpp"

namespace rotcap::app {

SteelModel steel_model(const SteelInput& steel);
SectionAssignment make_sections(const ShellModel& model, const SteelInput& steel, int layers, bool elastic_only);

}  // namespace rotcap::app
