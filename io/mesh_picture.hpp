#pragma once
// MeshPicture: a deformed shell mesh drawn as one SVG element, coloured by one nodal field, with
// the supports and loads marked. No mechanics: the caller hands over points, quads and values.
//
// Contract:
//  - points: 3-D coordinates [mm] (already deformed, scaled as the caller wants); quads: node
//    indices; values: one per point (the colour of a quad is the mean of its four values).
//  - projection: rotation about the global z axis by azimuth, then about the screen's horizontal
//    axis by elevation (an orthographic axonometric view, z up), fitted into width x height with
//    equal scales (the mesh, supports and load points together); quads painted far to near by
//    their mean depth (painter's algorithm).
//  - colour map: viridis (io/colour_map.hpp), linear in the value between the field's finite min
//    (t = 0) and max (t = 1); a constant field is drawn at t = 0. A colour bar on the right shows
//    the map with nice ticks (io/axis_ticks.hpp) labelled in the field's units and field_name
//    (which should carry the unit, e.g. "|uy| [mm]") beside it.
//  - supports: each point drawn as a triangle (white, black outline) with its apex at the point.
//  - loads: at each load point, a force [N] as a straight arrow whose head touches the point, a
//    moment [N mm] as a curved arrow around it, turning counter-clockwise on screen when the
//    moment vector points towards the viewer (right-hand rule); only directions are drawn (fixed
//    lengths). A key below the mesh names the symbols when there are supports or loads.
//  - Deterministic: the same picture gives the same bytes.
//  - Errors: std::invalid_argument for a quad index out of range, values.size() != points.size(),
//    no quads, or non-finite coordinates (message names the item).
#include <array>
#include <string>
#include <vector>

namespace rotcap {

/// A load at a point, global axes; a zero force or moment is not drawn.
struct MeshLoad {
  std::array<double, 3> point{};   ///< [mm]
  std::array<double, 3> force{};   ///< [N] (direction only is drawn)
  std::array<double, 3> moment{};  ///< [N mm] (sense only is drawn)
};

struct MeshPicture {
  std::vector<std::array<double, 3>> points;
  std::vector<std::array<int, 4>> quads;
  std::vector<double> values;
  std::string field_name;                             ///< with its unit, e.g. "|uy| [mm]"
  std::vector<std::array<double, 3>> support_points;  ///< [mm], same frame as points
  std::vector<MeshLoad> loads;
  double azimuth_deg = -35.0;
  double elevation_deg = 25.0;
  int width = 760;
  int height = 440;
  std::string title;
};

std::string render_mesh_svg(const MeshPicture& picture);

}  // namespace rotcap
