#pragma once
// Σ w JᵀJ, Σ w Jᵀd and Σ w d² over a point set, for any signed-distance
// function. A template so that a family with a cheap closed-form distance (the
// circular ones) gets it inlined into the loop, with the parameter count a
// compile-time constant: in a Monte Carlo run this loop is nearly all the work.
#include <cmath>
#include <span>

#include "geometry/core/reading.hpp"
#include "geometry/solver/levenberg_marquardt.hpp"

namespace soffit {

// `distance(p, gradient)` returns the signed distance and writes its gradient
// when `gradient` is not null. N > 0 fixes the parameter count at compile time.
template <int N, class Distance>
bool sum_normal_equations(const Distance& distance, int parameter_count, std::span<const Point2> points,
                          std::span<const double> weights, bool want_derivatives, NormalEquations& ne) {
  const int n = N > 0 ? N : parameter_count;
  double gradient[kMaxSolverParameters];
  double jtj[kMaxSolverParameters][kMaxSolverParameters] = {};
  double jtr[kMaxSolverParameters] = {};
  double cost = 0.0;
  int count = 0;
  for (size_t i = 0; i < points.size(); ++i) {
    const double w = weights[i];
    if (w <= 0.0) continue;
    const double d = distance(points[i], want_derivatives ? gradient : nullptr);
    if (!std::isfinite(d)) return false;
    cost += w * d * d;
    ++count;
    if (want_derivatives) {
      for (int a = 0; a < n; ++a) {
        const double wg = w * gradient[a];
        jtr[a] += wg * d;
        for (int b = 0; b <= a; ++b) jtj[a][b] += wg * gradient[b];
      }
    }
  }
  ne.cost = cost;
  ne.residual_count = count;
  if (want_derivatives) {
    ne.jtj.resize(n, n);
    ne.jtr.resize(n);
    for (int a = 0; a < n; ++a) {
      ne.jtr[a] = jtr[a];
      for (int b = 0; b <= a; ++b) ne.jtj(a, b) = ne.jtj(b, a) = jtj[a][b];
    }
  }
  return true;
}

}  // namespace soffit
