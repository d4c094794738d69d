// Semicircular: a circle whose centre lies on the springing line; span 2R, rise R.
// Parameters: centre x, springing level (= centre z), radius.
#include "geometry/fit/circle_algebraic.hpp"
#include "geometry/shapes/circle_distance.hpp"
#include "geometry/shapes/families.hpp"
#include "geometry/shapes/normal_equations_sum.hpp"

namespace soffit {
namespace {

class Semicircular final : public ShapeFamily {
 public:
  std::string_view name() const override { return "semicircular"; }
  std::string_view description() const override {
    return "circle centred on the springing line (span = 2R, rise = R)";
  }
  int parameter_count() const override { return 3; }
  int simplicity_rank() const override { return 0; }
  bool springing_from_shape() const override { return true; }

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

  std::optional<Outline> outline(const SolverVector& p, double) const override {
    if (!(p[2] > 0.0)) return std::nullopt;
    Outline o;
    o.z_springing = p[1];
    o.add({OutlinePiece::Kind::circular, p[0], p[1], p[2], 0.0, p[0] - p[2], p[0] + p[2]});
    return o;
  }

  NamedValues reported_parameters(const SolverVector& p, const Outline&) const override {
    return {{"radius_m", p[2]}, {"centre_x_m", p[0]}, {"centre_z_m", p[1]}};
  }
};

}  // namespace

const ShapeFamily& semicircular_family() {
  static const Semicircular family;
  return family;
}

}  // namespace soffit
