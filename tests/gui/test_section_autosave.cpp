// Exclusions made in the section view are written to the project as they are
// made (autosave), undo and redo carry to the file, and an issued visit
// refuses them with the reason shown (FIELD.md §3.3: readings are never
// deleted; issue: read-only once issued).
#include <doctest/doctest.h>

#include <chrono>
#include <cstdlib>
#include <filesystem>
#include <thread>

#include <unistd.h>

#include "app/gui/project_screens.hpp"
#include "storage/register_queries.hpp"
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

TEST_CASE("an exclusion in a draft visit is saved to the project; undo and redo follow it into the file") {
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

    // The 2019 visit is issued: the exclusion is refused and the view stays as the file is.
    screens.screen = gui::Screen::structure;
    ui.frame();
    REQUIRE(ui.tap("visit:2019-05-14"));
    settle(ui, screens);
    REQUIRE(ui.tap("exclude:6"));
    REQUIRE(ui.tap("reason:blunder"));
    REQUIRE(ui.tap("confirm exclude"));
    settle(ui, screens);
    CHECK_FALSE((*screens.sections.readings())[5].excluded);
    CHECK(excluded_in_file(screens, "2019-05-14") == 0);
    screens.defects.close();
    screens.rings_fill.close();
  }
  fs::remove_all(home);
}
