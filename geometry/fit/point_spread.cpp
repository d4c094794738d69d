#include "geometry/fit/point_spread.hpp"

#include <Eigen/Core>
#include <algorithm>
#include <cmath>

namespace soffit {

namespace {

// Four points per step in Eigen::Array4d lanes (SIMD on any target): these
// passes start every fit of a 10⁶-point scan. `add(x, z, keep)` gets keep = 1
// for real points and 0 for the padding lanes of the last 1–3 points.
using Lane = Eigen::Array4d;
template <class Add>
void for_each_lane(std::span<const Point2> points, Add&& add) {
  std::size_t i = 0;
  for (; i + 4 <= points.size(); i += 4) {
    const Point2* p = &points[i];
    add(Lane(p[0].x, p[1].x, p[2].x, p[3].x), Lane(p[0].z, p[1].z, p[2].z, p[3].z), Lane::Ones());
  }
  for (; i < points.size(); ++i)
    add(Lane::Constant(points[i].x), Lane::Constant(points[i].z), Lane(1, 0, 0, 0));
}

}  // namespace

std::optional<Point2> centroid(std::span<const Point2> points) {
  if (points.empty()) return std::nullopt;
  Lane sx = Lane::Zero(), sz = Lane::Zero();
  for_each_lane(points, [&](const Lane& x, const Lane& z, const Lane& keep) {
    sx += x * keep;
    sz += z * keep;
  });
  const Point2 c{sx.sum() / double(points.size()), sz.sum() / double(points.size())};
  if (!std::isfinite(c.x) || !std::isfinite(c.z)) return std::nullopt;
  return c;
}

std::optional<PointSpread> point_spread(std::span<const Point2> points) {
  const auto c = centroid(points);
  if (!c) return std::nullopt;
  Lane lxx = Lane::Zero(), lzz = Lane::Zero(), lxz = Lane::Zero();
  for_each_lane(points, [&](const Lane& x, const Lane& z, const Lane& keep) {
    const Lane dx = (x - c->x) * keep, dz = (z - c->z) * keep;
    lxx += dx * dx;
    lzz += dz * dz;
    lxz += dx * dz;
  });
  const double n = double(points.size());
  return point_spread(points, *c, lxx.sum() / n, lzz.sum() / n, lxz.sum() / n);
}

std::optional<PointSpread> point_spread(std::span<const Point2> points, Point2 centroid,
                                        double xx, double zz, double xz) {
  PointSpread s;
  s.mx = centroid.x;
  s.mz = centroid.z;
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
    smallest /= double(points.size());
  }
  s.along = std::sqrt(largest);
  s.across = std::sqrt(std::max(0.0, smallest));
  return s;
}

bool is_collinear(const PointSpread& spread, double relative) {
  return !(spread.across > relative * spread.along);
}

}  // namespace soffit
