// [analysis]: path-following control, convergence tests, stopping criteria, recorded DOFs.
// Limits are stated next to each key in io/case_file.hpp.
#include "io/case_file_parts.hpp"
#include "io/input_text.hpp"

namespace rotcap::detail {

namespace {

/// The PathOptions keys; their values are checked by PathOptions::validate() after parsing.
void read_path_options(TableReader& r, PathOptions& p) {
  p.force_tolerance = r.number("force_tolerance", p.force_tolerance);
  p.displacement_tolerance = r.number("displacement_tolerance", p.displacement_tolerance);
  p.max_iterations = r.integer("max_iterations", p.max_iterations);
  p.first_step = r.number("first_step", p.first_step);
  p.min_step_ratio = r.number("min_step_ratio", p.min_step_ratio);
  p.max_step_ratio = r.number("max_step_ratio", p.max_step_ratio);
  p.target_iterations = r.integer("target_iterations", p.target_iterations);
  p.step_rule = read_choice(r, "step_rule", p.step_rule);
  p.curve.plastic_step = r.number("plastic_step", p.curve.plastic_step);
  p.curve.turning_step = r.number("turning_step", p.curve.turning_step);
  p.max_steps = r.integer("max_steps", p.max_steps);
}

void read_stopping(TableReader& r, AnalysisInput& a) {
  a.arc_length_form = read_choice(r, "arc_length_form", a.arc_length_form);
  a.stop_below = r.number("stop_below", a.stop_below);
  r.check("stop_below", a.stop_below, a.stop_below > 0.0 && a.stop_below < 1.0, "0 < stop_below < 1");
}

void read_general_stops(TableReader& r, AnalysisInput& a) {
  a.max_load_factor = r.optional_number("max_load_factor");
  if (a.max_load_factor)
    r.check("max_load_factor", *a.max_load_factor, *a.max_load_factor > 0.0, "max_load_factor > 0");
  else if (a.control == Control::load)
    a.max_load_factor = 1.0;
  if (const toml::node* n = r.node("control_dof"))
    a.control_dof = read_group_dof(*n, r.file(), r.key_path("control_dof"));
  a.max_displacement = r.optional_number("max_displacement");
  if (a.max_displacement)
    r.check("max_displacement", *a.max_displacement, *a.max_displacement != 0.0,
            "max_displacement != 0 (its sign gives the direction)");
  const bool displacement = a.control == Control::displacement;
  if ((displacement || a.max_displacement) && !a.control_dof)
    r.fail("control_dof", "no value",
           std::string("{ group = \"...\", dof = \"ux\" } ") +
               (displacement ? "for control = \"displacement\"" : "to go with max_displacement"));
  if (a.path.step_rule == StepRule::curve && !a.control_dof)
    r.fail("step_rule", "\"curve\" without control_dof",
           "control_dof (the quantity whose load-deflection curve sizes the steps) for step_rule = \"curve\"");
  if ((displacement || a.control_dof) && !a.max_displacement)
    r.fail("max_displacement", "no value",
           std::string("the target value of control_dof [mm or rad] ") +
               (displacement ? "for control = \"displacement\"" : "to go with control_dof"));
  r.forbid("monitor", "record_dofs (the key's name since rotcap 0.2)");
  if (const toml::array* list = r.optional_array("record_dofs"))
    for (std::size_t i = 0; i < list->size(); ++i)
      a.record_dofs.push_back(read_group_dof(*list->get(i), r.file(),
                                         r.key_path("record_dofs") + "[" + std::to_string(i) + "]"));
}

}  // namespace

void read_analysis(TableReader& r, CaseInput& c) {
  AnalysisInput& a = c.analysis;
  const bool generated = c.kind == ModelKind::generated;
  a.control = read_choice(r, "control", generated ? Control::arc_length : Control::linear);
  if (generated) {
    // Hinge studies: arc-length steps sized by the moment-rotation curve (step_rule = curve): the
    // curve of a buckling hinge depends on the step size to first order through each step's
    // plastic increment (bench/results/step_size_study.txt: on the demo, constant steps
    // 0.1 -> 0.05 -> 0.025 moved R by +2.0 % and +1.0 %), while elastic steps cost nothing, so
    // the plastic rotation per step is what is held (bench/results/curve_step_study.txt).
    a.path.first_step = 0.05;
    a.path.max_step_ratio = 20.0;
    a.path.step_rule = StepRule::curve;
  }
  read_path_options(r, a.path);
  c.layers.material_substeps = r.integer("material_substeps", c.layers.material_substeps);
  read_stopping(r, a);
  if (generated) {
    a.max_rotation = r.number("max_rotation", a.max_rotation);
    r.check("max_rotation", a.max_rotation, a.max_rotation > 0.0 && a.max_rotation <= 1.0,
            "0 < max_rotation <= 1 [rad] (a hinge rotation in radians: 0.15 = 150 mrad)");
    for (const char* key : {"max_load_factor", "control_dof", "max_displacement", "record_dofs"})
      r.forbid(key, "it only in general models ([model]); generated models are controlled by "
                    "their load point and stop at max_rotation");
  } else {
    r.forbid("max_rotation", "it only in generated models (general models stop at "
                             "max_load_factor, max_displacement or max_steps)");
    read_general_stops(r, a);
  }
  r.finish();
}

}  // namespace rotcap::detail
