#pragma once
namespace soffit::gui {
// The meaning of every colour and symbol the views use, drawn with the same
// palette, as a popup opened from the top bar (never on hover).
void draw_legend_popup(const char* popup_id);
}  // namespace soffit::gui
