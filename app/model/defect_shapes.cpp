#include "app/model/defect_shapes.hpp"

#include <algorithm>
#include <cmath>

namespace soffit::app {

namespace {

double distance(PlanePoint a, PlanePoint b) { return std::hypot(a.first - b.first, a.second - b.second); }

double distance_to_segment(PlanePoint p, PlanePoint a, PlanePoint b) {
  const double dx = b.first - a.first, dy = b.second - a.second;
  const double len2 = dx * dx + dy * dy;
  if (len2 <= 0) return distance(p, a);
  const double t = std::clamp(((p.first - a.first) * dx + (p.second - a.second) * dy) / len2, 0.0, 1.0);
  return distance(p, {a.first + t * dx, a.second + t * dy});
}

void simplify_between(const PlanePath& path, size_t first, size_t last, double tolerance, std::vector<bool>& keep) {
  if (last <= first + 1) return;
  double worst = -1;
  size_t at = first;
  for (size_t i = first + 1; i < last; ++i) {
    const double d = distance_to_segment(path[i], path[first], path[last]);
    if (d > worst) {
      worst = d;
      at = i;
    }
  }
  if (worst <= tolerance) return;
  keep[at] = true;
  simplify_between(path, first, at, tolerance, keep);
  simplify_between(path, at, last, tolerance, keep);
}

}  // namespace

double path_length(const PlanePath& path) {
  double length = 0;
  for (size_t i = 1; i < path.size(); ++i) length += distance(path[i - 1], path[i]);
  return length;
}

double shoelace_area(const PlanePath& ring) {
  if (ring.size() < 3) return 0;
  double twice = 0;
  for (size_t i = 0, j = ring.size() - 1; i < ring.size(); j = i++)
    twice += ring[j].first * ring[i].second - ring[i].first * ring[j].second;
  return std::abs(twice) / 2;
}

double distance_to_path(PlanePoint p, const PlanePath& path, bool closed) {
  if (path.empty()) return INFINITY;
  double best = distance(p, path.front());
  for (size_t i = 1; i < path.size(); ++i) best = std::min(best, distance_to_segment(p, path[i - 1], path[i]));
  if (closed && path.size() > 2) best = std::min(best, distance_to_segment(p, path.back(), path.front()));
  return best;
}

bool inside_ring(PlanePoint p, const PlanePath& ring) {
  if (ring.size() < 3) return false;
  bool in = false;
  for (size_t i = 0, j = ring.size() - 1; i < ring.size(); j = i++) {
    const PlanePoint a = ring[i], b = ring[j];
    if ((a.second > p.second) != (b.second > p.second) &&
        p.first < (b.first - a.first) * (p.second - a.second) / (b.second - a.second) + a.first)
      in = !in;
  }
  return in;
}

PlanePath simplify_path(const PlanePath& path, double tolerance) {
  if (path.size() < 3) return path;
  std::vector<bool> keep(path.size(), false);
  keep.front() = keep.back() = true;
  const double chord = distance(path.front(), path.back());
  if (chord > tolerance) {
    simplify_between(path, 0, path.size() - 1, tolerance, keep);
  } else {
    // A closed drag ends where it began: split it at the point furthest from
    // the start, or every point would be measured against a zero-length chord.
    size_t far = 1;
    double far_d = -1;
    for (size_t i = 1; i + 1 < path.size(); ++i)
      if (const double d = distance(path[0], path[i]); d > far_d) far_d = d, far = i;
    keep[far] = true;
    simplify_between(path, 0, far, tolerance, keep);
    simplify_between(path, far, path.size() - 1, tolerance, keep);
  }
  PlanePath out;
  for (size_t i = 0; i < path.size(); ++i)
    if (keep[i]) out.push_back(path[i]);
  return out;
}

void StrokeSampler::start(PlanePoint p) {
  points_ = {p};
  reach_ = 0;
}

bool StrokeSampler::move(PlanePoint p) {
  if (points_.empty()) return false;
  reach_ = std::max(reach_, distance(points_.front(), p));
  if (distance(points_.back(), p) < step_) return false;
  points_.push_back(p);
  return true;
}

void StrokeSampler::finish(PlanePoint p) {
  if (points_.empty()) return;
  reach_ = std::max(reach_, distance(points_.front(), p));
  if (distance(points_.back(), p) > step_ * 0.1) points_.push_back(p);
}

}  // namespace soffit::app
