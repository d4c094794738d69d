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
  // A tall screen (a tablet held upright), so the new-reading row is on it without scrolling.
  void upright() { ImGui::GetIO().DisplaySize = ImVec2(1280, 1800); }
};

}  // namespace

TEST_CASE("tapping Exclude, a reason and Exclude refits without the reading - Undo brings it back") {
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

// The first sheet in assets/sheets is the invented Sallow Ford S1 downstream
// face 2019 (FIELD.md §10.2): offsets in mm up from a datum at RL 9.800, z = 0
// at RL 9.500, so z = 0.300 m + offset (SHEET_FORMAT.md offsets reduction).

TEST_CASE("correcting an offset on the keypad refits - Undo restores the reading as taken") {
  SectionHarness h;
  SectionWorkspace& view = h.view;
  view.load_folder(std::string(SOFFIT_ASSETS) + "/sheets");
  REQUIRE(h.settle());
  const double taken = (*view.readings())[5].z;
  const double rms_before = view.analysis()->fit->rms_m;
  REQUIRE(h.tap("cell:6:offset_mm"));
  // Clear the shown value and type 1350 (about 50 mm above the crown reading).
  for (int k = 0; k < 8; ++k) REQUIRE(h.tap("key:<"));
  for (const char* key : {"key:1", "key:3", "key:5", "key:0", "key:ok"}) REQUIRE(h.tap(key));
  REQUIRE(h.settle());
  CHECK(view.sheet()->raw_rows[5].cells[2] == "1350");  // kept as typed, in millimetres
  CHECK(std::abs((*view.readings())[5].z - 1.650) < 1e-12);
  CHECK(view.analysis()->fit->rms_m > rms_before);  // the fit moved with the new value
  REQUIRE(h.tap("undo"));
  REQUIRE(h.settle());
  CHECK((*view.readings())[5].z == taken);
  CHECK(std::abs(view.analysis()->fit->rms_m - rms_before) < 1e-12);
}

TEST_CASE("a new reading keyed on the keypad: Next walks along the new row, OK adds it and the fit uses it") {
  SectionHarness h;
  SectionWorkspace& view = h.view;
  view.load_folder(std::string(SOFFIT_ASSETS) + "/sheets");
  h.upright();
  REQUIRE(h.settle());
  REQUIRE(view.analysis()->fit->n_used == 11);
  REQUIRE(h.tap("new:station_m"));
  for (const char* key : {"key:3", "key:.", "key:6", "key:next"}) REQUIRE(h.tap(key));
  CHECK((*view.draft())[1] == "3.6");
  // Next opened the keypad on the new reading's offset (a frame to lay it out, as on screen).
  h.ui.frame();
  h.ui.frame();
  for (const char* key : {"key:1", "key:2", "key:8", "key:0", "key:ok"}) REQUIRE(h.tap(key));
  REQUIRE(h.settle());
  REQUIRE(view.readings()->size() == 12);
  CHECK(std::abs((*view.readings())[11].x - 3.600) < 1e-12);
  CHECK(std::abs((*view.readings())[11].z - 1.580) < 1e-12);
  CHECK(view.analysis()->fit->n_used == 12);
  CHECK((*view.draft())[1].empty());  // the new row is ready for the next reading
}

namespace {

// Keys as a laptop sends them: ImGui 1.86 reads KeysDown through KeyMap.
struct Keyboard {
  enum : int { tab = 1, enter = 2, backspace = 3 };
  explicit Keyboard(test::HeadlessUi& ui) : ui_(ui) {
    ImGuiIO& io = ImGui::GetIO();
    io.KeyMap[ImGuiKey_Tab] = tab;
    io.KeyMap[ImGuiKey_Enter] = enter;
    io.KeyMap[ImGuiKey_Backspace] = backspace;
  }
  void press(int key) {
    ImGui::GetIO().KeysDown[key] = true;
    ui_.frame();
    ImGui::GetIO().KeysDown[key] = false;
    ui_.frame();
    ui_.frame();  // the cell asked to take the focus takes it
  }
  void type(const char* text) {
    ImGui::GetIO().AddInputCharactersUTF8(text);
    ui_.frame();
  }
  test::HeadlessUi& ui_;
};

}  // namespace

TEST_CASE("on a keyboard, Tab moves along a new reading and Enter adds it, as in a spreadsheet") {
  SectionHarness h;
  SectionWorkspace& view = h.view;
  view.load_folder(std::string(SOFFIT_ASSETS) + "/sheets");
  h.upright();
  REQUIRE(h.settle());
  Keyboard keys(h.ui);
  REQUIRE(h.tap("entry:keyboard"));
  REQUIRE(h.tap("new:id"));
  keys.type("12");
  keys.press(Keyboard::tab);
  keys.type("3.600");  // Tab put the focus on station_m
  keys.press(Keyboard::tab);
  keys.type("1280");   // and then on offset_mm
  CHECK((*view.draft())[0] == "12");
  CHECK((*view.draft())[1] == "3.600");
  keys.press(Keyboard::enter);
  REQUIRE(h.settle());
  REQUIRE(view.readings()->size() == 12);
  CHECK(view.sheet()->raw_rows[11].cells[0] == "12");
  CHECK(std::abs((*view.readings())[11].z - 1.580) < 1e-12);
  CHECK(view.analysis()->fit->n_used == 12);
  // Enter went on to the next new reading's first cell: typing lands there.
  keys.type("13");
  keys.press(Keyboard::tab);
  CHECK((*view.draft())[0] == "13");
}

TEST_CASE("on a keyboard, a bad value is refused naming line and field and the cell keeps the focus - Enter then moves down") {
  SectionHarness h;
  SectionWorkspace& view = h.view;
  view.load_folder(std::string(SOFFIT_ASSETS) + "/sheets");
  REQUIRE(h.settle());
  Keyboard keys(h.ui);
  REQUIRE(h.tap("entry:keyboard"));
  const double z5 = (*view.readings())[4].z;
  REQUIRE(h.tap("cell:4:offset_mm"));
  keys.type("9,62");  // a decimal comma: refused by the reader (SHEET_FORMAT.md numbers)
  keys.press(Keyboard::enter);
  REQUIRE(h.settle());
  CHECK(view.message().find("sallow-ford_S1-DS_2019.csv:28") != std::string::npos);  // reading 4 is line 28
  CHECK(view.message().find("offset_mm") != std::string::npos);
  CHECK(view.sheet()->raw_rows[3].cells[2] == "962");  // nothing changed
  // The focus stayed on reading 4's offset: type it again, properly.
  keys.type("962.5");
  keys.press(Keyboard::enter);
  REQUIRE(h.settle());
  CHECK(view.message().empty());
  CHECK(view.sheet()->raw_rows[3].cells[2] == "962.5");
  CHECK(std::abs((*view.readings())[3].z - 1.2625) < 1e-12);
  // Enter went down the column to reading 5's offset.
  keys.type("1220");
  keys.press(Keyboard::enter);
  REQUIRE(h.settle());
  CHECK(view.sheet()->raw_rows[4].cells[2] == "1220");
  CHECK(std::abs((*view.readings())[4].z - 1.520) < 1e-12);
  CHECK((*view.readings())[4].z != z5);
}
