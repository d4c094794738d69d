// Direct (Fitzgibbon–Pilu–Fisher / Halíř–Flusser) ellipse fit.
// "[COMP]": tests/data/reference/fits/reference_values.json, recomputed by the team
// with numpy/scipy (scripts/ellipse_fits.py); REFERENCES.md §2.
#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <string>
#include <vector>

#include "geometry/fit/ellipse_direct.hpp"

namespace soffit::test {
std::vector<Point2> reference_points(const std::string& name);
}

using namespace soffit;

namespace {

struct Expected { double xc, zc, a, b, alpha; double conic[6]; };

void check_fit(const std::optional<DirectEllipseFit>& fit, const Expected& e, double tol) {
  REQUIRE(fit.has_value());
  CHECK(std::abs(fit->ellipse.cx - e.xc) < tol);
  CHECK(std::abs(fit->ellipse.cz - e.zc) < tol);
  CHECK(std::abs(fit->ellipse.a - e.a) < tol);
  CHECK(std::abs(fit->ellipse.b - e.b) < tol);
  CHECK(std::abs(fit->ellipse.alpha - e.alpha) < tol);
  const double got[6] = {fit->conic.A, fit->conic.B, fit->conic.C,
                         fit->conic.D, fit->conic.E, fit->conic.F};
  for (int i = 0; i < 6; ++i) CHECK(std::abs(got[i] - e.conic[i]) < tol);
}

std::vector<Point2> ellipse_points(double xc, double zc, double a, double b, double alpha,
                                   double from, double to, int n) {
  std::vector<Point2> pts;
  const double c = std::cos(alpha), s = std::sin(alpha);
  for (int k = 0; k < n; ++k) {
    const double t = from + (to - from) * k / (n - 1);
    const double u = a * std::cos(t), v = b * std::sin(t);
    pts.push_back({xc + c * u - s * v, zc + s * u + c * v});
  }
  return pts;
}

}  // namespace

TEST_CASE("ellipse_direct: Gander-Golub-Strebel eight points (E1)") {
  // [COMP] E1_ggs_ellipse_8pts.halir_flusser; REFERENCES.md §2 prints centre
  // (5.06388, 5.06975), a 3.77566, b 2.64233, α −0.386120.
  check_fit(fit_ellipse_direct(test::reference_points("E1_ggs_ellipse_8pts.csv")),
            {5.063877719459915, 5.0697527041887485, 3.7756637147119214, 2.6423339989461545,
             -0.38612003788591487,
             {0.013189153247327511, 0.008353026125771263, 0.021764943073018912,
              -0.17592429532465648, -0.2629844608902632, 0.9482470016240334}},
            1e-9);
}

TEST_CASE("ellipse_direct: semi-ellipse E3 and partial arc E4") {
  // [COMP] E3_semi_ellipse_a5_b3_10mm.halir_flusser.
  check_fit(fit_ellipse_direct(test::reference_points("E3_semi_ellipse_a5_b3_10mm.csv")),
            {5.002884746331222, 0.0007461841322518922, 4.999783326342893, 2.9992227759105106,
             -0.0009433009823953675,
             {0.09585319572115181, 0.00032170381554280365, 0.26637323114458283,
              -0.9590852215711855, -0.0020069740682891516, 0.002978745563390764}},
            1e-9);
  // [COMP] E4_partial_semi_ellipse_30mm.halir_flusser.
  check_fit(fit_ellipse_direct(test::reference_points("E4_partial_semi_ellipse_30mm.csv")),
            {5.018469216715827, -0.012527159204695314, 5.008990538207288, 3.012621509970041,
             -0.005385105949920366,
             {0.0956131578423056, 0.0018168732255725206, 0.2643009228583597,
              -0.9596406184290528, -0.0024960428760217534, 0.009137747336740776}},
            1e-9);
}

TEST_CASE("ellipse_direct: national-grid offsets (1e6, 2e6)") {
  // REFERENCES.md §2 pitfall: the ellipse (1e6, 2e6, 0.5, 0.1, 0.5) breaks an
  // uncentred direct fit. Exact points must return it; the input's own rounding
  // (ulp of 2e6 ≈ 2.3e-10) bounds what can be recovered.
  const auto pts = ellipse_points(1e6, 2e6, 0.5, 0.1, 0.5, 0.0, 2 * std::numbers::pi, 40);
  const auto fit = fit_ellipse_direct(pts);
  REQUIRE(fit.has_value());
  CHECK(std::abs(fit->ellipse.cx - 1e6) < 1e-8);
  CHECK(std::abs(fit->ellipse.cz - 2e6) < 1e-8);
  CHECK(std::abs(fit->ellipse.a - 0.5) < 1e-8);
  CHECK(std::abs(fit->ellipse.b - 0.1) < 1e-8);
  CHECK(std::abs(fit->ellipse.alpha - 0.5) < 1e-7);
}

TEST_CASE("ellipse_direct: noise-free arcs return the generating ellipse") {
  // Exact points lie on a conic with zero algebraic error, the global minimum.
  struct Case { double xc, zc, a, b, alpha, from, to; };
  const Case cases[] = {
      {5.0, 0.0, 5.0, 3.0, 0.0, 0.0, std::numbers::pi},       // semi-ellipse, like E3
      {5.0, 0.0, 5.0, 3.0, 0.0, 0.2618, 2.8798},              // 15°–165°, like E4
      {-2.0, 7.0, 4.0, 1.5, -1.2, -0.5, 3.5},
      {1.0, 1.0, 2.0, 1.999, 0.3, 0.0, 2 * std::numbers::pi},  // nearly a circle
  };
  for (const Case& c : cases) {
    const auto fit = fit_ellipse_direct(ellipse_points(c.xc, c.zc, c.a, c.b, c.alpha, c.from, c.to, 25));
    CAPTURE(c.alpha);
    REQUIRE(fit.has_value());
    CHECK(std::abs(fit->ellipse.cx - c.xc) < 1e-9);
    CHECK(std::abs(fit->ellipse.cz - c.zc) < 1e-9);
    CHECK(std::abs(fit->ellipse.a - c.a) < 1e-9);
    CHECK(std::abs(fit->ellipse.b - c.b) < 1e-9);
    CHECK(std::abs(fit->ellipse.alpha - c.alpha) < 1e-6);  // α is ill-determined as a → b
  }
}

TEST_CASE("ellipse_direct: no ellipse, no answer") {
  CHECK_FALSE(fit_ellipse_direct(std::vector<Point2>{{0, 0}, {1, 1}, {2, 0}, {3, 1}}).has_value());
  const std::vector<Point2> collinear{{0, 0}, {1, 1}, {2, 2}, {3, 3}, {4, 4}, {5, 5}};
  CHECK_FALSE(fit_ellipse_direct(collinear).has_value());
  // Exact points of the hyperbola x² − z² = 1: the only zero-error conic is a
  // hyperbola; FPF's constraint still forces an ellipse (FPF 1999), so the
  // fit must return an ellipse, not the hyperbola. Its quadratic part must be definite.
  std::vector<Point2> hyperbola;
  for (int k = -4; k <= 4; ++k) {
    const double t = 0.3 * k;
    hyperbola.push_back({std::cosh(t), std::sinh(t)});
  }
  const auto h = fit_ellipse_direct(hyperbola);
  REQUIRE(h.has_value());
  CHECK(4 * h->conic.A * h->conic.C - h->conic.B * h->conic.B > 0);
  const std::vector<Point2> not_finite{{0, 0}, {1, 1}, {2, NAN}, {3, 1}, {4, 0}};
  CHECK_FALSE(fit_ellipse_direct(not_finite).has_value());
}
