// Both themes, read from the live ImGui style after apply_style: text and
// control edges against what they sit on, and the height of a button.
// Contrast: WCAG 2.1 relative luminance and contrast ratio (W3C, 2018; from
// memory): SC 1.4.3 asks 4.5:1 for body text, SC 1.4.11 asks 3:1 for the
// boundary of a control and for the visual that shows its state.
// Height: the project's GUI standard (issue 4), targets of at least 44 px at
// scale 1 — the size of common touch guidelines (common practice).
#include <doctest/doctest.h>

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <string>

#include "app/gui/ui_theme.hpp"

using namespace soffit;

namespace {

double linear(double channel) {  // sRGB channel 0..1 to linear light (WCAG 2.1 definition)
  return channel <= 0.04045 ? channel / 12.92 : std::pow((channel + 0.055) / 1.055, 2.4);
}
double luminance(const ImVec4& c) { return 0.2126 * linear(c.x) + 0.7152 * linear(c.y) + 0.0722 * linear(c.z); }
double contrast(const ImVec4& a, const ImVec4& b) {
  const double la = luminance(a), lb = luminance(b);
  return (std::max(la, lb) + 0.05) / (std::min(la, lb) + 0.05);
}
// What a translucent colour looks like drawn over an opaque one.
ImVec4 over(const ImVec4& fg, const ImVec4& bg, float extra_alpha = 1.0f) {
  const float a = fg.w * extra_alpha;
  return ImVec4(fg.x * a + bg.x * (1 - a), fg.y * a + bg.y * (1 - a), fg.z * a + bg.z * (1 - a), 1);
}
ImVec4 rgba(unsigned int c) { return ImGui::ColorConvertU32ToFloat4(c); }
bool same(const ImVec4& a, const ImVec4& b) {
  return std::abs(a.x - b.x) < 1e-6f && std::abs(a.y - b.y) < 1e-6f && std::abs(a.z - b.z) < 1e-6f &&
         std::abs(a.w - b.w) < 1e-6f;
}

// An ImGui context with the app's own font, as the app builds it.
struct StyledContext {
  StyledContext(gui::Theme theme, float scale) {
    ImGui::CreateContext();
    ImGuiIO& io = ImGui::GetIO();
    io.IniFilename = nullptr;
    io.DisplaySize = ImVec2(1280, 800);
    io.DeltaTime = 1.0f / 60.0f;
    gui::load_font(scale, std::string(SOFFIT_ASSETS) + "/fonts/DejaVuSans.ttf");
    unsigned char* pixels = nullptr;
    int w = 0, h = 0;
    io.Fonts->GetTexDataAsRGBA32(&pixels, &w, &h);
    gui::apply_style(theme, scale);
  }
  ~StyledContext() { ImGui::DestroyContext(); }
  StyledContext(const StyledContext&) = delete;
  StyledContext& operator=(const StyledContext&) = delete;
};

void check_theme_contrast(gui::Theme theme) {
  StyledContext context(theme, 1.0f);
  const ImGuiStyle& style = ImGui::GetStyle();
  const ImVec4* c = style.Colors;
  const ImVec4 window = c[ImGuiCol_WindowBg];
  const gui::Palette& p = gui::palette();

  // SC 1.4.3, text 4.5:1.
  CHECK(contrast(c[ImGuiCol_Text], window) >= 4.5);
  CHECK(contrast(c[ImGuiCol_Text], over(c[ImGuiCol_Button], window)) >= 4.5);
  CHECK(contrast(c[ImGuiCol_Text], over(c[ImGuiCol_ButtonActive], window)) >= 4.5);
  CHECK(contrast(c[ImGuiCol_Text], over(c[ImGuiCol_Header], window)) >= 4.5);
  CHECK(contrast(c[ImGuiCol_TextDisabled], window) >= 4.5);  // used for notes, so held to text's rule
  CHECK(contrast(rgba(p.faint_ink), window) >= 4.5);
  CHECK(contrast(rgba(p.caution), window) >= 4.5);
  CHECK(contrast(rgba(p.ink), rgba(p.paper)) >= 4.5);
  CHECK(contrast(rgba(p.chosen_ink), rgba(p.chosen_fill)) >= 4.5);

  // SC 1.4.11, control boundaries 3:1: every frame has a border that shows.
  CHECK(style.FrameBorderSize >= 1.0f);
  const double border = contrast(over(c[ImGuiCol_Border], window), window);
  CHECK(border >= 3.0);
  CHECK(contrast(c[ImGuiCol_CheckMark], over(c[ImGuiCol_FrameBg], window)) >= 3.0);
  // The chosen option's fill against a plain button: a state shown by colour, 3:1.
  CHECK(contrast(rgba(p.chosen_fill), over(c[ImGuiCol_Button], window)) >= 3.0);

  // Touch leaves the pointer on the last tap, so hover must not look like a choice
  // (project rule from the sunlight review, item 12).
  CHECK(same(c[ImGuiCol_ButtonHovered], c[ImGuiCol_Button]));
  CHECK(same(c[ImGuiCol_HeaderHovered], c[ImGuiCol_Header]));
  CHECK(same(c[ImGuiCol_FrameBgHovered], c[ImGuiCol_FrameBg]));

  // A disabled control loses the 3:1 edge an enabled one has, so the two differ
  // by more than the text's grey (review item 15).
  CHECK(style.DisabledAlpha < 1.0f);
  CHECK(contrast(over(c[ImGuiCol_Border], window, style.DisabledAlpha), window) < 3.0);
}

}  // namespace

TEST_CASE("sunlight theme: text and control edges meet WCAG 2.1 contrast") {
  check_theme_contrast(gui::Theme::sunlight);
}

TEST_CASE("shade theme: text and control edges meet WCAG 2.1 contrast") {
  check_theme_contrast(gui::Theme::shade);
  // Under the arch the fill itself must stand off the dark window (the light border alone is thin).
  StyledContext context(gui::Theme::shade, 1.0f);
  const ImVec4* c = ImGui::GetStyle().Colors;
  CHECK(contrast(c[ImGuiCol_Button], c[ImGuiCol_WindowBg]) >= 3.0);
}

TEST_CASE("buttons are at least 44 px tall at scale 1 and grow with the scale") {
  for (const float scale : {1.0f, 1.75f}) {
    CAPTURE(scale);
    StyledContext context(gui::Theme::sunlight, scale);
    ImGui::NewFrame();
    ImGui::SetNextWindowPos(ImVec2(0, 0));
    ImGui::SetNextWindowSize(ImVec2(1280, 800));
    ImGui::Begin("##main", nullptr, ImGuiWindowFlags_NoDecoration);
    // The app's font, not ImGui's 13 px fallback: otherwise the sizes below mean nothing.
    CHECK(std::abs(ImGui::GetFontSize() - 20.0f * scale) < 0.01f);
    ImGui::Button("Plain");
    const float plain = ImGui::GetItemRectSize().y;
    gui::choice_button("Chosen", true);
    const float chosen = ImGui::GetItemRectSize().y;
    gui::choice_button("Not chosen", false);
    const float not_chosen = ImGui::GetItemRectSize().y;
    ImGui::End();
    ImGui::Render();
    CHECK(plain >= 44.0f * scale - 0.01f);
    CHECK(chosen >= 44.0f * scale - 0.01f);
    CHECK(not_chosen >= 44.0f * scale - 0.01f);
  }
}
