#include "geometry/fit/circle_geometric.hpp"

#include <Eigen/Core>
#include <algorithm>
#include <cmath>
#include <limits>
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

// One fused loop, four points at a time in Eigen::Array4d lanes (SIMD packets
// on SSE2, AVX or NEON: the square roots and divisions run packed, and the
// lane sums are a reassociation we choose, so no compiler flag is needed).
// Partial sums are flushed per block, so rounding grows with the block count,
// not the point count (10⁶ points).
using Lane = Eigen::Array4d;
constexpr std::size_t kBlock = 256;

struct LaneSums {
  Lane uxux = Lane::Zero(), uxuz = Lane::Zero(), uzuz = Lane::Zero(), ux = Lane::Zero(),
       uz = Lane::Zero(), w = Lane::Zero(), rux = Lane::Zero(), ruz = Lane::Zero(),
       r = Lane::Zero(), rr = Lane::Zero();
  CircleSums total() const {
    return {uxux.sum(), uxuz.sum(), uzuz.sum(), ux.sum(), uz.sum(),
            w.sum(),    rux.sum(),  ruz.sum(),  r.sum(),  rr.sum()};
  }
};

// Adds four points (w: their weights, or all 1 when !Weighted). A point exactly
// at the centre has no radial direction; dividing by max(d, DBL_MIN) gives it
// u = 0, a valid subgradient that keeps it out of the centre rows.
template <bool Weighted>
EIGEN_ALWAYS_INLINE void add_lane(LaneSums& s, const Lane& x, const Lane& z, const Lane& w,
                                  double cx, double cz, double radius) {
  const Lane dx = x - cx, dz = z - cz;
  const Lane d = (dx * dx + dz * dz).sqrt();
  const Lane inv = d.max(std::numeric_limits<double>::min()).inverse();
  const Lane ux = dx * inv, uz = dz * inv, r = d - radius;
  if constexpr (Weighted) {
    const Lane wux = w * ux, wuz = w * uz, wr = w * r;
    s.uxux += wux * ux;
    s.uxuz += wux * uz;
    s.uzuz += wuz * uz;
    s.ux += wux;
    s.uz += wuz;
    s.w += w;
    s.rux += wr * ux;
    s.ruz += wr * uz;
    s.r += wr;
    s.rr += wr * r;
  } else {
    s.uxux += ux * ux;
    s.uxuz += ux * uz;
    s.uzuz += uz * uz;
    s.ux += ux;
    s.uz += uz;
    s.rux += r * ux;
    s.ruz += r * uz;
    s.r += r;
    s.rr += r * r;
  }
}

template <bool Weighted>
CircleSums pass(std::span<const Point2> points, std::span<const double> weights, double cx,
                double cz, double radius) {
  CircleSums total;
  const std::size_t n = points.size();
  const Lane ones = Lane::Ones();
  for (std::size_t start = 0; start < n; start += kBlock) {
    const std::size_t end = std::min(n, start + kBlock);
    LaneSums s;
    std::size_t i = start;
    for (; i + 4 <= end; i += 4) {
      const Point2* p = &points[i];
      const Lane x(p[0].x, p[1].x, p[2].x, p[3].x), z(p[0].z, p[1].z, p[2].z, p[3].z);
      if constexpr (Weighted) {
        add_lane<true>(s, x, z, Lane(weights[i], weights[i + 1], weights[i + 2], weights[i + 3]),
                       cx, cz, radius);
      } else {
        add_lane<false>(s, x, z, ones, cx, cz, radius);
      }
    }
    CircleSums block = s.total();
    if constexpr (!Weighted) block.w = double(i - start);
    for (; i < end; ++i) {  // the block's last 0–3 points, in lane 0 with zero weight elsewhere
      const double w = Weighted ? weights[i] : 1.0;
      LaneSums tail;
      add_lane<true>(tail, Lane::Constant(points[i].x), Lane::Constant(points[i].z),
                     Lane(w, 0, 0, 0), cx, cz, radius);
      block.add(tail.total());
    }
    total.add(block);
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
