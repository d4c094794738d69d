// Honest uncertainty: simulated survey sheets with known truth. The 95%
// interval must hold the true span and rise 93–97% of the time (the coverage
// definition of JCGM 101:2008 §5.3 and §8, validated here by simulation).
// 1000 sheets: the binomial standard error at 95% is 0.7%, so the window
// 93–97% is ±2.9 standard errors around the nominal coverage.
#include <doctest/doctest.h>

#include <cmath>

#include "geometry/analysis/derived.hpp"
#include "geometry/analysis/uncertainty.hpp"
#include "geometry/shapes/families.hpp"
#include "tests/geometry/synthetic_arch.hpp"

using namespace soffit;

namespace {

struct Coverage {
  int span = 0, rise = 0, sheets = 0;
  double span_rate() const { return static_cast<double>(span) / sheets; }
  double rise_rate() const { return static_cast<double>(rise) / sheets; }
};

bool holds(const Estimate& e, double truth) { return e.lo <= truth && truth <= e.hi; }

Coverage simulate(const ShapeFamily& family, const SolverVector& truth_params, int sheets, int draws) {
  const auto truth = derive(family, truth_params, 0.0);
  REQUIRE(truth);
  const double true_span = truth->geometry[0], true_rise = truth->geometry[1];
  Coverage c;
  NormalSource noise(20261201);
  for (int s = 0; s < sheets; ++s) {
    const Readings readings = test::arch_readings(family, truth_params, 0.0, 11, 0.003, &noise);
    const FitOutcome out = fit_shape(family, readings, {});
    REQUIRE_MESSAGE(out.fit, out.error);
    UncertaintyOptions options;
    options.monte_carlo_draws = draws;
    options.seed = static_cast<std::uint64_t>(s + 1);
    const Uncertainty u = propagate_uncertainty(*out.fit, readings, options);
    ++c.sheets;
    c.span += holds(u.geometry[0], true_span);
    c.rise += holds(u.geometry[1], true_rise);
  }
  return c;
}

}  // namespace

TEST_CASE("Monte Carlo 95% intervals of span and rise cover the truth 93-97% of the time") {
  // Segmental arch like span S1 of the demo bridge: L 6.4 m, rise 1.6 m, 11 readings, σ 3 mm.
  const double half = 3.2, rise = 1.6;
  const double radius = (half * half + rise * rise) / (2 * rise);
  const Coverage c = simulate(segmental_family(), test::params({half, rise - radius, radius}), 1000, 400);
  MESSAGE("span coverage " << c.span_rate() << ", rise coverage " << c.rise_rate());
  CHECK(c.span_rate() >= 0.93);
  CHECK(c.span_rate() <= 0.97);
  CHECK(c.rise_rate() >= 0.93);
  CHECK(c.rise_rate() <= 0.97);
}

TEST_CASE("linearised 95% intervals of span and rise cover the truth 93-97% of the time") {
  const Coverage c = simulate(semicircular_family(), test::params({3.0, 0.0, 3.0}), 1000, 0);
  MESSAGE("span coverage " << c.span_rate() << ", rise coverage " << c.rise_rate());
  CHECK(c.span_rate() >= 0.93);
  CHECK(c.span_rate() <= 0.97);
  CHECK(c.rise_rate() >= 0.93);
  CHECK(c.rise_rate() <= 0.97);
}

TEST_CASE("scatter beyond the stated precision widens every range and says so") {
  NormalSource noise(5);
  // Readings scattered with σ 6 mm but stated as 1 mm.
  Readings readings = test::arch_readings(semicircular_family(), test::params({3.0, 0.0, 3.0}), 0.0, 15,
                                          0.006, &noise);
  for (Reading& r : readings) r.sigma = 0.001;
  const FitOutcome out = fit_shape(semicircular_family(), readings, {});
  REQUIRE(out.fit);
  UncertaintyOptions options;
  options.monte_carlo_draws = 0;
  const Uncertainty u = propagate_uncertainty(*out.fit, readings, options);
  CHECK(u.widened);
  CHECK(u.scale > 3.0);
  REQUIRE_FALSE(u.notes.empty());
  CHECK(u.notes[0].find("exceeds the stated precision") != std::string::npos);
  // Widened sd equals the unwidened one times √(reduced χ²).
  const double raw_sd = std::sqrt(out.fit->covariance(2, 2));
  const auto& radius = u.parameters[0].second;
  CHECK(std::abs(radius.sd - raw_sd * u.scale) < 1e-9);
}

TEST_CASE("Monte Carlo propagation is reproducible from its seed") {
  NormalSource noise(11);
  const Readings readings =
      test::arch_readings(segmental_family(), test::params({5.0, -3.75, 6.25}), 0.0, 13, 0.003, &noise);
  const FitOutcome out = fit_shape(segmental_family(), readings, {});
  REQUIRE(out.fit);
  UncertaintyOptions options;
  options.monte_carlo_draws = 300;
  options.seed = 42;
  const Uncertainty a = propagate_uncertainty(*out.fit, readings, options);
  const Uncertainty b = propagate_uncertainty(*out.fit, readings, options);
  options.seed = 43;
  const Uncertainty c = propagate_uncertainty(*out.fit, readings, options);
  CHECK(a.method == "monte-carlo");
  CHECK(a.draws_used == 300);
  CHECK(a.geometry[0].sd == b.geometry[0].sd);
  CHECK(a.geometry[0].lo == b.geometry[0].lo);
  CHECK(a.geometry[0].sd != c.geometry[0].sd);
  // Monte Carlo and linearised sd agree for a well-conditioned arch (JCGM 101 §8 validation idea).
  CHECK(std::abs(a.geometry[0].sd / a.geometry_linearised[0].sd - 1.0) < 0.15);
}
