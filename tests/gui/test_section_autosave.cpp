// Exclusions made in the section view are written to the project as they are
// made (autosave), undo and redo carry to the file, and an issued visit
// is shown read-only (FIELD.md §3.3: readings are never
// deleted; issue: read-only once issued).
#include <doctest/doctest.h>

#include "app/model/sheet_rows.hpp"
#include "storage/register_queries.hpp"
#include "storage/sheet_export.hpp"
#include "tests/gui/demo_screens_fixture.hpp"

using namespace soffit;

namespace {

// Read through the app's own connection: the project is locked while open for editing.
int excluded_in_file(gui::ProjectScreens& screens, const std::string& date) {
  const auto detail = screens.session().structure("BVDC-ST-0417");
  int excluded = 0;
  for (const auto& v : detail->inspections)
    if (v.date == date)
      for (const auto& s : v.sections) excluded += s.excluded_count;
  return excluded;
}

}  // namespace

TEST_CASE("an exclusion in a draft visit is saved to the project - undo and redo follow it into the file") {
  test::DemoScreens demo("autosave");
  gui::ProjectScreens& screens = demo.screens();
  test::HeadlessUi& ui = demo.ui();
  {
    REQUIRE(ui.tap("visit:2025-05-21"));  // the draft visit's sections
    REQUIRE(demo.settle());
    REQUIRE(ui.tap("exclude:6"));
    REQUIRE(ui.tap("reason:blunder"));
    REQUIRE(ui.tap("confirm exclude"));
    REQUIRE(demo.settle());
    CHECK((*screens.sections.readings())[5].excluded);
    CHECK(excluded_in_file(screens, "2025-05-21") == 1);
    REQUIRE(ui.tap("undo"));
    REQUIRE(demo.settle());
    CHECK(excluded_in_file(screens, "2025-05-21") == 0);
    REQUIRE(ui.tap("redo"));
    REQUIRE(demo.settle());
    CHECK(excluded_in_file(screens, "2025-05-21") == 1);

    // The 2019 visit is issued: it is shown read-only, with no way to exclude or type.
    screens.screen = gui::Screen::structure;
    ui.frame();
    REQUIRE(ui.tap("visit:2019-05-14"));
    REQUIRE(demo.settle());
    ui.forget_controls();
    ui.frame();
    CHECK(ui.drawn("undo"));
    CHECK_FALSE(ui.drawn("exclude:6"));
    CHECK_FALSE(ui.drawn("cell:6:offset_mm"));
    CHECK_FALSE(ui.drawn("new:station_m"));
    CHECK(excluded_in_file(screens, "2019-05-14") == 0);
  }
}

TEST_CASE("a value corrected on the keypad is saved to the project as typed - reopening the file shows it - undo reverts the file") {
  test::DemoScreens demo("typed");
  gui::ProjectScreens& screens = demo.screens();
  test::HeadlessUi& ui = demo.ui();
  const std::string project_path = demo.project_path();
  std::string typed, column;
  SurveySheet before;
  {
    REQUIRE(ui.tap("visit:2025-05-21"));  // a draft visit: it may be edited
    REQUIRE(demo.settle());
    const SurveySheet* sheet = screens.sections.sheet();
    REQUIRE(sheet);
    before = *sheet;
    // The sheet's last numeric column (the offset, distance or height as booked), reading 6.
    size_t c = 0;
    for (size_t k = 0; k < sheet->columns.size(); ++k)
      if (app::is_typed_column(sheet->columns[k]) && app::is_numeric_column(sheet->columns[k])) c = k;
    column = sheet->columns[c].name;
    const std::string taken = sheet->raw_rows[5].cells[c];
    typed = taken + (taken.find('.') == std::string::npos ? ".5" : "5");  // half a unit (or less) more
    REQUIRE(ui.tap("cell:6:" + column));
    for (size_t k = 0; k < 12; ++k) REQUIRE(ui.tap("key:<"));
    for (char ch : typed) REQUIRE(ui.tap(std::string("key:") + (ch == '-' ? '-' : ch)));
    REQUIRE(ui.tap("key:ok"));
    REQUIRE(demo.settle());
    CHECK(screens.sections.message().empty());
    CHECK(screens.sections.sheet()->raw_rows[5].cells[c] == typed);
    CHECK(screens.sections.readings()->at(5).z != before.readings[5].z);
    screens.defects.close();
    screens.rings_fill.close();
    screens.session().close();
  }
  // A fresh connection to the file: the typed value and its reduction are there.
  const auto find_section = [&](storage::Project& p) {
    const auto detail = storage::structure_detail(p.db(), "BVDC-ST-0417");
    for (const auto& v : detail->inspections)
      if (v.date == "2025-05-21")
        for (const auto& s : v.sections) {
          const SurveySheet stored = storage::load_section_sheet(p.db(), s.id);
          if (stored.raw_rows.size() == before.raw_rows.size() && stored.columns.size() == before.columns.size() &&
              stored.raw_rows[0].cells == before.raw_rows[0].cells)
            return stored;
        }
    return SurveySheet{};
  };
  {
    storage::Project p = storage::Project::open(project_path, "check");
    const SurveySheet stored = find_section(p);
    REQUIRE(stored.raw_rows.size() == before.raw_rows.size());
    size_t c = 0;
    while (c < stored.columns.size() && stored.columns[c].name != column) ++c;
    REQUIRE(c < stored.columns.size());
    CHECK(stored.raw_rows[5].cells[c] == typed);
    CHECK(stored.readings[5].z != before.readings[5].z);
    for (size_t i = 0; i < stored.readings.size(); ++i)
      if (i != 5) CHECK(stored.readings[i].z == before.readings[i].z);  // the other rows untouched
    // The edit is one step of the project's journal: undo puts the file back.
    REQUIRE(p.undo());
    const SurveySheet undone = find_section(p);
    CHECK(undone.raw_rows[5].cells[c] == before.raw_rows[5].cells[c]);
    CHECK(undone.readings[5].z == before.readings[5].z);
    p.close();
  }
}
