#pragma once
// The rough size of an arch read straight off its points, for starting values:
// mid-span and half-span from the end readings, springing level as their mean
// height, rise to the highest reading.
#include <algorithm>
#include <optional>
#include <span>

#include "geometry/core/end_readings.hpp"
#include "geometry/core/reading.hpp"

namespace soffit {

struct ArchExtent {
  double mid_x = 0.0, half_span = 0.0, springing_z = 0.0, rise = 0.0;
};

// Empty when the points have no width or no height above their ends.
inline std::optional<ArchExtent> arch_extent(std::span<const Point2> points) {
  const auto ends = find_end_readings(points);
  if (!ends) return std::nullopt;
  const Point2 lo = points[ends->first], hi = points[ends->last];
  double top = points[0].z;
  for (const Point2& p : points) top = std::max(top, p.z);
  ArchExtent e{(lo.x + hi.x) / 2.0, (hi.x - lo.x) / 2.0, end_readings_level(points), 0.0};
  e.rise = top - e.springing_z;
  if (!(e.half_span > 0.0) || !(e.rise > 0.0)) return std::nullopt;
  return e;
}

}  // namespace soffit
