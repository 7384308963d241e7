#pragma once
// General models: the ShellModel of a case with [model] (a Gmsh mesh), its thicknesses
// ([model] thickness and [[thickness]] groups), supports ([[support]]) and reference loads
// ([[load]], totals shared over a group's nodes by tributary weight, see
// model/shell_model.hpp tributary_weights). Group names of [[thickness]], [[support]], [[load]],
// analysis.control_dof and analysis.record_dofs are checked against the mesh's physical groups here.
//
// Thickness: a [[thickness]] group must be a physical surface; its value applies to that
// surface's quadrangles. Two entries covering the same quadrangle with different values are an
// error; [model] thickness applies to every quadrangle no entry covers; a quadrangle with neither
// is an error. Elements keep the mesh's node order and region (physical surface).
// Errors are InputError naming the case-file key and line (or the mesh file and line).

#include "io/case_input.hpp"
#include "io/gmsh_reader.hpp"
#include "io/input_error.hpp"
#include "model/shell_model.hpp"

namespace rotcap {

/// Reads c.model.mesh and builds the model. c.kind must be ModelKind::general.
ShellModel build_general_model(const CaseInput& c);

/// The same from a mesh already read.
ShellModel build_general_model(const CaseInput& c, const GmshMesh& mesh);

}  // namespace rotcap
