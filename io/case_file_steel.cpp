// [steel]: which keys each steel curve needs or does not take, and the true-stress table row by
// row; the values are checked by the steel model's own validate() (materials/steel_curve.hpp) after
// parsing. Limits are stated next to each key in io/case_file.hpp.
#include "io/case_file_parts.hpp"
#include "io/input_text.hpp"

#include <cmath>

namespace rotcap::detail {

namespace {

void read_steel_table(TableReader& r, SteelModel& s) {
  const toml::array* rows = r.optional_array("table");
  if (rows == nullptr)
    r.fail("table", "no value",
           "a table of [true stress, equivalent plastic strain] rows for curve = \"table\"");
  if (rows->empty()) r.fail("table", "an empty array", "at least one [stress, strain] row");
  for (std::size_t i = 0; i < rows->size(); ++i) {
    const std::string key = r.key_path("table") + "[" + std::to_string(i) + "]";
    const toml::node& row = *rows->get(i);
    const toml::array* pair = row.as_array();
    if (pair == nullptr || pair->size() != 2)
      throw InputError(r.file(), detail::node_line(row), key, detail::describe_node(row) +
                       (pair ? " of " + std::to_string(pair->size()) + " values" : ""),
                       "a row [true stress MPa, equivalent plastic strain]");
    const double stress = detail::number_value(*pair->get(0), r.file(), key + "[0]");
    const double strain = detail::number_value(*pair->get(1), r.file(), key + "[1]");
    const auto fail = [&](const std::string& found, const std::string& expected) {
      throw InputError(r.file(), detail::node_line(row), key, found, expected);
    };
    if (!(stress > 0.0)) fail("stress " + format_number(stress), "stress > 0");
    if (i == 0 && strain != 0.0)
      fail("plastic strain " + format_number(strain), "the first row at plastic strain 0");
    if (i > 0 && !(strain > s.table.back()[1]))
      fail("plastic strain " + format_number(strain) + " after " +
               format_number(s.table.back()[1]),
           "strictly increasing plastic strains");
    if (i > 0 && stress < s.table.back()[0])
      fail("stress " + format_number(stress) + " after " + format_number(s.table.back()[0]),
           "non-decreasing stresses (no softening)");
    s.table.push_back({stress, strain});
  }
}

}  // namespace

void read_steel(TableReader r, CaseInput& c) {
  // Values are checked by the steel model's own validate() (materials/steel_curve.hpp) after
  // parsing; here: which keys each curve needs or does not take.
  SteelModel& s = c.steel;
  s.E = r.number("E", s.E);
  s.nu = r.number("nu", s.nu);
  s.kind = read_choice(r, "curve", s.kind);
  const std::string curve = quote(enum_name(s.kind));
  const std::optional<double> fy = r.optional_number("fy");
  const std::optional<double> fu = r.optional_number("fu");
  const bool needs_fy = c.kind == ModelKind::generated || s.kind == SteelCurveKind::elastic_plastic ||
                        s.kind == SteelCurveKind::bilinear || s.kind == SteelCurveKind::quadlinear;
  if (needs_fy && !fy)
    r.fail("fy", "no value",
           c.kind == ModelKind::generated
               ? "the yield strength fy [MPa] (it defines Mp)"
               : "the yield strength fy [MPa] for curve = " + curve +
                     (r.has("curve") ? "" : " (the default; curve = \"elastic\" needs no fy)"));
  const bool needs_fu = s.kind == SteelCurveKind::bilinear || s.kind == SteelCurveKind::quadlinear;
  if (needs_fu && !fu) r.fail("fu", "no value", "the tensile strength fu [MPa] for curve = " + curve);
  if (!needs_fu) r.forbid("fu", "no fu with curve = " + curve + " (it does not use it; bilinear and quadlinear do)");
  if (s.kind == SteelCurveKind::bilinear)
    s.hardening_modulus = r.required_number("hardening_modulus",
                                            "the hardening modulus E_h [MPa] for curve = \"bilinear\"");
  else
    r.forbid("hardening_modulus", "no hardening_modulus with curve = " + curve + " (bilinear only)");
  if (s.kind == SteelCurveKind::table)
    read_steel_table(r, s);
  else
    r.forbid("table", "no table with curve = " + curve + " (curve = \"table\" only)");
  // A table defines its own yield stress (its first row); fy, when given too, must agree with it
  // (fy sets Mp and the class, the table the material: two different yield stresses would mix).
  if (fy && s.kind == SteelCurveKind::table && std::abs(s.table.front()[0] - *fy) > 0.005 * *fy)
    r.fail("table", "a first stress of " + format_number(s.table.front()[0]) + " MPa",
           "the yield stress fy = " + format_number(*fy) + " MPa (within 0.5 %) as the table's first row, or no fy");
  if (fy)
    s.fy = *fy;
  else if (s.kind == SteelCurveKind::table)
    s.fy = s.table.front()[0];
  s.fu = fu.value_or(s.fy);
  r.finish();
}

}  // namespace rotcap::detail
