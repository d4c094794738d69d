#pragma once
// The intrados of a fitted arch as a chain of smooth pieces, left springing to
// right springing. Every family describes itself this way, so span, rise,
// quarter-point rise, curvature and arc length are computed once, here, for all.
//
// Each piece is the upper branch z(x) of its curve over [x_from, x_to]: every
// classic arch profile is a function of x between its springings.
#include <array>
#include <vector>

#include "geometry/core/reading.hpp"

namespace soffit {

struct OutlinePiece {
  enum class Kind { circular, elliptical, parabolic };
  Kind kind = Kind::circular;
  double cx = 0.0, cz = 0.0;  // centre (circular, elliptical) or apex (parabolic), m
  double a = 0.0;             // radius; semi-axis along x; or c in z = cz − c (x − cx)², 1/m
  double b = 0.0;             // semi-axis along z (elliptical only), m
  double x_from = 0.0, x_to = 0.0;
};

struct Outline {
  static constexpr int kMaxPieces = 3;
  std::array<OutlinePiece, kMaxPieces> pieces{};
  int count = 0;
  double z_springing = 0.0;  // level of the springing line, m

  void add(const OutlinePiece& piece) { pieces[static_cast<size_t>(count++)] = piece; }
  double x_left() const { return pieces[0].x_from; }
  double x_right() const { return pieces[static_cast<size_t>(count - 1)].x_to; }
  double span() const { return x_right() - x_left(); }
};

// Height of the intrados at x (x clamped to the springings).
double height_at(const Outline& outline, double x);
// Radius of curvature of the intrados at x; at a junction of pieces, the piece on the left.
double radius_of_curvature_at(const Outline& outline, double x);
// Intrados length from springing to springing.
double arc_length(const Outline& outline);
// Points along the intrados, evenly spaced in arc parameter within each piece,
// for drawing and exports.
std::vector<Point2> sample_outline(const Outline& outline, int points_per_piece);

}  // namespace soffit
