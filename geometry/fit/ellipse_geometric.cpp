#include "geometry/fit/ellipse_geometric.hpp"

#include <cmath>
#include <numbers>

#include "geometry/fit/ellipse_direct.hpp"
#include "geometry/fit/ellipse_distance.hpp"
#include "geometry/solver/levenberg_marquardt.hpp"

namespace soffit {

namespace {

using Row5 = Eigen::Matrix<double, 5, 1>;
using Mat5 = Eigen::Matrix<double, 5, 5>;

// Sums the 5×5 normal equations at θ = (cx, cz, a, b, alpha) in one pass.
// The centre is (ox + p[0], oz + p[1]): see fit_ellipse_geometric.
bool ellipse_normal_equations(std::span<const Point2> points, double ox, double oz,
                              const SolverVector& p, NormalEquations& out) {
  const double cx = ox + p[0], cz = oz + p[1], a = p[2], b = p[3], alpha = p[4];
  if (!(a > 0) || !(b > 0) || !std::isfinite(alpha)) return false;
  const double c = std::cos(alpha), s = std::sin(alpha);
  Mat5 jtj = Mat5::Zero();
  Row5 jtr = Row5::Zero();
  double cost = 0;
  for (const Point2& pt : points) {
    const double dx = pt.x - cx, dz = pt.z - cz;
    const Point2 local{c * dx + s * dz, -s * dx + c * dz};  // into the ellipse's frame
    const EllipseFoot f = closest_point_on_ellipse(a, b, local);
    const double nu = f.normal.x, nv = f.normal.z;
    const double ct = f.foot.x / a, st = f.foot.z / b;  // cos t, sin t
    // dr/dθ = −n·∂q/∂θ at fixed t; q = c + R(α)(a cos t, b sin t).
    Row5 j;
    j << -(c * nu - s * nv),                     // ∂q/∂cx = (1, 0) global
        -(s * nu + c * nv),                      // ∂q/∂cz = (0, 1) global
        -nu * ct,                                // ∂q/∂a = R(α)(cos t, 0)
        -nv * st,                                // ∂q/∂b = R(α)(0, sin t)
        -(nv * f.foot.x - nu * f.foot.z);        // ∂q/∂α = R(α)(−q_v, q_u)
    const double r = f.signed_distance;
    jtj.noalias() += j * j.transpose();
    jtr.noalias() += j * r;
    cost += r * r;
  }
  out.jtj = jtj;
  out.jtr = jtr;
  out.cost = cost;
  out.residual_count = int(points.size());
  return std::isfinite(cost);
}

// a ≥ b and alpha in (−π/2, π/2], the documented form of Ellipse.
Ellipse canonical(double cx, double cz, double a, double b, double alpha) {
  constexpr double pi = std::numbers::pi;
  if (b > a) std::swap(a, b), alpha += 0.5 * pi;
  alpha = std::remainder(alpha, pi);  // now in [−π/2, π/2]
  if (alpha <= -0.5 * pi) alpha += pi;
  return {cx, cz, a, b, alpha};
}

}  // namespace

std::optional<EllipseFit> fit_ellipse_geometric(std::span<const Point2> points,
                                                const Ellipse& start) {
  if (points.size() < 5) return std::nullopt;
  if (!(start.a > 0) || !(start.b > 0) || !std::isfinite(start.a) || !std::isfinite(start.b))
    return std::nullopt;
  SolverVector x0(5);
  // The solver sees the centre as an offset from the start's, so that its
  // relative step test is measured against the axes, not against
  // national-grid coordinates.
  const double ox = start.cx, oz = start.cz;
  x0 << 0.0, 0.0, start.a, start.b, start.alpha;
  auto evaluate = [points, ox, oz](const SolverVector& p, bool, NormalEquations& out) {
    return ellipse_normal_equations(points, ox, oz, p, out);
  };
  SolverOptions options;
  // Stop on the step, not on a 1e-15 relative cost change, which leaves the
  // parameters ~3e-8 (relative) short of the minimum.
  options.relative_cost_tolerance = 0.0;
  const SolverResult result = levenberg_marquardt(evaluate, x0, options);
  if (result.status == SolverStatus::invalid_start) return std::nullopt;

  EllipseFit fit;
  const auto& p = result.params;
  fit.ellipse = canonical(ox + p[0], oz + p[1], p[2], p[3], p[4]);
  fit.rss = result.cost;
  fit.point_count = int(points.size());
  fit.iterations = result.iterations;
  fit.converged = result.ok();
  fit.message = result.message;
  // The Jacobian columns follow the solver's parameters; if canonical() swapped
  // the axes, a and b swap (and alpha shifts by a constant, same column).
  const bool swapped = p[3] > p[2];
  const int order[5] = {0, 1, swapped ? 3 : 2, swapped ? 2 : 3, 4};
  for (int i = 0; i < 5; ++i)
    for (int k = 0; k < 5; ++k) fit.jtj[i][k] = result.jtj(order[i], order[k]);
  return fit;
}

std::optional<EllipseFit> fit_ellipse_geometric(std::span<const Point2> points) {
  const auto direct = fit_ellipse_direct(points);
  if (!direct) return std::nullopt;
  return fit_ellipse_geometric(points, direct->ellipse);
}

}  // namespace soffit
