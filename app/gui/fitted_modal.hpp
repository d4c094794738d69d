#pragma once
// A modal dialog that stays inside the display at any text size: as tall as
// its contents up to the display less a margin, its body scrolls (by finger
// too) and its footer (the buttons that finish it) stays in view at the bottom.
// ImGui 1.86 clamps an auto-resizing popup to the display but then scrolls the
// buttons away with everything else; this keeps them out of the scrolling part.
#include <imgui.h>

#include <algorithm>

#include "app/gui/touch_scroll.hpp"

namespace soffit::gui {

class FittedModal {
 public:
  // Like BeginPopupModal(name) for a popup opened with OpenPopup(name): true
  // while it is open. Then draw the body, call footer(), draw the buttons,
  // call end_footer(), draw anything else that belongs to the popup (a nested
  // popup), and ImGui::EndPopup(). `width_em`: the width wanted, in font sizes.
  bool begin(const char* name, float width_em) {
    if (!ImGui::IsPopupOpen(name)) {
      was_open_ = false;
      return false;
    }
    if (!was_open_) body_h_ = footer_h_ = height_ = 0, top_ = -1;
    was_open_ = true;

    const ImGuiStyle& st = ImGui::GetStyle();
    const ImVec2 display = ImGui::GetIO().DisplaySize;
    const float font = ImGui::GetFontSize();
    const float margin = std::max(st.DisplaySafeAreaPadding.x, font * 0.5f);
    const ImVec2 max_size(std::max(display.x - 2 * margin, font * 10), std::max(display.y - 2 * margin, font * 8));
    footer_estimate_ = footer_h_ > 0 ? footer_h_ : 2 * st.ItemSpacing.y + 1 + ImGui::GetFrameHeight();
    const float title_h = font + 2 * st.FramePadding.y;
    // It never shrinks and its top stays put while open: what a finger is about
    // to tap does not move because a row came or went above it. Heights are
    // measured on the frame before, so a dialog that grows extends at the bottom.
    if (display.x != display_.x || display.y != display_.y) top_ = -1;  // turned or resized: place it again
    display_ = display;
    float height = max_size.y;
    if (body_h_ > 0) {
      height_ = std::max(height_, title_h + 2 * st.WindowPadding.y + body_h_ + footer_estimate_);
      if (top_ < 0) top_ = std::max(margin, (display.y - std::min(height_, max_size.y)) / 2);
      height = std::min(height_, display.y - top_ - margin);
    }
    const ImVec2 size(std::min(max_size.x, font * width_em + 2 * st.WindowPadding.x), height);
    ImGui::SetNextWindowPos(ImVec2(display.x / 2, top_ < 0 ? margin : top_), ImGuiCond_Always, ImVec2(0.5f, 0.0f));
    ImGui::SetNextWindowSize(size, ImGuiCond_Always);
    if (!ImGui::BeginPopupModal(name, nullptr,
                                ImGuiWindowFlags_NoResize | ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoSavedSettings |
                                    ImGuiWindowFlags_NoScrollbar | ImGuiWindowFlags_NoScrollWithMouse))
      return false;
    ImGui::BeginChild("##body", ImVec2(0, -footer_estimate_), false);
    return true;
  }

  // Ends the scrolling body; what follows is pinned at the bottom.
  void footer() {
    body_h_ = ImGui::GetCursorPosY() - ImGui::GetStyle().ItemSpacing.y;
    drag_to_scroll();
    ImGui::EndChild();
    footer_top_ = ImGui::GetItemRectMax().y;
    ImGui::Separator();
  }

  // Right after the footer's last item: measures the footer for the next frame.
  void end_footer() { footer_h_ = ImGui::GetItemRectMax().y - footer_top_; }

 private:
  bool was_open_ = false;
  float body_h_ = 0, footer_h_ = 0, footer_estimate_ = 0, footer_top_ = 0;
  float height_ = 0;  // the tallest it has been since it opened
  float top_ = -1;    // where its top was placed (unplaced: < 0)
  ImVec2 display_{0, 0};
};

}  // namespace soffit::gui
