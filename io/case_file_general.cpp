// General models: [model], [[thickness]], [[support]], [[load]]. Group names are checked against
// the mesh later (io/general_model.cpp); here only the case file's own rules apply.
#include "io/case_file_parts.hpp"
#include "io/input_text.hpp"

namespace rotcap::detail {

namespace {

/// The i-th entry of an array of tables, as a reader with path "name[i]".
TableReader entry(const TableReader& root, const toml::array& list, std::string_view name,
                  std::size_t i) {
  const std::string key = std::string(name) + "[" + std::to_string(i) + "]";
  const toml::node& item = *list.get(i);
  return TableReader(root.file(), &table_value(item, root.file(), key), key, node_line(item));
}

void read_model_table(TableReader& root, CaseInput& c) {
  TableReader r = root.child("model");
  ModelInput& m = c.model;
  m.mesh_as_written = r.required_string("mesh", "the Gmsh MSH 4.1 file of the mesh");
  m.line = r.line_of("mesh");
  const std::filesystem::path written(m.mesh_as_written);
  m.mesh = written.is_absolute() ? written : (c.file.parent_path() / written).lexically_normal();
  std::error_code ec;
  if (!std::filesystem::is_regular_file(m.mesh, ec))
    r.fail("mesh", quote(m.mesh_as_written) + " (no such file: " + m.mesh.string() + ")",
           "an existing Gmsh MSH 4.1 file, relative to the case file's folder");
  m.thickness = r.optional_number("thickness");
  if (m.thickness) r.check("thickness", *m.thickness, *m.thickness > 0.0, "thickness > 0 [mm]");
  r.finish();
}

void read_thickness(TableReader& root, CaseInput& c) {
  const toml::array* list = root.optional_array("thickness");
  if (list == nullptr) return;
  for (std::size_t i = 0; i < list->size(); ++i) {
    TableReader r = entry(root, *list, "thickness", i);
    ThicknessInput t;
    t.group = r.required_string("group", "the name of a physical surface of the mesh");
    t.line = r.line_of("group");
    t.value = r.required_number("value", "the plate thickness [mm]");
    r.check("value", t.value, t.value > 0.0, "thickness value > 0 [mm]");
    r.finish();
    c.thickness.push_back(t);
  }
}

void read_supports(TableReader& root, CaseInput& c) {
  static const std::string kDofs[] = {"ux", "uy", "uz", "rx", "ry", "rz"};
  const toml::array* list = root.optional_array("support");
  if (list == nullptr || list->empty())
    root.fail("support", "no [[support]]",
              "at least one [[support]] with group and fix (an unsupported model is singular)");
  for (std::size_t i = 0; i < list->size(); ++i) {
    TableReader r = entry(root, *list, "support", i);
    SupportInput s;
    s.group = r.required_string("group", "the name of a physical group of the mesh");
    s.line = r.line_of("group");
    const toml::array* fix = r.optional_array("fix");
    if (fix == nullptr || fix->empty())
      r.fail("fix", fix ? "an empty array" : "no value",
             "a non-empty list of held DOFs from " + quote_list(kDofs));
    for (std::size_t k = 0; k < fix->size(); ++k) {
      const std::string key = r.key_path("fix") + "[" + std::to_string(k) + "]";
      const std::string name = string_value(*fix->get(k), r.file(), key);
      Dof dof;
      if (!parse_dof(name, dof))
        throw InputError(r.file(), node_line(*fix->get(k)), key, quote(name),
                         "one of " + quote_list(kDofs) + did_you_mean(name, kDofs));
      s.fixed[static_cast<int>(dof)] = true;
    }
    r.finish();
    c.supports.push_back(s);
  }
}

void read_loads(TableReader& root, CaseInput& c) {
  const toml::array* list = root.optional_array("load");
  if (list == nullptr || list->empty())
    root.fail("load", "no [[load]]",
              "at least one [[load]] with group and force and/or moment (the reference load)");
  for (std::size_t i = 0; i < list->size(); ++i) {
    TableReader r = entry(root, *list, "load", i);
    LoadInput l;
    l.group = r.required_string("group", "the name of a physical group of the mesh");
    l.line = r.line_of("group");
    const bool has_force = r.has("force");
    const bool has_moment = r.has("moment");
    if (!has_force && !has_moment)
      r.fail("force", "neither force nor moment",
             "force = [Fx, Fy, Fz] [N] and/or moment = [Mx, My, Mz] [N mm]");
    l.force = r.vector3("force", l.force);
    l.moment = r.vector3("moment", l.moment);
    r.finish();
    c.loads.push_back(l);
  }
}

}  // namespace

void read_general_model(TableReader& root, CaseInput& c) {
  read_model_table(root, c);
  read_thickness(root, c);
  if (!c.model.thickness && c.thickness.empty())
    throw InputError(c.file, root.line_of("model"), "model.thickness", "no thickness",
                     "[model] thickness = <mm> or [[thickness]] entries (group, value)");
  read_supports(root, c);
  read_loads(root, c);
}

}  // namespace rotcap::detail
