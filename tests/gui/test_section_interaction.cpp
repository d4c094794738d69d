// Drives the section view through ImGui's input, as a finger or mouse would:
// move the pointer onto a control, press, release. Headless: a real ImGui
// context with a built font atlas and no renderer. The view fits on a worker
// thread; frames run until its results arrive, as they would on screen.
#include <doctest/doctest.h>
#include <imgui.h>

#include <chrono>
#include <cmath>
#include <string>
#include <thread>

#include "app/gui/section_workspace.hpp"
#include "tests/gui/headless_ui.hpp"

using namespace soffit;
using gui::SectionWorkspace;

namespace {

// The section view in a headless frame, polled once per frame as on screen.
struct SectionHarness {
  SectionWorkspace view;
  test::HeadlessUi ui{[this] {
    view.poll();
    view.draw();
  }};

  // Frames until the view has no fit running (bounded: a hang fails the test).
  bool settle() {
    for (int i = 0; i < 2000; ++i) {
      ui.frame();
      if (!view.busy() && view.analysis()) {
        ui.frame();
        return true;
      }
      std::this_thread::sleep_for(std::chrono::milliseconds(2));
    }
    return false;
  }
  bool tap(const std::string& control) { return ui.tap(control); }
};

}  // namespace

TEST_CASE("tapping Exclude, a reason and Exclude refits without the reading; Undo brings it back") {
  SectionHarness h;
  SectionWorkspace& view = h.view;
  view.load_folder(std::string(SOFFIT_ASSETS) + "/sheets");
  REQUIRE(h.settle());
  REQUIRE(view.readings());
  REQUIRE(view.analysis()->ok());
  const int used_before = view.analysis()->fit->n_used;
  CHECK(used_before == 11);  // S1 downstream face 2019: 11 stations (FIELD.md §10.2)

  REQUIRE(h.tap("exclude:6"));
  REQUIRE(h.tap("reason:blunder"));
  REQUIRE(h.tap("confirm exclude"));
  REQUIRE(h.settle());
  CHECK((*view.readings())[5].excluded);
  CHECK((*view.readings())[5].exclusion_reason == "blunder");
  CHECK(view.analysis()->fit->n_used == used_before - 1);
  CHECK_FALSE(view.analysis()->fit->used[5]);

  REQUIRE(h.tap("undo"));
  REQUIRE(h.settle());
  CHECK_FALSE((*view.readings())[5].excluded);
  CHECK(view.analysis()->fit->n_used == used_before);

  REQUIRE(h.tap("redo"));
  REQUIRE(h.settle());
  CHECK((*view.readings())[5].excluded);
}

TEST_CASE("Exclude is refused until a reason is given") {
  SectionHarness h;
  SectionWorkspace& view = h.view;
  view.load_folder(std::string(SOFFIT_ASSETS) + "/sheets");
  REQUIRE(h.settle());
  REQUIRE(h.tap("exclude:3"));
  REQUIRE(h.tap("confirm exclude"));  // no reason typed or chosen
  REQUIRE(h.settle());
  CHECK_FALSE((*view.readings())[2].excluded);
  CHECK(view.analysis()->fit->n_used == 11);
}

TEST_CASE("correcting a reading on the keypad refits; Undo restores the reading as taken") {
  SectionHarness h;
  SectionWorkspace& view = h.view;
  view.load_folder(std::string(SOFFIT_ASSETS) + "/sheets");
  REQUIRE(h.settle());
  const double taken = (*view.readings())[5].z;
  const double rms_before = view.analysis()->fit->rms_m;
  REQUIRE(h.tap("z:6"));
  // Clear the shown value and type 1.650 (56 mm above the crown reading of 1.594).
  for (int k = 0; k < 8; ++k) REQUIRE(h.tap("key:<"));
  for (const char* key : {"key:1", "key:.", "key:6", "key:5", "key:0", "key:ok"}) REQUIRE(h.tap(key));
  REQUIRE(h.settle());
  CHECK(std::abs((*view.readings())[5].z - 1.650) < 1e-12);
  CHECK(view.analysis()->fit->rms_m > rms_before);  // the fit moved with the new value
  REQUIRE(h.tap("undo"));
  REQUIRE(h.settle());
  CHECK((*view.readings())[5].z == taken);
  CHECK(std::abs(view.analysis()->fit->rms_m - rms_before) < 1e-12);
}
