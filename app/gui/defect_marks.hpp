#pragma once
// Soffit's own colour scheme for defect types: five families, each one
// colour; the mark's shape follows its geometry (point = dot, line =
// polyline, area = outline) and its size and number follow the severity.
#include <string>

namespace soffit::gui {

struct DefectFamily {
  const char* name;     // shown in the legend
  unsigned int colour;  // for the active theme
};

// The family of a vocabulary key (storage/defect_vocabulary.md); unknown keys go to "other".
DefectFamily defect_family(const std::string& defect_type);
// Every family, in legend order.
const DefectFamily* defect_families(int& count);
// Radius of a point mark in font units times the font size: grows with severity 1–5.
float severity_radius(int severity, float font_size);
float severity_thickness(int severity, float font_size);

// Draws the legend of this scheme into the current window (no popup).
void draw_defect_legend();

}  // namespace soffit::gui
