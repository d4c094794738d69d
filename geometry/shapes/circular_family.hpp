#pragma once
// What the semicircular and segmental families share: both fit one circle
// (centre x, centre z, radius) from a Taubin start, with a closed-form
// distance whose normal-equation loop is inlined. They differ only in where
// the springing line lies, that is in their outline.
#include <cmath>

#include "geometry/fit/circle_algebraic.hpp"
#include "geometry/shapes/circle_distance.hpp"
#include "geometry/shapes/normal_equations_sum.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit {

class CircularFamily : public ShapeFamily {
 public:
  int parameter_count() const final { return 3; }

  std::optional<SolverVector> initial_guess(std::span<const Point2> points) const final {
    const auto circle = fit_circle_taubin(points);
    if (!circle) return std::nullopt;
    SolverVector p(3);
    p << circle->cx, circle->cz, circle->r;
    return p;
  }

  double signed_distance(const SolverVector& p, Point2 q, double* gradient) const final {
    if (!(p[2] > 0.0)) return std::nan("");
    return circle_signed_distance(p[0], p[1], p[2], q, gradient);
  }

  bool normal_equations(const SolverVector& p, std::span<const Point2> points,
                        std::span<const double> weights, bool want_derivatives,
                        NormalEquations& out) const final {
    if (!(p[2] > 0.0)) return false;
    const double cx = p[0], cz = p[1], r = p[2];
    const auto distance = [=](Point2 q, double* gradient) {
      return circle_signed_distance(cx, cz, r, q, gradient);
    };
    return sum_normal_equations<3>(distance, 3, points, weights, want_derivatives, out);
  }

  NamedValues reported_parameters(const SolverVector& p, const Outline&) const final {
    return {{"radius_m", p[2]}, {"centre_x_m", p[0]}, {"centre_z_m", p[1]}};
  }
};

}  // namespace soffit
