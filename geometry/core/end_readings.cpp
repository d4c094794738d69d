#include "geometry/core/end_readings.hpp"

namespace soffit {

namespace {

// x_of(i) for i in [0, n) where use(i); ties as documented in the header.
template <class XOf, class Use>
std::optional<EndReadings> find_ends(size_t n, const XOf& x_of, const Use& use) {
  std::optional<EndReadings> ends;
  for (size_t i = 0; i < n; ++i) {
    if (!use(i)) continue;
    if (!ends) {
      ends = EndReadings{i, i};
      continue;
    }
    if (x_of(i) < x_of(ends->first)) ends->first = i;
    if (!(x_of(i) < x_of(ends->last))) ends->last = i;
  }
  return ends;
}

}  // namespace

std::optional<EndReadings> find_end_readings(std::span<const Point2> points) {
  return find_ends(
      points.size(), [&](size_t i) { return points[i].x; }, [](size_t) { return true; });
}

std::optional<EndReadings> find_end_readings(const Readings& readings, const std::vector<bool>& used) {
  return find_ends(
      readings.size(), [&](size_t i) { return readings[i].x; }, [&](size_t i) { return bool(used[i]); });
}

double end_readings_level(std::span<const Point2> points) {
  const EndReadings ends = *find_end_readings(points);
  return (points[ends.first].z + points[ends.last].z) / 2.0;
}

}  // namespace soffit
