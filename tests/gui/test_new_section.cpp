// A section started on site (issue 4: the section survey is filled in the
// app): New section on the draft visit, then three readings on the keypad and
// the fit appears; the file holds them. Levels and readings: the invented
// Sallow Ford S1 of FIELD.md §10.2 (datum RL 9.800, springing RL 9.500; crown
// offset 1302 mm, quarter point 968 mm), so z = 0.300 m + offset (SHEET_FORMAT.md offsets reduction).
#include <doctest/doctest.h>

#include <cmath>

#include "storage/register_queries.hpp"
#include "storage/sheet_export.hpp"
#include "tests/gui/demo_screens_fixture.hpp"

using namespace soffit;

namespace {

// Types `text` on the keypad that is open and presses `finish` (OK or Next).
void keypad(test::HeadlessUi& ui, const std::string& text, const char* finish = "key:ok") {
  ui.frame();  // the keypad lays itself out before its keys are where the probes say
  ui.frame();
  for (char ch : text) REQUIRE(ui.tap(std::string("key:") + ch));
  REQUIRE(ui.tap(finish));
}

}  // namespace

TEST_CASE("New section on the draft visit, four readings on the keypad: the fit appears and the file holds them") {
  test::DemoScreens demo("new_section");
  gui::ProjectScreens& screens = demo.screens();
  test::HeadlessUi& ui = demo.ui();
  ImGui::GetIO().DisplaySize = ImVec2(1280, 1800);  // upright tablet: the whole form and grid on screen
  ui.frame();
  const std::string project_path = demo.project_path();
  {
    CHECK_FALSE(ui.drawn("new-section:2019-05-14"));  // the issued visit takes no new section
    REQUIRE(ui.tap("new-section:2025-05-21"));
    REQUIRE(ui.tap("new-section:span:S1"));
    REQUIRE(ui.tap("new-section:label:MW"));  // already surveyed in this visit: refused below
    REQUIRE(ui.tap("new-section:datum"));
    keypad(ui, "9.8");
    REQUIRE(ui.tap("new-section:springing"));
    keypad(ui, "9.5");
    REQUIRE(ui.tap("new-section:create"));
    CHECK(screens.screen == gui::Screen::structure);  // still on the form, with the reason
    REQUIRE(ui.tap("new-section:label"));
    ImGui::GetIO().AddInputCharactersUTF8("Q3");
    ui.frame();
    REQUIRE(ui.tap("new-section:create"));
    REQUIRE(screens.screen == gui::Screen::section);
    REQUIRE(demo.settle());
    REQUIRE(screens.sections.sheet());
    CHECK(screens.sections.sheet()->readings.empty());
    CHECK_FALSE(screens.sections.analysis()->ok());  // no readings, no fit: said, not hidden

    // W springing, crown, E springing and W quarter point of FIELD.md §10.2, booked along each new row with Next.
    const std::pair<const char*, const char*> typed[] = {{"0", "-300"}, {"3.2", "1302"}, {"6.4", "-300"}, {"1.6", "968"}};
    for (const auto& [station, offset] : typed) {
      REQUIRE(ui.tap("new:station_m"));
      keypad(ui, station, "key:next");
      std::string off = offset;
      if (off[0] == '-') off = off.substr(1) + "-";  // the sign key toggles: type the digits, then +/-
      keypad(ui, off);
      REQUIRE(demo.settle());
      if (screens.sections.readings()->size() == 3) {
        // Three readings: every family needs a fourth, and the view says how many more to take.
        CHECK_FALSE(screens.sections.analysis()->ok());
        ui.forget_controls();
        ui.frame();
        CHECK(ui.drawn("no-fit:more-readings"));
      }
    }
    REQUIRE(screens.sections.readings()->size() == 4);
    CHECK(std::abs((*screens.sections.readings())[1].z - 1.602) < 1e-12);
    INFO(screens.sections.analysis()->error);
    REQUIRE(screens.sections.analysis()->ok());
    CHECK(screens.sections.analysis()->fit->n_used == 4);
    screens.defects.close();
    screens.rings_fill.close();
    screens.session().close();
  }
  {  // a fresh connection to the file
    storage::Project p = storage::Project::open(project_path, "check");
    const auto detail = storage::structure_detail(p.db(), "BVDC-ST-0417");
    std::string id;
    for (const auto& v : detail->inspections)
      for (const auto& s : v.sections)
        if (v.date == "2025-05-21" && s.label == "Q3") id = s.id;
    REQUIRE_FALSE(id.empty());
    const SurveySheet stored = storage::load_section_sheet(p.db(), id);
    REQUIRE(stored.readings.size() == 4);
    CHECK(stored.raw_rows[1].cells[2] == "1302");
    CHECK(std::abs(stored.readings[2].x - 6.4) < 1e-12);
    p.close();
  }
}
