#include "geometry/core/reading.hpp"

namespace soffit {

std::vector<Point2> included_points(const Readings& readings) {
  std::vector<Point2> points;
  points.reserve(readings.size());
  for (const Reading& r : readings) {
    if (!r.excluded && !r.check) points.push_back({r.x, r.z});
  }
  return points;
}

}  // namespace soffit
