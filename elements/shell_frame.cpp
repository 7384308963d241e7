// ShellFrame: the local frame of a four-node shell element (contract in shell_q4.hpp).
//
// The normal is the cross product of the diagonals, the usual choice for warped quadrilaterals
// (e.g. MacNeal 1978; Taylor 1987): it is the normal of the mean plane through the mid-points of
// the four edges, and it does not depend on which node is numbered first. The in-plane axis x is
// the bisector of the two diagonal directions, which treats both diagonals alike (a frame along
// one edge would not), so the corotational layer sees a frame that follows the element's mean
// in-plane rotation; every step is a smooth function of the node positions while d1 x d2 != 0.

#include "elements/shell_q4.hpp"

#include <Eigen/Geometry>
#include <stdexcept>
#include <string>

namespace rotcap {

ShellFrame ShellFrame::of(const Eigen::Matrix<double, 3, 4>& xyz) {
  ShellFrame frame;
  frame.origin = 0.25 * xyz.rowwise().sum();
  const Eigen::Vector3d d1 = xyz.col(2) - xyz.col(0);
  const Eigen::Vector3d d2 = xyz.col(3) - xyz.col(1);
  const Eigen::Vector3d normal = d1.cross(d2);
  const double scale = d1.norm() * d2.norm();
  // |d1 x d2| = |d1| |d2| sin(angle between diagonals); a relative 1e-12 is a collapsed element.
  if (!(normal.norm() > 1.0e-12 * scale))
    throw std::invalid_argument("ShellFrame::of: diagonals are parallel or of zero length (|d1 x d2| = " +
                                std::to_string(normal.norm()) + ")");
  const Eigen::Vector3d e3 = normal.normalized();
  // d1/|d1| and d2/|d2| are unit vectors normal to e3, so their difference is normal to e3 and
  // non-zero (they are not parallel).
  const Eigen::Vector3d e1 = (d1 / d1.norm() - d2 / d2.norm()).normalized();
  const Eigen::Vector3d e2 = e3.cross(e1);
  frame.rotation.col(0) = e1;
  frame.rotation.col(1) = e2;
  frame.rotation.col(2) = e3;
  return frame;
}

Eigen::Matrix<double, 3, 4> ShellFrame::to_local(const Eigen::Matrix<double, 3, 4>& xyz) const {
  return rotation.transpose() * (xyz.colwise() - origin);
}

}  // namespace rotcap
