// Which precision each reading gets: its own sigma cell, else --sigma-mm,
// else the sheet's sigma, else (polar) the propagated one, else the
// instrument class default of sheet_defaults.cpp.
#include <doctest/doctest.h>

#include <cmath>
#include <string>

#include "geometry/sheet/angles.hpp"
#include "geometry/sheet/sheet_defaults.hpp"
#include "geometry/sheet/sheet_reader.hpp"

using namespace soffit;

namespace {

std::string offsets_sheet(const std::string& extra_meta) {
  return "soffit-sheet,1\nmethod,offsets\ndatum_rl_m,9.8\nz_origin_rl_m,9.5\n" + extra_meta +
         "readings\nstation_m,offset_mm,sigma_mm\n0,-300,\n1,10,1.5\n2,20,\n";
}

}  // namespace

TEST_CASE("sheet sigma: the instrument class table holds FIELD.md §3.1 values (from memory)") {
  // FIELD.md §3.1, marked [fm] there: string line ±3–5 mm, laser datum ±2–3,
  // levelling ±1; the class default is the middle of the quoted range.
  CHECK(std::abs(find_instrument_class("string-line")->sigma_m - 0.004) < 1e-15);
  CHECK(std::abs(find_instrument_class("laser-level")->sigma_m - 0.0025) < 1e-15);
  CHECK(std::abs(find_instrument_class("levelling")->sigma_m - 0.001) < 1e-15);
  CHECK(find_instrument_class("theodolite") == nullptr);
  CHECK(default_instrument_class(SurveyMethod::offsets).key == "laser-level");
  CHECK(default_instrument_class(SurveyMethod::points).key == "total-station");
}

TEST_CASE("sheet sigma: order of precedence") {
  // No sheet sigma: the method's class (laser-level, 2.5 mm); the row's own 1.5 mm wins.
  SurveySheet s = parse_sheet(offsets_sheet(""), "s.csv", {});
  CHECK(std::abs(s.readings[0].sigma - 0.0025) < 1e-15);
  CHECK(std::abs(s.readings[1].sigma - 0.0015) < 1e-15);
  // A named class.
  s = parse_sheet(offsets_sheet("instrument,string-line\n"), "s.csv", {});
  CHECK(std::abs(s.readings[0].sigma - 0.004) < 1e-15);
  // The sheet's own default beats the class.
  s = parse_sheet(offsets_sheet("instrument,string-line\nsigma_mm,3\n"), "s.csv", {});
  CHECK(std::abs(s.readings[0].sigma - 0.003) < 1e-15);
  // --sigma-mm beats the sheet, not the row.
  SheetOptions opts;
  opts.default_sigma_m = 0.005;
  s = parse_sheet(offsets_sheet("sigma_mm,3\n"), "s.csv", opts);
  CHECK(std::abs(s.readings[0].sigma - 0.005) < 1e-15);
  CHECK(std::abs(s.readings[2].sigma - 0.005) < 1e-15);
  CHECK(std::abs(s.readings[1].sigma - 0.0015) < 1e-15);
}

TEST_CASE("sheet sigma: polar readings get the propagated precision") {
  // No precision in the sheet: the handheld-laser-polar class, 2 mm and 0.2°.
  // Slope 2 m at 30°: σ = √((2² + (2000·0.0034906585)²)/2) = 5.135114 mm
  // (worked in test_sheet_polar.cpp).
  const std::string text =
      "soffit-sheet,1\nmethod,polar\ninstrument_x_m,3.2\naxis_rl_m,10.3\nreadings\n"
      "sdist_m,elevation_deg\n2,30\n1,60\n3,10\n";
  SurveySheet s = parse_sheet(text, "p.csv", {});
  CHECK(std::abs(s.readings[0].sigma - 0.005135114) < 1e-8);
  // A stated sheet sigma replaces the propagation.
  s = parse_sheet("soffit-sheet,1\nmethod,polar\ninstrument_x_m,3.2\naxis_rl_m,10.3\nsigma_mm,7\n"
                  "readings\nsdist_m,elevation_deg\n2,30\n1,60\n3,10\n",
                  "p.csv", {});
  CHECK(std::abs(s.readings[0].sigma - 0.007) < 1e-15);
}

TEST_CASE("sheet sigma: plain x,z files use their column or --sigma-mm") {
  SurveySheet s = parse_sheet("x,z,sigma_mm\n0,0,2\n1,1,\n2,0,3\n", "xz.csv", {});
  CHECK(std::abs(s.readings[0].sigma - 0.002) < 1e-15);
  CHECK(s.readings[1].sigma == 0.0);  // not stated
  CHECK(s.warnings.size() == 1);
  SheetOptions opts;
  opts.default_sigma_m = 0.004;
  s = parse_sheet("x,z,sigma_mm\n0,0,2\n1,1,\n2,0,3\n", "xz.csv", opts);
  CHECK(std::abs(s.readings[1].sigma - 0.004) < 1e-15);
  CHECK(std::abs(s.readings[2].sigma - 0.003) < 1e-15);
  CHECK(s.warnings.empty());
}
