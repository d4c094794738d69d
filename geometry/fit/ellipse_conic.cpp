#include "geometry/fit/ellipse_conic.hpp"

#include <cmath>
#include <numbers>

namespace soffit {

std::optional<Ellipse> conic_to_ellipse(const Conic& q) {
  double A = q.A, B = q.B, C = q.C, D = q.D, E = q.E, F = q.F;
  if (A + C < 0) {  // one sign convention: positive-definite quadratic part
    A = -A, B = -B, C = -C, D = -D, E = -E, F = -F;
  }
  const double det = 4 * A * C - B * B;  // > 0 for an ellipse
  if (!(det > 0) || !std::isfinite(det)) return std::nullopt;
  const double xc = (B * E - 2 * C * D) / det;
  const double zc = (B * D - 2 * A * E) / det;
  const double f0 = F + 0.5 * (D * xc + E * zc);  // the conic's value at the centre
  const double half_gap = 0.5 * std::hypot(A - C, B);
  const double large = 0.5 * (A + C) + half_gap;
  const double small = 0.25 * det / large;  // λ₁λ₂ = det/4, without cancellation
  if (!(small > 0) || !(f0 < 0) || !std::isfinite(f0)) return std::nullopt;

  Ellipse e;
  e.cx = xc;
  e.cz = zc;
  e.a = std::sqrt(-f0 / small);
  e.b = std::sqrt(-f0 / large);
  if (half_gap > 0) {
    // 0.5·atan2(B, A − C) is the eigenvector of the larger eigenvalue, i.e. the
    // minor axis; the major axis is a quarter turn from it.
    double alpha = 0.5 * std::atan2(B, A - C) + 0.5 * std::numbers::pi;
    if (alpha > 0.5 * std::numbers::pi) alpha -= std::numbers::pi;
    e.alpha = alpha;
  }
  if (!std::isfinite(e.a) || !std::isfinite(e.b) || !std::isfinite(e.cx) || !std::isfinite(e.cz))
    return std::nullopt;
  return e;
}

}  // namespace soffit
