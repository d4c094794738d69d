// Polar readings from one set-up, and the angle units they use.
#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <string>

#include "geometry/sheet/angles.hpp"
#include "geometry/sheet/reduce_polar.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "geometry/sheet/sheet_units.hpp"

using namespace soffit;

namespace {
constexpr double kTol = 1e-12;
const double kPi = std::numbers::pi;
}  // namespace

TEST_CASE("sheet angles: gon and degrees (ISO 80000-3: 1 gon = 0.9 degree, 400 gon a turn)") {
  CHECK(std::abs(gon_to_degrees(1.0) - 0.9) < kTol);
  CHECK(std::abs(gon_to_radians(100.0) - kPi / 2) < kTol);
  CHECK(std::abs(gon_to_radians(400.0) - 2 * kPi) < kTol);
  CHECK(std::abs(degrees_to_radians(180.0) - kPi) < kTol);
  CHECK(std::abs(radians_to_degrees(kPi / 4) - 45.0) < kTol);
  // 50 gon = 45°, through both routes.
  CHECK(std::abs(gon_to_radians(50.0) - degrees_to_radians(45.0)) < kTol);
  // Unit suffixes: mgon is 1/1000 gon; an arcsecond 1/3600 degree.
  CHECK(std::abs(to_si(1000.0, "mgon") - gon_to_radians(1.0)) < kTol);
  CHECK(std::abs(to_si(3600.0, "arcsec") - degrees_to_radians(1.0)) < kTol);
  // Zenith angles are from the vertical: zenith 100 gon is level, 60° is 30° up.
  CHECK(std::abs(elevation_from_zenith(gon_to_radians(100.0))) < kTol);
  CHECK(std::abs(elevation_from_zenith(degrees_to_radians(60.0)) - degrees_to_radians(30.0)) < kTol);
}

TEST_CASE("sheet polar: slope distance and elevation") {
  // Axis at x 3.2, RL 10.300 (ground 9.050 + instrument 1.250), springing RL
  // 9.500 so the axis is at z 0.8. Slope 2.000 m at 30° up towards +x:
  //   x = 3.2 + 2·cos30° = 3.2 + 1.7320508075688772 = 4.932050807568877
  //   z = 0.8 + 2·sin30° = 1.8
  PolarSetup s;
  s.instrument_x_m = 3.2;
  s.axis_rl_m = 9.050 + 1.250;
  s.z_origin_rl_m = 9.500;
  const Point2 p = reduce_polar(s, {2.0, true, degrees_to_radians(30.0), +1});
  CHECK(std::abs(p.x - 4.932050807568877) < 1e-12);
  CHECK(std::abs(p.z - 1.8) < 1e-12);
}

TEST_CASE("sheet polar: horizontal distance and zenith in gon, towards -x") {
  // Horizontal 1.5 m at zenith 50 gon (= 45° up) towards −x:
  //   x = 3.2 − 1.5 = 1.7;  z = 0.8 + 1.5·tan45° = 2.3
  PolarSetup s;
  s.instrument_x_m = 3.2;
  s.axis_rl_m = 10.3;
  s.z_origin_rl_m = 9.5;
  const Point2 p = reduce_polar(s, {1.5, false, elevation_from_zenith(gon_to_radians(50.0)), -1});
  CHECK(std::abs(p.x - 1.7) < 1e-12);
  CHECK(std::abs(p.z - 2.3) < 1e-12);
}

TEST_CASE("sheet polar: precision propagated from distance and angle") {
  // σd = 2 mm, σa = 0.2° = 0.0034906585 rad (FIELD.md §3.1 handheld tilt, from memory).
  // Slope 2 m: across the line of sight 2·0.0034906585 = 6.981317 mm;
  //   σ = √((2² + 6.981317²)/2) mm = √(26.36939) = 5.135114 mm.
  const double sa = degrees_to_radians(0.2);
  CHECK(std::abs(polar_sigma({2.0, true, degrees_to_radians(30.0), 1}, 0.002, 0.0, sa) -
                 0.005135114) < 1e-8);
  // Horizontal 1.5 m at 45°: ∂z/∂d = tan45 = 1, ∂z/∂a = 1.5/cos²45 = 3 m/rad;
  //   trace = 2²·(1 + 1) + (3·3.4906585)² = 8 + 109.66227 = 117.66227 mm²
  //   σ = √(117.66227/2) = 7.670146 mm.
  CHECK(std::abs(polar_sigma({1.5, false, degrees_to_radians(45.0), 1}, 0.002, 0.0, sa) -
                 0.007670146) < 1e-8);
  // ppm part: 2 mm + 1000 ppm of 2 m = 4 mm along the line, no angle error:
  //   σ = √(4²/2) = 2.828427 mm.
  CHECK(std::abs(polar_sigma({2.0, true, 0.0, 1}, 0.002, 1000.0, 0.0) - 0.002828427) < 1e-8);
}

TEST_CASE("sheet polar: a sheet with zenith in gon, per-row direction and derived sigma") {
  // Ground 9.050 + instrument 1.250 = axis RL 10.300 (z 0.8 above RL 9.500).
  //  row 1: hdist 1.5, zenith 50 gon, −x  → x 1.7, z 2.3 (as above)
  //  row 2: hdist 2.0, zenith 100 gon, +x → x 5.2, z 0.8 (level shot)
  //  row 3: hdist 1.0, zenith 150 gon (45° down), +x → x 4.2, z 0.8 − 1.0 = −0.2
  const char* text =
      "soffit-sheet,1\n"
      "method,polar\n"
      "instrument_x_m,3.2\n"
      "ground_rl_m,9.050\n"
      "instrument_height_m,1.250\n"
      "z_origin_rl_m,9.500\n"
      "distance_sigma_mm,2\n"
      "angle_sigma_mgon,222.2222222222222\n"
      "readings\n"
      "id,hdist_m,zenith_gon,direction\n"
      "a,1.5,50,-x\n"
      "b,2.0,100,\n"
      "c,1.0,150,+x\n";
  const SurveySheet s = parse_sheet(text, "p.csv", {});
  REQUIRE(s.readings.size() == 3);
  REQUIRE(s.polar);
  CHECK(std::abs(s.polar->axis_rl_m - 10.3) < kTol);
  CHECK(std::abs(s.readings[0].x - 1.7) < 1e-12);
  CHECK(std::abs(s.readings[0].z - 2.3) < 1e-12);
  CHECK(std::abs(s.readings[1].x - 5.2) < 1e-12);
  CHECK(std::abs(s.readings[1].z - 0.8) < 1e-12);
  CHECK(std::abs(s.readings[2].x - 4.2) < 1e-12);
  CHECK(std::abs(s.readings[2].z + 0.2) < 1e-12);
  // 222.222… mgon = 0.2°: the 45° shot of 1.5 m gives 7.670146 mm (worked above).
  CHECK(std::abs(s.readings[0].sigma - 0.007670146) < 1e-8);
}

TEST_CASE("sheet polar: a sheet with slope distance and elevation in degrees, facing -x") {
  // axis_rl_m 10.3 given directly; facing −x for every row.
  // Slope 2 m at elevation 30°: x = 3.2 − 1.7320508 = 1.4679492, z = 1.8.
  const char* text =
      "soffit-sheet,1\n"
      "method,polar\n"
      "instrument_x_m,3.2\n"
      "axis_rl_m,10.3\n"
      "z_origin_rl_m,9.5\n"
      "facing,-x\n"
      "readings\n"
      "sdist_m,elevation_deg\n"
      "2.0,30\n"
      "1.2,90\n"
      "3.0,-10\n";
  const SurveySheet s = parse_sheet(text, "p2.csv", {});
  CHECK(std::abs(s.readings[0].x - (3.2 - std::sqrt(3.0))) < 1e-12);
  CHECK(std::abs(s.readings[0].z - 1.8) < 1e-12);
  // Plumb shot of 1.2 m: x stays at the instrument, z = 0.8 + 1.2 = 2.0.
  CHECK(std::abs(s.readings[1].x - 3.2) < 1e-12);
  CHECK(std::abs(s.readings[1].z - 2.0) < 1e-12);
}
