#pragma once
// A real ImGui context with a built font atlas and no renderer, for driving
// views through ImGui's input as a finger or mouse would: move the pointer
// onto a control, press, release. Controls are found by UiProbe name.
#include <imgui.h>

#include <functional>
#include <string>

#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"

namespace soffit::test {

class HeadlessUi {
 public:
  // `draw` draws the view inside a full-screen window, once per frame.
  explicit HeadlessUi(std::function<void()> draw) : draw_(std::move(draw)) {
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
    gui::UiProbe::instance().enabled = true;
  }
  ~HeadlessUi() {
    gui::UiProbe::instance().enabled = false;
    gui::UiProbe::instance().centres.clear();
    ImGui::DestroyContext();
  }
  HeadlessUi(const HeadlessUi&) = delete;
  HeadlessUi& operator=(const HeadlessUi&) = delete;

  void frame() {
    ImGui::NewFrame();
    ImGui::SetNextWindowPos(ImVec2(0, 0));
    ImGui::SetNextWindowSize(ImGui::GetIO().DisplaySize);
    ImGui::Begin("##main", nullptr, ImGuiWindowFlags_NoDecoration);
    draw_();
    ImGui::End();
    ImGui::Render();
  }

  // Hover, press, release at `at`: ImGui 1.86 registers a click on release over the item.
  void tap_at(ImVec2 at) {
    ImGuiIO& io = ImGui::GetIO();
    io.MousePos = at;
    frame();
    io.MouseDown[0] = true;
    frame();
    io.MouseDown[0] = false;
    frame();
    frame();  // popups opened by the click appear on the next frame
  }

  // Taps the control recorded under `control`; false if it was not drawn.
  bool tap(const std::string& control) {
    const auto& centres = gui::UiProbe::instance().centres;
    const auto it = centres.find(control);
    if (it == centres.end()) return false;
    tap_at(it->second);
    return true;
  }

  // Whether `control` was drawn in the last frames (probes are kept until cleared).
  bool drawn(const std::string& control) const { return gui::UiProbe::instance().centres.count(control) > 0; }
  void forget_controls() { gui::UiProbe::instance().centres.clear(); }

 private:
  std::function<void()> draw_;
};

}  // namespace soffit::test
