// The structure screen (issue 4: "Structure: spans, a timeline of inspections,
// the latest geometry summary"): the latest visit's sections are fitted on a
// worker and summarised; a new section changes the project and the summary
// follows; new visits and the photos of a visit start here. Values: FIELD.md
// §10.2's oracles for the invented Sallow Ford 2025 visit.
#include <doctest/doctest.h>

#include <cmath>

#include "app/model/register_filter.hpp"
#include "tests/gui/demo_screens_fixture.hpp"

using namespace soffit;

TEST_CASE("the structure screen summarises the latest visit's geometry, fitted on a worker") {
  test::DemoScreens demo("structure_summary");
  gui::ProjectScreens& screens = demo.screens();
  REQUIRE(demo.settle());
  REQUIRE(screens.latest_geometry());
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
  demo.ui().frame();
  demo.ui().frame();  // a dialog that sizes itself is laid out on its second frame
  REQUIRE(demo.tap("new-section:span:S2"));
  REQUIRE(demo.tap("new-section:label:US"));
  REQUIRE(demo.tap("new-section:xz"));
  REQUIRE(demo.tap("new-section:create"));
  REQUIRE(screens.screen == gui::Screen::section);
  screens.screen = gui::Screen::structure;
  REQUIRE(demo.settle());
  REQUIRE(screens.latest_geometry()->size() == 5);
  bool listed = false;
  for (const auto& s : *screens.latest_geometry())
    if (s.span == "S2" && s.section == "US") listed = !s.rise_m && !s.error.empty();
  CHECK(listed);
}

TEST_CASE("Photos on a visit opens the photo viewer as a screen, and Close photos comes back") {
  test::DemoScreens demo("structure_photos");
  gui::ProjectScreens& screens = demo.screens();
  REQUIRE(demo.tap("photos:2025-05-21"));
  CHECK(screens.screen == gui::Screen::photos);
  REQUIRE(screens.photos.is_open());
  CHECK(screens.photos.visit().photos.size() > 0);  // the demo's drawn pictures of its defects
  demo.ui().frame();
  REQUIRE(demo.tap("close photos"));
  demo.ui().frame();
  CHECK_FALSE(screens.photos.is_open());
  CHECK(screens.screen == gui::Screen::structure);
}

TEST_CASE("New visit starts a draft visit dated today - a date that already has a visit is refused") {
  test::DemoScreens demo("structure_visit");
  gui::ProjectScreens& screens = demo.screens();
  ImGui::GetIO().DisplaySize = ImVec2(1280, 1800);  // upright: the whole visit list on screen
  demo.ui().frame();
  // The demo's draft visit date (FIELD.md §10): refused, and nothing is added.
  REQUIRE(demo.tap("new-visit"));
  demo.ui().frame();
  REQUIRE(demo.tap("new-visit:date"));
  ImGui::GetIO().AddInputCharactersUTF8("2025-05-21");
  demo.ui().frame();
  REQUIRE(demo.tap("new-visit:create"));
  REQUIRE(screens.session().structure("BVDC-ST-0417"));
  CHECK(screens.session().structure("BVDC-ST-0417")->inspections.size() == 2);
  REQUIRE(demo.tap("new-visit:cancel"));
  // Today's date, as the form offers it.
  REQUIRE(demo.tap("new-visit"));
  demo.ui().frame();
  REQUIRE(demo.tap("new-visit:kind:special"));
  REQUIRE(demo.tap("new-visit:create"));
  const auto detail = screens.session().structure("BVDC-ST-0417");
  REQUIRE(detail);
  REQUIRE(detail->inspections.size() == 3);
  CHECK(detail->inspections.back().date == app::today_iso());
  CHECK(detail->inspections.back().status == "draft");
  CHECK(detail->inspections.back().kind == "special");
  demo.ui().forget_controls();
  demo.ui().frame();
  CHECK(demo.ui().drawn("new-section:" + app::today_iso()));  // sections can now be started in it
}
