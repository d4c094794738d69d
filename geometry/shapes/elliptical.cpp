// Semi-elliptical: z = z_s + b·√(1 − ((x − x_c)/a)²), horizontal and vertical
// axes, centre on the springing line; span 2a, rise b.
// Parameters: centre x, springing level (= centre z), semi-axis a along x, b along z.
#include <algorithm>
#include <cmath>
#include <numbers>

#include "geometry/fit/ellipse_direct.hpp"
#include "geometry/fit/ellipse_distance.hpp"
#include "geometry/shapes/arch_extent.hpp"
#include "geometry/shapes/families.hpp"

namespace soffit {
namespace {

class Elliptical final : public ShapeFamily {
 public:
  std::string_view name() const override { return "elliptical"; }
  std::string_view description() const override {
    return "semi-ellipse with axes horizontal and vertical, centre on the springing line";
  }
  int parameter_count() const override { return 4; }
  int simplicity_rank() const override { return 3; }
  bool springing_from_shape() const override { return true; }

  std::optional<SolverVector> initial_guess(std::span<const Point2> points) const override {
    if (points.size() < 4) return std::nullopt;
    SolverVector p(4);
    // The direct conic fit, when it finds a nearly upright ellipse, starts closest.
    if (const auto direct = fit_ellipse_direct(points)) {
      const Ellipse& e = direct->ellipse;
      const double tilt = std::abs(e.alpha);
      if (tilt < 0.2) {
        p << e.cx, e.cz, e.a, e.b;
        return p;
      }
      if (std::abs(tilt - std::numbers::pi / 2) < 0.2) {
        p << e.cx, e.cz, e.b, e.a;
        return p;
      }
    }
    const auto e = arch_extent(points);
    if (!e) return std::nullopt;
    p << e->mid_x, e->springing_z, e->half_span, e->rise;
    return p;
  }

  double signed_distance(const SolverVector& p, Point2 q, double* gradient) const override {
    const double a = p[2], b = p[3];
    if (!(a > 0.0) || !(b > 0.0)) return std::nan("");
    const EllipseFoot f = closest_point_on_ellipse(a, b, {q.x - p[0], q.z - p[1]});
    if (gradient) {
      // ∂d/∂θ = −n·∂q/∂θ at the fixed foot parameter t.
      gradient[0] = -f.normal.x;
      gradient[1] = -f.normal.z;
      gradient[2] = -f.normal.x * std::cos(f.t);
      gradient[3] = -f.normal.z * std::sin(f.t);
    }
    return f.signed_distance;
  }

  std::optional<Outline> outline(const SolverVector& p, double) const override {
    if (!(p[2] > 0.0) || !(p[3] > 0.0)) return std::nullopt;
    Outline o;
    o.z_springing = p[1];
    o.add({OutlinePiece::Kind::elliptical, p[0], p[1], p[2], p[3], p[0] - p[2], p[0] + p[2]});
    return o;
  }

  NamedValues reported_parameters(const SolverVector& p, const Outline&) const override {
    return {{"semi_axis_x_m", p[2]}, {"semi_axis_z_m", p[3]}, {"centre_x_m", p[0]}, {"centre_z_m", p[1]}};
  }
};

}  // namespace

const ShapeFamily& elliptical_family() {
  static const Elliptical family;
  return family;
}

}  // namespace soffit
