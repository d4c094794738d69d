// The bundled example sheets (assets/sheets, invented demo data of FIELD.md §10).
#include <doctest/doctest.h>

#include <cmath>
#include <string>
#include <vector>

#include "geometry/sheet/sheet_reader.hpp"

using namespace soffit;

namespace {

std::string asset(const std::string& name) { return std::string(SOFFIT_ASSETS) + "/sheets/" + name; }

// FIELD.md §10.2, S1 mid-width 2019 and the stations of S1.
const std::vector<double> kS1Stations = {0, 0.4, 0.8, 1.6, 2.4, 3.2, 4.0, 4.8, 5.6, 6.0, 6.4};
const std::vector<int> kS1MW2019 = {-300, 160, 493, 968, 1216, 1302, 1217, 957, 492, 154, -300};

// Distance of a point from FIELD.md §10.2's fitted S1 MW 2019 circle (R 4.0015 m,
// rise 1.5973 m, centre on x 3.2 to within the rounding of the table).
double off_s1_circle(double x, double z) {
  return std::hypot(x - 3.2, z - (1.5973 - 4.0015)) - 4.0015;
}

}  // namespace

TEST_CASE("sheet assets: every bundled sheet parses") {
  for (const char* name :
       {"sallow-ford_S1-MW_2019.csv", "sallow-ford_S1-MW_2025.csv", "sallow-ford_S1-US_2019.csv",
        "sallow-ford_S1-US_2025.csv", "sallow-ford_S1-DS_2019.csv", "sallow-ford_S1-DS_2025.csv",
        "sallow-ford_S2-MW_2019.csv", "sallow-ford_S2-MW_2025.csv",
        "sallow-ford_S1-MW_2019_xz.csv", "sallow-ford_S1-MW_2025_polar.csv",
        "sallow-ford_S1-DS_2025_points.csv"}) {
    CAPTURE(name);
    SurveySheet s;
    CHECK_NOTHROW(s = read_sheet_file(asset(name), {}));
    CHECK(included_points(s.readings).size() >= 11);
    CHECK(s.metadata.structure.value_or("BVDC-ST-0417") == "BVDC-ST-0417");
  }
}

TEST_CASE("sheet assets: S1 MW 2019 reduces to z = offset + 0.300 exactly") {
  // FIELD.md §10.2: datum RL 9.800, springing RL 9.500, so z = offset + 0.300 m.
  const SurveySheet s = read_sheet_file(asset("sallow-ford_S1-MW_2019.csv"), {});
  CHECK(s.form == SheetForm::soffit_sheet);
  CHECK(s.method == SurveyMethod::offsets);
  CHECK(s.metadata.span == "S1");
  CHECK(s.metadata.section == "MW");
  CHECK(s.metadata.position_m == 2.60);
  CHECK(s.metadata.direction == SectionDirection::skew);
  CHECK(s.metadata.date == "2019-05-14");
  CHECK(s.metadata.weather == "overcast, dry; air 13 C, soffit 11 C");
  CHECK(s.warnings.empty());
  REQUIRE(s.readings.size() == 11);
  for (size_t i = 0; i < 11; ++i) {
    CAPTURE(i);
    CHECK(std::abs(s.readings[i].x - kS1Stations[i]) < 1e-15);
    CHECK(std::abs(s.readings[i].z - (kS1MW2019[i] / 1000.0 + 0.300)) < 1e-12);
    CHECK(std::abs(s.readings[i].sigma - 0.003) < 1e-15);  // "u ≈ 3 mm"
    CHECK_FALSE(s.readings[i].excluded);
    // Raw values kept as written, in their unit.
    CHECK(s.raw_rows[i].values[2] == static_cast<double>(kS1MW2019[i]));
  }
  CHECK(s.columns[2].name == "offset_mm");
  CHECK(s.raw_rows[0].cells[1] == "0.000");
  CHECK(s.readings[5].note == "surface: brick; crown");
  // The plain x,z copy of the same section agrees.
  const SurveySheet xz = read_sheet_file(asset("sallow-ford_S1-MW_2019_xz.csv"), {});
  REQUIRE(xz.readings.size() == 11);
  for (size_t i = 0; i < 11; ++i) {
    CHECK(std::abs(xz.readings[i].x - s.readings[i].x) < 1e-12);
    CHECK(std::abs(xz.readings[i].z - s.readings[i].z) < 1e-12);
  }
}

TEST_CASE("sheet assets: S1 MW 2025 closing checks are reported, not fitted") {
  // Station 0 re-read -300 (as first read: 0.0 mm); crown 1296 against 1295: +1.0 mm.
  const SurveySheet s = read_sheet_file(asset("sallow-ford_S1-MW_2025.csv"), {});
  REQUIRE(s.readings.size() == 13);
  CHECK(included_points(s.readings).size() == 11);
  const std::string f = asset("sallow-ford_S1-MW_2025.csv");
  REQUIRE(s.warnings.size() == 2);
  CHECK(s.warnings[0] == f + ":37: closing check at station 0.000 m: dz 0.0 mm against line 25");
  CHECK(s.warnings[1] == f + ":38: closing check at station 3.200 m: dz +1.0 mm against line 30");
}

TEST_CASE("sheet assets: S2 MW 2019 stations and offsets as in FIELD.md §10.2") {
  const SurveySheet s = read_sheet_file(asset("sallow-ford_S2-MW_2019.csv"), {});
  REQUIRE(s.readings.size() == 11);
  CHECK(std::abs(s.readings[3].x - 1.525) < 1e-15);
  CHECK(std::abs(s.readings[5].z - 1.452) < 1e-12);  // crown 1152 + 300 mm
  CHECK(std::abs(s.readings[10].x - 6.1) < 1e-15);
}

TEST_CASE("sheet assets: the polar example lies on the S1 circle") {
  // Invented from the FIELD.md §10.2 S1 MW circle; the meter's 0.1° tilt
  // steps move a point up to 3.3 m·0.0009 rad ≈ 3 mm, so within 6 mm.
  const SurveySheet s = read_sheet_file(asset("sallow-ford_S1-MW_2025_polar.csv"), {});
  CHECK(s.method == SurveyMethod::polar);
  CHECK(s.warnings.empty());
  REQUIRE(s.readings.size() == 12);
  for (const Reading& r : s.readings) {
    if (r.excluded) continue;
    CAPTURE(r.source_line);
    CHECK(std::abs(off_s1_circle(r.x, r.z)) < 0.006);
    CHECK(r.sigma > 0.002);
  }
  // The crown, shot plumb up: x at the instrument, z = 0.800 + 0.797.
  CHECK(std::abs(s.readings[5].x - 3.2) < 1e-12);
  CHECK(std::abs(s.readings[5].z - 1.597) < 1e-12);
  // The shot into a recessed joint is kept, excluded, and reads beyond the soffit.
  CHECK(s.readings[11].excluded);
  CHECK(s.readings[11].exclusion_reason == "reading into a recessed joint");
}

TEST_CASE("sheet assets: the point-list example projects onto its 85° plane") {
  // Generated on bearing 85° with 3 mm out-of-plane noise (1σ) and 2 mm
  // along/height noise; one point on ivy 40 mm proud is excluded.
  const SurveySheet s = read_sheet_file(asset("sallow-ford_S1-DS_2025_points.csv"), {});
  REQUIRE(s.plane);
  CHECK(std::abs(s.plane->bearing_deg - 85.0) < 0.2);
  CHECK(s.plane->points_used == 33);
  CHECK(s.plane->scatter_rms_m > 0.001);
  CHECK(s.plane->scatter_rms_m < 0.006);
  CHECK(s.warnings.empty());
  REQUIRE(s.readings.size() == 34);
  CHECK(s.readings[33].excluded);
  for (const Reading& r : s.readings) {
    if (r.excluded) continue;
    CAPTURE(r.source_line);
    CHECK(std::abs(off_s1_circle(r.x, r.z)) < 0.012);
  }
}
