// Typing into a section's rows (issue 4: a readings grid filled on a keypad or
// the keyboard): a typed cell is reduced by the same reader as a file, a bad
// one is refused naming the file, line and field, and undo goes back exactly.
// Sheet: the invented Sallow Ford S1 mid-width 2019 sheet (FIELD.md §10.2),
// offsets up from a level datum at RL 9.800 with z = 0 at RL 9.500, so by the
// offsets reduction of geometry/sheet/SHEET_FORMAT.md z = 0.300 m + offset.
#include <doctest/doctest.h>

#include <cmath>
#include <string>

#include "app/model/edit_history.hpp"
#include "app/model/sheet_rows.hpp"
#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_reader.hpp"

using namespace soffit;
using app::EditHistory;
using app::RowEdit;
using app::RowState;

namespace {

SurveySheet mid_width_2019() {
  return read_sheet_file(std::string(SOFFIT_ASSETS) + "/sheets/sallow-ford_S1-MW_2019.csv", {});
}

// Columns of that sheet: id, station_m, offset_mm, surface, check, exclude, note.
constexpr size_t kStation = 1, kOffset = 2;

RowEdit set_cell(const SurveySheet& sheet, size_t row, size_t column, const std::string& text) {
  RowEdit e{row, app::row_state(sheet, row), app::row_state(sheet, row), "type"};
  e.after->cells[column] = text;
  return e;
}

}  // namespace

TEST_CASE("a typed offset is reduced to z = datum - springing RL + offset, in the sheet's own millimetres") {
  SurveySheet sheet = mid_width_2019();
  REQUIRE(sheet.readings.size() == 11);
  std::string why;
  CHECK(app::rows_reduce_again(sheet, why));
  EditHistory h;
  h.apply(sheet, set_cell(sheet, 5, kOffset, "1350"));
  CHECK(sheet.raw_rows[5].cells[kOffset] == "1350");
  CHECK(std::abs(sheet.readings[5].z - (0.300 + 1.350)) < 1e-12);  // SHEET_FORMAT.md offsets reduction
  CHECK(std::abs(sheet.readings[5].x - 3.200) < 1e-12);
  CHECK(sheet.raw_rows[5].line == 30);  // the row keeps its line in the sheet
  REQUIRE(h.undo(sheet) != nullptr);
  CHECK(sheet.raw_rows[5].cells[kOffset] == "1302");
  CHECK(std::abs(sheet.readings[5].z - 1.602) < 1e-12);  // FIELD.md §10.2: crown 1302 mm, z 1.602 m
  REQUIRE(h.redo(sheet) != nullptr);
  CHECK(std::abs(sheet.readings[5].z - 1.650) < 1e-12);
}

TEST_CASE("a value that is not a number is refused with the file, the row's own line and the column") {
  SurveySheet sheet = mid_width_2019();
  const SurveySheet before = sheet;
  EditHistory h;
  try {
    h.apply(sheet, set_cell(sheet, 3, kOffset, "9,68"));  // a decimal comma (SHEET_FORMAT.md: not accepted)
    FAIL("a decimal comma was accepted");
  } catch (const InputError& e) {
    CHECK(e.line() == 28);  // reading 4 is on line 28 of the file
    CHECK(e.field() == "offset_mm");
    CHECK(std::string(e.what()).find("sallow-ford_S1-MW_2019.csv") != std::string::npos);
  }
  CHECK_FALSE(h.can_undo());
  CHECK(sheet.raw_rows[3].cells == before.raw_rows[3].cells);
  CHECK(sheet.readings[3].z == before.readings[3].z);
}

TEST_CASE("a row added at the end is reduced and fitted with the rest - undo removes it") {
  SurveySheet sheet = mid_width_2019();
  RowState added;
  added.cells.assign(sheet.columns.size(), "");
  added.cells[0] = "12";
  added.cells[kStation] = "3.600";
  CHECK_FALSE(app::row_ready(sheet, added.cells));  // no offset yet
  added.cells[kOffset] = "1280";
  CHECK(app::row_ready(sheet, added.cells));
  added.line = app::next_line(sheet);
  CHECK(added.line == 36);  // after the last row, line 35
  EditHistory h;
  h.apply(sheet, RowEdit{sheet.raw_rows.size(), std::nullopt, added, "add reading 12"});
  REQUIRE(sheet.readings.size() == 12);
  CHECK(std::abs(sheet.readings[11].x - 3.600) < 1e-12);
  CHECK(std::abs(sheet.readings[11].z - 1.580) < 1e-12);
  REQUIRE(h.undo(sheet) != nullptr);
  CHECK(sheet.readings.size() == 11);
  CHECK(sheet.raw_rows.size() == 11);
}

TEST_CASE("a station typed twice is refused naming both lines (SHEET_FORMAT.md: repeated station)") {
  SurveySheet sheet = mid_width_2019();
  RowState added;
  added.cells.assign(sheet.columns.size(), "");
  added.cells[kStation] = "3.200";  // the crown station again, without check
  added.cells[kOffset] = "1300";
  added.line = app::next_line(sheet);
  EditHistory h;
  CHECK_THROWS_AS(h.apply(sheet, RowEdit{sheet.raw_rows.size(), std::nullopt, added, "add"}), InputError);
  CHECK(sheet.readings.size() == 11);
}

TEST_CASE("an exclusion is undone and redone exactly, reason included, without touching the cells") {
  SurveySheet sheet = mid_width_2019();
  EditHistory h;
  RowEdit e{1, app::row_state(sheet, 1), app::row_state(sheet, 1), "exclude reading 2"};
  e.after->excluded = true;
  e.after->reason = "reading on a protruding voussoir";
  h.apply(sheet, e);
  CHECK(sheet.readings[1].excluded);
  CHECK(sheet.readings[1].exclusion_reason == "reading on a protruding voussoir");
  CHECK(h.next_undo_label() == "exclude reading 2");
  REQUIRE(h.undo(sheet) != nullptr);
  CHECK_FALSE(sheet.readings[1].excluded);
  CHECK(sheet.readings[1].exclusion_reason.empty());
  REQUIRE(h.redo(sheet) != nullptr);
  CHECK(sheet.readings[1].excluded);

  // A later edit of a cell keeps the exclusion made in the app.
  h.apply(sheet, set_cell(sheet, 2, kOffset, "500"));
  CHECK(sheet.readings[1].excluded);
  CHECK(sheet.readings[1].exclusion_reason == "reading on a protruding voussoir");
  CHECK_FALSE(h.can_redo());
}

TEST_CASE("the polar and points example sheets reduce again to the points they hold") {
  for (const char* name : {"sallow-ford_S1-MW_2025_polar.csv", "sallow-ford_S1-DS_2025_points.csv",
                           "sallow-ford_S1-MW_2019_xz.csv"}) {
    CAPTURE(name);
    const SurveySheet sheet = read_sheet_file(std::string(SOFFIT_ASSETS) + "/sheets/" + name, {});
    std::string why;
    CHECK(app::rows_reduce_again(sheet, why));
    CHECK(why.empty());
  }
}
