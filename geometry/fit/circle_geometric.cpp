#include "geometry/fit/circle_geometric.hpp"

#include <algorithm>
#include <cmath>
#include <vector>

#include "geometry/fit/circle_algebraic.hpp"
#include "geometry/solver/levenberg_marquardt.hpp"

namespace soffit {

namespace {

// Running sums of one pass. With u = (p − c)/d the unit radial direction and
// r = d − R, the Jacobian row is −(uₓ, u_z, 1), so
//   JᵀWJ = Σw [uₓ² uₓu_z uₓ; · u_z² u_z; · · 1],  JᵀWr = −Σw r (uₓ, u_z, 1).
struct CircleSums {
  double uxux = 0, uxuz = 0, uzuz = 0, ux = 0, uz = 0, w = 0;
  double rux = 0, ruz = 0, r = 0, rr = 0;

  void add(const CircleSums& o) {
    uxux += o.uxux; uxuz += o.uxuz; uzuz += o.uzuz; ux += o.ux; uz += o.uz; w += o.w;
    rux += o.rux; ruz += o.ruz; r += o.r; rr += o.rr;
  }
};

// Points are summed in blocks whose partial sums are then added: the rounding
// error grows with the block count, not the point count (10⁶ points).
constexpr std::size_t kBlock = 512;

template <bool Weighted>
CircleSums pass(std::span<const Point2> points, std::span<const double> weights, double cx,
                double cz, double radius) {
  CircleSums total;
  for (std::size_t start = 0; start < points.size(); start += kBlock) {
    const std::size_t end = std::min(points.size(), start + kBlock);
    CircleSums s;
    for (std::size_t i = start; i < end; ++i) {
      const double dx = points[i].x - cx, dz = points[i].z - cz;
      const double d = std::sqrt(dx * dx + dz * dz);
      // A point exactly at the centre has no radial direction; any unit vector
      // is a valid subgradient, and zero keeps it out of the centre rows.
      const double inv = d > 0 ? 1.0 / d : 0.0;
      const double ux = dx * inv, uz = dz * inv, r = d - radius;
      const double w = Weighted ? weights[i] : 1.0;
      const double wux = w * ux, wuz = w * uz, wr = w * r;
      s.uxux += wux * ux; s.uxuz += wux * uz; s.uzuz += wuz * uz;
      s.ux += wux; s.uz += wuz; s.w += w;
      s.rux += wr * ux; s.ruz += wr * uz; s.r += wr; s.rr += wr * r;
    }
    total.add(s);
  }
  return total;
}

}  // namespace

std::optional<CircleFit> fit_circle_geometric(std::span<const Point2> points,
                                              std::span<const double> weights,
                                              const CircleFitOptions& options) {
  const bool weighted = !weights.empty();
  if (weighted && weights.size() != points.size()) return std::nullopt;
  int used = int(points.size());
  if (weighted) {
    used = 0;
    for (double w : weights) {
      if (!(w >= 0) || !std::isfinite(w)) return std::nullopt;
      used += w > 0;
    }
  }
  if (used < 3) return std::nullopt;
  // Zero-weight points take no part in the fit, so neither in its start.
  std::optional<Circle> start;
  if (used == int(points.size())) {
    start = fit_circle_taubin(points);
  } else {
    std::vector<Point2> kept;
    kept.reserve(std::size_t(used));
    for (std::size_t i = 0; i < points.size(); ++i)
      if (weights[i] > 0) kept.push_back(points[i]);
    start = fit_circle_taubin(kept);
  }
  if (!start) return std::nullopt;

  // The solver works on the centre's offset from Taubin's: its relative step
  // test then measures against the radius, not against national-grid
  // coordinates (1e-12 × 1e6 m would stop at a micrometre).
  const double ox = start->cx, oz = start->cz;
  auto evaluate = [&](const SolverVector& p, bool, NormalEquations& out) {
    if (!(p[2] > 0)) return false;  // a radius must be positive
    const double cx = ox + p[0], cz = oz + p[1];
    const CircleSums s = weighted ? pass<true>(points, weights, cx, cz, p[2])
                                  : pass<false>(points, weights, cx, cz, p[2]);
    out.jtj.resize(3, 3);
    out.jtj << s.uxux, s.uxuz, s.ux,  //
        s.uxuz, s.uzuz, s.uz,         //
        s.ux, s.uz, s.w;
    out.jtr.resize(3);
    out.jtr << -s.rux, -s.ruz, -s.r;
    out.cost = s.rr;
    out.residual_count = used;
    return std::isfinite(s.rr);
  };

  SolverVector x0(3);
  x0 << 0.0, 0.0, start->r;
  SolverOptions solver_options;
  solver_options.max_iterations = options.max_iterations;
  // A relative cost change of 1e-15 is reached while the parameters are still
  // ~sqrt(1e-15) ≈ 3e-8 (relative) from the minimum: stop on the step instead.
  solver_options.relative_cost_tolerance = 0.0;
  // Taubin's start is within O(σ²/R) of the minimum, where Gauss–Newton is
  // safe; the default damping would slow the flat-arch direction (the centre
  // height against the radius) for several passes over the points.
  solver_options.initial_damping = 1e-9;
  const SolverResult result = levenberg_marquardt(evaluate, x0, solver_options);
  if (result.status == SolverStatus::invalid_start) return std::nullopt;

  CircleFit fit;
  fit.circle = {ox + result.params[0], oz + result.params[1], result.params[2]};
  fit.rss = result.cost;
  fit.point_count = used;
  fit.iterations = result.iterations;
  fit.converged = result.ok();
  fit.message = result.message;
  for (int i = 0; i < 3; ++i)
    for (int j = 0; j < 3; ++j) fit.jtj[i][j] = result.jtj(i, j);
  return fit;
}

}  // namespace soffit
