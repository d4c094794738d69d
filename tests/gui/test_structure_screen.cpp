// The structure screen (issue 4: "Structure: spans, a timeline of inspections,
// the latest geometry summary"): the latest visit's sections are fitted on a
// worker and summarised; a new section changes the project and the summary
// follows. Values: FIELD.md §10.2's oracles for the invented Sallow Ford 2025 visit.
#include <doctest/doctest.h>

#include <chrono>
#include <cmath>
#include <cstdlib>
#include <filesystem>
#include <thread>

#include <unistd.h>

#include "app/gui/project_screens.hpp"
#include "tests/gui/headless_ui.hpp"

using namespace soffit;

namespace {

bool wait_for_summary(test::HeadlessUi& ui, gui::ProjectScreens& screens) {
  for (int i = 0; i < 3000; ++i) {
    ui.frame();
    if (screens.latest_geometry() && !screens.busy()) return true;
    std::this_thread::sleep_for(std::chrono::milliseconds(2));
  }
  return false;
}

}  // namespace

TEST_CASE("the structure screen summarises the latest visit's geometry, fitted on a worker") {
  namespace fs = std::filesystem;
  const fs::path home = fs::temp_directory_path() / ("soffit_structure_" + std::to_string(::getpid()));
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
    REQUIRE(wait_for_summary(ui, screens));
    const auto& g = *screens.latest_geometry();
    REQUIRE(g.size() == 4);  // S1 US, MW, DS and S2 MW (FIELD.md §10.2)
    for (const auto& s : g) {
      CAPTURE(s.section);
      REQUIRE(s.rise_m);
      CHECK(s.shape == "segmental");
      CHECK(s.rise_m->lo < s.rise_m->value);
      CHECK(s.rise_m->value < s.rise_m->hi);
    }
    // FIELD.md §10.2 oracles (from z = 0, ±0.5 mm; the fit measures from its end readings): 1 mm.
    CHECK(std::abs(g[0].rise_m->value * 1000 - 1599.5) < 1.0);  // S1 US 2025
    CHECK(std::abs(g[3].rise_m->value * 1000 - 1452.7) < 1.0);  // S2 MW 2025

    // A new, empty section in the latest visit: the summary is made again and lists it, unfitted.
    screens.open_new_section_form();
    ui.frame();
    ui.frame();  // a dialog that sizes itself is laid out on its second frame
    REQUIRE(ui.tap("new-section:span:S2"));
    REQUIRE(ui.tap("new-section:label:US"));
    REQUIRE(ui.tap("new-section:xz"));
    REQUIRE(ui.tap("new-section:create"));
    REQUIRE(screens.screen == gui::Screen::section);
    screens.screen = gui::Screen::structure;
    REQUIRE(wait_for_summary(ui, screens));
    REQUIRE(screens.latest_geometry()->size() == 5);
    bool listed = false;
    for (const auto& s : *screens.latest_geometry())
      if (s.span == "S2" && s.section == "US") listed = !s.rise_m && !s.error.empty();
    CHECK(listed);
    screens.defects.close();
    screens.rings_fill.close();
  }
  fs::remove_all(home);
}

TEST_CASE("Photos on a visit opens the photo viewer as a screen, and Close photos comes back") {
  namespace fs = std::filesystem;
  const fs::path home = fs::temp_directory_path() / ("soffit_structure_photos_" + std::to_string(::getpid()));
  fs::remove_all(home);
  fs::create_directories(home);
  ::setenv("XDG_DATA_HOME", home.c_str(), 1);
  {
    gui::ProjectScreens screens(SOFFIT_ASSETS, "test");
    test::HeadlessUi ui([&] {
      screens.sections.poll();
      screens.photos.poll();
      screens.draw_current();
    });
    screens.open_demo();
    screens.open_first_sections();
    screens.screen = gui::Screen::structure;
    ui.frame();
    REQUIRE(ui.tap("photos:2025-05-21"));
    CHECK(screens.screen == gui::Screen::photos);
    REQUIRE(screens.photos.is_open());
    CHECK(screens.photos.visit().photos.size() > 0);  // the demo's drawn pictures of its defects
    ui.frame();
    REQUIRE(ui.tap("close photos"));
    ui.frame();
    CHECK_FALSE(screens.photos.is_open());
    CHECK(screens.screen == gui::Screen::structure);
    screens.defects.close();
    screens.rings_fill.close();
  }
  fs::remove_all(home);
}
