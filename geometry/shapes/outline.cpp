#include "geometry/shapes/outline.hpp"

#include <algorithm>
#include <cmath>

namespace soffit {

namespace {

const OutlinePiece& piece_at(const Outline& outline, double x) {
  for (int i = 0; i < outline.count; ++i) {
    const OutlinePiece& p = outline.pieces[static_cast<size_t>(i)];
    if (x <= p.x_to) return p;
  }
  return outline.pieces[static_cast<size_t>(outline.count - 1)];
}

// Parameter angle of x on a circular or elliptical upper branch, in [0, π].
double branch_angle(const OutlinePiece& p, double x) {
  return std::acos(std::clamp((x - p.cx) / p.a, -1.0, 1.0));
}

double piece_height(const OutlinePiece& p, double x) {
  switch (p.kind) {
    case OutlinePiece::Kind::circular:
      return p.cz + p.a * std::sin(branch_angle(p, x));
    case OutlinePiece::Kind::elliptical:
      return p.cz + p.b * std::sin(branch_angle(p, x));
    case OutlinePiece::Kind::parabolic:
      return p.cz - p.a * (x - p.cx) * (x - p.cx);
  }
  return 0.0;
}

// ∫ √(a² sin² t + b² cos² t) dt over [t0, t1]: composite 8-point Gauss–Legendre,
// exact to rounding for the eccentricities of real arches.
double ellipse_arc(double a, double b, double t0, double t1) {
  static constexpr double node[4] = {0.1834346424956498, 0.5255324099163290, 0.7966664774136267,
                                     0.9602898564975363};
  static constexpr double weight[4] = {0.3626837833783620, 0.3137066458778873,
                                       0.2223810344533745, 0.1012285362903763};
  constexpr int panels = 16;
  const double h = (t1 - t0) / panels;
  double sum = 0.0;
  for (int k = 0; k < panels; ++k) {
    const double mid = t0 + (k + 0.5) * h;
    for (int i = 0; i < 4; ++i) {
      for (double sign : {-1.0, 1.0}) {
        const double t = mid + sign * node[i] * h / 2;
        const double s = std::sin(t), c = std::cos(t);
        sum += weight[i] * std::sqrt(a * a * s * s + b * b * c * c);
      }
    }
  }
  return sum * h / 2;
}

// Primitive of √(1 + u²)/(2c) du with u = 2c(x − cx): the parabola's arc length.
double parabola_arc_primitive(double c, double dx) {
  const double u = 2.0 * c * dx;
  return (u * std::sqrt(1.0 + u * u) + std::asinh(u)) / (4.0 * c);
}

double piece_length(const OutlinePiece& p) {
  switch (p.kind) {
    case OutlinePiece::Kind::circular:
      return p.a * (branch_angle(p, p.x_from) - branch_angle(p, p.x_to));
    case OutlinePiece::Kind::elliptical:
      return ellipse_arc(p.a, p.b, branch_angle(p, p.x_to), branch_angle(p, p.x_from));
    case OutlinePiece::Kind::parabolic:
      return parabola_arc_primitive(p.a, p.x_to - p.cx) - parabola_arc_primitive(p.a, p.x_from - p.cx);
  }
  return 0.0;
}

}  // namespace

double height_at(const Outline& outline, double x) {
  x = std::clamp(x, outline.x_left(), outline.x_right());
  return piece_height(piece_at(outline, x), x);
}

double radius_of_curvature_at(const Outline& outline, double x) {
  x = std::clamp(x, outline.x_left(), outline.x_right());
  const OutlinePiece& p = piece_at(outline, x);
  switch (p.kind) {
    case OutlinePiece::Kind::circular:
      return p.a;
    case OutlinePiece::Kind::elliptical: {
      const double t = branch_angle(p, x), s = std::sin(t), c = std::cos(t);
      return std::pow(p.a * p.a * s * s + p.b * p.b * c * c, 1.5) / (p.a * p.b);
    }
    case OutlinePiece::Kind::parabolic: {
      const double slope = 2.0 * p.a * (x - p.cx);
      return std::pow(1.0 + slope * slope, 1.5) / (2.0 * p.a);
    }
  }
  return 0.0;
}

double arc_length(const Outline& outline) {
  double total = 0.0;
  for (int i = 0; i < outline.count; ++i) total += piece_length(outline.pieces[static_cast<size_t>(i)]);
  return total;
}

std::vector<Point2> sample_outline(const Outline& outline, int points_per_piece) {
  std::vector<Point2> out;
  const int n = std::max(points_per_piece, 2);
  for (int i = 0; i < outline.count; ++i) {
    const OutlinePiece& p = outline.pieces[static_cast<size_t>(i)];
    for (int k = (i == 0 ? 0 : 1); k < n; ++k) {
      const double f = static_cast<double>(k) / (n - 1);
      double x;
      if (p.kind == OutlinePiece::Kind::parabolic) {
        x = p.x_from + f * (p.x_to - p.x_from);
      } else {
        // Even steps in angle keep the steep parts near the springings smooth.
        const double t0 = branch_angle(p, p.x_from), t1 = branch_angle(p, p.x_to);
        x = p.cx + p.a * std::cos(t0 + f * (t1 - t0));
      }
      out.push_back({x, piece_height(p, x)});
    }
  }
  return out;
}

}  // namespace soffit
