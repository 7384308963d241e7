// ShellQ4: flat four-node shell (contract in shell_q4.hpp).
//
// Sources, by part:
//  - MITC4 transverse shear: E.N. Dvorkin, K.J. Bathe, "A continuum mechanics based four-node
//    shell element for general nonlinear analysis", Eng. Comput. 1 (1984) 77-88; the tying scheme
//    as written out in K.J. Bathe, Finite Element Procedures (1996), ch. 5.4.
//  - Incompatible modes: E.L. Wilson, R.L. Taylor, W.P. Doherty, J. Ghaboussi, "Incompatible
//    displacement models" (1973), with the correction of R.L. Taylor, P.J. Beresford,
//    E.L. Wilson, "A non-conforming element for stress analysis", IJNME 10 (1976) 1211-1219.
//  - Drilling penalty: T.J.R. Hughes, F. Brezzi, "On drilling degrees of freedom", CMAME 72 (1989)
//    105-121 (gamma of the order of the shear modulus); the penalty form with one constant
//    skew-symmetric stress per element as in A. Ibrahimbegovic, R.L. Taylor, E.L. Wilson, "A
//    robust quadrilateral membrane finite element with drilling degrees of freedom", IJNME 30
//    (1990) 445-457.
//  - Warping: rigid links from the mean plane to the nodes, R.H. MacNeal, "A simple quadrilateral
//    shell element", Comput. Struct. 8 (1978) 175-183; R.L. Taylor, "Finite element analysis of
//    linear shell problems" (1987).
//
// Drilling, in detail. With e = rz - omega and m its element mean,
//    Pi_d = 1/2 t [ gamma_0 A m^2 + gamma int (e - m)^2 dA ],
//    gamma_0 = drilling_mean_ratio * G,  gamma = drilling_ratio * G,  2x2 Gauss for the integral.
// The mean part is the Hughes-Brezzi penalty for a skew stress that is constant over the element,
// with gamma_0 = G by default; the higher-order part (small gamma) only gives stiffness to the
// three rz modes per element that a constraint on the mean leaves free. With gamma_0 = gamma
// this is exactly 1/2 gamma t int e^2 dA. The split matters on curved (faceted) surfaces: there
// the normal component of a nodal rotation is held only by the drilling term, and with a weak
// penalty on the mean, adjacent facets can kink against each other (the MacNeal-Harder twisted
// beam, 12x2, came out 31 % too flexible with 1/2 gamma t int e^2 at gamma = 1e-3 G and 3.9 times
// at 1e-4 G; with the split it is within 0.5 % and insensitive to gamma).
// omega = 1/2 (v_x - u_y) includes the incompatible modes, the membrane field the element really
// uses, so e = 0 for every state the membrane represents exactly (constant strain; in-plane pure
// bending of a rectangle) and a large gamma_0 does not lock. The modes have zero mean rotation
// (Taylor's correction), so m depends on the nodal DOFs only.

#include "elements/shell_q4.hpp"

#include "elements/strain_operator.hpp"

#include <Eigen/LU>
#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

namespace rotcap {

namespace {

using Vec4 = Eigen::Vector4d;
using Mat4 = Eigen::Matrix4d;
using Mat3x4 = Eigen::Matrix<double, 3, 4>;
using Mat4x24 = Eigen::Matrix<double, 4, 24>;
using Mat24x4 = Eigen::Matrix<double, 24, 4>;
using Row24 = Eigen::Matrix<double, 1, 24>;

constexpr double kGauss = 0.577350269189625764509148780502;  // 1/sqrt(3), 2-point Gauss-Legendre
constexpr std::array<double, 4> kNodeXi{-1.0, 1.0, 1.0, -1.0};
constexpr std::array<double, 4> kNodeEta{-1.0, -1.0, 1.0, 1.0};

double gauss_xi(int gp) { return kGauss * kNodeXi[gp]; }
double gauss_eta(int gp) { return kGauss * kNodeEta[gp]; }

// Bilinear shape functions N_i = (1 + xi xi_i)(1 + eta eta_i) / 4 and their natural derivatives.
Eigen::Matrix<double, 1, 4> shape(double xi, double eta) {
  Eigen::Matrix<double, 1, 4> n;
  for (int i = 0; i < 4; ++i) n(i) = 0.25 * (1.0 + xi * kNodeXi[i]) * (1.0 + eta * kNodeEta[i]);
  return n;
}

Eigen::Matrix<double, 2, 4> natural_derivatives(double xi, double eta) {
  Eigen::Matrix<double, 2, 4> dn;
  for (int i = 0; i < 4; ++i) {
    dn(0, i) = 0.25 * kNodeXi[i] * (1.0 + eta * kNodeEta[i]);
    dn(1, i) = 0.25 * kNodeEta[i] * (1.0 + xi * kNodeXi[i]);
  }
  return dn;
}

// Covariant transverse shear strain e_s = dw/ds + ry dx/ds - rx dy/ds along the edge a -> b at its
// midpoint (s = xi or eta running from node a to node b): d()/ds = (()_b - ()_a) / 2 and the
// rotations are the mean of the two nodes (Bathe 1996, eq. 5.4.2 family; Dvorkin & Bathe 1984).
Row24 edge_shear(const Eigen::Matrix<double, 2, 4>& xy, int a, int b) {
  const double dx = 0.5 * (xy(0, b) - xy(0, a));
  const double dy = 0.5 * (xy(1, b) - xy(1, a));
  Row24 row = Row24::Zero();
  row(6 * a + 2) = -0.5;
  row(6 * b + 2) = 0.5;
  for (const int n : {a, b}) {
    row(6 * n + 3) = -0.5 * dy;
    row(6 * n + 4) = 0.5 * dx;
  }
  return row;
}

[[noreturn]] void bad_option(const std::string& what) {
  throw std::invalid_argument("ShellQ4::Options: " + what);
}

}  // namespace

ShellQ4::ShellQ4(const Eigen::Matrix<double, 3, 4>& local, const Options& options)
    : local_(local), options_(options), kernels_(&tangent_kernels(options.kernel.value_or(active_kernel()))) {
  if (!(options.drilling_ratio > 0.0))
    bad_option("drilling_ratio = " + std::to_string(options.drilling_ratio) + " must be > 0");
  if (!(options.shear_correction > 0.0 && options.shear_correction <= 1.0))
    bad_option("shear_correction = " + std::to_string(options.shear_correction) + " must be in (0, 1]");
  if (options.max_local_iterations < 1)
    bad_option("max_local_iterations = " + std::to_string(options.max_local_iterations) + " must be >= 1");
  if (!(options.drilling_mean_ratio > 0.0))
    bad_option("drilling_mean_ratio = " + std::to_string(options.drilling_mean_ratio) + " must be > 0");
  if (!(options.local_tolerance > 0.0 && options.local_tolerance < 1.0))
    bad_option("local_tolerance = " + std::to_string(options.local_tolerance) + " must be in (0, 1)");
  if (!local.allFinite()) throw std::invalid_argument("ShellQ4: non-finite node coordinates");

  warped_ = local.row(2).cwiseAbs().maxCoeff() > 0.0;
  const Eigen::Matrix<double, 2, 4> xy = local.topRows<2>();

  // Centre Jacobian J0 for Taylor's correction of the incompatible modes (Taylor et al. 1976).
  const Eigen::Matrix2d j0 = natural_derivatives(0.0, 0.0) * xy.transpose();
  const double det0 = j0.determinant();
  const Eigen::Matrix2d j0_inv = j0.inverse();

  // MITC4 tying points A (0,-1), C (0,1) for e_xi and D (-1,0), B (1,0) for e_eta.
  const Row24 tie_a = edge_shear(xy, 0, 1);
  const Row24 tie_c = edge_shear(xy, 3, 2);
  const Row24 tie_d = edge_shear(xy, 0, 3);
  const Row24 tie_b = edge_shear(xy, 1, 2);

  for (int gp = 0; gp < kGaussPoints; ++gp) {
    const double xi = gauss_xi(gp), eta = gauss_eta(gp);
    const Eigen::Matrix<double, 2, 4> dn = natural_derivatives(xi, eta);
    // J = [[x_xi, y_xi], [x_eta, y_eta]]
    const Eigen::Matrix2d jac = dn * xy.transpose();
    const double det = jac.determinant();
    if (!(det > 0.0))
      throw std::invalid_argument("ShellQ4: non-positive Jacobian det J = " + std::to_string(det) +
                                  " at Gauss point " + std::to_string(gp) +
                                  " (degenerate element or clockwise nodes)");
    const Eigen::Matrix2d jac_inv = jac.inverse();
    dN_[gp] = jac_inv * dn;
    weight_[gp] = det;  // Gauss weights are 1 for the 2x2 rule

    // Incompatible modes P1 = 1 - xi^2, P2 = 1 - eta^2 for u and v. Their Cartesian derivatives use
    // J0 and are scaled by det J0 / det J, so that int dP/dx dA = det J0 J0^-1 sum_gp dP/dxi = 0
    // for any geometry: constant strain states then do not excite the modes (patch test).
    Eigen::Matrix2d dp_nat;
    dp_nat << -2.0 * xi, 0.0, 0.0, -2.0 * eta;
    const Eigen::Matrix2d dp = (det0 / det) * (j0_inv * dp_nat);  // col k = [Pk_x, Pk_y]
    Mat3x4& bi = b_incompatible_[gp];
    bi.setZero();
    for (int k = 0; k < 2; ++k) {
      bi(0, k) = dp(0, k);      // u = Pk alpha_k:      e_xx = Pk_x, g_xy = Pk_y
      bi(2, k) = dp(1, k);
      bi(1, 2 + k) = dp(1, k);  // v = Pk alpha_{2+k}:  e_yy = Pk_y, g_xy = Pk_x
      bi(2, 2 + k) = dp(0, k);
      // in-plane rotation omega = 1/2 (v_x - u_y) of the mode
      w_incompatible_[gp](k) = -0.5 * dp(1, k);
      w_incompatible_[gp](2 + k) = 0.5 * dp(0, k);
    }

    // Assumed covariant shear e_xi = (1-eta)/2 e_A + (1+eta)/2 e_C, e_eta = (1-xi)/2 e_D +
    // (1+xi)/2 e_B (Dvorkin & Bathe 1984); Cartesian [g_xz, g_yz] = J^-1 [e_xi, e_eta].
    Eigen::Matrix<double, 2, 24> covariant;
    covariant.row(0) = 0.5 * (1.0 - eta) * tie_a + 0.5 * (1.0 + eta) * tie_c;
    covariant.row(1) = 0.5 * (1.0 - xi) * tie_d + 0.5 * (1.0 + xi) * tie_b;
    b_shear_[gp] = jac_inv * covariant;
  }
  // Element mean of (rz - omega_bilinear); the modes' omega has zero mean (see above).
  drill_mean_.setZero();
  for (int gp = 0; gp < kGaussPoints; ++gp) drill_mean_ += weight_[gp] * drilling_operator(gp);
  drill_mean_ /= area();
  for (int gp = 0; gp < kGaussPoints; ++gp) drill_rest_[gp] = drilling_operator(gp) - drill_mean_;
}

double ShellQ4::area() const { return weight_[0] + weight_[1] + weight_[2] + weight_[3]; }

Eigen::Matrix<double, 1, 24> ShellQ4::drilling_operator(int gp) const {
  const Eigen::Matrix<double, 1, 4> n = shape(gauss_xi(gp), gauss_eta(gp));
  Row24 b = Row24::Zero();
  for (int i = 0; i < 4; ++i) {
    b(6 * i + 5) = n(i);                   // rz
    b(6 * i) = 0.5 * dN_[gp](1, i);        // - omega = -1/2 (v_x - u_y)
    b(6 * i + 1) = -0.5 * dN_[gp](0, i);
  }
  return b;
}

Vec24 ShellQ4::to_flat(const Vec24& d) const {
  Vec24 flat = d;
  if (!warped_) return flat;
  for (int i = 0; i < 4; ++i) {
    const double z = local_(2, i);
    flat(6 * i) -= z * d(6 * i + 4);      // u_flat = u - z ry
    flat(6 * i + 1) += z * d(6 * i + 3);  // v_flat = v + z rx
  }
  return flat;
}

void ShellQ4::from_flat(Vec24& f, Mat24* K) const {
  if (!warped_) return;
  for (int i = 0; i < 4; ++i) {
    const double z = local_(2, i);
    f(6 * i + 4) -= z * f(6 * i);
    f(6 * i + 3) += z * f(6 * i + 1);
  }
  if (K == nullptr) return;
  // K <- W^T K W: the columns (rows) 6i, 6i+1 read here are not modified by W.
  for (int i = 0; i < 4; ++i) {
    const double z = local_(2, i);
    K->col(6 * i + 4) -= z * K->col(6 * i);
    K->col(6 * i + 3) += z * K->col(6 * i + 1);
  }
  for (int i = 0; i < 4; ++i) {
    const double z = local_(2, i);
    K->row(6 * i + 4) -= z * K->row(6 * i);
    K->row(6 * i + 3) += z * K->row(6 * i + 1);
  }
}

ElementStatus ShellQ4::compute(const Vec24& d, const ShellSection& section,
                               std::span<const LayerState> committed, std::span<LayerState> trial,
                               Vec24& f, Mat24* K, ShellQ4Resultants* out,
                               const Eigen::Vector4d* alpha_start, Eigen::Vector4d* alpha_end) const {
  const auto layers = static_cast<std::size_t>(section.layers());
  if (committed.size() < kGaussPoints * layers || trial.size() < kGaussPoints * layers)
    throw std::invalid_argument("ShellQ4::compute: history spans hold " +
                                std::to_string(committed.size()) + " / " +
                                std::to_string(trial.size()) + " slots, need " +
                                std::to_string(kGaussPoints * layers));
#ifndef NDEBUG
  f.setConstant(std::numeric_limits<double>::quiet_NaN());
  if (K != nullptr) K->setConstant(std::numeric_limits<double>::quiet_NaN());
#endif
  const Vec24 df = to_flat(d);
  const double t = section.thickness();
  const double shear_stiffness = options_.shear_correction * section.shear_modulus() * t;
  const double drill_stiffness = options_.drilling_ratio * section.shear_modulus() * t;
  const double drill_mean_stiffness = options_.drilling_mean_ratio * section.shear_modulus() * t * area();

  // Per Gauss point: nodal part of the generalised strains; the drilling operator minus its
  // element mean (e - m) is drill_rest_.
  const std::array<Row24, 4>& b_drill = drill_rest_;
  std::array<Vec6, 4> g_nodal;
  for (int gp = 0; gp < kGaussPoints; ++gp) g_nodal[gp] = strain_operator::apply(dN_[gp], df);
  const double drill_mean = drill_mean_.dot(df);

  // Higher-order drilling energy 1/2 gamma t int (b_drill d - w_inc alpha)^2 dA: its constant
  // alpha-alpha block and its alpha-part at alpha = 0.
  Mat4 kaa_drill = Mat4::Zero();
  Vec4 ra_drill0 = Vec4::Zero();
  double scale_drill = 0.0;
  for (int gp = 0; gp < kGaussPoints; ++gp) {
    const double wd = weight_[gp] * drill_stiffness;
    const double mismatch = b_drill[gp].dot(df);
    kaa_drill.noalias() += wd * w_incompatible_[gp].transpose() * w_incompatible_[gp];
    ra_drill0.noalias() -= wd * mismatch * w_incompatible_[gp].transpose();
    scale_drill += wd * w_incompatible_[gp].norm() * std::abs(mismatch);
  }

  // Section response at the mode amplitudes alpha, and the mode residual R_alpha = dPi/dalpha
  // with its tangent K_aa.
  Vec4 alpha = (alpha_start != nullptr && !section.is_linear()) ? Vec4(*alpha_start) : Vec4::Zero();
  std::array<Vec6, 4> g, r;
  std::array<Mat6, 4> c;
  Vec4 r_alpha;
  Mat4 k_aa;
  double force_scale = 0.0;
  const auto evaluate = [&]() {
    r_alpha = ra_drill0 + kaa_drill * alpha;
    k_aa = kaa_drill;
    force_scale = scale_drill;
    for (int gp = 0; gp < kGaussPoints; ++gp) {
      g[gp] = g_nodal[gp];
      g[gp].head<3>().noalias() += b_incompatible_[gp] * alpha;
      section.respond(g[gp], committed.subspan(gp * layers, layers),
                      trial.subspan(gp * layers, layers), r[gp], c[gp]);
      const double w = weight_[gp];
      r_alpha.noalias() += w * b_incompatible_[gp].transpose() * r[gp].head<3>();
      k_aa.noalias() += w * b_incompatible_[gp].transpose() * c[gp].topLeftCorner<3, 3>() *
                        b_incompatible_[gp];
      force_scale += w * b_incompatible_[gp].norm() * r[gp].head<3>().norm();
    }
  };

  Eigen::FullPivLU<Mat4> k_aa_lu;
  const auto factor = [&]() {
    k_aa_lu.compute(k_aa);
    return k_aa_lu.isInvertible();
  };

  if (section.is_linear()) {
    // R_alpha is linear in alpha: one solve, then r and g follow by linearity.
    evaluate();
    if (!factor()) return ElementStatus::LocalIterationFailed;
    alpha = -k_aa_lu.solve(r_alpha);
    if (layers > 0) {
      evaluate();  // a linear section with history slots: write them at the solved alpha
    } else {
      for (int gp = 0; gp < kGaussPoints; ++gp) {
        const Eigen::Vector3d de = b_incompatible_[gp] * alpha;
        g[gp].head<3>() += de;
        r[gp].noalias() += c[gp].leftCols<3>() * de;
      }
    }
  } else {
    // Local Newton loop on R_alpha(d, alpha) = 0 from alpha = 0; the last evaluation (and so the
    // trial history) is at the converged alpha. Plastic layers make R_alpha only piecewise smooth
    // (elastic-plastic switches, kinks of the hardening curve), so a full Newton step that does not
    // reduce |R_alpha| is halved (backtracking, up to 8 times) before it is taken.
    bool converged = false;
    evaluate();
    for (int iteration = 0;; ++iteration) {
      const double norm = r_alpha.norm();
      if (norm <= options_.local_tolerance * force_scale) {
        converged = true;
        break;
      }
      if (iteration == options_.max_local_iterations || !factor()) break;
      const Vec4 step = k_aa_lu.solve(r_alpha);
      const Vec4 start = alpha;
      double s = 1.0;
      for (int halving = 0; halving <= 8; ++halving, s *= 0.5) {
        alpha = start - s * step;
        evaluate();
        if (r_alpha.norm() < norm) break;
      }
    }
    if (!converged || !factor()) return ElementStatus::LocalIterationFailed;
  }
  if (!alpha.allFinite()) return ElementStatus::NotFinite;
  if (alpha_end != nullptr) *alpha_end = alpha;

  // Internal force at the converged alpha: membrane + bending, MITC4 shear, drilling.
  Vec24 ff = (drill_mean_stiffness * drill_mean) * drill_mean_.transpose();
  std::array<Eigen::Vector2d, 4> q;
  for (int gp = 0; gp < kGaussPoints; ++gp) {
    const double w = weight_[gp];
    q[gp].noalias() = shear_stiffness * (b_shear_[gp] * df);  // Q = k_s G t gamma
    const double drill_mismatch = b_drill[gp].dot(df) - w_incompatible_[gp].dot(alpha);
    strain_operator::add_transpose(dN_[gp], w * r[gp], ff);
    ff.noalias() += w * (b_shear_[gp].transpose() * q[gp]);
    ff.noalias() += (w * drill_stiffness * drill_mismatch) * b_drill[gp].transpose();
  }

  if (K != nullptr) {
    // Condensed consistent tangent K = K_dd - K_da K_aa^-1 K_ad at the converged alpha; the full
    // 6x6 C couples the modes (membrane) to the curvatures (parts: kernels/tangent_kernels.hpp).
    // The kernels read the per-Gauss-point arrays as contiguous column-major blocks.
    static_assert(sizeof(Eigen::Matrix<double, 2, 4>) == 8 * sizeof(double) &&
                  sizeof(Eigen::Matrix<double, 3, 4>) == 12 * sizeof(double) &&
                  sizeof(Eigen::Matrix<double, 1, 4>) == 4 * sizeof(double) &&
                  sizeof(Eigen::Matrix<double, 2, 24>) == 48 * sizeof(double) &&
                  sizeof(Row24) == 24 * sizeof(double) && sizeof(Mat6) == 36 * sizeof(double));
    kernels::ShellTangentInput in;
    in.dN = dN_[0].data();
    in.weight = weight_.data();
    in.C = c[0].data();
    in.b_incompatible = b_incompatible_[0].data();
    in.w_incompatible = w_incompatible_[0].data();
    in.b_shear = b_shear_[0].data();
    in.b_drill = b_drill[0].data();
    in.drill_mean = drill_mean_.data();
    in.shear_stiffness = shear_stiffness;
    in.drill_stiffness = drill_stiffness;
    in.drill_mean_stiffness = drill_mean_stiffness;
    Mat24x4 k_da;
    Mat4x24 k_ad;
    kernels_->shell_tangent(in, K->data(), k_da.data(), k_ad.data());
    const Mat4x24 a_d = k_aa_lu.solve(k_ad);  // d alpha / d d = -K_aa^-1 K_ad
    kernels_->subtract_condensed(k_da.data(), a_d.data(), K->data());
  }
  f = ff;
  from_flat(f, K);

  if (out != nullptr) {
    for (int gp = 0; gp < kGaussPoints; ++gp) {
      out->r[gp] = r[gp];
      out->q[gp] = q[gp];
      out->g[gp] = g[gp];
    }
  }
#ifndef NDEBUG
  if (!f.allFinite() || (K != nullptr && !K->allFinite())) return ElementStatus::NotFinite;
#endif
  return ElementStatus::Ok;
}

Mat24 ShellQ4::geometric_stiffness(const std::array<Eigen::Vector3d, 4>& membrane_forces) const {
  // Initial-stress stiffness: delta^2 of 1/2 int N_ab u_{,a} . u_{,b} dA with u the bilinear
  // translation field (all three components), H_ij = int dN_i^T [[Nxx, Nxy], [Nxy, Nyy]] dN_j.
  Mat24 kg = Mat24::Zero();
  for (int gp = 0; gp < kGaussPoints; ++gp) {
    const Eigen::Vector3d& n = membrane_forces[gp];
    Eigen::Matrix2d s;
    s << n(0), n(2), n(2), n(1);
    const Eigen::Matrix4d h = weight_[gp] * (dN_[gp].transpose() * s * dN_[gp]);
    for (int i = 0; i < 4; ++i)
      for (int j = 0; j < 4; ++j)
        for (int a = 0; a < 3; ++a) kg(6 * i + a, 6 * j + a) += h(i, j);
  }
  Vec24 unused = Vec24::Zero();
  from_flat(unused, &kg);
  return kg;
}

}  // namespace rotcap
