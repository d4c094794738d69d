#include "geometry/fit/ellipse_direct.hpp"

#include <Eigen/Dense>
#include <cmath>

#include "geometry/fit/point_spread.hpp"

namespace soffit {

std::optional<DirectEllipseFit> fit_ellipse_direct(std::span<const Point2> points) {
  const std::size_t n = points.size();
  if (n < 5) return std::nullopt;

  const auto spread = point_spread(points);
  if (!spread || is_collinear(*spread, kEllipseCollinearRelative)) return std::nullopt;
  const double mx = spread->mx, mz = spread->mz, scale = spread->rms;

  // Scatter blocks of Halíř & Flusser: D1 = [x², xz, z²], D2 = [x, z, 1].
  Eigen::Matrix3d s1 = Eigen::Matrix3d::Zero(), s2 = Eigen::Matrix3d::Zero(),
                  s3 = Eigen::Matrix3d::Zero();
  const double inv = 1.0 / scale;
  for (const Point2& p : points) {
    const double x = (p.x - mx) * inv, z = (p.z - mz) * inv;
    const Eigen::Vector3d d1(x * x, x * z, z * z), d2(x, z, 1.0);
    s1.noalias() += d1 * d1.transpose();
    s2.noalias() += d1 * d2.transpose();
    s3.noalias() += d2 * d2.transpose();
  }
  // T maps the quadratic part to the linear part that minimises for it.
  const Eigen::Matrix3d t = -s3.ldlt().solve(s2.transpose());
  const Eigen::Matrix3d m = s1 + s2 * t;
  Eigen::Matrix3d reduced;  // C1⁻¹ M, C1 = [[0,0,2],[0,−1,0],[2,0,0]]
  reduced.row(0) = 0.5 * m.row(2);
  reduced.row(1) = -m.row(1);
  reduced.row(2) = 0.5 * m.row(0);
  if (!reduced.allFinite()) return std::nullopt;

  Eigen::EigenSolver<Eigen::Matrix3d> eig(reduced);
  if (eig.info() != Eigen::Success) return std::nullopt;
  const double spectrum = eig.eigenvalues().cwiseAbs().maxCoeff();
  int best = -1;
  double best_value = 0;
  for (int k = 0; k < 3; ++k) {
    // The generalised eigenvalues are real (FPF 1999: S is positive definite); a complex pair is
    // not a candidate.
    if (std::abs(eig.eigenvalues()[k].imag()) > 1e-9 * spectrum) continue;
    const Eigen::Vector3d v = eig.eigenvectors().col(k).real();
    const double constraint = 4 * v[0] * v[2] - v[1] * v[1];  // aᵀC₁a
    if (!(constraint > 0)) continue;
    // Should two qualify through rounding, take the smaller algebraic error.
    const double value = std::abs(eig.eigenvalues()[k]);
    if (best < 0 || value < best_value) best = k, best_value = value;
  }
  if (best < 0) return std::nullopt;
  const Eigen::Vector3d a1 = eig.eigenvectors().col(best).real();
  const Eigen::Vector3d a2 = t * a1;

  const Conic local{a1[0], a1[1], a1[2], a2[0], a2[1], a2[2]};
  const std::optional<Ellipse> e = conic_to_ellipse(local);
  if (!e) return std::nullopt;

  DirectEllipseFit fit;
  fit.ellipse = {mx + scale * e->cx, mz + scale * e->cz, scale * e->a, scale * e->b, e->alpha};

  // Substitute X = (x − mx)/s, Z = (z − mz)/s and multiply through by s².
  const double A = local.A, B = local.B, C = local.C, D = local.D * scale, E = local.E * scale,
               F = local.F * scale * scale;
  Conic g{A,
          B,
          C,
          D - 2 * A * mx - B * mz,
          E - 2 * C * mz - B * mx,
          F + A * mx * mx + B * mx * mz + C * mz * mz - D * mx - E * mz};
  double norm = std::sqrt(g.A * g.A + g.B * g.B + g.C * g.C + g.D * g.D + g.E * g.E + g.F * g.F);
  if (g.A + g.C < 0) norm = -norm;
  g = {g.A / norm, g.B / norm, g.C / norm, g.D / norm, g.E / norm, g.F / norm};
  fit.conic = g;
  return fit;
}

}  // namespace soffit
