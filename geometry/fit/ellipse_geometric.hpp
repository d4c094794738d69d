#pragma once
// Geometric (orthogonal-distance) fit of a rotated ellipse: minimises the sum
// of squared distances from the points to the curve over (cx, cz, a, b, alpha).
//
// Each residual is the signed distance to the foot point found by
// closest_point_on_ellipse in the ellipse's own frame. Its gradient is
// −n·∂q/∂θ with n the outward unit normal and q the foot point at fixed
// parameter t (the foot's own movement along the curve is orthogonal to n):
// W. Gander, G. H. Golub, R. Strebel, "Least-squares fitting of circles and
// ellipses", BIT 34 (1994) 558–578 (geometric fit in parametric form);
// S. J. Ahn, W. Rauh, H.-J. Warnecke, "Least-squares orthogonal distances
// fitting of circle, sphere, ellipse, hyperbola, and parabola", Pattern
// Recognition 34 (2001) 2283–2303. Started from the direct fit
// (ellipse_direct.hpp), minimised by soffit::levenberg_marquardt, one pass over
// the points per iteration.
//
// Covariance: `jtj` is JᵀJ at the solution in the order (cx, cz, a, b, alpha);
// scale its inverse by rss / (n − 5) for first-order standard errors. Near a
// circle (a ≈ b) alpha is not determined and the solver reports it.
#include <array>
#include <optional>
#include <span>
#include <string>

#include "geometry/core/reading.hpp"
#include "geometry/fit/ellipse_conic.hpp"

namespace soffit {

struct EllipseFit {
  Ellipse ellipse;         // a ≥ b, alpha in (−π/2, π/2]
  double rss = 0.0;        // Σ (signed distance)²
  int point_count = 0;
  int iterations = 0;
  bool converged = false;  // false: the last iterate, not a minimum
  std::string message;     // the solver's verdict
  std::array<std::array<double, 5>, 5> jtj{};  // order (cx, cz, a, b, alpha)
};

// Starts from fit_ellipse_direct(points); std::nullopt when that has no ellipse
// (fewer than 5 points, collinear data, no ellipse fits).
std::optional<EllipseFit> fit_ellipse_geometric(std::span<const Point2> points);

// Starts from `start` (e.g. a previous fit or a shape's prior); std::nullopt for
// fewer than 5 points or a start with non-positive or non-finite axes.
std::optional<EllipseFit> fit_ellipse_geometric(std::span<const Point2> points,
                                                const Ellipse& start);

}  // namespace soffit
