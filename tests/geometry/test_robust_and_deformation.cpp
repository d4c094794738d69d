// Outliers and departures from the ideal shape. A reading on a protruding
// voussoir or a recessed joint is typically ±10–20 mm off (FIELD.md §3.3,
// common practice); the robust option must set it aside and say so.
#include <doctest/doctest.h>

#include <algorithm>

#include "geometry/analysis/deformation.hpp"
#include "geometry/analysis/profile_fit.hpp"
#include "geometry/shapes/families.hpp"
#include "tests/geometry/synthetic_arch.hpp"

using namespace soffit;
using test::params;

TEST_CASE("the robust fit sets aside a reading on a protruding voussoir and reports it") {
  NormalSource noise(3);
  Readings readings =
      test::arch_readings(segmental_family(), params({5.0, -3.75, 6.25}), 0.0, 15, 0.002, &noise);
  readings[5].z += 0.020;  // 20 mm proud
  FitOptions plain;
  FitOptions robust;
  robust.robust = true;
  const FitOutcome a = fit_shape(segmental_family(), readings, plain);
  const FitOutcome b = fit_shape(segmental_family(), readings, robust);
  REQUIRE(a.fit);
  REQUIRE(b.fit);
  REQUIRE(b.fit->downweighted.size() == 1);
  CHECK(b.fit->downweighted[0] == 5);
  CHECK(b.fit->weights[5] < 0.5);
  // The robust radius is much closer to the truth than the plain one.
  CHECK(std::abs(b.fit->params[2] - 6.25) < std::abs(a.fit->params[2] - 6.25));
  CHECK(std::abs(b.fit->params[2] - 6.25) < 0.01);
  // The reading is kept and its departure reported, never deleted.
  CHECK(b.fit->residuals.size() == readings.size());
  CHECK(b.fit->residuals[5] > 0.015);
}

TEST_CASE("a local sag across several readings is reported as a zone below the ideal") {
  Readings readings =
      test::arch_readings(segmental_family(), params({5.0, -3.75, 6.25}), 0.0, 21, 0.0);
  for (Reading& r : readings) r.sigma = 0.002;
  // Readings 12–15 dropped 6–9 mm: a flattened haunch.
  const double drop[] = {0.006, 0.009, 0.009, 0.006};
  for (int k = 0; k < 4; ++k) readings[static_cast<size_t>(12 + k)].z -= drop[k];
  const FitOutcome out = fit_shape(segmental_family(), readings, {});
  REQUIRE(out.fit);
  const auto zones = find_deformation_zones(*out.fit, readings);
  const auto below = std::find_if(zones.begin(), zones.end(),
                                  [](const DeformationZone& z) { return z.kind == "below ideal"; });
  REQUIRE(below != zones.end());
  const DeformationZone& z = *below;
  CHECK(z.kind == "below ideal");
  CHECK(z.mean_departure_m < -0.004);
  CHECK(z.x_from >= readings[11].x);
  CHECK(z.x_to <= readings[16].x);
  CHECK(z.description.find("below the fitted intrados") != std::string::npos);
}

TEST_CASE("readings within their precision give no zones") {
  NormalSource noise(21);
  const Readings readings =
      test::arch_readings(semicircular_family(), params({3.0, 0.0, 3.0}), 0.0, 11, 0.0005, &noise);
  Readings stated = readings;
  for (Reading& r : stated) r.sigma = 0.003;  // scatter well inside the stated σ
  const FitOutcome out = fit_shape(semicircular_family(), stated, {});
  REQUIRE(out.fit);
  CHECK(find_deformation_zones(*out.fit, stated).empty());
}
