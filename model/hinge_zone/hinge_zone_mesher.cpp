#include "model/hinge_zone/hinge_zone_mesher.hpp"

#include "core/check.hpp"
#include "core/option_error.hpp"
#include "core/text_format.hpp"
#include "materials/steel_curve.hpp"

#include "model/hinge_zone/section_grading.hpp"
#include "model/hinge_zone/section_grid.hpp"
#include "model/hinge_zone/station_grading.hpp"
#include "model/setups/loading_setup.hpp"

#include <Eigen/Geometry>

#include <algorithm>
#include <array>
#include <cmath>
#include <set>
#include <stdexcept>

namespace rotcap {

namespace {

constexpr int kTopFlange = 0, kBottomFlange = 1, kWeb = 2, kStiffener = 3;

std::string num(double v) { return format_number(v); }

[[noreturn]] void reject(const std::string& key, const std::string& found, const std::string& expected) {
  throw OptionError(key, found, expected);
}

/// Appends a quad, its nodes ordered counter-clockwise about +x (the stiffener plates' normal).
void push_ccw_about_x(ShellModel& m, std::array<int, 4> q, double t, int region) {
  const Eigen::Vector3d n = (m.nodes[q[2]] - m.nodes[q[0]]).cross(m.nodes[q[3]] - m.nodes[q[1]]);
  if (n.x() < 0.0) std::swap(q[1], q[3]);
  m.elements.push_back({q, t, region});
}

/// The stiffener plate at station i (x [mm]), zf [mm] the flanges' z, thickness t [mm].
void add_stiffener(ShellModel& m, const SectionGrid& g, double x, int i, double zf, double t, int region) {
  const int nb = g.nb(), nt = g.nt(), nw = g.nw();
  const int nf = std::max(nb, nt);
  const std::vector<double>& yf = nb >= nt ? g.y_bottom : g.y_top;  // the finer flange's lines
  std::vector<int> grid(static_cast<std::size_t>((nf + 1) * (nw + 1)), -1);
  auto id = [&](int k, int mm) -> int& { return grid[static_cast<std::size_t>(mm * (nf + 1) + k)]; };
  // Flange rows: fine k of each flange node (the coarser flange's lines are a subset).
  auto fine_k = [&](double y) {
    const auto it = std::find(yf.begin(), yf.end(), y);
    ROTCAP_CHECK(it != yf.end(), "a tension flange line off the compression flange's lines");
    return static_cast<int>(it - yf.begin());
  };
  for (int k = 0; k <= nb; ++k) id(fine_k(g.y_bottom[k]), 0) = g.bottom(i, k);
  for (int k = 0; k <= nt; ++k) id(fine_k(g.y_top[k]), nw) = g.top(i, k);
  for (int mm = 1; mm < nw; ++mm)
    for (int k = 0; k <= nf; ++k) {
      if (k == nf / 2) id(k, mm) = g.web(i, mm);
      else {
        id(k, mm) = m.node_count();
        m.nodes.emplace_back(x, yf[k], g.z_web[mm]);
      }
    }
  // The transition row (none when both flanges have nf elements): between the coarse flange row
  // and the next web row.
  const int coarse_row = nb < nf ? 0 : (nt < nf ? nw : -1);
  const int inner_row = coarse_row == 0 ? 1 : nw - 1;
  for (int mm = 0; mm < nw; ++mm) {
    if (coarse_row >= 0 && mm == std::min(coarse_row, inner_row)) continue;
    for (int k = 0; k < nf; ++k) push_ccw_about_x(m, {id(k, mm), id(k + 1, mm), id(k + 1, mm + 1), id(k, mm + 1)}, t, region);
  }
  if (coarse_row < 0) return;
  const double zc = coarse_row == 0 ? -zf : zf, zm = 0.5 * (zc + g.z_web[inner_row]);
  for (int k = 0; k < nf;) {
    auto b = [&](int j) { return id(k + j, inner_row); };  // the web-row side
    if (id(k + 1, coarse_row) >= 0) {  // a cell of one fine width
      push_ccw_about_x(m, {b(0), b(1), id(k + 1, coarse_row), id(k, coarse_row)}, t, region);
      k += 1;
      continue;
    }
    // A pair of cells of two fine widths: coarse nodes c0, c1, c2 at k, k + 2, k + 4; three
    // middle nodes p1..p3 halfway to the web row at k + 1..k + 3.
    ROTCAP_CHECK(id(k + 2, coarse_row) >= 0 && id(k + 4, coarse_row) >= 0 && id(k + 3, coarse_row) < 0,
                 "stiffener transition: cells of two fine widths must come in pairs");
    const int c0 = id(k, coarse_row), c1 = id(k + 2, coarse_row), c2 = id(k + 4, coarse_row);
    std::array<int, 4> p{};
    for (int j = 1; j <= 3; ++j) {
      p[j] = m.node_count();
      m.nodes.emplace_back(x, yf[k + j], zm);
    }
    for (const std::array<int, 4>& q : {std::array<int, 4>{b(0), b(1), p[1], c0}, {b(1), b(2), p[2], p[1]},
                                        {b(2), b(3), p[3], p[2]}, {b(3), b(4), c2, p[3]}, {p[1], p[2], c1, c0},
                                        {p[2], p[3], c2, c1}})
      push_ccw_about_x(m, q, t, region);
    k += 4;
  }
}

}  // namespace

void validate(const HingeZoneSpec& s) {
  const LoadingSetup& setup = loading_setup(s.setup);
  validate(s.section);
  const double L = s.length;
  if (!(L > 0.0) || !std::isfinite(L)) reject("member.length", num(L) + " mm", "a finite length > 0");
  if (!(L >= s.section.h))
    reject("member.length", num(L) + " mm",
           "a member at least as long as its depth h = " + num(s.section.h) + " mm (lengths are in mm)");
  require_yield_strength(s.fy);
  if (s.flange_elements < 4 || s.flange_elements % 2 != 0)
    reject("mesh.flange_elements", std::to_string(s.flange_elements),
           "an even number >= 4 (the web meets the flange at its centre line)");
  if (s.web_elements < 4) reject("mesh.web_elements", std::to_string(s.web_elements), ">= 4");
  if (!(s.aspect > 0.0) || !std::isfinite(s.aspect)) reject("mesh.aspect", num(s.aspect), "a finite value > 0");
  if (!(s.tension_coarsening >= 1.0 && s.tension_coarsening <= 3.0))
    reject("mesh.tension_coarsening", num(s.tension_coarsening),
           "a number from 1 (the uniform mesh) to 3 (tension-side elements up to 3 times the fine size)");
  if (!(s.far_growth >= 0.05 && s.far_growth <= 0.5))
    reject("mesh.far_growth", num(s.far_growth),
           "a number from 0.05 to 0.5 (the growth of the element length per element outside the hinge region)");
  if (!(s.far_element_length >= 1.0 && s.far_element_length <= 10.0))
    reject("mesh.far_element_length", num(s.far_element_length),
           "a number from 1 to 10 (the largest element length outside the hinge region, in hinge element lengths)");
  // Estimate of the element count (build_hinge_zone: hinge element length he = aspect b / nf,
  // stations at most min(3, far_element_length) he apart, about max(h, b) / he more in the hinge region of 1.5 max(h, b)),
  // in floating point so that no count overflows.
  const double he = s.aspect * s.section.b / s.flange_elements;
  const double stations = (L / std::min(3.0, s.far_element_length) + std::max(s.section.h, s.section.b)) / he;
  const double elements = stations * (2.0 * s.flange_elements + s.web_elements);
  if (!(elements <= kMaxHingeZoneElements))
    reject("mesh.flange_elements",
           std::to_string(s.flange_elements) + " with web_elements = " + std::to_string(s.web_elements) +
               ", aspect = " + num(s.aspect) + " and length = " + num(L) + " mm (about " + num(elements) +
               " shell elements)",
           "a model of at most " + num(kMaxHingeZoneElements) +
               " shell elements (fewer elements across the section, a larger aspect or a shorter member)");
  if (setup.needs_load_spacing()) {
    if (!(s.load_spacing > 0.0 && s.load_spacing < L))
      reject("member.load_spacing", num(s.load_spacing) + " mm",
             "0 < spacing < length = " + num(L) + " mm for setup = \"" + setup.name() + "\"");
  } else if (s.load_spacing != 0.0) {
    reject("member.load_spacing", num(s.load_spacing) + " mm",
           "no load spacing: it applies to setup = " + setup_names_where(&LoadingSetup::needs_load_spacing) + " only");
  }
  if (!setup.allows_axial_load() && s.axial_load_ratio != 0.0)
    reject("member.axial_load_ratio", num(s.axial_load_ratio),
           "0: an axial load applies to setup = " + setup_names_where(&LoadingSetup::allows_axial_load) + " only");
  if (!(s.axial_load_ratio >= 0.0 && s.axial_load_ratio < 1.0))
    reject("member.axial_load_ratio", num(s.axial_load_ratio), "0 <= N/Npl < 1 (compression positive)");
  if (s.stiffener_thickness && (!(*s.stiffener_thickness > 0.0) || !std::isfinite(*s.stiffener_thickness)))
    reject("member.stiffener_thickness", num(*s.stiffener_thickness) + " mm", "a finite thickness > 0");
  if (s.stiffeners == StiffenerPlacement::none && !s.stiffener_positions.empty())
    reject("member.stiffeners", "none with " + std::to_string(s.stiffener_positions.size()) + " positions",
           "either no stiffeners or a list of positions");
  for (std::size_t k = 0; k < s.stiffener_positions.size(); ++k) {
    const double x = s.stiffener_positions[k];
    if (!(x >= 0.0 && x <= L))
      reject("member.stiffeners[" + std::to_string(k) + "]", num(x) + " mm", "0 <= x <= length = " + num(L) + " mm");
    if (k > 0 && !(x > s.stiffener_positions[k - 1]))
      reject("member.stiffeners[" + std::to_string(k) + "]", num(x) + " mm",
             "strictly increasing positions (after " + num(s.stiffener_positions[k - 1]) + " mm)");
  }
  for (std::size_t k = 0; k < s.lateral_restraints.size(); ++k) {
    const double x = s.lateral_restraints[k].x;
    if (!(x >= 0.0 && x <= L))
      reject("restraints.lateral[" + std::to_string(k) + "].x", num(x) + " mm",
             "0 <= x <= length = " + num(L) + " mm");
  }
}

HingeZoneModel build_hinge_zone(const HingeZoneSpec& spec) {
  const LoadingSetup& setup = loading_setup(spec.setup);
  validate(spec);
  const ISection& sec = spec.section;
  const double L = spec.length;
  const double he = spec.aspect * sec.b / spec.flange_elements;
  const double tol = 1e-6 * L;  // special x's closer than this share a station

  HingeZoneModel out;
  out.setup = spec.setup;
  out.plate = plate_model_properties(sec);
  out.plastic_moment = plastic_moment(out.plate, spec.fy);
  out.moment_per_load_factor = out.plastic_moment;
  out.hinge_element_length = he;
  out.span = L;

  // Loads, rigid ends and the hinge region of the setup.
  const int n_hinge = static_cast<int>(std::ceil(1.5 * std::max(sec.h, sec.b) / he - 1e-9));
  const SetupStations special = setup.stations(spec, n_hinge * he);
  const std::vector<double>& loads = special.loads;
  const double hinge_lo = special.hinge_lo, hinge_hi = special.hinge_hi;

  // Stiffener positions: the setup's (supports and loads), plus listed ones; none at rigid ends.
  std::vector<double> stiff;
  if (spec.stiffeners == StiffenerPlacement::supports_and_loads) stiff = special.default_stiffeners;
  if (spec.stiffeners != StiffenerPlacement::none)
    stiff.insert(stiff.end(), spec.stiffener_positions.begin(), spec.stiffener_positions.end());
  std::erase_if(stiff, [&](double x) { return (special.rigid_start && x <= tol) || (special.rigid_end && x >= L - tol); });
  stiff = stiff.empty() ? stiff : unique_points(stiff, L, tol);

  // Hard points: ends, loads, stiffeners, restraints; the hinge-region ends where they are at
  // least one hinge element from every other hard point (so the hinge elements are exactly h_e).
  std::vector<double> hard{0.0, L};
  hard.insert(hard.end(), loads.begin(), loads.end());
  hard.insert(hard.end(), stiff.begin(), stiff.end());
  for (const auto& r : spec.lateral_restraints) hard.push_back(r.x);
  hard = unique_points(hard, L, tol);
  std::vector<double> with_hinge = hard;
  for (double x : {hinge_lo, hinge_hi}) {
    bool clear = x > he && x < L - he;
    for (double p : hard) clear = clear && std::abs(p - x) >= he;
    if (clear) with_hinge.push_back(x);
  }
  // Far-region elements: at most far_element_length h_e and at most b/2 (= nf / (2 aspect) h_e), so
  // that coarse section meshes keep a flange's buckle length b resolved along x.
  const double far_size = std::max(1.0, std::min(spec.far_element_length, 0.5 * sec.b / he));
  Stations st{grade_stations(unique_points(with_hinge, L, tol), he, hinge_lo, hinge_hi, far_size, spec.far_growth), tol};
  out.stations = st.x;

  // Nodes: the cross-section at every station, then stiffener interiors, then reference nodes.
  ShellModel& m = out.model;
  m.region_names = {"top_flange", "bottom_flange", "web", "stiffener"};
  out.axial_force = spec.axial_load_ratio * out.plate.A * spec.fy;
  out.grid = section_grid(spec, setup.top_flange_in_compression(), out.axial_force);
  const SectionGrid& g = out.grid;
  const int nb = g.nb(), nt = g.nt(), nw = g.nw();
  const double zf = 0.5 * (sec.h - sec.tf);
  const int n_st = static_cast<int>(st.x.size());
  m.nodes.reserve(static_cast<std::size_t>(n_st) * g.per());
  for (int i = 0; i < n_st; ++i) {
    for (double y : g.y_bottom) m.nodes.emplace_back(st.x[i], y, -zf);
    for (double y : g.y_top) m.nodes.emplace_back(st.x[i], y, zf);
    for (int mm = 1; mm < nw; ++mm) m.nodes.emplace_back(st.x[i], 0.0, g.z_web[mm]);
  }

  // Elements between stations: flanges CCW about +z, web CCW about +y.
  for (int i = 0; i + 1 < n_st; ++i) {
    for (int k = 0; k < std::max(nb, nt); ++k) {
      if (k < nt)
        m.elements.push_back({{g.top(i, k), g.top(i + 1, k), g.top(i + 1, k + 1), g.top(i, k + 1)}, sec.tf, kTopFlange});
      if (k < nb)
        m.elements.push_back(
            {{g.bottom(i, k), g.bottom(i + 1, k), g.bottom(i + 1, k + 1), g.bottom(i, k + 1)}, sec.tf, kBottomFlange});
    }
    for (int mm = 0; mm < nw; ++mm)
      m.elements.push_back({{g.web(i, mm), g.web(i, mm + 1), g.web(i + 1, mm + 1), g.web(i + 1, mm)}, sec.tw, kWeb});
  }

  // Stiffeners: a (nf + 1) x (nw + 1) grid in the y-z plane on the finer flange's y lines and the
  // web's z lines, CCW about +x; its flange rows are the flange nodes, its k = nf/2 column the web
  // nodes. With a coarser tension flange (its lines a subset, section_grading.hpp) the row next to
  // it is a transition: a quad per cell of one fine width, six quads per pair of cells of two.
  const double ts = spec.stiffener_thickness.value_or(sec.tf);
  for (double xs : stiff) add_stiffener(m, g, st.x[st.at(xs)], st.at(xs), zf, ts, kStiffener);
  for (double xs : stiff) out.stiffener_x.push_back(st.x[st.at(xs)]);

  // Supports, ties, loads and the hinge-rotation measure of the setup.
  const int last = n_st - 1;
  setup.apply(HingeZoneMesh{spec, g, st, out});

  // Lateral restraints on the flange centre-line nodes; none at a rigidly tied end section.
  for (std::size_t k = 0; k < spec.lateral_restraints.size(); ++k) {
    const LateralBrace& r = spec.lateral_restraints[k];
    const int i = st.at(r.x);
    NodeGroup group;
    if (r.flange != RestrainedFlange::bottom) group.nodes.push_back(g.top_centre(i));
    if (r.flange != RestrainedFlange::top) group.nodes.push_back(g.bottom_centre(i));
    std::sort(group.nodes.begin(), group.nodes.end());
    for (int n : group.nodes) group.cells.push_back({n});
    const std::string name = "restraint_" + std::to_string(k);
    m.groups[name] = group;
    if (!setup.tied_section(i, last)) m.supports.push_back(support(name, {Dof::uy}));
  }
  return out;
}

double beam_theory_rotation_at_mp(const HingeZoneModel& m, double E) {
  if (!(E > 0.0)) throw std::invalid_argument("steel.E = " + num(E) + " MPa: expected > 0");
  const double EI = E * m.plate.Iy;
  return m.loading().beam_theory_rotation_at_mp(m, EI);
}

double shear_rotation_at_mp(const HingeZoneModel& m, double E, double nu) {
  ROTCAP_CHECK(E > 0.0 && nu >= 0.0 && nu < 0.5, "E = " + num(E) + ", nu = " + num(nu));
  const double G = E / (2.0 * (1.0 + nu));
  return m.loading().shear_rotation_at_mp(m, G * m.plate.Avz);
}

MeshStatistics mesh_statistics(const ShellModel& model) {
  MeshStatistics s;
  s.nodes = model.node_count();
  s.elements = model.element_count();
  s.dofs = model.dof_count();
  std::set<int> tied;
  for (const auto& t : model.rigid_ties)
    if (const auto g = model.groups.find(t.group); g != model.groups.end()) tied.insert(g->second.nodes.begin(), g->second.nodes.end());
  std::set<std::pair<int, int>> fixed;
  for (const auto& sup : model.supports) {
    const auto g = model.groups.find(sup.group);
    if (g == model.groups.end()) continue;
    for (int n : g->second.nodes)
      for (int d = 0; d < kDofsPerNode; ++d)
        if (sup.fixed[d] && !tied.count(n)) fixed.insert({n, d});
  }
  s.tied_nodes = static_cast<int>(tied.size());
  s.fixed_dofs = static_cast<int>(fixed.size());
  s.free_dofs = s.dofs - kDofsPerNode * s.tied_nodes - s.fixed_dofs;
  return s;
}

}  // namespace rotcap
