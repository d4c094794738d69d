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
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"

using namespace soffit;
using gui::SectionWorkspace;
using gui::UiProbe;

namespace {

class HeadlessUi {
 public:
  HeadlessUi() {
    ImGui::CreateContext();
    ImGuiIO& io = ImGui::GetIO();
    io.IniFilename = nullptr;
    io.DisplaySize = ImVec2(1280, 800);
    io.DeltaTime = 1.0f / 60.0f;
    io.Fonts->AddFontDefault();
    unsigned char* pixels = nullptr;
    int w = 0, h = 0;
    io.Fonts->GetTexDataAsRGBA32(&pixels, &w, &h);  // builds the atlas a frame needs
    gui::apply_style(gui::Theme::sunlight, 1.0f);
    UiProbe::instance().enabled = true;
  }
  ~HeadlessUi() {
    UiProbe::instance().enabled = false;
    UiProbe::instance().centres.clear();
    ImGui::DestroyContext();
  }

  void frame(SectionWorkspace& view) {
    view.poll();
    ImGui::NewFrame();
    ImGui::SetNextWindowPos(ImVec2(0, 0));
    ImGui::SetNextWindowSize(ImGui::GetIO().DisplaySize);
    ImGui::Begin("##main", nullptr, ImGuiWindowFlags_NoDecoration);
    view.draw();
    ImGui::End();
    ImGui::Render();
  }

  // Frames until the view has no fit running (bounded: a hang fails the test).
  bool settle(SectionWorkspace& view) {
    for (int i = 0; i < 2000; ++i) {
      frame(view);
      if (!view.busy() && view.analysis()) {
        frame(view);
        return true;
      }
      std::this_thread::sleep_for(std::chrono::milliseconds(2));
    }
    return false;
  }

  // Hover, press, release: ImGui 1.86 registers a click on release over the item.
  bool tap(SectionWorkspace& view, const std::string& control) {
    const auto& centres = UiProbe::instance().centres;
    const auto it = centres.find(control);
    if (it == centres.end()) return false;
    ImGuiIO& io = ImGui::GetIO();
    io.MousePos = it->second;
    frame(view);
    io.MouseDown[0] = true;
    frame(view);
    io.MouseDown[0] = false;
    frame(view);
    frame(view);  // popups opened by the click appear on the next frame
    return true;
  }
};

}  // namespace

TEST_CASE("tapping Exclude, a reason and Exclude refits without the reading; Undo brings it back") {
  HeadlessUi ui;
  SectionWorkspace view;
  view.load_folder(std::string(SOFFIT_ASSETS) + "/sheets");
  REQUIRE(ui.settle(view));
  REQUIRE(view.readings());
  REQUIRE(view.analysis()->ok());
  const int used_before = view.analysis()->fit->n_used;
  CHECK(used_before == 11);  // S1 downstream face 2019: 11 stations (FIELD.md §10.2)

  REQUIRE(ui.tap(view, "exclude:6"));
  REQUIRE(ui.tap(view, "reason:blunder"));
  REQUIRE(ui.tap(view, "confirm exclude"));
  REQUIRE(ui.settle(view));
  CHECK((*view.readings())[5].excluded);
  CHECK((*view.readings())[5].exclusion_reason == "blunder");
  CHECK(view.analysis()->fit->n_used == used_before - 1);
  CHECK_FALSE(view.analysis()->fit->used[5]);

  REQUIRE(ui.tap(view, "undo"));
  REQUIRE(ui.settle(view));
  CHECK_FALSE((*view.readings())[5].excluded);
  CHECK(view.analysis()->fit->n_used == used_before);

  REQUIRE(ui.tap(view, "redo"));
  REQUIRE(ui.settle(view));
  CHECK((*view.readings())[5].excluded);
}

TEST_CASE("Exclude is refused until a reason is given") {
  HeadlessUi ui;
  SectionWorkspace view;
  view.load_folder(std::string(SOFFIT_ASSETS) + "/sheets");
  REQUIRE(ui.settle(view));
  REQUIRE(ui.tap(view, "exclude:3"));
  REQUIRE(ui.tap(view, "confirm exclude"));  // no reason typed or chosen
  REQUIRE(ui.settle(view));
  CHECK_FALSE((*view.readings())[2].excluded);
  CHECK(view.analysis()->fit->n_used == 11);
}

TEST_CASE("correcting a reading on the keypad refits; Undo restores the reading as taken") {
  HeadlessUi ui;
  SectionWorkspace view;
  view.load_folder(std::string(SOFFIT_ASSETS) + "/sheets");
  REQUIRE(ui.settle(view));
  const double taken = (*view.readings())[5].z;
  const double rms_before = view.analysis()->fit->rms_m;
  REQUIRE(ui.tap(view, "z:6"));
  // Clear the shown value and type 1.650 (56 mm above the crown reading of 1.594).
  for (int k = 0; k < 8; ++k) REQUIRE(ui.tap(view, "key:<"));
  for (const char* key : {"key:1", "key:.", "key:6", "key:5", "key:0", "key:ok"}) REQUIRE(ui.tap(view, key));
  REQUIRE(ui.settle(view));
  CHECK(std::abs((*view.readings())[5].z - 1.650) < 1e-12);
  CHECK(view.analysis()->fit->rms_m > rms_before);  // the fit moved with the new value
  REQUIRE(ui.tap(view, "undo"));
  REQUIRE(ui.settle(view));
  CHECK((*view.readings())[5].z == taken);
  CHECK(std::abs(view.analysis()->fit->rms_m - rms_before) < 1e-12);
}
