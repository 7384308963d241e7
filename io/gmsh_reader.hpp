#pragma once
// Gmsh MSH 4.1 ASCII reader for shell meshes.
//
// Accepted: $MeshFormat 4.1, file-type 0 (ASCII); $PhysicalNames; $Entities (physical tags of
// points, curves, surfaces, volumes); $Nodes (entity blocks, parametric coordinates skipped);
// $Elements of types 15 (point), 1 (2-node line) and 3 (4-node quadrangle). Other sections
// ($Comments, $NodeData, $Periodic, ...) are skipped. Everything else is an InputError naming the
// file, the section and the line: other versions (2.2, 4.0) or binary files, partitioned meshes,
// triangles and every other element type (2nd order included), truncated files, missing
// sections, bad numbers, unknown node tags, quadrangles with a repeated node, zero area, a corner
// turned the wrong way (inverted or non-convex), and nodes used by no quadrangle.
//
// Physical groups become node groups through the ELEMENTS of the entities that carry the physical
// tag (boundary nodes are classified on points and curves, so an entity's own nodes would miss
// them): a physical curve's cells are its 2-node lines, a physical surface's its quadrangles.
// A group without a $PhysicalNames entry is named like Gmsh's GUI does: "Physical Surface 5",
// "Physical Curve 3", "Physical Point 1". Group names must be unique across dimensions.
// Each quadrangle's region is the first physical surface of its entity (the order of $Entities);
// quadrangles on a surface with no physical tag get the region "unassigned".
// Node order within a quadrangle is Gmsh's (counter-clockwise about the surface's normal).

#include "io/input_error.hpp"
#include "model/shell_model.hpp"

#include <Eigen/Core>
#include <array>
#include <filesystem>
#include <map>
#include <string>
#include <string_view>
#include <vector>

namespace rotcap {

struct GmshMesh {
  std::filesystem::path file;
  std::vector<Eigen::Vector3d> nodes;            ///< coordinates [mm], in file order
  std::vector<long long> node_tags;              ///< Gmsh tag of each node
  std::vector<std::array<int, 4>> quads;         ///< node indices
  std::vector<long long> quad_tags;              ///< Gmsh element tag of each quad
  std::vector<int> quad_region;                  ///< index into region_names, per quad
  std::vector<std::string> region_names;         ///< physical surface names (+ "unassigned")
  std::map<std::string, NodeGroup> groups;       ///< every physical group, by name
  std::map<std::string, std::vector<int>> group_quads;  ///< quad indices of surface groups
};

/// Reads a mesh file; throws InputError (never anything else) on bad input.
GmshMesh read_gmsh(const std::filesystem::path& path);

/// The same for file contents in memory; file names the source in messages.
GmshMesh parse_gmsh_text(std::string_view text, const std::filesystem::path& file);

/// "Physical Point", "Physical Curve", "Physical Surface", "Physical Volume" for dim 0..3.
const char* gmsh_dimension_name(int dim);

}  // namespace rotcap
