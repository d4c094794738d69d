#pragma once
// Soffit's own colour scheme for defect types: five families, each one
// colour; the mark's shape follows its geometry (point = dot, line =
// polyline, area = outline over a light fill of the same colour) and its
// size and number follow the severity.
#include <imgui.h>

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
// Line width of a line mark: grows with severity 1–5.
float severity_thickness(int severity, float font_size);
// Outline width of an area mark (the same at every severity: the number says it).
float area_outline_thickness(float font_size);
// The light fill inside an area mark, in `colour` made translucent; the ring
// may be concave (a finger's outline), so it is filled by scanlines.
void draw_area_fill(ImDrawList* draw, const ImVec2* ring, int count, unsigned int colour);

// Draws the legend of this scheme into the current window (no popup).
void draw_defect_legend();

}  // namespace soffit::gui
