#pragma once
// Look and size of the app: one UI scale, fonts loaded at that scale, every
// size in font units; a high-contrast light theme for sunlight and a dark one
// for the shade under the arch.
#include <imgui.h>

#include <string>

namespace soffit::gui {

enum class Theme { sunlight, shade };

// Rebuilds the style and palette for `theme` at `scale` (touch-sized targets
// at scale 1). Call between frames only.
void apply_style(Theme theme, float scale);

// Rebuilds the font atlas with the TTF at the scaled size (the built-in font
// when the file is missing). The renderer must then re-upload the atlas.
void load_font(float scale, const std::string& font_path);

// Colours used by views, from the active theme. chosen_* mark the option
// that is on (see choice_button).
struct Palette {
  unsigned int ink, faint_ink, paper, grid, reading, excluded, fitted_curve, band, residual_above,
      residual_below, caution, chosen_fill, chosen_ink, chosen_border;
};
const Palette& palette();

// A button for one option among a few (a tab, a mode, a preset). The chosen
// one is drawn inverted with a 2 px border, so that it stays distinct from a
// button a finger merely rested on (touch leaves "hover" on the last tap).
bool choice_button(const char* label, bool chosen, ImVec2 size = ImVec2(0, 0));

}  // namespace soffit::gui
