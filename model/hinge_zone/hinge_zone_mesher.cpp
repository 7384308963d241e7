#include "model/hinge_zone/hinge_zone_mesher.hpp"

#include <algorithm>
#include <cmath>
#include <set>
#include <sstream>
#include <stdexcept>

namespace rotcap {

namespace {

constexpr double kGrowth = 0.2;      // slope of the target size: element ratio 1 + kGrowth
constexpr double kMaxRatio = 1.25;   // accepted ratio of neighbouring element lengths
constexpr double kMaxSize = 3.0;     // largest element, in hinge element lengths
constexpr int kTopFlange = 0, kBottomFlange = 1, kWeb = 2, kStiffener = 3;

std::string num(double v) {
  std::ostringstream s;
  s.precision(8);
  s << v;
  return s.str();
}

[[noreturn]] void reject(const std::string& key, const std::string& found, const std::string& expected) {
  throw std::invalid_argument(key + " = " + found + ": expected " + expected);
}

void validate_spec(const HingeZoneSpec& s) {
  validate(s.section);
  const double L = s.length;
  if (!(L > 0.0) || !std::isfinite(L)) reject("member.length", num(L) + " mm", "a finite length > 0");
  if (!(s.fy > 0.0) || !std::isfinite(s.fy)) reject("steel.fy", num(s.fy) + " MPa", "a finite value > 0");
  if (s.flange_elements < 4 || s.flange_elements % 2 != 0)
    reject("mesh.flange_elements", std::to_string(s.flange_elements),
           "an even number >= 4 (the web meets the flange at its centre line)");
  if (s.web_elements < 4) reject("mesh.web_elements", std::to_string(s.web_elements), ">= 4");
  if (!(s.aspect > 0.0) || !std::isfinite(s.aspect)) reject("mesh.aspect", num(s.aspect), "a finite value > 0");
  if (s.setup == HingeSetup::four_point) {
    if (!(s.load_spacing > 0.0 && s.load_spacing < L))
      reject("member.load_spacing", num(s.load_spacing) + " mm",
             "0 < spacing < length = " + num(L) + " mm for setup = \"four_point\"");
  } else if (s.load_spacing != 0.0) {
    reject("member.load_spacing", num(s.load_spacing) + " mm", "no load spacing: it applies to setup = \"four_point\" only");
  }
  const bool axial_allowed = s.setup == HingeSetup::cantilever || s.setup == HingeSetup::uniform_moment;
  if (!axial_allowed && s.axial_load_ratio != 0.0)
    reject("member.axial_load_ratio", num(s.axial_load_ratio),
           "0: an axial load applies to setup = \"cantilever\" or \"uniform_moment\" only");
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
  }
  for (std::size_t k = 0; k < s.lateral_restraints.size(); ++k) {
    const double x = s.lateral_restraints[k].x;
    if (!(x >= 0.0 && x <= L))
      reject("restraints.lateral[" + std::to_string(k) + "].x", num(x) + " mm",
             "0 <= x <= length = " + num(L) + " mm");
  }
}

// ---- Stations along x ---------------------------------------------------------------------
// The target element length s(x) is sampled on a fine grid per span between hard points (the
// hard points appear twice, as the end of one span and the start of the next). Node lines are
// placed span by span at equal increments of phi(x) = int dx / s, with ceil(phi_span) elements,
// so no element exceeds the target. Where neighbouring elements still differ by more than
// kMaxRatio (short spans, rounding), the target is lowered over the larger element to
// (1 + kGrowth) times the smaller one and re-limited to slope kGrowth, and the spans re-placed.

struct SizeField {
  std::vector<double> x, s;
  std::vector<std::size_t> begin;  // first sample of each span; begin.back() = x.size()
};

// Lipschitz envelope: the largest field <= s with |ds/dx| <= kGrowth (two sweeps).
void limit_slope(SizeField& f) {
  for (std::size_t i = 1; i < f.s.size(); ++i) f.s[i] = std::min(f.s[i], f.s[i - 1] + kGrowth * (f.x[i] - f.x[i - 1]));
  for (std::size_t i = f.s.size() - 1; i-- > 0;) f.s[i] = std::min(f.s[i], f.s[i + 1] + kGrowth * (f.x[i + 1] - f.x[i]));
}

SizeField initial_field(const std::vector<double>& hard, double he, double hinge_lo, double hinge_hi) {
  SizeField f;
  for (std::size_t j = 0; j + 1 < hard.size(); ++j) {
    const double a = hard[j], len = hard[j + 1] - a;
    const int m = std::max(8, static_cast<int>(std::ceil(16.0 * len / he)));
    f.begin.push_back(f.x.size());
    for (int t = 0; t <= m; ++t) {
      const double x = t == m ? hard[j + 1] : a + len * t / m;
      const double d = x < hinge_lo ? hinge_lo - x : (x > hinge_hi ? x - hinge_hi : 0.0);
      f.x.push_back(x);
      f.s.push_back(std::min({kMaxSize * he, he + kGrowth * d, len}));  // no element beyond its span
    }
  }
  f.begin.push_back(f.x.size());
  limit_slope(f);
  return f;
}

std::vector<double> place_stations(const SizeField& f) {
  std::vector<double> st{f.x.front()};
  std::vector<double> phi;
  for (std::size_t j = 0; j + 1 < f.begin.size(); ++j) {
    const std::size_t i0 = f.begin[j], i1 = f.begin[j + 1];
    phi.assign(1, 0.0);
    for (std::size_t i = i0 + 1; i < i1; ++i)
      phi.push_back(phi.back() + 0.5 * (f.x[i] - f.x[i - 1]) * (1.0 / f.s[i] + 1.0 / f.s[i - 1]));
    const int n = std::max(1, static_cast<int>(std::ceil(phi.back() - 1e-6)));
    std::size_t i = 0;
    for (int k = 1; k < n; ++k) {
      const double target = phi.back() * k / n;
      while (phi[i + 1] < target) ++i;
      const double t = (target - phi[i]) / (phi[i + 1] - phi[i]);
      st.push_back(f.x[i0 + i] + t * (f.x[i0 + i + 1] - f.x[i0 + i]));
    }
    st.push_back(f.x[i1 - 1]);
  }
  return st;
}

void lower(SizeField& f, double x0, double x1, double value) {
  for (std::size_t i = 0; i < f.x.size(); ++i)
    if (f.x[i] >= x0 && f.x[i] <= x1) f.s[i] = std::min(f.s[i], value);
}

std::vector<double> grade_stations(const std::vector<double>& hard, double he, double hinge_lo, double hinge_hi) {
  SizeField f = initial_field(hard, he, hinge_lo, hinge_hi);
  for (int iteration = 0; iteration < 100; ++iteration) {
    const std::vector<double> st = place_stations(f);
    bool graded = true;
    for (std::size_t e = 0; e + 2 < st.size(); ++e) {
      const double a = st[e + 1] - st[e], b = st[e + 2] - st[e + 1];
      if (a > kMaxRatio * b) {
        lower(f, st[e], st[e + 1], (1.0 + kGrowth) * b);
        graded = false;
      } else if (b > kMaxRatio * a) {
        lower(f, st[e + 1], st[e + 2], (1.0 + kGrowth) * a);
        graded = false;
      }
    }
    if (graded) return st;
    limit_slope(f);
  }
  return place_stations(f);  // best effort; not reached for the meshes tested
}

// ---- Special x positions --------------------------------------------------------------------

struct Stations {
  std::vector<double> x;
  double tol = 0.0;
  // Index of the station at x (every special x is one).
  int at(double xq) const {
    const auto it = std::lower_bound(x.begin(), x.end(), xq - tol);
    if (it == x.end() || std::abs(*it - xq) > tol) throw std::logic_error("hinge-zone mesher: no station at x = " + num(xq));
    return static_cast<int>(it - x.begin());
  }
};

// Sorted, with points closer than tol merged into the first (points within tol of 0 or L become
// exactly 0 or L).
std::vector<double> unique_points(std::vector<double> p, double L, double tol) {
  for (double& x : p) x = std::abs(x) <= tol ? 0.0 : (std::abs(x - L) <= tol ? L : x);
  std::sort(p.begin(), p.end());
  std::vector<double> out;
  for (double x : p)
    if (out.empty() || x - out.back() > tol) out.push_back(x);
  return out;
}

// ---- Cross-section node numbering -----------------------------------------------------------
// Station i holds per = 2 (nf + 1) + nw - 1 nodes: bottom flange k = 0..nf, top flange k = 0..nf,
// then the web's interior nodes m = 1..nw-1 (m = 0 and m = nw are the flanges' centre nodes).
struct SectionGrid {
  int nf, nw;
  int per() const { return 2 * (nf + 1) + nw - 1; }
  int bottom(int i, int k) const { return i * per() + k; }
  int top(int i, int k) const { return i * per() + nf + 1 + k; }
  int web(int i, int m) const {
    if (m == 0) return bottom(i, nf / 2);
    if (m == nw) return top(i, nf / 2);
    return i * per() + 2 * (nf + 1) + m - 1;
  }
};

NodeGroup point_group(int node) { return NodeGroup{0, {node}, {{node}}}; }

// All nodes of station i as a curve group (flange and web segments as its cells).
NodeGroup section_group(const SectionGrid& g, int i) {
  NodeGroup group;
  group.dimension = 1;
  for (int k = 0; k < g.nf; ++k) {
    group.cells.push_back({g.bottom(i, k), g.bottom(i, k + 1)});
    group.cells.push_back({g.top(i, k), g.top(i, k + 1)});
  }
  for (int m = 0; m < g.nw; ++m) group.cells.push_back({g.web(i, m), g.web(i, m + 1)});
  for (int n = g.bottom(i, 0); n < g.bottom(i, 0) + g.per(); ++n) group.nodes.push_back(n);
  return group;
}

Support support(const std::string& group, std::initializer_list<Dof> dofs) {
  Support s;
  s.group = group;
  for (Dof d : dofs) s.fixed[static_cast<int>(d)] = true;
  return s;
}

}  // namespace

HingeZoneModel build_hinge_zone(const HingeZoneSpec& spec) {
  validate_spec(spec);
  const ISection& sec = spec.section;
  const double L = spec.length;
  const int nf = spec.flange_elements, nw = spec.web_elements;
  const double he = spec.aspect * sec.b / nf;
  const double tol = 1e-6 * L;  // special x's closer than this share a station

  HingeZoneModel out;
  out.setup = spec.setup;
  out.plate = plate_model_properties(sec);
  out.plastic_moment = plastic_moment(out.plate, spec.fy);
  out.moment_per_load_factor = out.plastic_moment;
  out.hinge_element_length = he;
  out.span = L;
  const double Mp = out.plastic_moment;
  const double a = spec.setup == HingeSetup::four_point ? 0.5 * (L - spec.load_spacing) : 0.0;

  // Loads, rigid ends and the hinge region of each setup.
  std::vector<double> loads;
  bool rigid_start = false, rigid_end = false;
  const int n_hinge = static_cast<int>(std::ceil(1.5 * std::max(sec.h, sec.b) / he - 1e-9));
  double hinge_lo = 0.0, hinge_hi = L;
  switch (spec.setup) {
    case HingeSetup::cantilever:
      rigid_start = rigid_end = true;  // fixed section, tied section
      hinge_hi = std::min(L, n_hinge * he);
      break;
    case HingeSetup::three_point:
      loads = {0.5 * L};
      hinge_lo = std::max(0.0, 0.5 * L - n_hinge * he);
      hinge_hi = std::min(L, 0.5 * L + n_hinge * he);
      break;
    case HingeSetup::four_point:
      loads = {a, L - a};
      hinge_lo = std::max(0.0, a - n_hinge * he);
      hinge_hi = std::min(L, L - a + n_hinge * he);
      break;
    case HingeSetup::uniform_moment:
      rigid_start = rigid_end = true;
      break;
  }

  // Stiffener positions: supports and loads (beams), plus listed ones; none at rigid ends.
  std::vector<double> stiff;
  if (spec.stiffeners == StiffenerPlacement::supports_and_loads &&
      (spec.setup == HingeSetup::three_point || spec.setup == HingeSetup::four_point)) {
    stiff = {0.0, L};
    stiff.insert(stiff.end(), loads.begin(), loads.end());
  }
  if (spec.stiffeners != StiffenerPlacement::none)
    stiff.insert(stiff.end(), spec.stiffener_positions.begin(), spec.stiffener_positions.end());
  std::erase_if(stiff, [&](double x) { return (rigid_start && x <= tol) || (rigid_end && x >= L - tol); });
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
  Stations st{grade_stations(unique_points(with_hinge, L, tol), he, hinge_lo, hinge_hi), tol};
  out.stations = st.x;

  // Nodes: the cross-section at every station, then stiffener interiors, then reference nodes.
  ShellModel& m = out.model;
  m.region_names = {"top_flange", "bottom_flange", "web", "stiffener"};
  const SectionGrid g{nf, nw};
  const double zf = 0.5 * (sec.h - sec.tf);
  // Measured from the web (y = 0) and the mid-depth, so the centre lines are exactly y = 0, z = 0.
  auto y_of = [&](int k) { return (k - nf / 2) * (sec.b / nf); };
  auto z_of = [&](int mm) { return (mm - 0.5 * nw) * (2.0 * zf / nw); };
  const int n_st = static_cast<int>(st.x.size());
  m.nodes.reserve(static_cast<std::size_t>(n_st) * g.per());
  for (int i = 0; i < n_st; ++i) {
    for (int k = 0; k <= nf; ++k) m.nodes.emplace_back(st.x[i], y_of(k), -zf);
    for (int k = 0; k <= nf; ++k) m.nodes.emplace_back(st.x[i], y_of(k), zf);
    for (int mm = 1; mm < nw; ++mm) m.nodes.emplace_back(st.x[i], 0.0, z_of(mm));
  }

  // Elements between stations: flanges CCW about +z, web CCW about +y.
  for (int i = 0; i + 1 < n_st; ++i) {
    for (int k = 0; k < nf; ++k) {
      m.elements.push_back({{g.top(i, k), g.top(i + 1, k), g.top(i + 1, k + 1), g.top(i, k + 1)}, sec.tf, kTopFlange});
      m.elements.push_back(
          {{g.bottom(i, k), g.bottom(i + 1, k), g.bottom(i + 1, k + 1), g.bottom(i, k + 1)}, sec.tf, kBottomFlange});
    }
    for (int mm = 0; mm < nw; ++mm)
      m.elements.push_back({{g.web(i, mm), g.web(i, mm + 1), g.web(i + 1, mm + 1), g.web(i + 1, mm)}, sec.tw, kWeb});
  }

  // Stiffeners: a (nf + 1) x (nw + 1) grid in the y-z plane, CCW about +x; its bottom and top
  // rows are the flange nodes, its k = nf/2 column the web nodes.
  const double ts = spec.stiffener_thickness.value_or(sec.tf);
  for (double xs : stiff) {
    const int i = st.at(xs);
    out.stiffener_x.push_back(st.x[i]);
    std::vector<int> grid((nf + 1) * (nw + 1));
    auto id = [&](int k, int mm) -> int& { return grid[mm * (nf + 1) + k]; };
    for (int mm = 0; mm <= nw; ++mm)
      for (int k = 0; k <= nf; ++k) {
        if (mm == 0) id(k, mm) = g.bottom(i, k);
        else if (mm == nw) id(k, mm) = g.top(i, k);
        else if (k == nf / 2) id(k, mm) = g.web(i, mm);
        else {
          id(k, mm) = m.node_count();
          m.nodes.emplace_back(st.x[i], y_of(k), z_of(mm));
        }
      }
    for (int mm = 0; mm < nw; ++mm)
      for (int k = 0; k < nf; ++k)
        m.elements.push_back({{id(k, mm), id(k + 1, mm), id(k + 1, mm + 1), id(k, mm + 1)}, ts, kStiffener});
  }

  // Supports, ties, loads and the hinge-rotation measure.
  const int last = n_st - 1, c = nf / 2;
  out.axial_force = spec.axial_load_ratio * out.plate.A * spec.fy;
  const Eigen::Vector3d axial(-out.axial_force, 0.0, 0.0);  // into the member at x = L
  auto add_reference = [&](const std::string& name, double x) {
    const int ref = m.node_count();
    m.nodes.emplace_back(x, 0.0, 0.0);
    m.groups[name] = point_group(ref);
    return ref;
  };
  switch (spec.setup) {
    case HingeSetup::cantilever: {
      m.groups["support"] = section_group(g, 0);
      if (spec.cantilever_support == CantileverSupport::fixed) {
        m.supports.push_back(support("support", {Dof::ux, Dof::uy, Dof::uz, Dof::rx, Dof::ry, Dof::rz}));
      } else {
        // Symmetry plane of a three-point-bending specimen: ux, ry, rz held at every node; the web
        // line carries the shear and the lateral restraint (uy, uz); the flanges may contract.
        m.supports.push_back(support("support", {Dof::ux, Dof::ry, Dof::rz}));
        NodeGroup web;
        web.dimension = 1;
        for (int mm = 0; mm <= g.nw; ++mm) web.nodes.push_back(g.web(0, mm));
        for (int mm = 0; mm < g.nw; ++mm) web.cells.push_back({g.web(0, mm), g.web(0, mm + 1)});
        std::sort(web.nodes.begin(), web.nodes.end());
        m.groups["support_web"] = web;
        m.supports.push_back(support("support_web", {Dof::uy, Dof::uz}));
      }
      m.groups["end_section"] = section_group(g, last);
      const int ref = add_reference("load_point", L);
      m.rigid_ties.push_back({"end_section", ref});
      m.supports.push_back(support("load_point", {Dof::uy, Dof::rx}));
      out.reference_load = Mp / L;
      out.lever_arm = out.shear_span = L;
      m.loads.push_back({"load_point", Eigen::Vector3d(0.0, 0.0, -out.reference_load), Eigen::Vector3d::Zero()});
      if (out.axial_force > 0.0) m.fixed_loads.push_back({"load_point", axial, Eigen::Vector3d::Zero()});
      out.rotation = {{ref}, Dof::uz, {-1.0 / L}};
      break;
    }
    case HingeSetup::three_point:
    case HingeSetup::four_point: {
      m.groups["bearing_a"] = point_group(g.bottom(0, c));
      m.groups["bearing_b"] = point_group(g.bottom(last, c));
      m.groups["twist_a"] = point_group(g.top(0, c));
      m.groups["twist_b"] = point_group(g.top(last, c));
      m.supports.push_back(support("bearing_a", {Dof::ux, Dof::uy, Dof::uz}));
      m.supports.push_back(support("bearing_b", {Dof::uy, Dof::uz}));
      m.supports.push_back(support("twist_a", {Dof::uy}));
      m.supports.push_back(support("twist_b", {Dof::uy}));
      if (spec.setup == HingeSetup::three_point) {
        const int i = st.at(0.5 * L);
        m.groups["load_point"] = point_group(g.top(i, c));
        m.groups["midspan_bottom"] = point_group(g.bottom(i, c));
        out.reference_load = 4.0 * Mp / L;
        out.lever_arm = 0.25 * L;
        out.shear_span = 0.5 * L;
        m.loads.push_back({"load_point", Eigen::Vector3d(0.0, 0.0, -out.reference_load), Eigen::Vector3d::Zero()});
        out.rotation = {{g.bottom(i, c)}, Dof::uz, {-4.0 / L}};
      } else {
        const int ia = st.at(a), ib = st.at(L - a);
        m.groups["load_point_a"] = point_group(g.top(ia, c));
        m.groups["load_point_b"] = point_group(g.top(ib, c));
        m.groups["deflection_a"] = point_group(g.bottom(ia, c));
        m.groups["deflection_b"] = point_group(g.bottom(ib, c));
        out.reference_load = Mp / a;
        out.lever_arm = out.shear_span = a;
        for (const char* name : {"load_point_a", "load_point_b"})
          m.loads.push_back({name, Eigen::Vector3d(0.0, 0.0, -out.reference_load), Eigen::Vector3d::Zero()});
        out.rotation = {{g.bottom(ia, c), g.bottom(ib, c)}, Dof::uz, {-1.0 / a, -1.0 / a}};
      }
      break;
    }
    case HingeSetup::uniform_moment: {
      m.groups["end_section_a"] = section_group(g, 0);
      m.groups["end_section_b"] = section_group(g, last);
      const int ra = add_reference("end_a", 0.0), rb = add_reference("end_b", L);
      m.rigid_ties.push_back({"end_section_a", ra});
      m.rigid_ties.push_back({"end_section_b", rb});
      m.supports.push_back(support("end_a", {Dof::ux, Dof::uy, Dof::uz, Dof::rx}));
      m.supports.push_back(support("end_b", {Dof::uy, Dof::uz, Dof::rx}));
      out.reference_load = Mp;
      m.loads.push_back({"end_a", Eigen::Vector3d::Zero(), Eigen::Vector3d(0.0, Mp, 0.0)});
      m.loads.push_back({"end_b", Eigen::Vector3d::Zero(), Eigen::Vector3d(0.0, -Mp, 0.0)});
      if (out.axial_force > 0.0) m.fixed_loads.push_back({"end_b", axial, Eigen::Vector3d::Zero()});
      out.rotation = {{ra, rb}, Dof::ry, {1.0, -1.0}};
      break;
    }
  }

  // Lateral restraints on the flange centre-line nodes; none at a rigidly tied end section.
  for (std::size_t k = 0; k < spec.lateral_restraints.size(); ++k) {
    const LateralBrace& r = spec.lateral_restraints[k];
    const int i = st.at(r.x);
    NodeGroup group;
    if (r.flange != RestrainedFlange::bottom) group.nodes.push_back(g.top(i, c));
    if (r.flange != RestrainedFlange::top) group.nodes.push_back(g.bottom(i, c));
    std::sort(group.nodes.begin(), group.nodes.end());
    for (int n : group.nodes) group.cells.push_back({n});
    const std::string name = "restraint_" + std::to_string(k);
    m.groups[name] = group;
    const bool tied = (spec.setup == HingeSetup::cantilever && i == last) ||
                      (spec.setup == HingeSetup::uniform_moment && (i == 0 || i == last));
    if (!tied) m.supports.push_back(support(name, {Dof::uy}));
  }
  return out;
}

double beam_theory_rotation_at_mp(const HingeZoneModel& m, double E) {
  if (!(E > 0.0)) throw std::invalid_argument("steel.E = " + num(E) + " MPa: expected > 0");
  const double EI = E * m.plate.Iy, Mp = m.plastic_moment, L = m.span;
  switch (m.setup) {
    case HingeSetup::cantilever:    // delta = P L^3 / (3 EI), theta = delta / L
    case HingeSetup::three_point:   // delta = P L^3 / (48 EI), theta = 4 delta / L
      return Mp * L / (3.0 * EI);
    case HingeSetup::four_point:    // delta(a) = P a^2 (3 L - 4 a) / (6 EI), theta = 2 delta / a
      return Mp * (3.0 * L - 4.0 * m.shear_span) / (3.0 * EI);
    case HingeSetup::uniform_moment:  // end slopes +-M L / (2 EI)
      return Mp * L / EI;
  }
  return 0.0;
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
