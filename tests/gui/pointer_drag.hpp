#pragma once
// Press, move and release through ImGui's input, one frame per step, as a
// finger drawing on a view would: the view sees the press, every sample of
// the movement, and the lift. Works with HeadlessUi's frames.
#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <vector>

#include "headless_ui.hpp"

namespace soffit::test {

// Moves the pointer to `at` and presses (two frames: hover, then down).
inline void press_at(HeadlessUi& ui, ImVec2 at) {
  ImGuiIO& io = ImGui::GetIO();
  io.MousePos = at;
  ui.frame();
  io.MouseDown[0] = true;
  ui.frame();
}

// Moves the held pointer in a straight line to `to`, a frame every `step_px` pixels.
inline void move_to(HeadlessUi& ui, ImVec2 to, float step_px = 4.0f) {
  ImGuiIO& io = ImGui::GetIO();
  const ImVec2 from = io.MousePos;
  const float length = std::hypot(to.x - from.x, to.y - from.y);
  const int steps = std::max(1, static_cast<int>(std::ceil(length / step_px)));
  for (int i = 1; i <= steps; ++i) {
    const float t = static_cast<float>(i) / static_cast<float>(steps);
    io.MousePos = ImVec2(from.x + (to.x - from.x) * t, from.y + (to.y - from.y) * t);
    ui.frame();
  }
}

// Lifts the pointer where it is; one more frame lets a dialog it opens appear.
inline void release(HeadlessUi& ui) {
  ImGui::GetIO().MouseDown[0] = false;
  ui.frame();
  ui.frame();
}

// Press at the first point, move through the others, release at the last.
inline void drag_through(HeadlessUi& ui, const std::vector<ImVec2>& path, float step_px = 4.0f) {
  if (path.empty()) return;
  press_at(ui, path.front());
  for (size_t i = 1; i < path.size(); ++i) move_to(ui, path[i], step_px);
  release(ui);
}

}  // namespace soffit::test
