#pragma once
// The rough size of an arch read straight off its points, for starting values:
// mid-span and half-span from the end readings, springing level as their mean
// height, rise to the highest reading.
#include <algorithm>
#include <optional>
#include <span>

#include "geometry/core/reading.hpp"

namespace soffit {

struct ArchExtent {
  double mid_x = 0.0, half_span = 0.0, springing_z = 0.0, rise = 0.0;
};

// Empty when the points have no width or no height above their ends.
inline std::optional<ArchExtent> arch_extent(std::span<const Point2> points) {
  if (points.empty()) return std::nullopt;
  const auto [lo, hi] = std::minmax_element(points.begin(), points.end(),
                                            [](Point2 a, Point2 b) { return a.x < b.x; });
  double top = points[0].z;
  for (const Point2& p : points) top = std::max(top, p.z);
  ArchExtent e{(lo->x + hi->x) / 2.0, (hi->x - lo->x) / 2.0, (lo->z + hi->z) / 2.0, 0.0};
  e.rise = top - e.springing_z;
  if (!(e.half_span > 0.0) || !(e.rise > 0.0)) return std::nullopt;
  return e;
}

}  // namespace soffit
