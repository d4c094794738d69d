#pragma once
// Signed distance to a full circle and its gradient, shared by the circular families.
#include <cmath>

#include "geometry/core/reading.hpp"

namespace soffit {

// d = |p − c| − r; gradient with respect to (cx, cz, r) when `gradient` is not null.
inline double circle_signed_distance(double cx, double cz, double r, Point2 p, double* gradient) {
  const double dx = p.x - cx, dz = p.z - cz;
  // sqrt rather than hypot: arch coordinates are far from overflow, and hypot
  // costs several times as much in the Monte Carlo loop.
  const double rho = std::sqrt(dx * dx + dz * dz);
  if (gradient) {
    const double inv = rho > 0.0 ? 1.0 / rho : 0.0;
    gradient[0] = -dx * inv;
    gradient[1] = -dz * inv;
    gradient[2] = -1.0;
  }
  return rho - r;
}

}  // namespace soffit
