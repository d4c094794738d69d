// The 95% band of the fitted intrados (exports/intrados_band.hpp) and the
// extrados offset, against the FIELD.md §10.2 oracle and circle geometry.
#include <doctest/doctest.h>

#include <cmath>

#include "exports/intrados_band.hpp"
#include "exports/section_ring_fill.hpp"
#include "tests/exports/export_test_support.hpp"

using namespace soffit;
using soffit::test::fitted_demo;

namespace {

double param(const ProfileAnalysis& a, const std::string& name) {
  for (const auto& [key, e] : a.uncertainty.parameters)
    if (key == name) return e.value;
  FAIL("no parameter " << name);
  return NAN;
}

}  // namespace

TEST_CASE("intrados band: at the crown it is the rise uncertainty of the FIELD.md oracle") {
  // FIELD.md §10.2: S1 MW 2019, rise 1597.3 ± 1.8 mm with u from (JᵀJ)⁻¹·Σr²/(n−3),
  // i.e. the covariance scaled by the observed scatter. Soffit's band uses the
  // stated σ (3 mm) unless the scatter exceeds it, so rescale by √(reduced χ²)
  // (= s/σ with s² = Σr²/(n−3)) before comparing. At the crown the normal is
  // vertical and the curve position there is the rise, springing line fixed.
  const auto s = fitted_demo();
  const ShapeFit& fit = *s.analysis.fit;
  REQUIRE_FALSE(s.analysis.uncertainty.widened);
  const IntradosBand band = intrados_band(fit, s.analysis.uncertainty, 48);
  const IntradosStation* crown = &band.stations.front();
  for (const IntradosStation& st : band.stations)
    if (st.at.z > crown->at.z) crown = &st;
  CHECK(std::abs(crown->normal.x) < 0.02);
  CHECK(std::abs(crown->normal.z - 1.0) < 1e-3);
  CHECK(std::abs(crown->position_sd_m * std::sqrt(fit.reduced_chi2) * 1000.0 - 1.8) < 0.1);
  CHECK(std::abs(band.coverage_factor - 1.959964) < 1e-5);  // two-sided 95% normal quantile
  CHECK(std::abs(crown->half_width_95_m - 1.959964 * crown->position_sd_m) < 1e-9);
}

TEST_CASE("intrados band: normals are radial and the extrados is the concentric circle R + d") {
  // A segmental intrados is a circle: its outward normal points away from the
  // centre and its offset by d is the circle of radius R + d (elementary geometry).
  const auto s = fitted_demo();
  const double R = param(s.analysis, "radius_m");
  const double cx = param(s.analysis, "centre_x_m"), cz = param(s.analysis, "centre_z_m");
  const IntradosBand band = intrados_band(*s.analysis.fit, s.analysis.uncertainty, 24);
  REQUIRE(band.stations.size() >= 24);
  for (const IntradosStation& st : band.stations) {
    const double rx = (st.at.x - cx) / R, rz = (st.at.z - cz) / R;
    CHECK(std::abs(std::hypot(st.at.x - cx, st.at.z - cz) - R) < 1e-9);
    CHECK(std::abs(st.normal.x - rx) < 1e-6);
    CHECK(std::abs(st.normal.z - rz) < 1e-6);
    const Point2 e = offset_point(st, 0.465);
    CHECK(std::abs(std::hypot(e.x - cx, e.z - cz) - (R + 0.465)) < 1e-6);
    CHECK(st.half_width_95_m > 0.0);
    CHECK(st.half_width_95_m < 0.01);  // millimetres, not metres: σ = 3 mm per reading
  }
}

TEST_CASE("ring of a pointed arch: the extrados apex is where the two offset arcs meet") {
  // Equilateral pointed arch, L = ρ = 4 m: arcs of radius 4 centred on the
  // springing line at x = 4 (left arc) and x = 0 (right arc); crown height
  // √(ρL − L²/4) = √12 (FIELD.md §2.1). Offset by d = 0.4 m, the arcs of radius
  // 4.4 meet at x = 2, z = √(4.4² − 2²) = 3.9192 m (intersection of two circles).
  std::string sheet = "x,z\n";
  for (int i = 0; i <= 12; ++i) {
    const double x = 4.0 * i / 12;
    const double z = x <= 2.0 ? std::sqrt(16 - (x - 4) * (x - 4)) : std::sqrt(16 - x * x);
    sheet += std::to_string(x) + "," + std::to_string(z) + "\n";
  }
  const auto s = soffit::test::fitted_text(sheet, "pointed.csv", "pointed");
  RingFillOptions options;
  options.ring_thickness_m = 0.4;
  const RingFill ring = ring_fill(*s.analysis.fit, s.analysis.uncertainty, options);
  CHECK(std::abs(s.analysis.uncertainty.geometry[7].value - std::sqrt(12.0)) < 1e-4);  // crown_z_m
  CHECK(std::abs(ring.top_of_ring_z - std::sqrt(4.4 * 4.4 - 4.0)) < 1e-4);
  REQUIRE(ring.piece_ends.size() == 2);
  const Point2 apex = ring.extrados[ring.piece_ends[0]];
  CHECK(std::abs(apex.x - 2.0) < 1e-4);
}
