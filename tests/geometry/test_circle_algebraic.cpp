// Algebraic circle fits against published / recomputed values.
// "[COMP]" values: tests/data/reference/fits/reference_values.json, recomputed by
// the team with numpy/scipy (scripts/circle_fits.py); see REFERENCES.md §1.
#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <random>
#include <string>
#include <vector>

#include "geometry/fit/circle_algebraic.hpp"

namespace soffit::test {
std::vector<Point2> reference_points(const std::string& name);
}

using namespace soffit;

namespace {

void check_circle(const std::optional<Circle>& c, double cx, double cz, double r, double tol) {
  REQUIRE(c.has_value());
  CHECK(std::abs(c->cx - cx) < tol);
  CHECK(std::abs(c->cz - cz) < tol);
  CHECK(std::abs(c->r - r) < tol);
}

std::vector<Point2> arc(double cx, double cz, double r, double from, double to, int n) {
  std::vector<Point2> pts;
  for (int k = 0; k < n; ++k) {
    const double t = from + (to - from) * k / (n - 1);
    pts.push_back({cx + r * std::cos(t), cz + r * std::sin(t)});
  }
  return pts;
}

}  // namespace

TEST_CASE("circle_algebraic: Gander-Golub-Strebel six points") {
  const auto pts = test::reference_points("C1_ggs_circle_6pts.csv");
  // Kåsa: [COMP] reference_values.json C1_ggs_circle_6pts.kasa (REFERENCES.md §1).
  check_circle(fit_circle_kasa(pts), 4.742331288343561, 3.8351226993865053, 4.108761522345446, 1e-9);
  // Pratt: [COMP] = Chernov's published programs [SRC] (REFERENCES.md §1).
  check_circle(fit_circle_pratt(pts), 4.615481516846648, 2.8073543971933734, 4.9113015968873235, 1e-9);
  // Taubin: [COMP] = Chernov's published programs [SRC] (REFERENCES.md §1).
  check_circle(fit_circle_taubin(pts), 4.613932693878592, 2.7952093469311046, 4.879212845615986, 1e-9);
}

TEST_CASE("circle_algebraic: segmental arch C2 (L 10, f 2.5, 5 mm)") {
  const auto pts = test::reference_points("C2_segmental_arch_L10_f2.5_5mm.csv");
  // [COMP] reference_values.json C2_segmental_arch_L10_f2.5_5mm.{kasa,pratt,taubin}.
  check_circle(fit_circle_kasa(pts), 4.999017107526502, -3.749380073273456, 6.249468579426523, 1e-9);
  check_circle(fit_circle_pratt(pts), 4.99901710300654, -3.74946948556686, 6.24954599637946, 1e-9);
  check_circle(fit_circle_taubin(pts), 4.999017103006538, -3.7494694855947905, 6.249544043990721, 1e-9);
}

TEST_CASE("circle_algebraic: flat segmental arch C4 (span/rise 8, 20 mm)") {
  const auto pts = test::reference_points("C4_flat_segmental_L10_f1.25_2cm.csv");
  // [COMP] reference_values.json C4_flat_segmental_L10_f1.25_2cm; REFERENCES.md §1
  // quotes Kåsa's small-arc bias R 10.67781 against the geometric 10.68667.
  check_circle(fit_circle_kasa(pts), 4.991137131113449, -9.429440230584628, 10.677814620747078, 1e-9);
  check_circle(fit_circle_pratt(pts), 4.991130323164083, -9.43854453372741, 10.686508687061263, 1e-9);
  check_circle(fit_circle_taubin(pts), 4.991130323153783, -9.43854454750182, 10.686492546396972, 1e-9);
}

TEST_CASE("circle_algebraic: noise-free arcs return the generating circle") {
  // Exact points on a circle are an exact solution of every algebraic fit
  // (REFERENCES.md §1: "every method must return the truth to ~1e-12").
  struct Case { double cx, cz, r, from, to; int n; };
  const Case cases[] = {
      {5.0, -3.75, 6.25, 0.6435011087932844, 2.498091544796509, 15},  // C2 geometry without noise
      {5.0, -9.375, 10.625, 1.0799, 2.0617, 11},                       // flat segmental
      {2.0, 1.0, 4.0, 1.0708, 2.0708, 9},                              // a 1-radian arc
      {700123.4, 250456.7, 7.5, 0.3, 2.8, 40},                         // national-grid coordinates
      {0.0, 0.0, 3.0, 0.0, 2 * std::numbers::pi * 0.9, 3},             // three points
  };
  for (const Case& c : cases) {
    const auto pts = arc(c.cx, c.cz, c.r, c.from, c.to, c.n);
    const double tol = 1e-9;
    CAPTURE(c.cx);
    check_circle(fit_circle_kasa(pts), c.cx, c.cz, c.r, tol);
    check_circle(fit_circle_pratt(pts), c.cx, c.cz, c.r, tol);
    check_circle(fit_circle_taubin(pts), c.cx, c.cz, c.r, tol);
  }
}

TEST_CASE("circle_algebraic: degenerate data give no circle") {
  const std::vector<Point2> two{{0, 0}, {1, 1}};
  const std::vector<Point2> collinear{{0, 0}, {1, 2}, {2, 4}, {3, 6}, {4.5, 9}};
  const std::vector<Point2> far_collinear{{1e6, 2e6}, {1e6 + 1, 2e6 + 0.5}, {1e6 + 3, 2e6 + 1.5}};
  const std::vector<Point2> coincident{{1, 1}, {1, 1}, {1, 1}};
  const std::vector<Point2> not_finite{{0, 0}, {1, NAN}, {2, 0}};
  // Three collinear points determine no circle (elementary geometry).
  for (const auto* set : {&two, &collinear, &far_collinear, &coincident, &not_finite}) {
    CHECK_FALSE(fit_circle_kasa(*set).has_value());
    CHECK_FALSE(fit_circle_pratt(*set).has_value());
    CHECK_FALSE(fit_circle_taubin(*set).has_value());
  }
  // A measurable bow (sagitta 1e-6 on a 2 m chord) is a circle: R = (c²/4 + f²)/(2f).
  const std::vector<Point2> bowed{{-1, 0}, {0, 1e-6}, {1, 0}};
  const auto c = fit_circle_taubin(bowed);
  REQUIRE(c.has_value());
  CHECK(std::abs(c->r - (1.0 + 1e-12) / 2e-6) < 1e-3);
}
