#include "app/gui/ui_theme.hpp"

#include <imgui.h>

namespace soffit::gui {

namespace {

Palette g_palette;

// Colours chosen for contrast, not borrowed: near-black ink on white for
// sunlight, light ink on near-black for shade; readings in a saturated blue,
// the fitted curve in orange, departures above/below in purple/red.
void set_palette(Theme theme) {
  if (theme == Theme::sunlight) {
    g_palette = {IM_COL32(0, 0, 0, 255),       IM_COL32(90, 90, 90, 255),  IM_COL32(255, 255, 255, 255),
                 IM_COL32(215, 215, 215, 255), IM_COL32(0, 70, 200, 255),  IM_COL32(150, 150, 150, 255),
                 IM_COL32(215, 95, 0, 255),    IM_COL32(215, 95, 0, 60),   IM_COL32(120, 40, 170, 255),
                 IM_COL32(200, 0, 30, 255),    IM_COL32(130, 60, 0, 255)};
  } else {
    g_palette = {IM_COL32(245, 245, 245, 255), IM_COL32(170, 170, 170, 255), IM_COL32(18, 18, 18, 255),
                 IM_COL32(60, 60, 60, 255),    IM_COL32(90, 170, 255, 255),  IM_COL32(110, 110, 110, 255),
                 IM_COL32(255, 160, 60, 255),  IM_COL32(255, 160, 60, 70),   IM_COL32(200, 130, 255, 255),
                 IM_COL32(255, 90, 90, 255),   IM_COL32(255, 200, 90, 255)};
  }
}

}  // namespace

const Palette& palette() { return g_palette; }

void apply_style(Theme theme, float scale) {
  ImGuiStyle style;
  if (theme == Theme::sunlight) {
    ImGui::StyleColorsLight(&style);
    style.Colors[ImGuiCol_WindowBg] = ImVec4(1, 1, 1, 1);
    style.Colors[ImGuiCol_Text] = ImVec4(0, 0, 0, 1);
    style.Colors[ImGuiCol_Border] = ImVec4(0, 0, 0, 0.6f);
    style.Colors[ImGuiCol_Button] = ImVec4(0.82f, 0.87f, 0.98f, 1);
    style.Colors[ImGuiCol_ButtonActive] = ImVec4(0.55f, 0.68f, 0.95f, 1);
  } else {
    ImGui::StyleColorsDark(&style);
    style.Colors[ImGuiCol_WindowBg] = ImVec4(0.07f, 0.07f, 0.07f, 1);
  }
  // Touch: 44 px targets at scale 1 come from a 20 px font plus padding.
  style.FramePadding = ImVec2(12, 11);
  style.ItemSpacing = ImVec2(10, 10);
  style.ItemInnerSpacing = ImVec2(8, 8);
  style.ScrollbarSize = 28;
  style.GrabMinSize = 28;
  style.TouchExtraPadding = ImVec2(4, 4);
  style.WindowBorderSize = 1;
  style.FrameBorderSize = 1;
  style.FrameRounding = 4;
  style.ScaleAllSizes(scale);
  ImGui::GetStyle() = style;
  set_palette(theme);

  ImGui::GetIO().MouseDragThreshold = 12.0f * scale;
}

void load_font(float scale, const std::string& font_path) {
  ImGuiIO& io = ImGui::GetIO();
  io.Fonts->Clear();
  if (!io.Fonts->AddFontFromFileTTF(font_path.c_str(), 20.0f * scale)) io.Fonts->AddFontDefault();
  io.Fonts->Build();
}

}  // namespace soffit::gui
