// Writing an edited section back to the project (issue 4: readings typed in
// the field app are saved as they are made; issue 3: an issued visit is
// read-only). Sheet: the invented Sallow Ford S1 mid-width 2019 (FIELD.md §10.2).
#include <doctest/doctest.h>

#include "app/model/sheet_rows.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/section_readings.hpp"
#include "storage/sheet_export.hpp"
#include "storage/sheet_import.hpp"
#include "storage/storage_error.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit;
using namespace soffit::storage;
using soffit::test::TempDir;

namespace {

SurveySheet mid_width_2019() {
  return read_sheet_file(std::string(SOFFIT_ASSETS) + "/sheets/sallow-ford_S1-MW_2019.csv", {});
}

void save(Project& p, const std::string& section, const SurveySheet& sheet) {
  p.edit("save rows", [&](Connection& db) { save_section_rows(db, p.author(), section, sheet); });
}

}  // namespace

TEST_CASE("a changed cell updates its row in place - a new row is added - the file reads back as typed") {
  TempDir dir;
  Project p = Project::create(dir.file("rows.soffit"), "J. Okafor");
  const auto r = import_sheet(p, mid_width_2019(), {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
  const std::vector<std::string> ids_before = section_reading_ids(p.db(), r.section_id);
  SurveySheet sheet = load_section_sheet(p.db(), r.section_id);

  app::RowState crown = app::row_state(sheet, 5);
  crown.cells[2] = "1350";
  sheet = app::with_row(sheet, 5, crown);
  app::RowState added;
  added.cells = {"12", "3.600", "1280", "brick", "", "", "typed on site"};
  added.line = app::next_line(sheet);
  sheet = app::with_row(sheet, sheet.raw_rows.size(), added);
  save(p, r.section_id, sheet);

  const std::vector<std::string> ids_after = section_reading_ids(p.db(), r.section_id);
  REQUIRE(ids_after.size() == 12);
  for (size_t i = 0; i < ids_before.size(); ++i) CHECK(ids_after[i] == ids_before[i]);  // keys kept
  const SurveySheet stored = load_section_sheet(p.db(), r.section_id);
  CHECK(stored.raw_rows[5].cells[2] == "1350");
  CHECK(std::abs(stored.readings[5].z - 1.650) < 1e-12);  // z = 0.300 m + offset (SHEET_FORMAT.md)
  CHECK(stored.raw_rows[11].cells[6] == "typed on site");
  CHECK(std::abs(stored.readings[11].x - 3.600) < 1e-12);
  CHECK(std::abs(stored.readings[11].z - 1.580) < 1e-12);
  // The exported sheet reads back to the same readings (the round trip of issue 3 holds after edits).
  const SurveySheet again = parse_sheet(export_section_sheet(p.db(), r.section_id), "again.csv", {});
  REQUIRE(again.readings.size() == 12);
  for (size_t i = 0; i < 12; ++i) CHECK(again.readings[i].z == stored.readings[i].z);

  // One edit, one undo step.
  REQUIRE(p.undo());
  const SurveySheet undone = load_section_sheet(p.db(), r.section_id);
  CHECK(undone.readings.size() == 11);
  CHECK(undone.raw_rows[5].cells[2] == "1302");
}

TEST_CASE("removing the last row deletes only it - an issued visit refuses and keeps its rows") {
  TempDir dir;
  Project p = Project::create(dir.file("rows.soffit"), "J. Okafor");
  const auto r = import_sheet(p, mid_width_2019(), {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
  SurveySheet sheet = load_section_sheet(p.db(), r.section_id);
  save(p, r.section_id, app::with_row(sheet, 10, std::nullopt));
  CHECK(section_reading_ids(p.db(), r.section_id).size() == 10);
  REQUIRE(p.undo());
  CHECK(section_reading_ids(p.db(), r.section_id).size() == 11);

  p.edit("check", [&](Connection& db) { set_inspection_status(db, p.author(), r.inspection_id, "checked"); });
  p.edit("issue", [&](Connection& db) { set_inspection_status(db, p.author(), r.inspection_id, "issued"); });
  app::RowState crown = app::row_state(sheet, 5);
  crown.cells[2] = "1350";
  CHECK_THROWS_AS(save(p, r.section_id, app::with_row(sheet, 5, crown)), StorageError);
  const SurveySheet stored = load_section_sheet(p.db(), r.section_id);
  CHECK(stored.raw_rows[5].cells[2] == "1302");
  CHECK(stored.readings.size() == 11);
}
