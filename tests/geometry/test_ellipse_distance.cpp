// Closest point on an axis-aligned ellipse, against brute force and exact cases.
#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <random>

#include "geometry/fit/ellipse_distance.hpp"

using namespace soffit;

namespace {

// Independent reference: dense sampling of t, then golden-section search on
// the bracketing interval (the distance is smooth in t there). The distance
// at the minimum is insensitive to t to first order, so it is exact to rounding.
double brute_force_distance(double a, double b, Point2 p) {
  constexpr int kSamples = 20000;
  auto d2 = [&](double t) {
    const double dx = p.x - a * std::cos(t), dz = p.z - b * std::sin(t);
    return dx * dx + dz * dz;
  };
  const double h = 2 * std::numbers::pi / kSamples;
  int best = 0;
  double best_d2 = d2(0);
  for (int k = 1; k < kSamples; ++k)
    if (const double v = d2(k * h); v < best_d2) best = k, best_d2 = v;
  double lo = (best - 1) * h, hi = (best + 1) * h;
  const double g = (std::sqrt(5.0) - 1) / 2;
  for (int i = 0; i < 200 && hi - lo > 1e-15; ++i) {
    const double m1 = hi - g * (hi - lo), m2 = lo + g * (hi - lo);
    if (d2(m1) < d2(m2)) hi = m2; else lo = m1;
  }
  return std::sqrt(d2(0.5 * (lo + hi)));
}

// Properties of a true foot point (Lagrange conditions): on the ellipse, and
// p − foot parallel to the normal there.
void check_foot(double a, double b, Point2 p, const EllipseFoot& f) {
  const double scale = std::max(a, b);
  CHECK(std::abs((f.foot.x / a) * (f.foot.x / a) + (f.foot.z / b) * (f.foot.z / b) - 1) < 1e-14);
  CHECK(std::abs(f.foot.x - a * std::cos(f.t)) < 1e-12 * scale);
  CHECK(std::abs(f.foot.z - b * std::sin(f.t)) < 1e-12 * scale);
  // Rounding of the normal scales with |p − foot|, hence with |p| for far points.
  const double far = std::max(scale, std::hypot(p.x, p.z));
  const double cross = (p.x - f.foot.x) * f.normal.z - (p.z - f.foot.z) * f.normal.x;
  CHECK(std::abs(cross) < 1e-12 * far);
  CHECK(std::abs(std::hypot(f.normal.x, f.normal.z) - 1) < 1e-14);
  // Signed distance = n·(p − foot), + outside.
  const double along = (p.x - f.foot.x) * f.normal.x + (p.z - f.foot.z) * f.normal.z;
  CHECK(std::abs(along - f.signed_distance) < 1e-12 * far);
}

}  // namespace

TEST_CASE("ellipse_distance: random points against dense sampling") {
  std::mt19937_64 rng(7);
  std::uniform_real_distribution<double> axis(0.2, 10.0), spread(-3.0, 3.0);
  for (int i = 0; i < 400; ++i) {
    const double a = axis(rng), b = axis(rng);
    // Mix far points, points near the curve (fitting's case) and inside points.
    const double s = i % 3 == 0 ? spread(rng) : (i % 3 == 1 ? 1 + 1e-3 * spread(rng) : 0.3 * spread(rng));
    const double t = spread(rng);
    const Point2 p{s * a * std::cos(t) + (i % 3 == 0 ? spread(rng) : 0.0), s * b * std::sin(t)};
    const EllipseFoot f = closest_point_on_ellipse(a, b, p);
    CAPTURE(a);
    CAPTURE(b);
    CAPTURE(p.x);
    CAPTURE(p.z);
    check_foot(a, b, p, f);
    CHECK(std::abs(std::abs(f.signed_distance) - brute_force_distance(a, b, p)) < 1e-12 * std::max(a, b));
    const double level = (p.x / a) * (p.x / a) + (p.z / b) * (p.z / b) - 1;
    CHECK((level > 0) == (f.signed_distance > 0));
  }
}

TEST_CASE("ellipse_distance: degenerate positions") {
  const double a = 5, b = 3;
  // Centre: nearest points are the minor-axis vertices, distance b (geometry).
  auto f = closest_point_on_ellipse(a, b, {0, 0});
  CHECK(std::abs(f.signed_distance + 3) < 1e-15);
  CHECK(std::abs(std::abs(f.foot.z) - 3) < 1e-15);
  // Tall ellipse (b > a): centre distance is a.
  f = closest_point_on_ellipse(3, 5, {0, 0});
  CHECK(std::abs(f.signed_distance + 3) < 1e-15);
  // On the major axis outside: the vertex (a, 0).
  f = closest_point_on_ellipse(a, b, {7, 0});
  CHECK(std::abs(f.signed_distance - 2) < 1e-15);
  CHECK(std::abs(f.foot.x - 5) < 1e-15);
  // On the major axis inside the evolute's cusp (x < (a² − b²)/a = 3.2): the
  // foot leaves the axis at x = a²·x₀/(a² − b²) (Eberly 2013; also from the Lagrange condition).
  f = closest_point_on_ellipse(a, b, {-2, 0});
  CHECK(std::abs(f.foot.x - -25.0 * 2 / 16) < 1e-14);
  CHECK(std::abs(f.signed_distance + brute_force_distance(a, b, {-2, 0})) < 1e-12);
  check_foot(a, b, {-2, 0}, f);
  // On the minor axis, above and below: the vertex.
  f = closest_point_on_ellipse(a, b, {0, 10});
  CHECK(std::abs(f.signed_distance - 7) < 1e-15);
  f = closest_point_on_ellipse(a, b, {0, -1});
  CHECK(std::abs(f.signed_distance + 2) < 1e-15);
  CHECK(std::abs(f.foot.z + 3) < 1e-15);
  // On the curve: zero distance, the point itself.
  const double t = 0.7;
  f = closest_point_on_ellipse(a, b, {a * std::cos(t), b * std::sin(t)});
  CHECK(std::abs(f.signed_distance) < 1e-14);
  CHECK(std::abs(f.t - t) < 1e-14);
  // Tiny and huge offsets from an axis.
  for (const Point2 p : {Point2{2, 1e-300}, Point2{6, 1e-300}, Point2{1e-300, 2}, Point2{1e-300, 1e-300},
                         Point2{4.9, 1e-9}, Point2{3.2, 1e-12}, Point2{1e6, 1e6}}) {
    CAPTURE(p.x);
    CAPTURE(p.z);
    f = closest_point_on_ellipse(a, b, p);
    check_foot(a, b, p, f);
    CHECK(std::abs(std::abs(f.signed_distance) - brute_force_distance(a, b, p)) < 1e-12 * std::max(1.0, std::hypot(p.x, p.z)));
  }
}

TEST_CASE("ellipse_distance: circles and nearly circles") {
  // a = b: the distance is |p| − r exactly (geometry of the circle).
  for (const Point2 p : {Point2{3, 4}, Point2{0.3, -0.4}, Point2{-2, 0}, Point2{0, 1}}) {
    const auto f = closest_point_on_ellipse(2, 2, p);
    CHECK(std::abs(f.signed_distance - (std::hypot(p.x, p.z) - 2)) < 1e-15);
    check_foot(2, 2, p, f);
  }
  // a ≈ b (1e-12 apart): within rounding of the circle answer.
  for (const Point2 p : {Point2{3, 4}, Point2{0.3, -0.4}, Point2{-2, 1e-20}}) {
    const auto f = closest_point_on_ellipse(2 * (1 + 1e-12), 2, p);
    CHECK(std::abs(f.signed_distance - (std::hypot(p.x, p.z) - 2)) < 1e-11);
    check_foot(2 * (1 + 1e-12), 2, p, f);
  }
}
