#include "app/gui/ui_theme.hpp"

#include <algorithm>

namespace soffit::gui {

namespace {

Palette g_palette;
float g_scale = 1.0f;

// Colours chosen for contrast, not borrowed: near-black ink on white for
// sunlight, light ink on near-black for shade; readings in a saturated blue,
// the fitted curve in orange, departures above/below in purple/red.
// Ratios are WCAG 2.1 contrast ratios (relative luminance), against paper
// unless said; tests/gui/test_theme_contrast.cpp checks the ones that matter.
void set_palette(Theme theme) {
  if (theme == Theme::sunlight) {
    g_palette = {IM_COL32(0, 0, 0, 255),       // ink 21:1
                 IM_COL32(90, 90, 90, 255),    // faint ink 6.9:1 (notes, information)
                 IM_COL32(255, 255, 255, 255),  // paper
                 IM_COL32(215, 215, 215, 255),
                 IM_COL32(0, 70, 200, 255),    // reading 7.7:1
                 IM_COL32(150, 150, 150, 255),
                 IM_COL32(215, 95, 0, 255),
                 IM_COL32(215, 95, 0, 60),
                 IM_COL32(120, 40, 170, 255),
                 IM_COL32(200, 0, 30, 255),
                 IM_COL32(130, 60, 0, 255),    // caution 8.1:1
                 IM_COL32(20, 60, 150, 255),   // chosen fill: 5.9:1 against a plain button
                 IM_COL32(255, 255, 255, 255),  // chosen ink 9.9:1 on the chosen fill
                 IM_COL32(0, 0, 0, 255)};
  } else {
    g_palette = {IM_COL32(245, 245, 245, 255),  // ink 17.2:1
                 IM_COL32(170, 170, 170, 255),  // faint ink 8.1:1
                 IM_COL32(18, 18, 18, 255),     // paper
                 IM_COL32(60, 60, 60, 255),
                 IM_COL32(90, 170, 255, 255),
                 IM_COL32(110, 110, 110, 255),
                 IM_COL32(255, 160, 60, 255),
                 IM_COL32(255, 160, 60, 70),
                 IM_COL32(200, 130, 255, 255),
                 IM_COL32(255, 90, 90, 255),
                 IM_COL32(255, 200, 90, 255),   // caution 12.2:1
                 IM_COL32(170, 210, 255, 255),  // chosen fill: 3.8:1 against a plain button
                 IM_COL32(0, 0, 0, 255),        // chosen ink 13.4:1 on the chosen fill
                 IM_COL32(255, 255, 255, 255)};
  }
}

ImVec4 rgb(int r, int g, int b, float a = 1.0f) { return ImVec4(r / 255.0f, g / 255.0f, b / 255.0f, a); }

// On touch the pointer stays where the finger lifted, so ImGui's "hovered"
// sticks to the last tapped control: hovered colours equal the plain ones,
// and only a press (Active) shows, as feedback under the finger.
void sunlight_colours(ImVec4* c) {
  c[ImGuiCol_WindowBg] = rgb(255, 255, 255);
  c[ImGuiCol_PopupBg] = rgb(255, 255, 255);
  c[ImGuiCol_Text] = rgb(0, 0, 0);                  // 21:1 on the window, 12.5:1 on a button
  c[ImGuiCol_TextDisabled] = rgb(90, 90, 90);       // 6.9:1: used for notes, so it must read
  c[ImGuiCol_Border] = rgb(0, 0, 0, 0.6f);          // over white (102,102,102): 5.7:1, the control edge
  c[ImGuiCol_Button] = rgb(180, 200, 240);          // 1.7:1 on white; the border carries the edge
  c[ImGuiCol_ButtonHovered] = c[ImGuiCol_Button];
  c[ImGuiCol_ButtonActive] = rgb(150, 175, 230);    // pressed: text 9.6:1
  c[ImGuiCol_FrameBg] = rgb(255, 255, 255);         // inputs and check boxes: white, edged by the border
  c[ImGuiCol_FrameBgHovered] = c[ImGuiCol_FrameBg];
  c[ImGuiCol_FrameBgActive] = rgb(235, 240, 250);
  c[ImGuiCol_CheckMark] = rgb(0, 70, 200);          // 7.7:1 on white
  c[ImGuiCol_Header] = rgb(180, 200, 240);          // a selected list row; a tap selects, so hovered = selected
  c[ImGuiCol_HeaderHovered] = c[ImGuiCol_Header];
  c[ImGuiCol_HeaderActive] = rgb(150, 175, 230);
  c[ImGuiCol_ScrollbarGrab] = rgb(110, 110, 110);   // 4.8:1 on the near-white track
  c[ImGuiCol_ScrollbarGrabHovered] = c[ImGuiCol_ScrollbarGrab];
  c[ImGuiCol_ScrollbarGrabActive] = rgb(60, 60, 60);
  c[ImGuiCol_SliderGrab] = rgb(0, 70, 200);
  c[ImGuiCol_SliderGrabActive] = rgb(0, 50, 150);
  c[ImGuiCol_TabHovered] = c[ImGuiCol_Tab];
  c[ImGuiCol_ResizeGripHovered] = c[ImGuiCol_ResizeGrip];
}

void shade_colours(ImVec4* c) {
  c[ImGuiCol_WindowBg] = rgb(18, 18, 18);
  c[ImGuiCol_PopupBg] = rgb(28, 28, 28);
  c[ImGuiCol_Text] = rgb(240, 240, 240);            // 16.4:1 on the window, 5.2:1 on a button
  c[ImGuiCol_TextDisabled] = rgb(170, 170, 170);    // 8.1:1
  c[ImGuiCol_Border] = rgb(200, 200, 200, 0.8f);    // over the window (164,164,164): 7.5:1
  c[ImGuiCol_Button] = rgb(45, 100, 175);           // 3.2:1 against the window
  c[ImGuiCol_ButtonHovered] = c[ImGuiCol_Button];
  c[ImGuiCol_ButtonActive] = rgb(25, 70, 130);      // pressed: darker, text 8.2:1
  c[ImGuiCol_FrameBg] = rgb(40, 40, 48);            // edged by the light border
  c[ImGuiCol_FrameBgHovered] = c[ImGuiCol_FrameBg];
  c[ImGuiCol_FrameBgActive] = rgb(55, 55, 66);
  c[ImGuiCol_CheckMark] = rgb(120, 190, 255);       // 7.4:1 on the check box
  c[ImGuiCol_Header] = rgb(45, 100, 175);
  c[ImGuiCol_HeaderHovered] = c[ImGuiCol_Header];
  c[ImGuiCol_HeaderActive] = rgb(25, 70, 130);
  c[ImGuiCol_ScrollbarGrab] = rgb(150, 150, 150);
  c[ImGuiCol_ScrollbarGrabHovered] = c[ImGuiCol_ScrollbarGrab];
  c[ImGuiCol_ScrollbarGrabActive] = rgb(200, 200, 200);
  c[ImGuiCol_SliderGrab] = rgb(120, 190, 255);
  c[ImGuiCol_SliderGrabActive] = rgb(170, 210, 255);
  c[ImGuiCol_TabHovered] = c[ImGuiCol_Tab];
  c[ImGuiCol_ResizeGripHovered] = c[ImGuiCol_ResizeGrip];
}

}  // namespace

const Palette& palette() { return g_palette; }

void apply_style(Theme theme, float scale) {
  ImGuiStyle style;
  if (theme == Theme::sunlight) {
    ImGui::StyleColorsLight(&style);
    sunlight_colours(style.Colors);
  } else {
    ImGui::StyleColorsDark(&style);
    shade_colours(style.Colors);
  }
  // Disabled controls fade to 45%: fill 1.25:1 on the window (enabled 1.7), border 1.9:1
  // (sunlight) instead of 5.7:1, text 3.4:1 — flat beside an edged, filled
  // enabled button even in glare.
  style.DisabledAlpha = 0.45f;
  // Touch: 44 px targets at scale 1 from a 20 px font plus 2 x 12 px padding.
  style.FramePadding = ImVec2(12, 12);
  style.ItemSpacing = ImVec2(10, 10);
  style.ItemInnerSpacing = ImVec2(8, 8);
  style.ScrollbarSize = 28;
  style.GrabMinSize = 28;
  style.TouchExtraPadding = ImVec2(4, 4);
  style.WindowBorderSize = 1;
  style.FrameBorderSize = 1;
  style.PopupBorderSize = 1;
  style.FrameRounding = 4;
  style.ScaleAllSizes(scale);
  ImGui::GetStyle() = style;
  set_palette(theme);
  g_scale = scale;

  ImGui::GetIO().MouseDragThreshold = 12.0f * scale;
}

bool choice_button(const char* label, bool chosen, ImVec2 size) {
  if (!chosen) return ImGui::Button(label, size);
  const Palette& c = palette();
  ImGui::PushStyleColor(ImGuiCol_Button, c.chosen_fill);
  ImGui::PushStyleColor(ImGuiCol_ButtonHovered, c.chosen_fill);
  ImGui::PushStyleColor(ImGuiCol_ButtonActive, c.chosen_fill);
  ImGui::PushStyleColor(ImGuiCol_Text, c.chosen_ink);
  ImGui::PushStyleColor(ImGuiCol_Border, c.chosen_border);
  ImGui::PushStyleVar(ImGuiStyleVar_FrameBorderSize, std::max(2.0f, 2.0f * g_scale));
  const bool pressed = ImGui::Button(label, size);
  ImGui::PopStyleVar();
  ImGui::PopStyleColor(5);
  return pressed;
}

void load_font(float scale, const std::string& font_path) {
  // Latin-1 plus the punctuation and signs the views write: – — ‘ ’ “ ” … (General
  // Punctuation), − (minus sign), ✓ (check mark). All are in DejaVu Sans.
  static const ImWchar kRanges[] = {0x0020, 0x00FF, 0x2010, 0x2027, 0x2212, 0x2212, 0x2713, 0x2713, 0};
  ImGuiIO& io = ImGui::GetIO();
  io.Fonts->Clear();
  if (!io.Fonts->AddFontFromFileTTF(font_path.c_str(), 20.0f * scale, nullptr, kRanges)) io.Fonts->AddFontDefault();
  io.Fonts->Build();
}

}  // namespace soffit::gui
