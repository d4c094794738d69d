// Pointed (two-centred): two arcs of radius ρ, each centred on the springing
// line at distance ρ from its own springing, meeting at the crown.
// Crown height √(ρL − L²/4); equilateral when ρ = L; semicircular when ρ = L/2.
// ρ < L/2 is outside the family (the arcs would cross and dip at the crown).
// Parameters: mid-span x, springing level, half-span h = L/2, radius ρ.
#include <algorithm>
#include <cmath>

#include "geometry/shapes/arc_segment.hpp"
#include "geometry/shapes/arch_extent.hpp"
#include "geometry/shapes/families.hpp"

namespace soffit {
namespace {

class Pointed final : public ShapeFamily {
 public:
  std::string_view name() const override { return "pointed"; }
  std::string_view description() const override {
    return "two-centred arch, centres on the springing line";
  }
  int parameter_count() const override { return 4; }
  int simplicity_rank() const override { return 4; }
  bool springing_from_shape() const override { return true; }
  bool has_analytic_gradient() const override { return false; }

  std::optional<SolverVector> initial_guess(std::span<const Point2> points) const override {
    if (points.size() < 4) return std::nullopt;
    const auto e = arch_extent(points);
    if (!e) return std::nullopt;
    const double h = e->half_span, rise = e->rise;
    SolverVector p(4);
    // ρ from the crown height, but never below h: ρ < L/2 would cross the centres.
    p << e->mid_x, e->springing_z, h, std::max((rise * rise + h * h) / (2.0 * h), 1.001 * h);
    return p;
  }

  double signed_distance(const SolverVector& p, Point2 q, double*) const override {
    const auto o = outline(p, 0.0);
    if (!o) return std::nan("");
    return outline_signed_distance(*o, q);
  }

  std::optional<Outline> outline(const SolverVector& p, double) const override {
    const double xm = p[0], zs = p[1], h = p[2], rho = p[3];
    // ρ = h is the semicircle; ρ < h would cross the centres and dip at the crown.
    if (!(h > 0.0) || !(rho >= h)) return std::nullopt;
    Outline o;
    o.z_springing = zs;
    o.add({OutlinePiece::Kind::circular, xm - h + rho, zs, rho, 0.0, xm - h, xm});
    o.add({OutlinePiece::Kind::circular, xm + h - rho, zs, rho, 0.0, xm, xm + h});
    return o;
  }

  NamedValues reported_parameters(const SolverVector& p, const Outline&) const override {
    return {{"radius_m", p[3]},
            {"centre_left_x_m", p[0] - p[2] + p[3]},
            {"centre_right_x_m", p[0] + p[2] - p[3]},
            {"centre_z_m", p[1]}};
  }
};

}  // namespace

const ShapeFamily& pointed_family() {
  static const Pointed family;
  return family;
}

}  // namespace soffit
