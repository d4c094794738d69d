// Choosing the family: the simplest one the data support (rules in
// geometry/analysis/shape_selection.hpp; ΔAIC ≤ 2 after Burnham & Anderson 2002).
#include <doctest/doctest.h>

#include "geometry/analysis/shape_selection.hpp"
#include "geometry/shapes/families.hpp"
#include "tests/geometry/synthetic_arch.hpp"

using namespace soffit;
using test::params;

namespace {

std::string chosen_for(const ShapeFamily& family, const SolverVector& p, double sigma, std::uint64_t seed,
                       int count = 21) {
  NormalSource noise(seed);
  const Readings readings = test::arch_readings(family, p, 0.0, count, sigma, &noise);
  const ShapeSelection s = select_shape(readings, {});
  REQUIRE(s.chosen >= 0);
  INFO(s.reason);
  return std::string(s.candidates[static_cast<size_t>(s.chosen)].family->name());
}

}  // namespace

TEST_CASE("auto names the family that made the data") {
  CHECK(chosen_for(semicircular_family(), params({3.0, 0.0, 3.0}), 0.002, 1) == "semicircular");
  // L/f = 4 segment (REFERENCES.md §4 geometry)
  CHECK(chosen_for(segmental_family(), params({5.0, -3.75, 6.25}), 0.002, 2) == "segmental");
  CHECK(chosen_for(parabolic_family(), params({5.0, 3.0, 0.12}), 0.002, 3) == "parabolic");
  CHECK(chosen_for(elliptical_family(), params({5.0, 0.0, 5.0, 3.0}), 0.002, 4) == "elliptical");
  CHECK(chosen_for(pointed_family(), params({5.0, 0.0, 5.0, 10.0}), 0.002, 5) == "pointed");
}

TEST_CASE("an ellipse whose axes agree within their uncertainty is called semicircular") {
  // a − b = 1 mm with σ = 3 mm readings: not distinguishable from a circle.
  CHECK(chosen_for(elliptical_family(), params({3.0, 0.0, 3.001, 3.0}), 0.003, 6) == "semicircular");
}

TEST_CASE("a circle centred on the end readings' level is semicircular, not segmental") {
  NormalSource noise(9);
  const Readings readings =
      test::arch_readings(segmental_family(), params({3.0, 0.0, 3.0}), 0.0, 15, 0.003, &noise);
  const ShapeSelection s = select_shape(readings, {});
  REQUIRE(s.chosen >= 0);
  CHECK(s.candidates[static_cast<size_t>(s.chosen)].family->name() == "semicircular");
  CHECK(s.reason.find("centre lies") != std::string::npos);
}

TEST_CASE("auto reports every candidate, fitted or not") {
  NormalSource noise(12);
  const Readings readings =
      test::arch_readings(segmental_family(), params({5.0, -3.75, 6.25}), 0.0, 15, 0.003, &noise);
  const ShapeSelection s = select_shape(readings, {});
  CHECK(s.candidates.size() == shape_families().size());
  int fitted = 0;
  for (const ShapeCandidate& c : s.candidates) {
    if (c.fit) {
      ++fitted;
      CHECK(std::isfinite(c.fit->aic));
    } else {
      CHECK_FALSE(c.error.empty());
    }
  }
  // Families that cannot describe a segmental arch (pointed: ρ ≥ L/2 only) may fail to fit.
  CHECK(fitted >= 3);
  // The chosen family fits within the readings' precision (σ 3 mm).
  CHECK(s.candidates[static_cast<size_t>(s.chosen)].fit->rms_m < 0.005);
}
