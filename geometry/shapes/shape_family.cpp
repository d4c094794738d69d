#include "geometry/shapes/shape_family.hpp"

#include <algorithm>
#include <cmath>

#include "geometry/shapes/normal_equations_sum.hpp"

namespace soffit {

double distance_with_gradient(const ShapeFamily& family, const SolverVector& params, Point2 p,
                              double* gradient) {
  if (!gradient || family.has_analytic_gradient()) return family.signed_distance(params, p, gradient);
  const double d = family.signed_distance(params, p, nullptr);
  SolverVector q = params;
  for (Eigen::Index j = 0; j < params.size(); ++j) {
    const double h = 1e-7 * std::max(1.0, std::abs(params[j]));
    q[j] = params[j] + h;
    const double up = family.signed_distance(q, p, nullptr);
    q[j] = params[j] - h;
    const double down = family.signed_distance(q, p, nullptr);
    q[j] = params[j];
    if (std::isfinite(up) && std::isfinite(down))
      gradient[j] = (up - down) / (2 * h);
    else if (std::isfinite(up))
      gradient[j] = (up - d) / h;
    else
      gradient[j] = (d - down) / h;
  }
  return d;
}

bool ShapeFamily::normal_equations(const SolverVector& params, std::span<const Point2> points,
                                   std::span<const double> weights, bool want_derivatives,
                                   NormalEquations& out) const {
  const auto distance = [this, &params](Point2 p, double* gradient) {
    return distance_with_gradient(*this, params, p, gradient);
  };
  const int n = static_cast<int>(params.size());
  switch (n) {
    case 3: return sum_normal_equations<3>(distance, n, points, weights, want_derivatives, out);
    case 4: return sum_normal_equations<4>(distance, n, points, weights, want_derivatives, out);
    case 5: return sum_normal_equations<5>(distance, n, points, weights, want_derivatives, out);
    default: return sum_normal_equations<0>(distance, n, points, weights, want_derivatives, out);
  }
}

}  // namespace soffit
