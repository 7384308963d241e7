#include "io/case_file.hpp"

#include "core/option_error.hpp"

#include "io/amplitude.hpp"
#include "io/case_file_parts.hpp"
#include "io/input_text.hpp"
#include "model/section/i_section.hpp"
#include "model/setups/loading_setup.hpp"
#include "model/section/section_table.hpp"

#include <cctype>
#include <cmath>
#include <fstream>
#include <stdexcept>
#include <sstream>

namespace rotcap {

namespace detail {

GroupDof read_group_dof(const toml::node& node, const std::filesystem::path& file,
                        const std::string& key_path) {
  TableReader r(file, &table_value(node, file, key_path), key_path, node_line(node));
  GroupDof g;
  g.group = r.required_string("group", "the name of a physical group of the mesh");
  g.line = r.line_of("group");
  static const std::string kDofs[] = {"ux", "uy", "uz", "rx", "ry", "rz"};
  const std::string dof = r.required_string("dof", "one of " + quote_list(kDofs));
  if (!parse_dof(dof, g.dof))
    r.fail("dof", quote(dof), "one of " + quote_list(kDofs) + did_you_mean(dof, kDofs));
  r.finish();
  return g;
}

}  // namespace detail

namespace {

using detail::read_choice;
using detail::TableReader;

void read_section(TableReader r, CaseInput& c) {
  ISection& s = c.zone.section;
  static const char* kPlates[] = {"depth", "flange_width", "flange_thickness", "web_thickness",
                                  "root_radius", "weld_throat"};
  if (const std::optional<std::string> name = r.optional_string("designation")) {
    for (const char* key : kPlates)
      r.forbid(key, "either designation or the plate dimensions, not both (the table gives them)");
    const std::optional<SectionTableRow> row = find_section_row(*name);
    if (!row) {
      const std::vector<std::string> names = list_sections();
      r.fail("designation", quote(*name),
             "a section of the built-in table (IPE 80-600, HEA and HEB 100-1000, EN 10365)" +
                 did_you_mean(*name, names));
    }
    s = ISection{row->designation, row->h, row->b, row->tf, row->tw, row->r, 0.0};
  } else {
    // Values are checked by the section's own validate() (model/i_section.hpp) after parsing.
    s.h = r.required_number("depth", "the overall depth h [mm] (or designation = \"IPE 300\")");
    s.b = r.required_number("flange_width", "the flange width b [mm]");
    s.tf = r.required_number("flange_thickness", "the flange thickness tf [mm]");
    s.tw = r.required_number("web_thickness", "the web thickness tw [mm]");
    s.r = r.number("root_radius", 0.0);
    s.weld_throat = r.number("weld_throat", 0.0);
  }
  r.finish();
}

void read_stiffeners(TableReader& r, HingeZoneSpec& m) {
  const toml::node* n = r.node("stiffeners");
  if (n == nullptr) return;
  if (const toml::array* xs = n->as_array()) {
    // Positions are checked by the spec's own validate() (range and order).
    m.stiffeners = StiffenerPlacement::positions;
    for (std::size_t i = 0; i < xs->size(); ++i)
      m.stiffener_positions.push_back(detail::number_value(
          *xs->get(i), r.file(), r.key_path("stiffeners") + "[" + std::to_string(i) + "]"));
    return;
  }
  static const std::string kLayouts[] = {"supports_and_loads", "none"};
  if (n->as_string() == nullptr)
    r.fail("stiffeners", detail::describe_node(*n),
           "\"supports_and_loads\", \"none\" or an array of positions [x, ...] in mm");
  m.stiffeners = static_cast<StiffenerPlacement>(r.choice("stiffeners", kLayouts, 0));
}

void read_member(TableReader r, CaseInput& c) {
  // Values are checked by the spec's own validate() (model/hinge_zone_mesher.hpp) after parsing;
  // here: which keys a setup needs or does not take.
  HingeZoneSpec& m = c.zone;
  if (!r.has("setup"))
    r.fail("setup", "no value", "one of " + quote_list(enum_names<HingeSetup>()));
  m.setup = read_choice(r, "setup", m.setup);
  m.length = r.required_number("length", "the member length [mm] (cantilever: support to load; beams: span)");
  const LoadingSetup& setup = loading_setup(m.setup);
  if (setup.needs_load_spacing())
    m.load_spacing = r.required_number("load_spacing", "the distance between the two loads [mm] for setup = " +
                                                           quote(enum_name(m.setup)));
  else
    r.forbid("load_spacing", "no load_spacing with setup = " + quote(enum_name(m.setup)) +
                                 " (" + setup_names_where(&LoadingSetup::needs_load_spacing) + " only)");
  m.axial_load_ratio = r.number("axial_load_ratio", m.axial_load_ratio);
  if (setup.allows_support_choice())
    m.cantilever_support = read_choice(r, "support", m.cantilever_support);
  else
    r.forbid("support", "no support with setup = " + quote(enum_name(m.setup)) + " (" +
                            setup_names_where(&LoadingSetup::allows_support_choice) + " only)");
  read_stiffeners(r, m);
  if (m.stiffeners == StiffenerPlacement::none)
    r.forbid("stiffener_thickness", "no stiffener_thickness with stiffeners = \"none\"");
  else
    m.stiffener_thickness = r.optional_number("stiffener_thickness");
  r.finish();
}

void read_restraints(TableReader r, CaseInput& c) {
  if (const toml::array* list = r.optional_array("lateral")) {
    for (std::size_t i = 0; i < list->size(); ++i) {
      const std::string key = r.key_path("lateral") + "[" + std::to_string(i) + "]";
      const toml::node& item = *list->get(i);
      TableReader e(r.file(), &detail::table_value(item, r.file(), key), key, detail::node_line(item));
      LateralBrace lr;
      lr.x = e.required_number("x", "the restraint position x [mm] along the member");
      lr.flange = read_choice(e, "flange", lr.flange);
      e.finish();
      c.zone.lateral_restraints.push_back(lr);
    }
  }
  r.finish();
}

Amplitude read_amplitude(TableReader& r, std::string_view key, const Amplitude& fallback,
                         ModelKind kind) {
  const toml::node* n = r.node(key);
  if (n == nullptr) return fallback;
  const std::string general_note =
      kind == ModelKind::general ? " (general models: a number in mm)" : "";
  if (n->is_number()) {
    const double mm = detail::number_value(*n, r.file(), r.key_path(key));
    r.check(key, mm, mm >= 0.0, std::string(key) + " >= 0 [mm]");
    return amplitude_mm(mm);
  }
  if (const toml::value<std::string>* s = n->as_string()) {
    std::optional<Amplitude> a = parse_amplitude(s->get());
    if (!a)
      r.fail(key, quote(s->get()),
             "a number in mm or a ratio \"S/n\" with S one of " + quote_list(amplitude_bases()) +
                 " and n > 0, e.g. \"b/200\"" + general_note);
    if (kind == ModelKind::general)
      r.fail(key, quote(s->get()),
             "a number in mm (ratios of the section's plates exist only for generated models)");
    return *a;
  }
  r.fail(key, detail::describe_node(*n), "a number in mm or a ratio string such as \"b/200\"");
}

void read_imperfection(TableReader r, CaseInput& c) {
  ImperfectionInput& im = c.imperfection;
  if (c.kind == ModelKind::general) {
    im.local = LocalImperfection::none;
    im.local_amplitude = amplitude_mm(0.0);
    im.global_amplitude = amplitude_mm(0.0);
  }
  im.local = read_choice(r, "local", im.local);
  if (c.kind == ModelKind::general && im.local == LocalImperfection::half_sine)
    r.fail("local", quote("half_sine"),
           "\"none\" or \"buckling_mode\" (half_sine needs the generated section's plates)");
  if (im.local == LocalImperfection::none)
    r.forbid("local_amplitude", "no local_amplitude with local = \"none\"");
  else
    im.local_amplitude = read_amplitude(r, "local_amplitude", im.local_amplitude, c.kind);
  if (im.local == LocalImperfection::buckling_mode) {
    im.mode = r.integer("mode", im.mode);
    r.check("mode", im.mode, im.mode >= 1, "an integer >= 1 (1: the lowest local buckling mode)");
  } else {
    r.forbid("mode", "mode only with local = \"buckling_mode\"");
  }
  if (im.local == LocalImperfection::none) {
    r.forbid("sign", "no sign with local = \"none\"");
  } else {
    im.sign = r.integer("sign", im.sign);
    r.check("sign", im.sign, im.sign == 1 || im.sign == -1, "1 (the pattern as computed) or -1 (reversed)");
  }
  im.global_amplitude = read_amplitude(r, "global_amplitude", im.global_amplitude, c.kind);
  r.finish();
}

void read_mesh(TableReader r, CaseInput& c) {
  if (c.kind == ModelKind::generated) {
    c.zone.flange_elements = r.integer("flange_elements", c.zone.flange_elements);
    c.zone.web_elements = r.integer("web_elements", c.zone.web_elements);
    c.zone.aspect = r.number("aspect", c.zone.aspect);
    c.zone.tension_coarsening = r.number("tension_coarsening", c.zone.tension_coarsening);
    c.zone.far_element_length = r.number("far_element_length", c.zone.far_element_length);
    c.zone.far_growth = r.number("far_growth", c.zone.far_growth);
  } else {
    for (const char* key : {"flange_elements", "web_elements", "aspect", "tension_coarsening", "far_element_length", "far_growth"})
      r.forbid(key, "only mesh.layers in a general model (the mesh comes from [model] mesh)");
  }
  c.layers.layers = r.integer("layers", c.layers.layers);
  r.finish();
}

void read_demand(TableReader r, CaseInput& c) {
  if (!r.present()) return;
  const std::optional<double> theta = r.optional_number("plastic_rotation_mrad");
  const std::optional<double> R = r.optional_number("rotation_capacity");
  const std::string one = "plastic_rotation_mrad (the plastic rotation the mechanism needs at this hinge, mrad) or "
                          "rotation_capacity (a required R), one of the two";
  if (theta && R) r.fail("rotation_capacity", "both plastic_rotation_mrad and rotation_capacity", one);
  if (!theta && !R) r.fail("", "an empty [demand] table", one);
  if (theta) {
    r.check("plastic_rotation_mrad", *theta, *theta > 0.0 && *theta <= 1000.0,
            "0 < plastic_rotation_mrad <= 1000 [mrad] (a hinge rotation, in milliradians)");
    c.demand = RotationDemand{RotationDemand::Kind::plastic_rotation, 1e-3 * *theta};
  } else {
    r.check("rotation_capacity", *R, *R > 0.0 && *R <= 100.0, "0 < rotation_capacity <= 100");
    c.demand = RotationDemand{RotationDemand::Kind::rotation_capacity, *R};
  }
  r.finish();
}

void read_buckling(TableReader r, CaseInput& c) {
  c.buckling.modes = r.integer("modes", c.buckling.modes);
  r.check("modes", c.buckling.modes, c.buckling.modes >= 1 && c.buckling.modes <= 50,
          "1 <= modes <= 50");
  r.finish();
}

void read_output(TableReader r, CaseInput& c) {
  c.output.fields_every = r.integer("fields_every", c.output.fields_every);
  r.check("fields_every", c.output.fields_every, c.output.fields_every >= 1, "fields_every >= 1");
  c.output.checkpoint_every = r.integer("checkpoint_every", c.output.checkpoint_every);
  r.check("checkpoint_every", c.output.checkpoint_every, c.output.checkpoint_every >= 0,
          "checkpoint_every >= 0 (0: no checkpoints, rotcap resume then has nothing to continue)");
  r.finish();
}

ModelKind decide_kind(TableReader& root) {
  const bool model = root.has("model");
  const bool section = root.has("section");
  const bool member = root.has("member");
  const std::string either =
      "either [section] + [member] (generated hinge zone) or [model] (a general mesh)";
  if (model && (section || member))
    root.fail("model", std::string("[model] together with ") + (section ? "[section]" : "[member]"),
              either + ", not both");
  if (model) return ModelKind::general;
  if (!section && !member) root.fail("", "neither [section] + [member] nor [model]", either);
  if (!section)
    root.fail("section", "[member] without [section]",
              "a [section] table (depth, flange_width, flange_thickness, web_thickness)");
  if (!member)
    root.fail("member", "[section] without [member]", "a [member] table (setup, length)");
  return ModelKind::generated;
}

void read_root(TableReader& root, CaseInput& c) {
  c.title = root.string("title", "");
  c.kind = decide_kind(root);
  const std::string generated_only = "it only in generated models ([section] + [member])";
  if (c.kind == ModelKind::generated) {
    read_section(root.child("section"), c);
    read_member(root.child("member"), c);
    read_restraints(root.child("restraints"), c);
    TableReader rs = root.child("residual_stress");
    c.residual_stress = read_choice(rs, "pattern", c.residual_stress);
    rs.finish();
    read_demand(root.child("demand"), c);
    for (const char* key : {"thickness", "support", "load"})
      root.forbid(key, std::string("[[") + key + "]] only in general models ([model])");
  } else {
    for (const char* key : {"restraints", "residual_stress", "demand"}) root.forbid(key, generated_only);
    detail::read_general_model(root, c);
  }
  detail::read_steel(root.child("steel"), c);
  read_imperfection(root.child("imperfection"), c);
  read_mesh(root.child("mesh"), c);
  TableReader analysis = root.child("analysis");
  detail::read_analysis(analysis, c);
  read_buckling(root.child("buckling"), c);
  read_output(root.child("output"), c);
  root.finish();
}

/// The line of a dotted key path ("member.stiffeners[2]", "steel.fy") in the file; the nearest
/// enclosing value's line when the key is absent (a default), 0 when nothing of it is there.
int line_of_path(const toml::table& table, std::string path) {
  while (!path.empty()) {
    if (const toml::node* n = table.at_path(path).node()) return detail::node_line(*n);
    const std::size_t cut = path.find_last_of(".[");
    path = cut == std::string::npos ? std::string() : path.substr(0, cut);
  }
  return 0;
}

/// Each component validates the options it owns, right after parsing; its OptionError becomes an
/// InputError at the key's line.
void validate_components(const toml::table& table, CaseInput& c) {
  try {
    // A unit slip first (fy in Pa, E in GPa): its message says more than the rule it breaks next.
    if (c.kind == ModelKind::generated) require_structural_steel_values(c.steel);
    validate(c.steel);
    c.layers.validate();
    c.analysis.path.validate();
    if (c.kind == ModelKind::generated) {
      c.zone.fy = c.steel.fy;
      validate(c.zone);
    }
  } catch (const OptionError& e) {
    throw InputError(c.file, line_of_path(table, e.key()), e.key(), e.found(), e.expected());
  }
}

/// " (a text value needs quotes: key = \"...\")" when the line of a syntax error reads key = word...
/// with an unquoted word (toml++ then reports a malformed number); "" otherwise.
std::string unquoted_text_hint(std::string_view text, int line) {
  std::size_t start = 0;
  for (int l = 1; l < line && start != std::string_view::npos; ++l) {
    start = text.find('\n', start);
    if (start != std::string_view::npos) ++start;
  }
  if (start == std::string_view::npos || line < 1) return "";
  const std::string_view row = text.substr(start, text.find('\n', start) - start);
  const std::size_t eq = row.find('=');
  if (eq == std::string_view::npos) return "";
  const std::size_t v = row.find_first_not_of(" \t", eq + 1);
  if (v == std::string_view::npos || !std::isalpha(static_cast<unsigned char>(row[v]))) return "";
  const std::string_view value = row.substr(v);
  for (const char* word : {"true", "false", "inf", "nan"})
    if (value.rfind(word, 0) == 0) return "";
  const std::string key(row.substr(0, row.find_last_not_of(" \t", eq - 1) + 1));
  return "; a text value needs quotes: " + key + " = \"" + std::string(value.substr(0, value.find_first_of("#\r"))) +
         "\"";
}

}  // namespace

namespace detail {

CaseInput parse_case_table(const toml::table& table, const std::filesystem::path& file) {
  CaseInput c;
  c.file = file;
  TableReader root(file, &table, "", 1);
  read_root(root, c);
  validate_components(table, c);
  return c;
}

}  // namespace detail

CaseInput parse_case_text(std::string_view text, const std::filesystem::path& file) {
  toml::table table;
  try {
    table = toml::parse(text, file.string());
  } catch (const toml::parse_error& e) {
    const int line = static_cast<int>(e.source().begin.line);
    throw InputError(file, line, "", "a TOML syntax error: " + std::string(e.description()),
                     "valid TOML (https://toml.io/en/v1.0.0)" + unquoted_text_hint(text, line));
  }
  return detail::parse_case_table(table, file);
}

CaseInput read_case_file(const std::filesystem::path& path) {
  std::error_code ec;
  if (!std::filesystem::is_regular_file(path, ec))
    throw InputError(path, 0, "",
                     std::filesystem::exists(path, ec) ? "a folder or special file" : "no such file",
                     "a case file (TOML)");
  std::ifstream in(path, std::ios::binary);
  std::ostringstream text;
  text << in.rdbuf();
  if (!in && !in.eof()) throw InputError(path, 0, "", "a file that cannot be read", "a readable case file");
  return parse_case_text(text.str(), path);
}

}  // namespace rotcap
