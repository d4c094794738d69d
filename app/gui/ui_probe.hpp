#pragma once
// Where named controls were drawn in the last frame, so that tests can drive
// the real UI through ImGui's input (move the pointer there, press, release)
// rather than call the view's internals. Recording costs nothing when off.
#include <imgui.h>

#include <map>
#include <string>

namespace soffit::gui {

class UiProbe {
 public:
  static UiProbe& instance() {
    static UiProbe probe;
    return probe;
  }
  bool enabled = false;
  std::map<std::string, ImVec2> centres;  // control name → centre of its rectangle
  // Control name → its whole rectangle, for checks of size and of being on screen.
  struct Rect {
    ImVec2 min, max;
  };
  std::map<std::string, Rect> rects;

  // Call right after the control.
  void record(const std::string& name) {
    if (!enabled) return;
    const ImVec2 a = ImGui::GetItemRectMin(), b = ImGui::GetItemRectMax();
    centres[name] = ImVec2((a.x + b.x) / 2, (a.y + b.y) / 2);
    rects[name] = Rect{a, b};
  }
};

inline void probe(const std::string& name) { UiProbe::instance().record(name); }

}  // namespace soffit::gui
