// The export entry point of the app: from a visit on the structure screen,
// Export... then Export writes the analyst's files on a worker thread while
// the frames go on; the files appear in the chosen folder (issue: exports
// reachable from the GUI with a progress bar).
#include <doctest/doctest.h>

#include <chrono>
#include <cstdlib>
#include <filesystem>
#include <thread>

#include <unistd.h>

#include "app/gui/project_screens.hpp"
#include "tests/gui/headless_ui.hpp"

using namespace soffit;

TEST_CASE("Export... on a visit writes its geometry file, section files and report into the folder") {
  namespace fs = std::filesystem;
  const fs::path home = fs::temp_directory_path() / ("soffit_export_dialog_" + std::to_string(::getpid()));
  fs::remove_all(home);
  fs::create_directories(home);
  ::setenv("XDG_DATA_HOME", home.c_str(), 1);  // the demo project and exports go here

  gui::ProjectScreens screens(SOFFIT_ASSETS, "test");
  test::HeadlessUi ui([&] {
    screens.sections.poll();
    screens.draw_current();
  });
  screens.open_demo();
  screens.open_first_sections();
  screens.screen = gui::Screen::structure;
  ui.frame();
  REQUIRE(ui.tap("export:2019-05-14"));
  REQUIRE(ui.tap("export:go"));
  for (int i = 0; i < 3000 && screens.export_dialog.running(); ++i) {
    ui.frame();  // frames keep coming while the worker writes
    std::this_thread::sleep_for(std::chrono::milliseconds(5));
  }
  ui.frame();
  CHECK_FALSE(screens.export_dialog.running());
  const fs::path out = home / "soffit" / "exports" / "BVDC-ST-0417_2019-05-14";
  CHECK(fs::exists(out / "BVDC-ST-0417_2019-05-14_geometry.json"));
  CHECK(fs::exists(out / "BVDC-ST-0417_2019-05-14_report.pdf"));
  int svg = 0;
  for (const auto& e : fs::directory_iterator(out)) svg += e.path().extension() == ".svg";
  CHECK(svg == 4);  // one elevation per section of the 2019 visit (FIELD.md §10.2: S1 US, MW, DS and S2 MW)
  screens.defects.close();
  screens.rings_fill.close();
  fs::remove_all(home);
}
