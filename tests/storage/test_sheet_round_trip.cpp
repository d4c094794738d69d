// Import of a survey sheet into a project and export back (issue 3: "export
// of a section back to the same format (the round trip is exact)").
#include <doctest/doctest.h>

#include <cmath>

#include "geometry/sheet/sheet_reader.hpp"
#include "storage/project_file.hpp"
#include "storage/register_queries.hpp"
#include "storage/sheet_export.hpp"
#include "storage/sheet_import.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

namespace {

const std::string kSheets = std::string(SOFFIT_ASSETS) + "/sheets/";

void check_same_readings(const soffit::Readings& a, const soffit::Readings& b) {
  REQUIRE(a.size() == b.size());
  for (size_t i = 0; i < a.size(); ++i) {
    CAPTURE(i);
    CHECK(a[i].x == b[i].x);  // exact: the same text reduces to the same double
    CHECK(a[i].z == b[i].z);
    CHECK(a[i].sigma == b[i].sigma);
    CHECK(a[i].excluded == b[i].excluded);
    CHECK(a[i].exclusion_reason == b[i].exclusion_reason);
    CHECK(a[i].check == b[i].check);
    CHECK(a[i].note == b[i].note);
  }
}

void check_same_layout(const soffit::SurveySheet& a, const soffit::SurveySheet& b) {
  CHECK(a.form == b.form);
  CHECK(a.method == b.method);
  REQUIRE(a.raw_rows.size() == b.raw_rows.size());
  for (size_t i = 0; i < a.raw_rows.size(); ++i) CHECK(a.raw_rows[i].cells == b.raw_rows[i].cells);
  REQUIRE(a.raw_metadata.size() == b.raw_metadata.size());
  for (size_t i = 0; i < a.raw_metadata.size(); ++i) {
    CHECK(a.raw_metadata[i].key == b.raw_metadata[i].key);
    CHECK(a.raw_metadata[i].values == b.raw_metadata[i].values);
  }
  REQUIRE(a.columns.size() == b.columns.size());
  for (size_t i = 0; i < a.columns.size(); ++i) CHECK(a.columns[i].name == b.columns[i].name);
  REQUIRE(a.comments.size() == b.comments.size());
  for (size_t i = 0; i < a.comments.size(); ++i) CHECK(a.comments[i].text == b.comments[i].text);
}

soffit::SurveySheet round_trip(const std::string& file, const std::string& section, std::string* text_out = nullptr) {
  TempDir dir;
  const auto original = soffit::read_sheet_file(kSheets + file, {});
  Project p = Project::create(dir.file("round_trip.soffit"), "J. Okafor");
  const auto r = import_sheet(p, original, {"BVDC-ST-0417", 1, "2019-05-14", section});
  const std::string text = export_section_sheet(p.db(), r.section_id);
  if (text_out) *text_out = text;
  const auto again = soffit::parse_sheet(text, "exported.csv", {});
  check_same_readings(original.readings, again.readings);
  check_same_layout(original, again);
  check_same_readings(original.readings, load_section_sheet(p.db(), r.section_id).readings);
  return again;
}

}  // namespace

TEST_CASE("the S1 mid-width 2019 offsets sheet survives import and export exactly") {
  std::string text;
  const auto again = round_trip("sallow-ford_S1-MW_2019.csv", "MW", &text);
  // FIELD.md §10.2: datum RL 9.800, springing line RL 9.500, so z = offset + 0.300 m;
  // the crown station x = 3.2 m read 1302 mm in 2019.
  REQUIRE(again.readings.size() == 11);
  CHECK(std::abs(again.readings[5].x - 3.2) < 1e-12);
  CHECK(std::abs(again.readings[5].z - 1.602) < 1e-12);
  CHECK(std::abs(again.readings[0].z - 0.0) < 1e-12);  // W springing, −300 mm
  CHECK(std::abs(again.readings[0].sigma - 0.003) < 1e-15);  // sigma_mm,3 in the sheet
  // Cells with commas are quoted again, as the sheet had them.
  CHECK(text.find("weather,\"overcast, dry; air 13 C, soffit 11 C\"") != std::string::npos);
  CHECK(text.rfind("soffit-sheet,1\n", 0) == 0);
}

TEST_CASE("polar, points and plain x,z sheets also survive import and export") {
  round_trip("sallow-ford_S1-MW_2025_polar.csv", "MW");
  round_trip("sallow-ford_S1-DS_2025_points.csv", "DS");
  round_trip("sallow-ford_S1-MW_2019_xz.csv", "MW");
}

TEST_CASE("importing stores the section under its structure, span, inspection and date") {
  TempDir dir;
  Project p = Project::create(dir.file("register.soffit"), "J. Okafor");
  const auto mw = soffit::read_sheet_file(kSheets + "sallow-ford_S1-MW_2019.csv", {});
  const auto us = soffit::read_sheet_file(kSheets + "sallow-ford_S1-US_2019.csv", {});
  const auto a = import_sheet(p, mw, {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
  const auto b = import_sheet(p, us, {"BVDC-ST-0417", 1, "2019-05-14", "US"});
  CHECK(a.structure_created);
  CHECK_FALSE(b.structure_created);
  CHECK(a.inspection_id == b.inspection_id);  // one visit, two sections
  const auto d = structure_detail(p.db(), "BVDC-ST-0417");
  REQUIRE(d.has_value());
  CHECK(d->structure.fields.name == "Sallow Ford Bridge");  // from the sheet's structure_name
  REQUIRE(d->inspections.size() == 1);
  CHECK(d->inspections[0].status == "draft");
  REQUIRE(d->inspections[0].sections.size() == 2);
  // Ordered by position across the width: US at y = 0.15, MW at 2.60 (FIELD.md §10.2).
  CHECK(d->inspections[0].sections[0].label == "US");
  CHECK(d->inspections[0].sections[1].label == "MW");
  CHECK(std::abs(*d->inspections[0].sections[1].position_m - 2.60) < 1e-12);
  CHECK(d->inspections[0].sections[1].method == "offsets");

  // The same section again is refused and nothing is overwritten.
  try {
    import_sheet(p, mw, {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
    FAIL("imported the same section twice");
  } catch (const StorageError& e) {
    CHECK(e.kind() == ErrorKind::invalid);
    CHECK(std::string(e.what()).find("already in the project") != std::string::npos);
  }
  CHECK(p.db().query_int("SELECT count(*) FROM reading") == 22);
}
