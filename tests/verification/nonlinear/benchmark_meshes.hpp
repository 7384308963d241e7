#pragma once
// Meshes of the geometrically nonlinear shell benchmarks, built in code as ShellModels (nodes,
// quads, groups, supports; the tests add the loads). Units are each benchmark's own consistent
// units (the Sze, Liu & Lo 2004 problems are dimensionless apart from the roof, in mm, N, MPa).
//
// Every mesh is a structured nu x nv grid of a map (s, t) in [0, 1]^2 -> x: node (i, j) at
// (s, t) = (i / nu, j / nv) has index j (nu + 1) + i, element (i, j) has the nodes
// (i, j), (i+1, j), (i+1, j+1), (i, j+1), counter-clockwise about d x/ds x d x/dt.
// Groups made by structured_shell(): "s0", "s1" (the lines i = 0 and i = nu), "t0", "t1" (j = 0,
// j = nv) with their line cells, so loads on them are shared by tributary length.
//
// Geometry, material and supports of the benchmarks: K.Y. Sze, X.H. Liu, S.H. Lo, "Popular
// benchmark problems for geometric nonlinear analysis of shells", Finite Elements in Analysis and
// Design 40 (2004) 1551-1569. The problem data were not read in the paper; they are from memory,
// as listed in docs/spec/references.md section 2.

#include "model/shell_model.hpp"

#include <Eigen/Core>
#include <functional>
#include <initializer_list>
#include <string>
#include <vector>

namespace rotcap::verification {

/// A structured grid of quads on the map, all of the given thickness, in region "shell".
/// nu, nv >= 1.
ShellModel structured_shell(int nu, int nv, double thickness,
                            const std::function<Eigen::Vector3d(double s, double t)>& map);

/// Node index of grid point (i, j) of a structured_shell with nu elements along s.
inline int grid_node(int nu, int i, int j) { return j * (nu + 1) + i; }

/// Adds a group of one node (a point cell), for point loads and recorded DOFs.
void add_point_group(ShellModel& model, const std::string& name, int node);

/// Adds a support on group: the listed DOFs held at zero.
void add_support(ShellModel& model, const std::string& group, std::initializer_list<Dof> dofs);

/// Cantilever strip along x: length x width x thickness, `elements` along the length and one across
/// the width. Groups "clamped" (x = 0, all six DOFs held) and "tip" (x = length, two nodes).
ShellModel cantilever_strip(double length, double width, double thickness, int elements);

/// Hinged cylindrical roof (Sze et al. 2004, from memory): radius 2540 mm, axial length 508 mm,
/// half-angle 0.1 rad, straight edges hinged (translations held), curved edges free. Quarter
/// model x in [0, 254] (axial), phi in [0, 0.1] from the crown, n x n elements; symmetry planes
/// x = 0 (ux, ry, rz held) and y = 0 (uy, rx, rz held). Crown (the load point) at the origin.
/// Group "crown": the node at x = 0, phi = 0.
ShellModel hinged_roof_quarter(double thickness, int n);

/// Slit annular plate (Sze et al. 2004, from memory): inner radius 6, outer radius 10, in the
/// plane z = 0, slit along the positive x axis. `radial` elements across the width, `around`
/// elements around. Groups "clamped" (theta = 0, all six DOFs held) and "lifted" (theta = 2 pi,
/// the loaded slit edge, free); points "A" (inner radius) and "B" (outer radius) of "lifted".
ShellModel slit_annular_plate(double thickness, int radial, int around);

/// Hemispherical shell with an 18 degree polar hole (Sze et al. 2004, from memory): radius 10,
/// quarter model azimuth phi in [0, 90 deg], polar angle from 18 deg (hole) to 90 deg (equator),
/// n x n elements. Symmetry planes y = 0 (uy, rx, rz held) and x = 0 (ux, ry, rz held), uz held at
/// one hole node (the rigid z translation). Points "A" (equator, on the x axis) and "B" (equator,
/// on the y axis).
ShellModel hemisphere_quarter(double thickness, int n);

/// Mean of one DOF over a group's nodes, from a full (6 per node) displacement vector.
double group_mean(const ShellModel& model, const std::string& group, Dof dof, const Eigen::VectorXd& u);

}  // namespace rotcap::verification
