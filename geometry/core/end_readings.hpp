#pragma once
// The end readings: the readings used in a fit with the smallest and the
// largest x. When a shape does not fix its own springing line (segmental,
// parabolic) and the surveyor gave none, their mean level is the springing
// level, and their σ set that level's uncertainty.
//
// Ties (two readings at the same end x, as on a vertical skewback face): the
// first of the smallest x and the last of the largest, std::minmax_element's
// rule, so that the level and its σ always come from the same two readings.
#include <cstddef>
#include <optional>
#include <span>
#include <vector>

#include "geometry/core/reading.hpp"

namespace soffit {

struct EndReadings {
  size_t first = 0;  // index of the reading at the smallest x
  size_t last = 0;   // index of the reading at the largest x
};

// Among `points`, all of them used. Empty when there are none.
std::optional<EndReadings> find_end_readings(std::span<const Point2> points);
// Among the readings with used[i] (used.size() == readings.size()). Empty when none is used.
std::optional<EndReadings> find_end_readings(const Readings& readings, const std::vector<bool>& used);

// Mean z of the end readings among `points` (not empty).
double end_readings_level(std::span<const Point2> points);

}  // namespace soffit
