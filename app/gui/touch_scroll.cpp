#include "app/gui/touch_scroll.hpp"

#include <imgui.h>
#include <imgui_internal.h>  // the window being drawn, the active item: what a finger drag has to know

#include <algorithm>
#include <string>

#include "app/gui/ui_probe.hpp"

namespace soffit::gui {

namespace {

// Per window, in ImGui's own state storage (so it follows the context, not a static).
enum DragState { idle = 0, pressed_here = 1, scrolling = 2 };

bool editing_text() {
  const ImGuiContext& g = *ImGui::GetCurrentContext();
  return g.ActiveId != 0 && g.ActiveId == g.InputTextState.ID;
}

void scroll_by(ImGuiWindow* window, ImVec2 pointer_moved) {
  // Content follows the finger: moving the finger up shows what is below.
  // ImGui clamps the target to the window's scroll range when it applies it.
  ImGui::SetScrollY(window, window->Scroll.y - pointer_moved.y);
  if (window->ScrollMax.x > 0) ImGui::SetScrollX(window, window->Scroll.x - pointer_moved.x);
}

}  // namespace

void drag_to_scroll() {
  ImGuiContext& g = *ImGui::GetCurrentContext();
  const ImGuiIO& io = g.IO;
  ImGuiWindow* window = ImGui::GetCurrentWindow();
  ImGuiStorage* storage = ImGui::GetStateStorage();
  const ImGuiID key = window->GetID("##drag-to-scroll");
  int state = storage->GetInt(key, idle);

  // Only a press inside this very window counts: a child, a popup or a modal
  // above it is hovered instead, and drags there are theirs.
  if (io.MouseClicked[0]) state = (g.HoveredWindow == window && !editing_text()) ? pressed_here : idle;
  if (!io.MouseDown[0]) state = idle;

  if (state == pressed_here && ImGui::IsMouseDragging(ImGuiMouseButton_Left) && !editing_text()) {
    state = scrolling;
    // Catch up the distance moved before the drag threshold was passed.
    scroll_by(window, ImGui::GetMouseDragDelta(ImGuiMouseButton_Left));
  } else if (state == scrolling) {
    scroll_by(window, io.MouseDelta);
  }
  // The row or button the finger first landed on is let go, so that lifting
  // the finger after a scroll does not also tap it.
  if (state == scrolling && g.ActiveId != 0 && !editing_text()) ImGui::ClearActiveID();
  storage->SetInt(key, state);
}

bool paging_buttons(const char* id) {
  ImGuiWindow* parent = ImGui::GetCurrentWindow();
  if (parent->DC.ChildWindows.empty()) return false;
  // The child ended last: Begin() appends each child to its parent's list as it starts.
  ImGuiWindow* child = parent->DC.ChildWindows.back();
  // Less one row, so the row at the edge is still in view after the page.
  const float page = std::max(child->InnerRect.GetHeight() - ImGui::GetFrameHeightWithSpacing(),
                              ImGui::GetFrameHeight());
  bool pressed = false;
  ImGui::PushID(id);
  ImGui::BeginDisabled(child->Scroll.y <= 0.0f);
  if (ImGui::Button("Page up")) {
    ImGui::SetScrollY(child, std::max(0.0f, child->Scroll.y - page));
    pressed = true;
  }
  probe(std::string(id) + ":page-up");
  ImGui::EndDisabled();
  ImGui::SameLine();
  ImGui::BeginDisabled(child->Scroll.y >= child->ScrollMax.y);
  if (ImGui::Button("Page down")) {
    ImGui::SetScrollY(child, std::min(child->ScrollMax.y, child->Scroll.y + page));
    pressed = true;
  }
  probe(std::string(id) + ":page-down");
  ImGui::EndDisabled();
  ImGui::PopID();
  return pressed;
}

}  // namespace soffit::gui
