#pragma once
// Distance from a point to part of a circle (the upper branch between two x),
// and the piecewise signed distance to an outline made of such arcs. Used by
// the multi-centred families, whose intrados has corners or tangent joints.
#include <algorithm>
#include <cmath>
#include <limits>

#include "geometry/shapes/outline.hpp"

namespace soffit {

// Unsigned distance from p to the arc of `piece` (circular kind), clamped to
// its ends. `interior` says whether the nearest point lies inside the arc.
inline double arc_segment_distance(const OutlinePiece& piece, Point2 p, bool& interior) {
  const double angle = std::atan2(p.z - piece.cz, p.x - piece.cx);
  const double a_from = std::acos(std::clamp((piece.x_from - piece.cx) / piece.a, -1.0, 1.0));
  const double a_to = std::acos(std::clamp((piece.x_to - piece.cx) / piece.a, -1.0, 1.0));
  if (angle <= a_from && angle >= a_to) {
    interior = true;
    return std::abs(std::hypot(p.x - piece.cx, p.z - piece.cz) - piece.a);
  }
  interior = false;
  const double zf = piece.cz + piece.a * std::sin(a_from);
  const double zt = piece.cz + piece.a * std::sin(a_to);
  return std::min(std::hypot(p.x - piece.x_from, p.z - zf), std::hypot(p.x - piece.x_to, p.z - zt));
}

// Signed distance (+ above the intrados) to an outline of circular arcs.
inline double outline_signed_distance(const Outline& outline, Point2 p) {
  double best = std::numeric_limits<double>::infinity();
  int best_piece = 0;
  bool best_interior = false;
  for (int i = 0; i < outline.count; ++i) {
    bool interior = false;
    const double d = arc_segment_distance(outline.pieces[static_cast<size_t>(i)], p, interior);
    if (d < best) {
      best = d;
      best_piece = i;
      best_interior = interior;
    }
  }
  const OutlinePiece& piece = outline.pieces[static_cast<size_t>(best_piece)];
  bool above;
  if (best_interior) {
    above = std::hypot(p.x - piece.cx, p.z - piece.cz) > piece.a;
  } else if (p.x > outline.x_left() && p.x < outline.x_right()) {
    above = p.z > height_at(outline, p.x);
  } else {
    above = p.z > outline.z_springing;  // beyond a springing: outside the opening
  }
  return above ? best : -best;
}

}  // namespace soffit
