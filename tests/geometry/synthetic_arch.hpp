#pragma once
// Readings on a known arch, with optional seeded noise, for recovery and
// coverage tests.
#include <cmath>
#include <vector>

#include "geometry/analysis/random_normal.hpp"
#include "geometry/core/reading.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit::test {

inline SolverVector params(std::initializer_list<double> values) {
  SolverVector p(static_cast<Eigen::Index>(values.size()));
  Eigen::Index k = 0;
  for (double v : values) p[k++] = v;
  return p;
}

// `count` points along the intrados from springing to springing (even steps in
// x), each moved along both axes by N(0, σ²) when σ > 0.
inline Readings arch_readings(const ShapeFamily& family, const SolverVector& p, double springing_z,
                              int count, double sigma, NormalSource* noise = nullptr) {
  const auto outline = family.outline(p, springing_z);
  Readings out;
  if (!outline) return out;
  for (int k = 0; k < count; ++k) {
    const double x = outline->x_left() + outline->span() * k / (count - 1);
    Reading r;
    r.x = x;
    r.z = height_at(*outline, x);
    if (noise && sigma > 0) {
      r.x += sigma * noise->next();
      r.z += sigma * noise->next();
    }
    r.sigma = sigma > 0 ? sigma : 0.001;
    out.push_back(r);
  }
  return out;
}

inline Readings readings_from(const std::vector<Point2>& points, double sigma) {
  Readings out;
  for (const Point2& p : points) {
    Reading r;
    r.x = p.x;
    r.z = p.z;
    r.sigma = sigma;
    out.push_back(r);
  }
  return out;
}

}  // namespace soffit::test
