// Segmental: a circular arc whose centre lies below the springing line. The
// springing line is not part of the shape: it is the level of the end readings
// or the level the surveyor gives. R = (L²/4 + r²)/(2r).
// Parameters: centre x, centre z, radius.
#include <cmath>

#include "geometry/fit/circle_algebraic.hpp"
#include "geometry/shapes/circle_distance.hpp"
#include "geometry/shapes/families.hpp"
#include "geometry/shapes/normal_equations_sum.hpp"

namespace soffit {
namespace {

class Segmental final : public ShapeFamily {
 public:
  std::string_view name() const override { return "segmental"; }
  std::string_view description() const override {
    return "circular arc cut by the springing line (centre below it)";
  }
  int parameter_count() const override { return 3; }
  int simplicity_rank() const override { return 1; }
  bool springing_from_shape() const override { return false; }

  std::optional<SolverVector> initial_guess(std::span<const Point2> points) const override {
    const auto circle = fit_circle_taubin(points);
    if (!circle) return std::nullopt;
    SolverVector p(3);
    p << circle->cx, circle->cz, circle->r;
    return p;
  }

  double signed_distance(const SolverVector& p, Point2 q, double* gradient) const override {
    if (!(p[2] > 0.0)) return std::nan("");
    return circle_signed_distance(p[0], p[1], p[2], q, gradient);
  }

  bool normal_equations(const SolverVector& p, std::span<const Point2> points,
                        std::span<const double> weights, bool want_derivatives,
                        NormalEquations& out) const override {
    if (!(p[2] > 0.0)) return false;
    const double cx = p[0], cz = p[1], r = p[2];
    const auto distance = [=](Point2 q, double* gradient) {
      return circle_signed_distance(cx, cz, r, q, gradient);
    };
    return sum_normal_equations<3>(distance, 3, points, weights, want_derivatives, out);
  }

  std::optional<Outline> outline(const SolverVector& p, double springing_z) const override {
    // The springing line must lie above the centre (or on it): below it the
    // arc is more than a semicircle (horseshoe), which this family does not describe.
    const double dz = springing_z - p[1];
    if (!(p[2] > 0.0) || !(dz >= 0.0) || !(dz < p[2])) return std::nullopt;
    const double half_chord = std::sqrt(p[2] * p[2] - dz * dz);
    Outline o;
    o.z_springing = springing_z;
    o.add({OutlinePiece::Kind::circular, p[0], p[1], p[2], 0.0, p[0] - half_chord,
           p[0] + half_chord});
    return o;
  }

  NamedValues reported_parameters(const SolverVector& p, const Outline&) const override {
    return {{"radius_m", p[2]}, {"centre_x_m", p[0]}, {"centre_z_m", p[1]}};
  }
};

}  // namespace

const ShapeFamily& segmental_family() {
  static const Segmental family;
  return family;
}

}  // namespace soffit
