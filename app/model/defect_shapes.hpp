#pragma once
// The measured facts of a drawn defect and the geometry the defects view
// needs to draw and pick it: polyline length, polygon area (shoelace),
// distance to a path, inside a ring, and thinning a finger's stroke.
// Pure computation in the plane of the defect's frame, (s, y) or (x, z) in
// metres (or pixels: nothing here cares about units). No UI, no storage.
#include <utility>
#include <vector>

namespace soffit::app {

using PlanePoint = std::pair<double, double>;
using PlanePath = std::vector<PlanePoint>;

// Sum of the straight pieces between successive points; 0 for fewer than 2.
double path_length(const PlanePath& path);

// Area enclosed by the ring (the closing edge back to the first point is
// implied), by the shoelace formula; positive whichever way it runs. A ring
// that crosses itself gives the net of its loops. 0 for fewer than 3 points.
double shoelace_area(const PlanePath& ring);

// Shortest distance from `p` to the path (to the ring, closing edge
// included, when `closed`). A single point: the distance to it.
double distance_to_path(PlanePoint p, const PlanePath& path, bool closed);

// Whether `p` lies inside the ring (even-odd rule; on an edge counts either way).
bool inside_ring(PlanePoint p, const PlanePath& ring);

// Ramer–Douglas–Peucker thinning: keeps the ends and every point further than
// `tolerance` from the line through the kept neighbours, so a straight drag
// sampled every few pixels is stored as its two ends.
PlanePath simplify_path(const PlanePath& path, double tolerance);

// Collects a drag: a new sample is kept once the pointer has moved `step`
// from the last kept one; `reach` is the furthest it got from the start, so
// that a drag shorter than a tap's wobble can be treated as a tap.
class StrokeSampler {
 public:
  explicit StrokeSampler(double step = 6.0) : step_(step) {}
  void start(PlanePoint p);
  // Returns true if `p` was kept.
  bool move(PlanePoint p);
  // Keeps the release point unless it is within a tenth of a step of the last sample.
  void finish(PlanePoint p);
  const PlanePath& points() const { return points_; }
  double reach() const { return reach_; }
  bool active() const { return !points_.empty(); }
  void clear() {
    points_.clear();
    reach_ = 0;
  }

 private:
  double step_;
  PlanePath points_;
  double reach_ = 0;
};

}  // namespace soffit::app
