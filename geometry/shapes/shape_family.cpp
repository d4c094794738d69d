#include "geometry/shapes/shape_family.hpp"

#include "geometry/core/numeric_derivative.hpp"
#include "geometry/shapes/normal_equations_sum.hpp"

namespace soffit {

double distance_with_gradient(const ShapeFamily& family, const SolverVector& params, Point2 p,
                              double* gradient) {
  if (!gradient || family.has_analytic_gradient()) return family.signed_distance(params, p, gradient);
  // The distance to an arch of pieces has kinks (at the springings, where the
  // curve ends), and a central difference blends the two sides within one step
  // of a kink: the fit settles no closer than about one step, so this step is
  // well below ∛ε, as small as rounding allows (≈ ε·5 m / 5e-7 m ≈ 2e-9 in the
  // gradient, far below what the fit needs). With ∛ε a noise-free
  // three-centred arch is recovered only to ~2e-7 m.
  constexpr double kRelativeStep = 1e-7;
  const double d = family.signed_distance(params, p, nullptr);
  numeric_gradient([&](const SolverVector& q) { return family.signed_distance(q, p, nullptr); }, params, d,
                   gradient, kRelativeStep);
  return d;
}

Point2 distance_gradient_at_point(const ShapeFamily& family, const SolverVector& params, Point2 p) {
  const double d = family.signed_distance(params, p, nullptr);
  return {numeric_derivative([&](double x) { return family.signed_distance(params, {x, p.z}, nullptr); }, p.x, d),
          numeric_derivative([&](double z) { return family.signed_distance(params, {p.x, z}, nullptr); }, p.z, d)};
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
