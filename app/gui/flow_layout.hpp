#pragma once
// Rows of buttons that wrap like words: at a large text scale a row of
// actions goes on to the next line instead of running off the screen.
#include <imgui.h>

namespace soffit::gui {

// Call between two buttons instead of ImGui::SameLine(): stays on the line
// when a button labelled `next_label` still fits in the window, else wraps.
inline void same_line_if_fits(const char* next_label) {
  const ImGuiStyle& style = ImGui::GetStyle();
  const float width = ImGui::CalcTextSize(next_label, nullptr, true).x + style.FramePadding.x * 2;
  const float right = ImGui::GetItemRectMax().x + style.ItemSpacing.x + width;
  if (right <= ImGui::GetWindowPos().x + ImGui::GetWindowContentRegionMax().x) ImGui::SameLine();
}

}  // namespace soffit::gui
