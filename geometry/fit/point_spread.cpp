#include "geometry/fit/point_spread.hpp"

#include <algorithm>
#include <cmath>

namespace soffit {

std::optional<PointSpread> point_spread(std::span<const Point2> points) {
  if (points.empty()) return std::nullopt;
  const double n = double(points.size());
  PointSpread s;
  for (const Point2& p : points) {
    s.mx += p.x;
    s.mz += p.z;
  }
  s.mx /= n;
  s.mz /= n;
  if (!std::isfinite(s.mx) || !std::isfinite(s.mz)) return std::nullopt;
  double xx = 0, zz = 0, xz = 0;
  for (const Point2& p : points) {
    const double dx = p.x - s.mx, dz = p.z - s.mz;
    xx += dx * dx;
    zz += dz * dz;
    xz += dx * dz;
  }
  xx /= n, zz /= n, xz /= n;
  s.rms = std::sqrt(xx + zz);
  if (!(s.rms > 0) || !std::isfinite(s.rms)) return std::nullopt;
  const double half_gap = std::sqrt(0.25 * (xx - zz) * (xx - zz) + xz * xz);
  const double largest = 0.5 * (xx + zz) + half_gap;
  double smallest = (xx * zz - xz * xz) / largest;  // noisy at ~1e-16·largest
  if (!(smallest > 1e-12 * largest)) {
    // Recompute across the principal direction, whose angle is well
    // conditioned precisely when one spread dominates.
    const double theta = 0.5 * std::atan2(2 * xz, xx - zz);
    const double c = std::cos(theta), sn = std::sin(theta);
    smallest = 0;
    for (const Point2& p : points) {
      const double off = -sn * (p.x - s.mx) + c * (p.z - s.mz);
      smallest += off * off;
    }
    smallest /= n;
  }
  s.along = std::sqrt(largest);
  s.across = std::sqrt(std::max(0.0, smallest));
  return s;
}

bool is_collinear(const PointSpread& spread, double relative) {
  return !(spread.across > relative * spread.along);
}

}  // namespace soffit
