#pragma once
// Closest point on an axis-aligned ellipse to a point: the inner loop of the
// orthogonal-distance fits of elliptical arches.
//
// The ellipse is centred at the origin with semi-axis a along x and b along z
// (either may be the larger). Method: D. Eberly, "Distance from a Point to an
// Ellipse, an Ellipsoid, or a Hyperellipsoid" (Geometric Tools, 2013): reflect
// into the first quadrant, put the larger axis first, and find the root s of
//   F(s) = (r₀z₀/(s + r₀))² + (z₁/(s + 1))² − 1,  r₀ = (e₀/e₁)², zᵢ = yᵢ/eᵢ,
// which is convex and decreasing on its bracket. Eberly bisects; here each
// iteration takes a Newton step from the left end of the bracket (monotone by
// convexity, quadratic near the root) plus a bisection step when Newton gains
// less than half the bracket, so points near a vertex or the centre stay fast.
// Points on an axis, at the centre and circles (a = b) take closed forms.
#include "geometry/core/reading.hpp"

namespace soffit {

struct EllipseFoot {
  Point2 foot;             // closest point on the ellipse
  double t = 0.0;          // foot = (a cos t, b sin t), t in (−π, π]
  double signed_distance = 0.0;  // |p − foot|, positive outside the ellipse
  Point2 normal;           // outward unit normal at the foot
};

// a > 0 and b > 0 are the caller's responsibility (fits refuse other steps).
EllipseFoot closest_point_on_ellipse(double a, double b, Point2 p);

}  // namespace soffit
