// Central differences (geometry/core/numeric_derivative.hpp) against closed-form
// derivatives from elementary calculus. Tolerances follow the error estimate of
// a central difference, truncation h²|f‴|/6 plus rounding ε|f|/h (Press et al.,
// Numerical Recipes, "Numerical Derivatives"; from memory), with h = ∛ε·max(|x|, 1)
// ≈ 6.1e-6·max(|x|, 1) unless a test says otherwise.
#include <doctest/doctest.h>

#include <cmath>
#include <limits>
#include <numbers>

#include "geometry/core/numeric_derivative.hpp"
#include "geometry/shapes/families.hpp"
#include "tests/geometry/synthetic_arch.hpp"

using namespace soffit;

namespace {
constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();
}

TEST_CASE("the central step is the cube root of epsilon times max(|x|, 1)") {
  // ∛(2⁻⁵²) = 2^(−52/3) ≈ 6.0555e-6 (closed form).
  const double cbrt_eps = std::pow(2.0, -52.0 / 3.0);
  CHECK(std::abs(central_relative_step() - cbrt_eps) < 1e-18);
  CHECK(std::abs(difference_step(0.0, central_relative_step()) - cbrt_eps) < 1e-18);
  CHECK(std::abs(difference_step(-0.3, central_relative_step()) - cbrt_eps) < 1e-18);
  CHECK(std::abs(difference_step(-40.0, central_relative_step()) - 40.0 * cbrt_eps) < 1e-16);
}

TEST_CASE("d/dx sin x is cos x to 1e-9 at points from -3 to 12") {
  // |f‴| ≤ 1 and |f| ≤ 1: at |x| ≤ 12, h ≤ 7.3e-5, so the error is at most
  // (7.3e-5)²/6 + 2.2e-16/6.1e-6 ≈ 9e-10 + 4e-11 < 1e-9.
  for (double x : {-3.0, -1.0, -0.2, 0.0, 0.5, 1.0, 2.5, 12.0}) {
    CAPTURE(x);
    const double d = numeric_derivative([](double t) { return std::sin(t); }, x, std::sin(x));
    CHECK(std::abs(d - std::cos(x)) < 1e-9);
  }
}

TEST_CASE("d/dx sqrt x at x = 100 is 0.05 to 1e-10: the step grows with x") {
  // f‴ = (3/8)x^(−5/2) = 3.75e-6, h = 6.1e-4: truncation 2.3e-13; rounding
  // ε·10/6.1e-4 ≈ 3.6e-12.
  const double d = numeric_derivative([](double t) { return std::sqrt(t); }, 100.0, 10.0);
  CHECK(std::abs(d - 0.05) < 1e-10);
}

TEST_CASE("at the edge of the domain the derivative is one-sided, with an error of order h") {
  // f = x² only on one side of x = 1: f′(1) = 2, and ((1 + h)² − 1)/h = 2 + h,
  // so the error is h ≈ 6.1e-6.
  const auto right = [](double t) { return t >= 1.0 ? t * t : kNaN; };
  const auto left = [](double t) { return t <= 1.0 ? t * t : kNaN; };
  CHECK(std::abs(numeric_derivative(right, 1.0, 1.0) - 2.0) < 1e-5);
  CHECK(std::abs(numeric_derivative(left, 1.0, 1.0) - 2.0) < 1e-5);
  // Defined at x alone: no derivative.
  const auto point = [](double t) { return t == 1.0 ? 1.0 : kNaN; };
  CHECK_FALSE(std::isfinite(numeric_derivative(point, 1.0, 1.0)));
}

TEST_CASE("gradient of a circle's orthogonal distance with respect to centre and radius") {
  // d(xc, zc, r) = ρ − r with ρ = √((x − xc)² + (z − zc)²), hence
  //   ∂d/∂xc = −(x − xc)/ρ,  ∂d/∂zc = −(z − zc)/ρ,  ∂d/∂r = −1.
  // Second derivatives are of order 1/ρ and third of order 1/ρ², ρ ≥ 1 here and
  // |d| ≤ 7: error ≤ (6.1e-6·5)²/6 + 2.2e-16·7/6.1e-6 ≈ 2e-10 < 1e-9.
  const SolverVector c = test::params({3.2, -0.4, 4.5});
  for (Point2 p : {Point2{0.1, 2.0}, Point2{3.2, 5.0}, Point2{7.9, -0.1}, Point2{4.0, 1.0}}) {
    CAPTURE(p.x);
    CAPTURE(p.z);
    const auto distance = [p](const SolverVector& q) { return std::hypot(p.x - q[0], p.z - q[1]) - q[2]; };
    double g[3];
    numeric_gradient(distance, c, distance(c), g);
    const double rho = std::hypot(p.x - c[0], p.z - c[1]);
    CHECK(std::abs(g[0] - (-(p.x - c[0]) / rho)) < 1e-9);
    CHECK(std::abs(g[1] - (-(p.z - c[1]) / rho)) < 1e-9);
    CHECK(std::abs(g[2] - (-1.0)) < 1e-9);
  }
}

TEST_CASE("Jacobian of (x·y, sin x, y²) is [[y, x], [cos x, 0], [0, 2y]]") {
  // Third derivatives are at most 1 (sin) or 0; |f| ≤ 9 and h ≤ 1.8e-5:
  // error ≤ (1.8e-5)²/6 + 2.2e-16·9/6.1e-6 ≈ 6e-11 < 1e-9.
  Eigen::Vector2d at(2.0, -3.0);
  const auto f = [](const Eigen::Vector2d& v) {
    return Eigen::VectorXd((Eigen::VectorXd(3) << v[0] * v[1], std::sin(v[0]), v[1] * v[1]).finished());
  };
  const Eigen::MatrixXd j = numeric_jacobian(f, at, f(at));
  Eigen::MatrixXd expected(3, 2);
  expected << -3.0, 2.0, std::cos(2.0), 0.0, 0.0, -6.0;
  REQUIRE(j.rows() == 3);
  REQUIRE(j.cols() == 2);
  CHECK((j - expected).cwiseAbs().maxCoeff() < 1e-9);
}

TEST_CASE("numeric gradient of a pointed arch's distance matches the arc's closed form") {
  // Pointed family, parameters (xm, zs, h, ρ): the left arc has centre
  // (xm − h + ρ, zs) and radius ρ. For a point whose foot lies inside that arc,
  // d = D − ρ with D = |p − centre| and u = (p − centre)/D, so
  //   ∂d/∂xm = −u_x, ∂d/∂zs = −u_z, ∂d/∂h = +u_x, ∂d/∂ρ = −u_x − 1.
  // The family has no analytic gradient: distance_with_gradient differences it
  // with a step of 1e-7·max(|p|, 1) ≤ 6e-7 (see shape_family.cpp); rounding
  // ε·6/4e-7 ≈ 3e-9 dominates: 1e-7 leaves room.
  const ShapeFamily& pointed = pointed_family();
  REQUIRE_FALSE(pointed.has_analytic_gradient());
  const SolverVector p = test::params({4.0, 0.2, 4.0, 6.0});
  const double cx = 4.0 - 4.0 + 6.0, cz = 0.2;
  // 6.1 m from the centre at 150°: 0.1 m above the arc, foot at x ≈ 0.80 (the arc spans 0 to 4).
  const double angle = 150.0 * std::numbers::pi / 180.0;
  const Point2 q{cx + 6.1 * std::cos(angle), cz + 6.1 * std::sin(angle)};
  double g[kMaxSolverParameters];
  const double d = distance_with_gradient(pointed, p, q, g);
  CHECK(std::abs(d - 0.1) < 1e-12);
  const double ux = std::cos(angle), uz = std::sin(angle);
  CHECK(std::abs(g[0] - (-ux)) < 1e-7);
  CHECK(std::abs(g[1] - (-uz)) < 1e-7);
  CHECK(std::abs(g[2] - ux) < 1e-7);
  CHECK(std::abs(g[3] - (-ux - 1.0)) < 1e-7);
}

TEST_CASE("the distance's gradient with respect to the point is the circle's outward unit normal") {
  // For a circle d = |p − c| − r, so ∇ₚd = (p − c)/|p − c|, outward whether p
  // lies outside or inside. Third derivatives ≈ 1/|p − c|² ≤ 1, h ≤ 5e-5:
  // error ≤ 5e-10 + 2e-16·3/6e-6 < 1e-9.
  const SolverVector c = test::params({3.2, 0.0, 3.2});  // semicircular: (xc, zs, r)
  for (Point2 p : {Point2{5.0, 3.5}, Point2{1.0, 1.0}, Point2{3.2, 2.0}}) {
    CAPTURE(p.x);
    CAPTURE(p.z);
    const Point2 n = distance_gradient_at_point(semicircular_family(), c, p);
    const double rho = std::hypot(p.x - c[0], p.z - c[1]);
    CHECK(std::abs(n.x - (p.x - c[0]) / rho) < 1e-9);
    CHECK(std::abs(n.z - (p.z - c[1]) / rho) < 1e-9);
  }
}
