// Gmsh MSH 4.1 ASCII, as specified in the Gmsh reference manual, section "MSH file format"
// (version 4.1). Tokens are whitespace-separated; only physical names are read by line.
#include "io/gmsh_reader.hpp"

#include "io/input_error.hpp"
#include "io/input_text.hpp"
#include "io/msh_lexer.hpp"

#include <Eigen/Geometry>
#include <algorithm>
#include <cmath>
#include <fstream>
#include <set>
#include <sstream>
#include <unordered_map>
#include <utility>

namespace rotcap {

namespace {

using EntityKey = std::pair<int, long long>;  // (dimension, entity tag)
using PhysicalKey = std::pair<int, long long>;  // (dimension, physical tag)
using detail::MshLexer;
using detail::MshToken;

/// Element types of MSH 4.1 worth naming in a message (Gmsh manual, "MSH file format").
std::string element_type_name(long long type) {
  switch (type) {
    case 1: return "2-node line";
    case 2: return "3-node triangle";
    case 3: return "4-node quadrangle";
    case 4: return "4-node tetrahedron";
    case 5: return "8-node hexahedron";
    case 6: return "6-node prism";
    case 7: return "5-node pyramid";
    case 8: return "3-node second-order line";
    case 9: return "6-node second-order triangle";
    case 10: return "9-node second-order quadrangle";
    case 11: return "10-node second-order tetrahedron";
    case 15: return "1-node point";
    case 16: return "8-node second-order quadrangle";
    default: return "an element type rotcap does not read";
  }
}

struct Cell {              // a point or line element, for the physical groups
  EntityKey entity;
  std::array<int, 4> nodes{};
  int size = 0;
};

class MshParser {
 public:
  MshParser(std::string_view text, const std::filesystem::path& file) : lex_(text, file) {
    mesh_.file = file;
  }

  GmshMesh parse() {
    const MshToken first = lex_.next("$MeshFormat", "$MeshFormat");
    if (first.text != "$MeshFormat")
      lex_.fail(first.line, "$MeshFormat", quote(first.text),
                "$MeshFormat on the first line (a Gmsh MSH 4.1 ASCII file)");
    read_format();
    bool entities = false, nodes = false, elements = false;
    while (!lex_.at_end()) {
      const MshToken t = lex_.next("", "a section");
      if (t.text == "$PhysicalNames") {
        read_physical_names();
      } else if (t.text == "$Entities") {
        read_entities();
        entities = true;
      } else if (t.text == "$Nodes") {
        read_nodes(entities, t.line);
        nodes = true;
      } else if (t.text == "$Elements") {
        read_elements(nodes, t.line);
        elements = true;
      } else if (t.text == "$PartitionedEntities") {
        lex_.fail(t.line, t.text, "a partitioned mesh", "an unpartitioned mesh");
      } else if (t.text.size() > 1 && t.text[0] == '$') {
        lex_.skip_section(t.text);
      } else {
        lex_.fail(t.line, "", quote(t.text), "a section header such as $Nodes or $Elements");
      }
    }
    if (!entities) lex_.fail(0, "$Entities", "no $Entities section", "$Entities (written by Gmsh 4.1)");
    if (!nodes) lex_.fail(0, "$Nodes", "no $Nodes section", "a $Nodes section");
    if (!elements) lex_.fail(0, "$Elements", "no $Elements section", "an $Elements section");
    build_groups();
    check_unused_nodes();
    return std::move(mesh_);
  }

 private:
  void read_format() {
    const MshToken version = lex_.next("$MeshFormat", "the format version");
    if (version.text != "4.1")
      lex_.fail(version.line, "$MeshFormat", "MSH version " + std::string(version.text),
                "version 4.1 (export with Mesh.MshFileVersion = 4.1)");
    const int line = lex_.peek_line();
    const long long file_type = lex_.integer("$MeshFormat", "the file type");
    if (file_type != 0)
      lex_.fail(line, "$MeshFormat", "file type " + std::to_string(file_type) + " (binary)",
                "file type 0 (ASCII; export with Mesh.Binary = 0)");
    lex_.integer("$MeshFormat", "the data size");
    lex_.expect("$MeshFormat", "$EndMeshFormat");
  }

  void read_physical_names() {
    const std::size_t n = lex_.count("$PhysicalNames", "the number of physical names");
    for (std::size_t i = 0; i < n; ++i) {
      const int dim = static_cast<int>(lex_.integer("$PhysicalNames", "a dimension"));
      const long long tag = lex_.integer("$PhysicalNames", "a physical tag");
      const MshToken name = lex_.rest_of_line();
      if (name.text.size() < 2 || name.text.front() != '"' || name.text.back() != '"')
        lex_.fail(name.line, "$PhysicalNames", quote(name.text), "a name in double quotes");
      names_[{dim, tag}] = std::string(name.text.substr(1, name.text.size() - 2));
      physical_.insert({dim, tag});
    }
    lex_.expect("$PhysicalNames", "$EndPhysicalNames", " (more names than the count?)");
  }

  void read_entities() {
    std::size_t counts[4];
    for (std::size_t& c : counts) c = lex_.count("$Entities", "the number of entities");
    for (int dim = 0; dim < 4; ++dim)
      for (std::size_t i = 0; i < counts[dim]; ++i) {
        const long long tag = lex_.integer("$Entities", "an entity tag");
        for (int k = 0; k < (dim == 0 ? 3 : 6); ++k) lex_.real("$Entities", "a bounding-box coordinate");
        std::vector<long long>& tags = entity_physicals_[{dim, tag}];
        const std::size_t np = lex_.count("$Entities", "the number of physical tags");
        for (std::size_t k = 0; k < np; ++k) {
          tags.push_back(lex_.integer("$Entities", "a physical tag"));
          physical_.insert({dim, tags.back()});
        }
        if (dim == 0) continue;
        const std::size_t nb = lex_.count("$Entities", "the number of bounding entities");
        for (std::size_t k = 0; k < nb; ++k) lex_.integer("$Entities", "a bounding entity tag");
      }
    lex_.expect("$Entities", "$EndEntities");
  }

  void read_nodes(bool have_entities, int header_line) {
    if (!have_entities)
      lex_.fail(header_line, "$Nodes", "$Nodes before $Entities", "$Entities first (as Gmsh writes it)");
    const std::size_t blocks = lex_.count("$Nodes", "the number of entity blocks");
    const std::size_t total = lex_.count("$Nodes", "the number of nodes");
    lex_.integer("$Nodes", "the minimum node tag");
    lex_.integer("$Nodes", "the maximum node tag");
    mesh_.nodes.reserve(std::min(total, lex_.size() / 8));  // a node takes >= 8 characters
    for (std::size_t b = 0; b < blocks; ++b) {
      const int dim = static_cast<int>(lex_.integer("$Nodes", "the entity dimension"));
      lex_.integer("$Nodes", "the entity tag");
      const long long parametric = lex_.integer("$Nodes", "the parametric flag");
      const std::size_t n = lex_.count("$Nodes", "the number of nodes in the block");
      for (std::size_t i = 0; i < n; ++i) {
        const int line = lex_.peek_line();
        const long long tag = lex_.integer("$Nodes", "a node tag");
        if (!node_index_.emplace(tag, static_cast<int>(mesh_.node_tags.size())).second)
          lex_.fail(line, "$Nodes", "node tag " + std::to_string(tag) + " a second time", "unique node tags");
        mesh_.node_tags.push_back(tag);
        node_lines_.push_back(line);
      }
      for (std::size_t i = 0; i < n; ++i) {
        Eigen::Vector3d x;
        for (int k = 0; k < 3; ++k) x[k] = lex_.real("$Nodes", "a node coordinate");
        for (int k = 0; k < (parametric != 0 ? dim : 0); ++k) lex_.real("$Nodes", "a parametric coordinate");
        mesh_.nodes.push_back(x);
      }
    }
    if (mesh_.nodes.size() != total)
      lex_.fail(lex_.peek_line(), "$Nodes", std::to_string(mesh_.nodes.size()) + " nodes in the blocks",
                std::to_string(total) + " as the section header says");
    lex_.expect("$Nodes", "$EndNodes", " (more nodes than the header's count?)");
  }

  int node(long long tag, int line) {
    const auto it = node_index_.find(tag);
    if (it == node_index_.end())
      lex_.fail(line, "$Elements", "node tag " + std::to_string(tag) + ", which $Nodes does not define",
                "elements that use defined nodes");
    return it->second;
  }

  void read_elements(bool have_nodes, int header_line) {
    if (!have_nodes)
      lex_.fail(header_line, "$Elements", "$Elements before $Nodes", "$Nodes first (as Gmsh writes it)");
    const std::size_t blocks = lex_.count("$Elements", "the number of entity blocks");
    const std::size_t total = lex_.count("$Elements", "the number of elements");
    lex_.integer("$Elements", "the minimum element tag");
    lex_.integer("$Elements", "the maximum element tag");
    std::size_t read = 0;
    for (std::size_t b = 0; b < blocks; ++b) {
      const int line = lex_.peek_line();
      const int dim = static_cast<int>(lex_.integer("$Elements", "the entity dimension"));
      const long long entity = lex_.integer("$Elements", "the entity tag");
      const long long type = lex_.integer("$Elements", "the element type");
      const std::size_t n = lex_.count("$Elements", "the number of elements in the block");
      const int size = type == 15 ? 1 : type == 1 ? 2 : type == 3 ? 4 : 0;
      const int type_dim = type == 15 ? 0 : type == 1 ? 1 : 2;
      if (size == 0)
        lex_.fail(line, "$Elements", "element type " + std::to_string(type) + " (" + element_type_name(type) + ")",
                  "type 3 (4-node quadrangle) for shells, 1 (line) or 15 (point) for groups; mesh "
                  "with quadrangles only (Mesh.RecombineAll = 1, Mesh.ElementOrder = 1)");
      if (dim != type_dim)
        lex_.fail(line, "$Elements", element_type_name(type) + "s on an entity of dimension " + std::to_string(dim),
                  "entity dimension " + std::to_string(type_dim));
      if (!entity_physicals_.count({dim, entity}))
        lex_.fail(line, "$Elements", "entity " + std::to_string(entity) + " of dimension " + std::to_string(dim),
                  "an entity that $Entities declares");
      for (std::size_t i = 0; i < n; ++i, ++read) read_element({dim, entity}, size);
    }
    if (read != total)
      lex_.fail(lex_.peek_line(), "$Elements", std::to_string(read) + " elements in the blocks",
                std::to_string(total) + " as the section header says");
    lex_.expect("$Elements", "$EndElements", " (more elements than the header's count?)");
  }

  void read_element(EntityKey entity, int size) {
    const int line = lex_.peek_line();
    const long long tag = lex_.integer("$Elements", "an element tag");
    Cell cell{entity, {}, size};
    for (int k = 0; k < size; ++k) {
      cell.nodes[k] = node(lex_.integer("$Elements", "a node tag"), line);
      for (int j = 0; j < k; ++j)
        if (cell.nodes[j] == cell.nodes[k])
          lex_.fail(line, "$Elements", "element " + std::to_string(tag) + " using node " +
                    std::to_string(mesh_.node_tags[cell.nodes[k]]) + " twice",
                    "distinct nodes in every element");
    }
    if (size == 4) {
      check_quad(cell.nodes, tag, line);
      mesh_.quads.push_back(cell.nodes);
      mesh_.quad_tags.push_back(tag);
      quad_entities_.push_back(entity);
    } else {
      cells_.push_back(cell);
    }
  }

  /// A quadrangle must enclose a positive area and turn the same way at all four corners about
  /// its normal n = d13 x d24 (diagonals): otherwise it is inverted, non-convex or degenerate.
  void check_quad(const std::array<int, 4>& q, long long tag, int line) const {
    const auto& X = mesh_.nodes;
    double edge = 0.0;
    for (int k = 0; k < 4; ++k) edge = std::max(edge, (X[q[(k + 1) % 4]] - X[q[k]]).norm());
    const Eigen::Vector3d n = (X[q[2]] - X[q[0]]).cross(X[q[3]] - X[q[1]]);
    const std::string which = "quadrangle " + std::to_string(tag);
    if (!(n.norm() > 1e-12 * edge * edge))
      lex_.fail(line, "$Elements", which + " with zero area", "quadrangles of positive area");
    const Eigen::Vector3d unit = n.normalized();
    for (int k = 0; k < 4; ++k) {
      const Eigen::Vector3d to_next = X[q[(k + 1) % 4]] - X[q[k]];
      const Eigen::Vector3d to_prev = X[q[(k + 3) % 4]] - X[q[k]];
      if (!(to_next.cross(to_prev).dot(unit) > 1e-8 * to_next.norm() * to_prev.norm()))
        lex_.fail(line, "$Elements",
                  which + " inverted or non-convex at node " + std::to_string(mesh_.node_tags[q[k]]) +
                      " (corner angle 0 or >= 180 degrees)",
                  "a convex quadrangle with its nodes in order around it");
    }
  }

  void build_groups() {
    std::map<PhysicalKey, std::string> name_of;
    std::map<std::string, int> dim_of;
    for (const PhysicalKey& p : physical_) {
      const auto it = names_.find(p);
      const std::string name = it != names_.end() ? it->second
                               : std::string(gmsh_dimension_name(p.first)) + " " + std::to_string(p.second);
      if (dim_of.count(name))
        lex_.fail(0, "$PhysicalNames", "the group name " + quote(name) + " twice",
                  "a distinct name for every physical group");
      dim_of[name] = p.first;
      name_of[p] = name;
      mesh_.groups[name].dimension = p.first;
      if (p.first == 2) {
        region_index_[p] = static_cast<int>(mesh_.region_names.size());
        mesh_.region_names.push_back(name);
      }
    }
    for (const Cell& c : cells_)
      for (long long p : entity_physicals_.at(c.entity))
        add_cell(mesh_.groups[name_of.at({c.entity.first, p})], c.nodes.data(), c.size);
    int unassigned = -1;
    mesh_.quad_region.resize(mesh_.quads.size());
    for (std::size_t e = 0; e < mesh_.quads.size(); ++e) {
      const std::vector<long long>& tags = entity_physicals_.at(quad_entities_[e]);
      for (long long p : tags) {
        add_cell(mesh_.groups[name_of.at({2, p})], mesh_.quads[e].data(), 4);
        mesh_.group_quads[name_of.at({2, p})].push_back(static_cast<int>(e));
      }
      if (tags.empty() && unassigned < 0) {
        unassigned = static_cast<int>(mesh_.region_names.size());
        mesh_.region_names.push_back("unassigned");
      }
      mesh_.quad_region[e] = tags.empty() ? unassigned : region_index_.at({2, tags.front()});
    }
    for (auto& [name, g] : mesh_.groups) {
      std::sort(g.nodes.begin(), g.nodes.end());
      g.nodes.erase(std::unique(g.nodes.begin(), g.nodes.end()), g.nodes.end());
    }
  }

  static void add_cell(NodeGroup& g, const int* nodes, int size) {
    g.cells.emplace_back(nodes, nodes + size);
    g.nodes.insert(g.nodes.end(), nodes, nodes + size);
  }

  void check_unused_nodes() const {
    std::vector<char> used(mesh_.nodes.size(), 0);
    for (const auto& q : mesh_.quads)
      for (int n : q) used[n] = 1;
    for (std::size_t i = 0; i < used.size(); ++i)
      if (!used[i])
        lex_.fail(node_lines_[i], "$Nodes",
                  "node " + std::to_string(mesh_.node_tags[i]) + ", which no quadrangle uses",
                  "every node on a shell element (a free node has no stiffness)");
  }

  MshLexer lex_;
  GmshMesh mesh_;
  std::map<PhysicalKey, std::string> names_;
  std::set<PhysicalKey> physical_;
  std::map<EntityKey, std::vector<long long>> entity_physicals_;
  std::map<PhysicalKey, int> region_index_;
  std::unordered_map<long long, int> node_index_;
  std::vector<int> node_lines_;
  std::vector<Cell> cells_;
  std::vector<EntityKey> quad_entities_;
};

}  // namespace

const char* gmsh_dimension_name(int dim) {
  switch (dim) {
    case 0: return "Physical Point";
    case 1: return "Physical Curve";
    case 2: return "Physical Surface";
    case 3: return "Physical Volume";
    default: return "Physical Group";
  }
}

GmshMesh parse_gmsh_text(std::string_view text, const std::filesystem::path& file) {
  return MshParser(text, file).parse();
}

GmshMesh read_gmsh(const std::filesystem::path& path) {
  std::error_code ec;
  if (!std::filesystem::is_regular_file(path, ec))
    throw InputError(path, 0, "", std::filesystem::exists(path, ec) ? "a folder or special file" : "no such file",
                     "a Gmsh MSH 4.1 ASCII mesh file");
  std::ifstream in(path, std::ios::binary);
  std::ostringstream text;
  text << in.rdbuf();
  if (!in && !in.eof()) throw InputError(path, 0, "", "a file that cannot be read", "a readable mesh file");
  return parse_gmsh_text(text.str(), path);
}

}  // namespace rotcap
