// Conic → ellipse conversion (analytic geometry of central conics).
#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "geometry/fit/ellipse_conic.hpp"

using namespace soffit;

namespace {

// Expands (u/a)² + (v/b)² = 1, u,v in the frame rotated by alpha about (xc, zc),
// into A..F (a textbook expansion, written independently of conic_to_ellipse).
Conic conic_of(double xc, double zc, double a, double b, double alpha, double factor) {
  const double c = std::cos(alpha), s = std::sin(alpha);
  const double A = c * c / (a * a) + s * s / (b * b);
  const double B = 2 * c * s * (1 / (a * a) - 1 / (b * b));
  const double C = s * s / (a * a) + c * c / (b * b);
  const double D = -2 * A * xc - B * zc, E = -2 * C * zc - B * xc;
  const double F = A * xc * xc + B * xc * zc + C * zc * zc - 1;
  return {factor * A, factor * B, factor * C, factor * D, factor * E, factor * F};
}

}  // namespace

TEST_CASE("ellipse_conic: round trip through the expanded equation") {
  struct Case { double xc, zc, a, b, alpha, factor; };
  const Case cases[] = {{5, 0, 5, 3, 0, 1},     {2.7, 3.8, 6.5, 3.0, 0.36, -7.0},
                        {-1, 4, 2, 1, -1.2, 0.01}, {0, 0, 3, 1, std::numbers::pi / 2, 1},
                        {0, 0, 3, 1, -0.25 * std::numbers::pi, 2}};
  for (const Case& k : cases) {
    const auto e = conic_to_ellipse(conic_of(k.xc, k.zc, k.a, k.b, k.alpha, k.factor));
    CAPTURE(k.alpha);
    REQUIRE(e.has_value());
    CHECK(std::abs(e->cx - k.xc) < 1e-12);
    CHECK(std::abs(e->cz - k.zc) < 1e-12);
    CHECK(std::abs(e->a - k.a) < 1e-12);
    CHECK(std::abs(e->b - k.b) < 1e-12);
    CHECK(std::abs(e->alpha - k.alpha) < 1e-12);
  }
  // The same ellipse with its axes named the other way round: a ≥ b, α turns by π/2.
  const auto e = conic_to_ellipse(conic_of(0, 0, 1, 3, 0.2, 1));
  REQUIRE(e.has_value());
  CHECK(std::abs(e->a - 3) < 1e-12);
  CHECK(std::abs(e->b - 1) < 1e-12);
  CHECK(std::abs(e->alpha - (0.2 + std::numbers::pi / 2 - std::numbers::pi)) < 1e-12);
}

TEST_CASE("ellipse_conic: conics that are not real ellipses") {
  CHECK_FALSE(conic_to_ellipse({1, 0, -1, 0, 0, -1}).has_value());  // hyperbola x² − z² = 1
  CHECK_FALSE(conic_to_ellipse({1, 0, 0, 0, -1, 0}).has_value());   // parabola z = x²
  CHECK_FALSE(conic_to_ellipse({1, 0, 1, 0, 0, 1}).has_value());    // x² + z² = −1: imaginary
  CHECK_FALSE(conic_to_ellipse({1, 0, 1, 0, 0, 0}).has_value());    // a single point
  CHECK_FALSE(conic_to_ellipse({NAN, 0, 1, 0, 0, -1}).has_value());
}
