// Bad input: each case names the file, line and field, and says what to do.
#include <doctest/doctest.h>

#include <string>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_reader.hpp"

using namespace soffit;

namespace {

// The InputError a text raises (line −1 and "no error" when it parses).
InputError error_of(const std::string& text, const std::string& name = "bad.csv") {
  try {
    parse_sheet(text, name, {});
  } catch (const InputError& e) {
    return e;
  }
  return InputError(name, -1, "", "no error");
}

bool says(const InputError& e, const std::string& words) {
  return std::string(e.what()).find(words) != std::string::npos;
}

const std::string kOffsetsHead =
    "soffit-sheet,1\n"       // 1
    "method,offsets\n"       // 2
    "datum_rl_m,9.800\n"     // 3
    "z_origin_rl_m,9.500\n"  // 4
    "readings\n";            // 5

}  // namespace

TEST_CASE("sheet errors: empty file, comments only") {
  CHECK_THROWS_WITH_AS(parse_sheet("", "e.csv", {}), "e.csv: the file is empty", InputError);
  CHECK_THROWS_WITH_AS(parse_sheet("\xEF\xBB\xBF\r\n \n", "e.csv", {}), "e.csv: the file is empty",
                       InputError);
  const InputError e = error_of("# only a comment\n");
  CHECK(e.line() == 0);
  CHECK(says(e, "only comment lines"));
}

TEST_CASE("sheet errors: wrong header of a plain file says which columns are expected") {
  const InputError e = error_of("# note\nx,y\n0,0\n1,1\n2,0\n");
  CHECK(e.line() == 2);
  CHECK(says(e, "x,z or x,z,sigma_mm"));
  // A sheet header without the first line.
  const InputError f = error_of("station_m,offset_mm\n0,-300\n");
  CHECK(f.line() == 1);
  CHECK(says(f, "soffit-sheet,1"));
}

TEST_CASE("sheet errors: wrong or missing columns of a survey sheet") {
  InputError e = error_of(kOffsetsHead + "station_m,ofset_mm\n0,1\n");
  CHECK(e.line() == 6);
  CHECK(says(e, "the offset column is missing; expected station_m, offset_mm;"));
  CHECK(says(e, "optional: sigma_mm, id, exclude, check"));
  e = error_of(kOffsetsHead + "station,offset_mm\n");
  CHECK(e.line() == 6);
  CHECK(e.field() == "station");
  CHECK(says(e, "needs a unit, for example station_m"));
  e = error_of(kOffsetsHead + "station_m,offset_mm,easting_m\n");
  CHECK(e.field() == "easting_m");
  CHECK(says(e, "belongs to method points"));
  e = error_of(kOffsetsHead + "station_m,offset_mm,offset_m\n");
  CHECK(e.field() == "offset_m");
  CHECK(says(e, "this column appears twice"));
  e = error_of("soffit-sheet,1\nmethod,polar\nreadings\nhdist_m,sdist_m,zenith_gon\n");
  CHECK(e.line() == 4);
  CHECK(says(e, "two distance columns are given; keep one (hdist_m or sdist_m, elevation_deg or "
                "zenith_gon; optional: direction,"));
}

TEST_CASE("sheet errors: unknown units suffix") {
  InputError e = error_of(kOffsetsHead + "station_m,offset_in\n0,1\n");
  CHECK(e.line() == 6);
  CHECK(e.field() == "offset_in");
  CHECK(says(e, "unit 'in' is not known for offset; use m, cm or mm"));
  e = error_of("soffit-sheet,1\nmethod,offsets\ndatum_rl_ft,32.1\nreadings\n");
  CHECK(e.line() == 3);
  CHECK(e.field() == "datum_rl_ft");
  CHECK(says(e, "unit 'ft' is not known"));
  e = error_of("soffit-sheet,1\nmethod,polar\nreadings\nid,sdist_m,zenith_rad\n");
  CHECK(e.field() == "zenith_rad");
  CHECK(says(e, "deg, gon, mgon or arcsec"));
}

TEST_CASE("sheet errors: a non-numeric cell, a decimal comma, NaN and Inf") {
  InputError e = error_of("x,z\n0,0\n0.8,abc\n1.6,1\n");
  CHECK(e.line() == 3);
  CHECK(e.field() == "z");
  CHECK(says(e, "'abc' is not a number"));
  e = error_of(kOffsetsHead + "station_m,offset_mm\n0,-300\n\"0,4\",160\n");
  CHECK(e.line() == 8);
  CHECK(e.field() == "station_m");
  CHECK(says(e, "use a point as the decimal separator"));
  for (const char* bad : {"nan", "NaN", "inf", "-inf", "Infinity"}) {
    CAPTURE(bad);
    e = error_of(kOffsetsHead + "station_m,offset_mm\n0,-300\n0.4," + bad + "\n");
    CHECK(e.line() == 8);
    CHECK(e.field() == "offset_mm");
    CHECK(says(e, "NaN and infinity are not accepted"));
  }
  e = error_of("soffit-sheet,1\nmethod,offsets\ndatum_rl_m,nan\nreadings\n");
  CHECK(e.line() == 3);
  CHECK(e.field() == "datum_rl_m");
}

TEST_CASE("sheet errors: fewer than three usable readings") {
  InputError e = error_of("x,z\n0,0\n1,1\n");
  CHECK(e.line() == 0);
  CHECK(says(e, "only 2 usable readings"));
  // Four rows, but one excluded and one a check: two usable.
  e = error_of(kOffsetsHead +
               "station_m,offset_mm,exclude,check\n0,-300,,\n0.4,160,tape slipped,\n0.8,493,,\n"
               "0,-300,,yes\n");
  CHECK(e.line() == 0);
  CHECK(says(e, "only 2 usable readings (of 4 rows"));
}

TEST_CASE("sheet errors: a repeated station not marked as a check names both lines") {
  const InputError e =
      error_of(kOffsetsHead + "station_m,offset_mm\n0,-300\n0.4,160\n0.8,493\n0.4,161\n");
  CHECK(e.line() == 10);
  CHECK(e.field() == "station_m");
  CHECK(says(e, "station 0.4 m appears twice (lines 8 and 10)"));
  CHECK(says(e, "write yes in its check column"));
  // Polar: the same point id twice.
  const InputError p = error_of(
      "soffit-sheet,1\nmethod,polar\ninstrument_x_m,3\naxis_rl_m,10\nreadings\n"
      "id,sdist_m,elevation_deg\nA,1,10\nB,2,20\nA,1.1,11\nC,3,5\n");
  CHECK(p.line() == 9);
  CHECK(p.field() == "id");
  CHECK(says(p, "point A appears twice (lines 7 and 9)"));
}

TEST_CASE("sheet errors: repeated identical points in an x,z file") {
  const InputError e = error_of("x,z\n0,0\n1.6,1.268\n3.2,1.602\n1.600,1.2680\n");
  CHECK(e.line() == 5);
  CHECK(e.field() == "x");
  CHECK(says(e, "appears twice (lines 3 and 5)"));
}

TEST_CASE("sheet errors: millimetres in a metres column and metres in a millimetres column") {
  // FIELD.md §3.3 "units mixed": ×1000 blunders.
  InputError e = error_of("x,z\n0,0\n3200,1.6\n6400,0\n");
  CHECK(e.line() == 4);
  CHECK(e.field() == "x");
  CHECK(says(e, "run from 0.000 to 6400.000, which looks like millimetres"));
  CHECK(says(e, "divide the values by 1000"));
  e = error_of(kOffsetsHead + "station_mm,offset_mm\n0,-0.3\n3200,1.302\n6400,-0.3\n");
  CHECK(e.line() == 7);
  CHECK(e.field() == "offset_mm");
  CHECK(says(e, "looks like metres in a millimetres column; rename the column offset_m"));
  e = error_of(kOffsetsHead + "station_m,offset_mm,sigma_mm\n0,-300,0.003\n1,10,\n2,20,\n");
  CHECK(e.line() == 7);
  CHECK(e.field() == "sigma_mm");
  e = error_of(kOffsetsHead + "station_m,offset_mm\n0,-300\n3200,1302\n6400,-300\n");
  CHECK(e.line() == 9);
  CHECK(e.field() == "station_m");
  CHECK(says(e, "rename the column station_mm"));
}

TEST_CASE("sheet errors: unknown metadata key is a warning, not an error") {
  const SurveySheet s = parse_sheet(kOffsetsHead.substr(0, kOffsetsHead.size() - 9) +
                                        "colour,red\nreadings\nstation_m,offset_mm\n0,-300\n1,10\n2,20\n",
                                    "w.csv", {});
  REQUIRE(s.warnings.size() == 1);
  CHECK(s.warnings[0] ==
        "w.csv:5: unknown metadata key 'colour' kept as written but not used (see "
        "SHEET_FORMAT.md for the keys)");
  CHECK(s.raw_metadata.back().key == "colour");
}

TEST_CASE("sheet errors: angles out of range") {
  const std::string head =
      "soffit-sheet,1\nmethod,polar\ninstrument_x_m,3\naxis_rl_m,10\nreadings\n";
  InputError e = error_of(head + "hdist_m,zenith_gon\n1,50\n2,250\n3,80\n");
  CHECK(e.line() == 8);
  CHECK(e.field() == "zenith_gon");
  CHECK(says(e, "a zenith angle of 250 gon is out of range (0 to 200 gon)"));
  e = error_of(head + "sdist_m,elevation_deg\n1,50\n2,95\n3,80\n");
  CHECK(e.line() == 8);
  CHECK(says(e, "(-90 to 90 deg)"));
  e = error_of(head + "hdist_m,elevation_deg\n1,50\n2,90\n3,80\n");
  CHECK(e.line() == 8);
  CHECK(says(e, "a vertical shot has no horizontal distance"));
  e = error_of("soffit-sheet,1\nmethod,points\nbearing_deg,400\nreadings\n"
               "easting_m,northing_m,height_m\n0,0,1\n1,0,2\n2,0,1\n");
  CHECK(e.line() == 3);
  CHECK(e.field() == "bearing_deg");
}

TEST_CASE("sheet errors: structure of the survey sheet") {
  InputError e = error_of("soffit-sheet,2\nmethod,offsets\n");
  CHECK(e.line() == 1);
  CHECK(says(e, "newer than this program reads (version 1)"));
  e = error_of("soffit-sheet\nmethod,offsets\n");
  CHECK(says(e, "must read soffit-sheet,1"));
  e = error_of("soffit-sheet,1\nmethod,offsets\nstation_m,offset_mm\n0,1\n");
  CHECK(e.line() == 3);
  CHECK(says(e, "the line 'readings' is missing"));
  e = error_of("soffit-sheet,1\nmethod,offsets\nspan,S1\n");
  CHECK(says(e, "no 'readings' line"));
  e = error_of("soffit-sheet,1\nspan,S1\nreadings\nstation_m,offset_mm\n");
  CHECK(e.field() == "method");
  e = error_of("soffit-sheet,1\nmethod,tape\nreadings\n");
  CHECK(e.line() == 2);
  CHECK(says(e, "'tape' is not a method"));
  e = error_of("soffit-sheet,1\nmethod,offsets\nreadings\n");
  CHECK(e.line() == 3);
  CHECK(says(e, "no column header after the 'readings' line"));
  e = error_of("soffit-sheet,1\nmethod,offsets\nspan,S1\nspan,S2\nreadings\n");
  CHECK(e.line() == 4);
  CHECK(says(e, "given twice (also on line 3"));
  e = error_of("soffit-sheet,1\nmethod,offsets\ninstrument,Leica\nreadings\n");
  CHECK(e.field() == "instrument");
  CHECK(says(e, "not an instrument class"));
  e = error_of("soffit-sheet,1\nmethod,offsets\ndirection,diagonal\nreadings\n");
  CHECK(e.field() == "direction");
  e = error_of("soffit-sheet,1\nmethod,offsets\ndatum_rl_m\nreadings\n");
  CHECK(e.line() == 3);
  CHECK(says(e, "the value is missing"));
}

TEST_CASE("sheet errors: rows, flags and set-up keys") {
  InputError e = error_of(kOffsetsHead + "station_m,offset_mm\n0,-300,5\n");
  CHECK(e.line() == 7);
  CHECK(says(e, "3 cells but the header has 2 columns"));
  e = error_of(kOffsetsHead + "station_m,offset_mm\n0,\n");
  CHECK(e.line() == 7);
  CHECK(e.field() == "offset_mm");
  CHECK(says(e, "the cell is empty"));
  e = error_of(kOffsetsHead + "station_m,offset_mm,check\n0,-300,maybe\n");
  CHECK(e.field() == "check");
  CHECK(says(e, "'maybe' is not understood"));
  e = error_of(kOffsetsHead + "station_m,offset_mm,sigma_mm\n0,-300,-2\n");
  CHECK(e.field() == "sigma_mm");
  e = error_of("soffit-sheet,1\nmethod,offsets\ndatum_start_station_m,0\ndatum_start_rl_m,9.8\n"
               "readings\nstation_m,offset_mm\n0,1\n1,2\n2,3\n");
  CHECK(e.line() == 4);
  CHECK(says(e, "missing: datum_end_station_m, datum_end_rl_m"));
  e = error_of("soffit-sheet,1\nmethod,polar\naxis_rl_m,10\nreadings\nsdist_m,elevation_deg\n"
               "1,1\n2,2\n3,3\n");
  CHECK(e.field() == "instrument_x_m");
  e = error_of("soffit-sheet,1\nmethod,polar\ninstrument_x_m,1\nground_rl_m,9\nreadings\n"
               "sdist_m,elevation_deg\n1,1\n2,2\n3,3\n");
  CHECK(e.line() == 4);
  CHECK(says(e, "missing: instrument_height_m"));
  e = error_of("soffit-sheet,1\nmethod,polar\ninstrument_x_m,1\naxis_rl_m,9\nreadings\n"
               "sdist_m,elevation_deg\n1,1\n-2,2\n3,3\n");
  CHECK(e.line() == 8);
  CHECK(says(e, "a distance must be greater than zero"));
  e = error_of("soffit-sheet,1\nmethod,points\nreadings\neasting_m,northing_m,height_m\n"
               "1,1,1\n1,1,2\n1,1,3\n");
  CHECK(says(e, "same plan position"));
}

TEST_CASE("sheet errors: a missing file") {
  CHECK_THROWS_WITH_AS(read_sheet_file("/nonexistent/dir/none.csv", {}),
                       "/nonexistent/dir/none.csv: the file cannot be opened (check the name and "
                       "that it exists)",
                       InputError);
}
