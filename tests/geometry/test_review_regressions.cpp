// Regressions found in review of the profile engine, one case each, named
// after the defect. Values are constructed so the right answer is known.
#include <doctest/doctest.h>

#include <cmath>

#include "geometry/analysis/deformation.hpp"
#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/core/input_error.hpp"
#include "geometry/shapes/families.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "tests/geometry/synthetic_arch.hpp"

using namespace soffit;
using test::params;

TEST_CASE("regression: readings that sag downward are refused, not fitted as a tall arch") {
  // An offset sign error (FIELD.md §3.3) turns the soffit upside down.
  const Readings sag = test::readings_from({{0, 0}, {1, -1}, {2, -1.5}, {3, -1}, {4, 0}}, 0.003);
  for (const ShapeFamily* family : {&segmental_family(), &semicircular_family(), &elliptical_family()}) {
    CAPTURE(std::string(family->name()));
    const FitOutcome out = fit_shape(*family, sag, {});
    CHECK_FALSE(out.fit);
  }
  ProfileRequest request;
  request.uncertainty.monte_carlo_draws = 0;
  const ProfileAnalysis a = analyse_profile(sag, request);
  CHECK_FALSE(a.ok());
}

TEST_CASE("regression: auto keeps the ellipse when the readings stop short of the springings") {
  // Upright ellipse a 5 m, b 3 m; readings from 50 mm inside each springing (0.42 m up).
  Readings r;
  for (int k = 0; k < 15; ++k) {
    const double x = 0.05 + 9.9 * k / 14.0;
    Reading reading;
    reading.x = x;
    reading.z = 3.0 * std::sqrt(std::max(0.0, 1.0 - (x - 5.0) * (x - 5.0) / 25.0));
    reading.sigma = 0.003;
    r.push_back(reading);
  }
  const ShapeSelection s = select_shape(r, {});
  REQUIRE(s.chosen >= 0);
  CHECK(s.candidates[static_cast<size_t>(s.chosen)].family->name() == "elliptical");
}

TEST_CASE("regression: a x1000 slip in a millimetre column is bad input naming line and field") {
  const std::string sheet =
      "soffit-sheet,1\nmethod,offsets\ndatum_rl_m,9.8\nz_origin_rl_m,9.5\nsigma_mm,3\nreadings\n"
      "station_m,offset_mm\n0,-300\n1.6,968\n3.2,1302000\n4.8,957\n6.4,-300\n";
  try {
    parse_sheet(sheet, "slip.csv", {});
    FAIL("the slip was accepted");
  } catch (const InputError& e) {
    CHECK(e.line() == 10);
    CHECK(e.field() == "offset_mm");
  }
}

TEST_CASE("regression: pointed arches need rho >= L/2 and three-centred arches rise <= L/2") {
  // ρ < h would cross the centres and dip at the crown (FIELD.md §2.1: pointed, ρ ≥ L/2).
  CHECK_FALSE(pointed_family().outline(params({5.0, 0.0, 5.0, 4.0}), 0.0));
  CHECK(pointed_family().outline(params({5.0, 0.0, 5.0, 5.0}), 0.0));
  // A basket-handle arch with rise above its half-span has no tangent crown arc.
  CHECK_FALSE(three_centred_family().outline(params({5.0, 0.0, 3.0, 4.0, 1.0}), 0.0));
}

TEST_CASE("regression: a segmental arc cut below its centre (horseshoe) is not described as segmental") {
  CHECK_FALSE(segmental_family().outline(params({0.0, 0.0, 2.0}), -1.0));
  CHECK(segmental_family().outline(params({0.0, 0.0, 2.0}), 0.5));
}

TEST_CASE("regression: one 200 mm blunder is flagged even though it widens the ranges") {
  NormalSource noise(4);
  Readings r = test::arch_readings(semicircular_family(), params({3.0, 0.0, 3.0}), 0.0, 15, 0.003, &noise);
  r[7].z += 0.2;
  ProfileRequest request;
  request.shape = "semicircular";
  request.uncertainty.monte_carlo_draws = 0;
  const ProfileAnalysis a = analyse_profile(r, request);
  REQUIRE(a.ok());
  CHECK(a.uncertainty.widened);
  bool flagged = false;
  for (const DeformationZone& z : a.zones)
    for (size_t i : z.readings) flagged = flagged || i == 7;
  CHECK(flagged);
}

TEST_CASE("regression: departure zones rarely appear in pure noise at the stated precision") {
  // 200 sheets of 25 readings with σ exactly as stated: a zone is a false alarm.
  // Singles beyond 3σ alone give about 25 × 0.27% ≈ 6.5% of sheets; runs add a little.
  NormalSource noise(77);
  int sheets_with_zones = 0;
  for (int s = 0; s < 200; ++s) {
    const Readings r =
        test::arch_readings(segmental_family(), params({5.0, -3.75, 6.25}), 0.0, 25, 0.003, &noise);
    const FitOutcome out = fit_shape(segmental_family(), r, {});
    REQUIRE(out.fit);
    if (!find_deformation_zones(*out.fit, r).empty()) ++sheets_with_zones;
  }
  MESSAGE(sheets_with_zones << " of 200 noise-only sheets show a zone");
  CHECK(sheets_with_zones <= 24);
}

TEST_CASE("regression: too few Monte Carlo draws fall back to the linearised ranges and say why") {
  NormalSource noise(8);
  const Readings r =
      test::arch_readings(segmental_family(), params({5.0, -3.75, 6.25}), 0.0, 13, 0.003, &noise);
  const FitOutcome out = fit_shape(segmental_family(), r, {});
  REQUIRE(out.fit);
  UncertaintyOptions options;
  options.monte_carlo_draws = 10;
  const Uncertainty u = propagate_uncertainty(*out.fit, r, options);
  CHECK(u.method == "linearised");
  REQUIRE_FALSE(u.notes.empty());
  CHECK(u.notes.back().find("too few") != std::string::npos);
}
