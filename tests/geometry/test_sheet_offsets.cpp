// Offsets from a datum line: level and sloping datums, taut-line sag, offsets
// measured downward. Expected values are worked by hand in the comments.
#include <doctest/doctest.h>

#include <cmath>
#include <string>

#include "geometry/sheet/reduce_offsets.hpp"
#include "geometry/sheet/sheet_reader.hpp"

using namespace soffit;

namespace {
constexpr double kTol = 1e-12;  // metres; the arithmetic below is exact to ~1e-15
}

TEST_CASE("sheet offsets: level datum, z above the springing line") {
  // FIELD.md §10.2: datum RL 9.800, springing RL 9.500, station 0.8, offset
  // +493 mm: z = 9.800 − 9.500 + 0.493 = 0.793 m, x = 0.8 m.
  OffsetSetup s;
  s.datum_rl_m = 9.800;
  s.z_origin_rl_m = 9.500;
  const Point2 p = reduce_offset(s, 0.8, 0.493);
  CHECK(std::abs(p.x - 0.8) < kTol);
  CHECK(std::abs(p.z - 0.793) < kTol);
  // A springing read −300 mm (below the line) lands on z = 0.
  CHECK(std::abs(reduce_offset(s, 0.0, -0.300).z) < kTol);
}

TEST_CASE("sheet offsets: x origin shifts stations") {
  // Stations taped from a mark 0.250 m west of the springing: x = 1.850 − 0.250 = 1.600.
  OffsetSetup s;
  s.x_origin_m = 0.250;
  CHECK(std::abs(reduce_offset(s, 1.850, 0.0).x - 1.600) < kTol);
}

TEST_CASE("sheet offsets: sloping datum interpolates linearly") {
  // Datum RL 9.800 at station 0 and 9.805 at 6.4 (FIELD.md §3.3: "datum not
  // level, up to 5 mm"). At 3.2 the line is at 9.8025; offset 1302 mm:
  // z = 9.8025 − 9.500 + 1.302 = 1.6045. At 8.0 (beyond the end) the line is
  // extrapolated: 9.800 + 0.005·8.0/6.4 = 9.80625.
  OffsetSetup s;
  s.datum_start = DatumMark{0.0, 9.800};
  s.datum_end = DatumMark{6.4, 9.805};
  s.z_origin_rl_m = 9.500;
  CHECK(std::abs(datum_height_at(s, 3.2) - 9.8025) < kTol);
  CHECK(std::abs(datum_height_at(s, 8.0) - 9.80625) < kTol);
  CHECK(std::abs(reduce_offset(s, 3.2, 1.302).z - 1.6045) < 1e-12);
}

TEST_CASE("sheet offsets: taut-line sag, parabolic between the line ends") {
  // Line from station 0 to 6.4 sagging 5 mm at mid-length (FIELD.md §3.1: a
  // 2 g/m line over 6.4 m sags ≈ 5 mm at 20 N). The drop is sag·4u(1−u):
  //   u = 0.25 (station 1.6): 5·4·0.25·0.75 = 3.75 mm;  u = 0.5: 5 mm;  ends: 0.
  // A reading up from the sagging line starts lower: station 1.6, offset 968:
  //   z = 0.300 − 0.00375 + 0.968 = 1.26425.
  OffsetSetup s;
  s.datum_rl_m = 9.800;
  s.z_origin_rl_m = 9.500;
  s.sag_m = 0.005;
  s.line_start_station_m = 0.0;
  s.line_end_station_m = 6.4;
  CHECK(std::abs(sag_drop_at(s, 1.6) - 0.00375) < kTol);
  CHECK(std::abs(sag_drop_at(s, 3.2) - 0.005) < kTol);
  CHECK(sag_drop_at(s, 0.0) == 0.0);
  CHECK(sag_drop_at(s, 6.4) == 0.0);
  CHECK(sag_drop_at(s, 7.0) == 0.0);  // beyond the end: the line is held there
  CHECK(std::abs(reduce_offset(s, 1.6, 0.968).z - 1.26425) < kTol);
  CHECK(std::abs(reduce_offset(s, 3.2, 1.302).z - 1.597) < kTol);
}

TEST_CASE("sheet offsets: offsets measured downward from a line above") {
  // A line strung at RL 12.000 and the soffit read 900 mm below it:
  // z = 12.000 − 0.900 − 9.500 = 1.600.
  OffsetSetup s;
  s.datum_rl_m = 12.000;
  s.z_origin_rl_m = 9.500;
  s.offsets_down = true;
  CHECK(std::abs(reduce_offset(s, 3.2, 0.900).z - 1.600) < kTol);
}

TEST_CASE("sheet offsets: a sheet with sag and default line ends") {
  // Without line_start/end the taut line runs from the first to the last
  // station (0 and 6.4); the sheet's sag 4 mm gives a 3 mm drop at u = 0.25:
  // station 1.6, offset 968 mm → z = 0.300 − 0.003 + 0.968 = 1.265.
  const char* text =
      "soffit-sheet,1\n"
      "method,offsets\n"
      "instrument,string-line\n"
      "datum_rl_m,9.800\n"
      "z_origin_rl_m,9.500\n"
      "line_sag_mm,4\n"
      "readings\n"
      "station_m,offset_mm\n"
      "0,-300\n"
      "1.6,968\n"
      "3.2,1302\n"
      "6.4,-300\n";
  const SurveySheet s = parse_sheet(text, "sag.csv", {});
  REQUIRE(s.offsets);
  CHECK(s.offsets->line_start_station_m == 0.0);
  CHECK(s.offsets->line_end_station_m == 6.4);
  CHECK(std::abs(s.readings[1].z - 1.265) < 1e-12);
  CHECK(std::abs(s.readings[2].z - (0.300 - 0.004 + 1.302)) < 1e-12);
  CHECK(std::abs(s.readings[3].z - 0.0) < 1e-12);
  CHECK(s.warnings.empty());
}

TEST_CASE("sheet offsets: a sloping datum sheet, stations in mm and offsets in m") {
  // Units stay as written until reduction: station_mm 3200 → 3.2 m; offset_m 1.302.
  // Datum 9.800 at 0 and 9.804 at 6.4: at 3.2 it is 9.802; z = 9.802 − 9.5 + 1.302 = 1.604.
  const char* text =
      "soffit-sheet,1\n"
      "method,offsets\n"
      "datum_start_station_m,0\n"
      "datum_start_rl_m,9.800\n"
      "datum_end_station_m,6.4\n"
      "datum_end_rl_m,9.804\n"
      "z_origin_rl_m,9.500\n"
      "readings\n"
      "station_mm,offset_m\n"
      "0,-0.300\n"
      "3200,1.302\n"
      "6400,-0.296\n";
  const SurveySheet s = parse_sheet(text, "slope.csv", {});
  REQUIRE(s.readings.size() == 3);
  CHECK(std::abs(s.readings[1].x - 3.2) < kTol);
  CHECK(std::abs(s.readings[1].z - 1.604) < kTol);
  // At 6.4 the datum is 9.804: z = 9.804 − 9.5 − 0.296 = 0.008.
  CHECK(std::abs(s.readings[2].z - 0.008) < kTol);
  CHECK(s.columns[0].unit == "mm");
  CHECK(s.raw_rows[1].cells[0] == "3200");
  CHECK(s.raw_rows[1].values[0] == 3200.0);
}

TEST_CASE("sheet offsets: excluded readings and closing checks") {
  // Station 0.4 is read twice: the first is excluded (tape snagged), the
  // second is used; station 0 is repeated as a closing check at the end,
  // 2 mm higher: closure dz = −298 − (−300) = +2.0 mm.
  const char* text =
      "soffit-sheet,1\n"
      "method,offsets\n"
      "datum_rl_m,9.800\n"
      "z_origin_rl_m,9.500\n"
      "readings\n"
      "station_m,offset_mm,exclude,check,surface,note\n"
      "0,-300,,,brick,\n"
      "0.4,190,tape snagged on a voussoir,,brick,\n"
      "0.4,160,,,joint,re-read\n"
      "0.8,493,,,brick,\n"
      "0,-298,,yes,,closing check\n";
  const SurveySheet s = parse_sheet(text, "ck.csv", {});
  REQUIRE(s.readings.size() == 5);
  CHECK(s.readings[1].excluded);
  CHECK(s.readings[1].exclusion_reason == "tape snagged on a voussoir");
  CHECK_FALSE(s.readings[2].excluded);
  CHECK(s.readings[2].note == "surface: joint; re-read");
  CHECK(s.readings[4].check);
  CHECK(s.readings[4].source_line == 11);
  CHECK(included_points(s.readings).size() == 3);
  REQUIRE(s.warnings.size() == 1);
  CHECK(s.warnings[0] == "ck.csv:11: closing check at station 0 m: dz +2.0 mm against line 7");
}
