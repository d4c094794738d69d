// Three-centred (basket handle): two haunch arcs of radius r₁ centred on the
// springing line, and a crown arc of radius R tangent to both:
//   R = [(L/2 − r₁)² + r² − r₁²] / [2(r − r₁)]
// Parameters: mid-span x, springing level, half-span h = L/2, rise r, r₁.
#include <algorithm>
#include <cmath>

#include "geometry/shapes/arc_segment.hpp"
#include "geometry/shapes/arch_extent.hpp"
#include "geometry/shapes/families.hpp"

namespace soffit {
namespace {

class ThreeCentred final : public ShapeFamily {
 public:
  std::string_view name() const override { return "three-centred"; }
  std::string_view description() const override {
    return "crown arc tangent to two haunch arcs centred on the springing line";
  }
  int parameter_count() const override { return 5; }
  int simplicity_rank() const override { return 5; }
  bool springing_from_shape() const override { return true; }
  bool has_analytic_gradient() const override { return false; }

  static double crown_radius(double h, double rise, double r1) {
    return ((h - r1) * (h - r1) + rise * rise - r1 * r1) / (2.0 * (rise - r1));
  }

  std::optional<SolverVector> initial_guess(std::span<const Point2> points) const override {
    if (points.size() < 5) return std::nullopt;
    const auto e = arch_extent(points);
    if (!e) return std::nullopt;
    const double h = e->half_span, rise = e->rise;
    // The haunch radius is the least obvious parameter: try a few and keep the best.
    std::optional<SolverVector> best;
    double best_cost = INFINITY;
    for (double f : {0.2, 0.35, 0.5, 0.65, 0.8}) {
      SolverVector p(5);
      const double r = std::min(rise, 0.999 * h);
      p << e->mid_x, e->springing_z, h, r, f * std::min(h, r);
      const auto o = outline(p, 0.0);
      if (!o) continue;
      double cost = 0.0;
      for (const Point2& q : points) {
        const double d = outline_signed_distance(*o, q);
        cost += d * d;
      }
      if (cost < best_cost) {
        best_cost = cost;
        best = p;
      }
    }
    return best;
  }

  double signed_distance(const SolverVector& p, Point2 q, double*) const override {
    const auto o = outline(p, 0.0);
    if (!o) return std::nan("");
    return outline_signed_distance(*o, q);
  }

  std::optional<Outline> outline(const SolverVector& p, double) const override {
    const double xm = p[0], zs = p[1], h = p[2], rise = p[3], r1 = p[4];
    // A basket-handle arch rises no higher than its half-span: beyond that the
    // crown centre climbs above the springing and the arcs no longer meet.
    if (!(h > 0.0) || !(r1 > 0.0) || !(r1 < h) || !(r1 < rise) || !(rise <= h)) return std::nullopt;
    const double big_r = crown_radius(h, rise, r1);
    if (!(big_r > r1) || !std::isfinite(big_r)) return std::nullopt;
    const double ccz = zs + rise - big_r;  // crown centre height
    // Tangent point: on the line from the crown centre through the haunch centre.
    const double hx = xm - h + r1;
    const double ux = (hx - xm) / (big_r - r1);
    const double tx = hx + r1 * ux;
    if (!(tx > xm - h) || !(tx < xm)) return std::nullopt;
    Outline o;
    o.z_springing = zs;
    o.add({OutlinePiece::Kind::circular, hx, zs, r1, 0.0, xm - h, tx});
    o.add({OutlinePiece::Kind::circular, xm, ccz, big_r, 0.0, tx, 2.0 * xm - tx});
    o.add({OutlinePiece::Kind::circular, xm + h - r1, zs, r1, 0.0, 2.0 * xm - tx, xm + h});
    return o;
  }

  NamedValues reported_parameters(const SolverVector& p, const Outline& o) const override {
    return {{"radius_crown_m", o.pieces[1].a},
            {"radius_haunch_m", p[4]},
            {"crown_centre_z_m", o.pieces[1].cz},
            {"haunch_centre_left_x_m", o.pieces[0].cx},
            {"haunch_centre_right_x_m", o.pieces[2].cx},
            {"springing_z_m", p[1]}};
  }
};

}  // namespace

const ShapeFamily& three_centred_family() {
  static const ThreeCentred family;
  return family;
}

}  // namespace soffit
