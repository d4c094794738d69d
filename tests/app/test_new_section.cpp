// A section started on site with no readings yet (issue 4: a readings grid
// filled on site), then keyed in one reading at a time. Levels: the invented
// Sallow Ford datum of FIELD.md §10.2 (datum RL 9.800, springing RL 9.500), so by
// the offsets reduction of SHEET_FORMAT.md z = 0.300 m + offset.
#include <doctest/doctest.h>

#include <cmath>

#include "app/model/new_section.hpp"
#include "app/model/sheet_rows.hpp"
#include "app/model/section_store.hpp"
#include "geometry/core/input_error.hpp"
#include "storage/register_queries.hpp"
#include "storage/sheet_export.hpp"
#include "storage/storage_error.hpp"
#include "tests/app/demo_project_fixture.hpp"

using namespace soffit;

namespace {

app::NewSection east_quarter() {
  app::NewSection s;
  s.structure_ref = "BVDC-ST-0417";
  s.date = "2025-05-21";  // the demo's draft visit
  s.span_index = 1;
  s.label = "Q3";
  s.datum_rl_m = 9.800;
  s.z_origin_rl_m = 9.500;
  s.sigma_mm = 3;
  return s;
}

}  // namespace

TEST_CASE("a new section starts empty in the draft visit and takes readings typed one at a time") {
  test::DemoProject demo;
  storage::Project& p = *demo.project;
  const std::string id = app::add_blank_section(p, east_quarter());
  SurveySheet sheet = storage::load_section_sheet(p.db(), id);
  CHECK(sheet.readings.empty());
  CHECK(sheet.method == SurveyMethod::offsets);
  REQUIRE(sheet.columns.size() == 7);

  // Crown and both springings of FIELD.md §10.2's S1: offsets -300, 1302, -300 mm.
  const std::pair<const char*, const char*> typed[] = {{"0.000", "-300"}, {"3.200", "1302"}, {"6.400", "-300"}};
  for (const auto& [station, offset] : typed) {
    app::RowState row;
    row.cells.assign(sheet.columns.size(), "");
    row.cells[1] = station;
    row.cells[2] = offset;
    row.line = app::next_line(sheet);
    sheet = app::with_row(sheet, sheet.readings.size(), row);  // one and two readings are kept, not refused
    app::save_section(p, id, sheet, "add reading");
  }
  const SurveySheet stored = storage::load_section_sheet(p.db(), id);
  REQUIRE(stored.readings.size() == 3);
  CHECK(std::abs(stored.readings[1].z - 1.602) < 1e-12);
  CHECK(std::abs(stored.readings[2].x - 6.400) < 1e-12);
  CHECK(std::abs(stored.readings[0].sigma - 0.003) < 1e-12);  // the form's 3 mm
  // Undo goes back one reading at a time, then removes the section itself.
  REQUIRE(p.undo());
  CHECK(storage::load_section_sheet(p.db(), id).readings.size() == 2);
}

TEST_CASE("a new section is refused without a label or a level, or with a label already used in that span") {
  test::DemoProject demo;
  app::NewSection s = east_quarter();
  s.label = "";
  try {
    app::add_blank_section((*demo.project), s);
    FAIL("an empty label was accepted");
  } catch (const InputError& e) {
    CHECK(e.field() == "label");
  }
  s = east_quarter();
  s.datum_rl_m.reset();
  try {
    app::add_blank_section((*demo.project), s);
    FAIL("a missing datum level was accepted");
  } catch (const InputError& e) {
    CHECK(e.field() == "datum_rl_m");
  }
  s = east_quarter();
  s.label = "MW";  // the demo's 2025 visit already has S1 MW
  CHECK_THROWS_AS(app::add_blank_section((*demo.project), s), storage::StorageError);
}

TEST_CASE("a new x,z section takes reduced points as typed") {
  test::DemoProject demo;
  app::NewSection s = east_quarter();
  s.booking = app::NewSectionBooking::xz;
  s.datum_rl_m.reset();
  s.z_origin_rl_m.reset();
  const std::string id = app::add_blank_section((*demo.project), s);
  SurveySheet sheet = storage::load_section_sheet((*demo.project).db(), id);
  REQUIRE(sheet.columns.size() == 3);
  app::RowState row;
  row.cells = {"3.2", "1.602", ""};
  row.line = app::next_line(sheet);
  sheet = app::with_row(sheet, 0, row);
  REQUIRE(sheet.readings.size() == 1);
  CHECK(std::abs(sheet.readings[0].z - 1.602) < 1e-12);
}
