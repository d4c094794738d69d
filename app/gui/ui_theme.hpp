#pragma once
// Look and size of the app: one UI scale, fonts loaded at that scale, every
// size in font units; a high-contrast light theme for sunlight and a dark one
// for the shade under the arch.
#include <string>

namespace soffit::gui {

enum class Theme { sunlight, shade };

// Rebuilds the style and palette for `theme` at `scale` (touch-sized targets
// at scale 1). Call between frames only.
void apply_style(Theme theme, float scale);

// Rebuilds the font atlas with the TTF at the scaled size (the built-in font
// when the file is missing). The renderer must then re-upload the atlas.
void load_font(float scale, const std::string& font_path);

// Colours used by views, from the active theme.
struct Palette {
  unsigned int ink, faint_ink, paper, grid, reading, excluded, fitted_curve, band, residual_above,
      residual_below, caution;
};
const Palette& palette();

}  // namespace soffit::gui
