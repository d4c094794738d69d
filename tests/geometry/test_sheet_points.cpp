// Point lists projected onto the section's vertical plane.
#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <string>
#include <vector>

#include "geometry/sheet/reduce_points.hpp"
#include "geometry/sheet/sheet_number.hpp"
#include "geometry/sheet/sheet_reader.hpp"

using namespace soffit;

namespace {

const double kPi = std::numbers::pi;

// Points of a plane at a bearing through (e0, n0): along-distance a, height h,
// and a horizontal offset w to the right of the direction of travel.
GridPoint on_plane(double e0, double n0, double bearing_deg, double a, double h, double w = 0) {
  const double b = bearing_deg * kPi / 180.0;
  const double de = std::sin(b), dn = std::cos(b);
  return {e0 + a * de + w * dn, n0 + a * dn - w * de, h};
}

std::vector<bool> all(size_t n) { return std::vector<bool>(n, true); }

}  // namespace

TEST_CASE("sheet points: the best-fit plane recovers a known bearing with zero scatter") {
  // Seven coplanar points on a bearing of 60°: the fit must give 60° and
  // scatter 0 (exact data; tolerance for rounding only).
  std::vector<GridPoint> pts;
  for (int k = 0; k <= 6; ++k) pts.push_back(on_plane(1000.0, 2000.0, 60.0, k * 1.0, 0.1 * k * k));
  const SectionPlane plane = fit_section_plane(pts, all(pts.size()), {});
  CHECK(std::abs(plane.bearing_deg - 60.0) < 1e-9);
  CHECK_FALSE(plane.bearing_given);
  CHECK(plane.scatter_rms_m < 1e-12);
  CHECK(plane.scatter_max_m < 1e-12);
  // x from the leftmost point (a = 0), z = height.
  for (int k = 0; k <= 6; ++k) {
    const Point2 p = project_to_section(plane, pts[k], 0.0);
    CHECK(std::abs(p.x - k) < 1e-11);
    CHECK(std::abs(p.z - 0.1 * k * k) < 1e-15);
  }
}

TEST_CASE("sheet points: a best-fit line runs eastward whatever the point order") {
  // Points listed west-going on a bearing of 240° lie on the 60° line: x still
  // increases eastward and the last-listed point is x = 0.
  std::vector<GridPoint> pts;
  for (int k = 0; k <= 4; ++k) pts.push_back(on_plane(0.0, 0.0, 240.0, k * 1.0, 0.0));
  const SectionPlane plane = fit_section_plane(pts, all(pts.size()), {});
  CHECK(std::abs(plane.bearing_deg - 60.0) < 1e-9);
  CHECK(std::abs(project_to_section(plane, pts[4], 0.0).x) < 1e-12);
  CHECK(std::abs(project_to_section(plane, pts[0], 0.0).x - 4.0) < 1e-12);
}

TEST_CASE("sheet points: scatter of a known out-of-plane offset") {
  // Pairs of points at each along-position, 10 mm either side of a 30° line:
  // the fitted line is the 30° line itself (by symmetry), and every point is
  // 10 mm off it, so RMS = max = 0.010 m.
  std::vector<GridPoint> pts;
  for (int k = 0; k < 5; ++k) {
    pts.push_back(on_plane(50.0, 80.0, 30.0, k * 1.5, 1.0, +0.010));
    pts.push_back(on_plane(50.0, 80.0, 30.0, k * 1.5, 1.0, -0.010));
  }
  const SectionPlane plane = fit_section_plane(pts, all(pts.size()), {});
  CHECK(std::abs(plane.bearing_deg - 30.0) < 1e-9);
  CHECK(std::abs(plane.scatter_rms_m - 0.010) < 1e-12);
  CHECK(std::abs(plane.scatter_max_m - 0.010) < 1e-12);
  CHECK(std::abs(std::abs(out_of_plane_m(plane, pts[0])) - 0.010) < 1e-12);
}

TEST_CASE("sheet points: a given bearing and origin") {
  // The points lie on bearing 90° (due east) at northing 5 but the sheet says
  // 80°: the plane at 80° through their centroid (e 2, n 5). A point at along
  // a from the centroid is off that plane by a·sin10°; for e = 0 and 4
  // (a = ∓2 along east) that is 2·sin10° = 0.3472964 m, and 0 at the centroid.
  std::vector<GridPoint> pts = {{0, 5, 0}, {1, 5, 0}, {2, 5, 0}, {3, 5, 0}, {4, 5, 0}};
  PointsSetup setup;
  setup.bearing_rad = 80.0 * kPi / 180.0;
  setup.origin_easting = 0.0;
  setup.origin_northing = 5.0;
  const SectionPlane plane = fit_section_plane(pts, all(pts.size()), setup);
  CHECK(plane.bearing_given);
  CHECK(std::abs(plane.bearing_deg - 80.0) < 1e-12);
  CHECK(std::abs(plane.scatter_max_m - 2.0 * std::sin(10.0 * kPi / 180.0)) < 1e-12);
  // x = 0 at the origin point; e = 4 is 4·cos10° = 3.9392310 along the plane.
  CHECK(std::abs(project_to_section(plane, pts[0], 0.0).x) < 1e-12);
  CHECK(std::abs(project_to_section(plane, pts[4], 0.0).x - 4.0 * std::cos(10.0 * kPi / 180.0)) <
        1e-12);
}

TEST_CASE("sheet points: national-grid coordinates keep sub-millimetre precision") {
  // A 6.4 m arch section at E ≈ 500 000, N ≈ 1 000 000 on a bearing of 85°.
  // Uncentred sums of squares of 1e6-size values would carry ~1e12 m² and lose
  // every digit below a millimetre; the reader centres first. Expect the true
  // along-distances back within 1e-6 m (the input itself is rounded at ~1e-10).
  std::vector<GridPoint> pts;
  std::vector<double> truth;
  for (int k = 0; k <= 32; ++k) {
    const double a = 0.2 * k;
    truth.push_back(a);
    const double z = std::sqrt(4.0015 * 4.0015 - (a - 3.2) * (a - 3.2)) - 2.4042;
    pts.push_back(on_plane(500123.4567, 1000456.7891, 85.0, a, 9.5 + z));
  }
  const SectionPlane plane = fit_section_plane(pts, all(pts.size()), {});
  CHECK(std::abs(plane.bearing_deg - 85.0) < 1e-7);
  CHECK(plane.scatter_max_m < 1e-6);
  for (size_t k = 0; k < pts.size(); ++k) {
    CHECK(std::abs(project_to_section(plane, pts[k], 9.5).x - truth[k]) < 1e-6);
  }
}

TEST_CASE("sheet points: a points sheet, excluded point left out of the plane") {
  // Four points on bearing 90° (due east, northing 100); a fifth 0.5 m north is
  // excluded: the plane stays at 90° with zero scatter and the excluded point
  // still gets its x (2.0) and z.
  const char* text =
      "soffit-sheet,1\n"
      "method,points\n"
      "z_origin_rl_m,9.5\n"
      "readings\n"
      "id,easting_m,northing_m,height_m,exclude\n"
      "P1,1000000.000,100.000,9.5,\n"
      "P2,1000001.000,100.000,10.3,\n"
      "P3,1000002.000,100.000,10.6,\n"
      "P4,1000003.000,100.000,10.3,\n"
      "P5,1000002.000,100.500,10.6,on the wing wall\n";
  const SurveySheet s = parse_sheet(text, "pts.csv", {});
  REQUIRE(s.plane);
  CHECK(std::abs(s.plane->bearing_deg - 90.0) < 1e-9);
  CHECK(s.plane->points_used == 4);
  CHECK(s.plane->scatter_max_m < 1e-12);
  CHECK(std::abs(s.readings[2].x - 2.0) < 1e-9);
  CHECK(std::abs(s.readings[2].z - 1.1) < 1e-12);
  CHECK(s.readings[4].excluded);
  CHECK(std::abs(s.readings[4].x - 2.0) < 1e-9);
  CHECK(s.warnings.empty());
}

TEST_CASE("sheet points: large scatter is warned about") {
  // Alternate points 40 mm either side of the line: RMS 40 mm > 10 mm limit.
  std::string text =
      "soffit-sheet,1\nmethod,points\nreadings\neasting_m,northing_m,height_m\n";
  for (int k = 0; k < 6; ++k) {
    text += format_fixed(k * 1.0, 3) + "," + format_fixed(k % 2 ? 0.04 : -0.04, 3) + ",1\n";
    text += format_fixed(k * 1.0, 3) + "," + format_fixed(k % 2 ? -0.04 : 0.04, 3) + ",1.2\n";
  }
  const SurveySheet s = parse_sheet(text, "sc.csv", {});
  REQUIRE(s.plane);
  CHECK(std::abs(s.plane->scatter_rms_m - 0.04) < 1e-12);
  REQUIRE(s.warnings.size() == 1);
  CHECK(s.warnings[0].find("40.0 mm RMS") != std::string::npos);
}
