// Exclusions made in the section view are written to the project as they are
// made (autosave), undo and redo carry to the file, and an issued visit
// is shown read-only (FIELD.md §3.3: readings are never
// deleted; issue: read-only once issued).
#include <doctest/doctest.h>

#include <chrono>
#include <cstdlib>
#include <filesystem>
#include <thread>

#include <unistd.h>

#include "app/gui/project_screens.hpp"
#include "app/model/sheet_rows.hpp"
#include "storage/register_queries.hpp"
#include "storage/sheet_export.hpp"
#include "tests/gui/headless_ui.hpp"

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

void settle(test::HeadlessUi& ui, gui::ProjectScreens& screens) {
  for (int i = 0; i < 2000 && (screens.sections.busy() || !screens.sections.analysis()); ++i) {
    ui.frame();
    std::this_thread::sleep_for(std::chrono::milliseconds(2));
  }
  ui.frame();
  ui.frame();
}

}  // namespace

TEST_CASE("an exclusion in a draft visit is saved to the project - undo and redo follow it into the file") {
  namespace fs = std::filesystem;
  const fs::path home = fs::temp_directory_path() / ("soffit_autosave_" + std::to_string(::getpid()));
  fs::remove_all(home);
  fs::create_directories(home);
  ::setenv("XDG_DATA_HOME", home.c_str(), 1);
  {
    gui::ProjectScreens screens(SOFFIT_ASSETS, "test");
    test::HeadlessUi ui([&] {
      screens.sections.poll();
      screens.draw_current();
    });
    screens.open_demo();
    screens.open_first_sections();
    screens.screen = gui::Screen::structure;
    ui.frame();
    REQUIRE(ui.tap("visit:2025-05-21"));  // the draft visit's sections
    settle(ui, screens);
    REQUIRE(ui.tap("exclude:6"));
    REQUIRE(ui.tap("reason:blunder"));
    REQUIRE(ui.tap("confirm exclude"));
    settle(ui, screens);
    CHECK((*screens.sections.readings())[5].excluded);
    CHECK(excluded_in_file(screens, "2025-05-21") == 1);
    REQUIRE(ui.tap("undo"));
    settle(ui, screens);
    CHECK(excluded_in_file(screens, "2025-05-21") == 0);
    REQUIRE(ui.tap("redo"));
    settle(ui, screens);
    CHECK(excluded_in_file(screens, "2025-05-21") == 1);

    // The 2019 visit is issued: it is shown read-only, with no way to exclude or type.
    screens.screen = gui::Screen::structure;
    ui.frame();
    REQUIRE(ui.tap("visit:2019-05-14"));
    settle(ui, screens);
    ui.forget_controls();
    ui.frame();
    CHECK(ui.drawn("undo"));
    CHECK_FALSE(ui.drawn("exclude:6"));
    CHECK_FALSE(ui.drawn("cell:6:offset_mm"));
    CHECK_FALSE(ui.drawn("new:station_m"));
    CHECK(excluded_in_file(screens, "2019-05-14") == 0);
    screens.defects.close();
    screens.rings_fill.close();
  }
  fs::remove_all(home);
}

TEST_CASE("a value corrected on the keypad is saved to the project as typed - reopening the file shows it - undo reverts the file") {
  namespace fs = std::filesystem;
  const fs::path home = fs::temp_directory_path() / ("soffit_typed_" + std::to_string(::getpid()));
  fs::remove_all(home);
  fs::create_directories(home);
  ::setenv("XDG_DATA_HOME", home.c_str(), 1);
  std::string project_path, typed, column;
  SurveySheet before;
  {
    gui::ProjectScreens screens(SOFFIT_ASSETS, "test");
    test::HeadlessUi ui([&] {
      screens.sections.poll();
      screens.draw_current();
    });
    screens.open_demo();
    project_path = screens.session().path();
    screens.open_first_sections();
    screens.screen = gui::Screen::structure;
    ui.frame();
    REQUIRE(ui.tap("visit:2025-05-21"));  // a draft visit: it may be edited
    settle(ui, screens);
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
    settle(ui, screens);
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
  fs::remove_all(home);
}
