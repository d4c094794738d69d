#include "app/gui/defect_marks.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <set>
#include <vector>

#include "app/gui/ui_theme.hpp"

namespace soffit::gui {

namespace {

bool dark_theme() { return (palette().paper & 0xFF) < 128; }

// Colours picked for separation from each other and from the page in both
// themes: cracking red, masonry loss purple, shape change amber, water blue,
// everything else green-grey.
DefectFamily family_at(int i) {
  static const char* names[] = {"cracking", "masonry loss or separation", "shape change",
                                "water, growth or scour", "other, damage or repair"};
  const unsigned int light[] = {IM_COL32(200, 0, 30, 255), IM_COL32(120, 40, 170, 255), IM_COL32(190, 110, 0, 255),
                                IM_COL32(0, 90, 200, 255), IM_COL32(40, 110, 60, 255)};
  const unsigned int dark[] = {IM_COL32(255, 90, 90, 255), IM_COL32(200, 140, 255, 255),
                               IM_COL32(255, 190, 70, 255), IM_COL32(100, 180, 255, 255),
                               IM_COL32(120, 210, 140, 255)};
  return {names[i], dark_theme() ? dark[i] : light[i]};
}

int family_index(const std::string& t) {
  static const std::set<std::string> cracking{"longitudinal_crack", "transverse_crack", "diagonal_crack"};
  static const std::set<std::string> loss{"ring_separation", "spalling", "mortar_loss", "missing_unit",
                                          "dropped_voussoir"};
  static const std::set<std::string> shape{"deformation", "spandrel_bulge", "spandrel_lean", "spandrel_sliding",
                                           "spandrel_separation"};
  static const std::set<std::string> water{"seepage", "efflorescence", "vegetation", "scour"};
  if (cracking.count(t)) return 0;
  if (loss.count(t)) return 1;
  if (shape.count(t)) return 2;
  if (water.count(t)) return 3;
  return 4;
}

}  // namespace

DefectFamily defect_family(const std::string& defect_type) { return family_at(family_index(defect_type)); }

const DefectFamily* defect_families(int& count) {
  static DefectFamily all[5];
  for (int i = 0; i < 5; ++i) all[i] = family_at(i);
  count = 5;
  return all;
}

float severity_radius(int severity, float font_size) {
  return font_size * (0.22f + 0.09f * static_cast<float>(std::clamp(severity, 1, 5)));
}

float severity_thickness(int severity, float font_size) {
  return font_size * (0.08f + 0.04f * static_cast<float>(std::clamp(severity, 1, 5)));
}

float area_outline_thickness(float font_size) { return font_size * 0.14f; }

void draw_area_fill(ImDrawList* draw, const ImVec2* ring, int count, unsigned int colour) {
  if (count < 3) return;
  const unsigned int fill = (colour & ~IM_COL32_A_MASK) | (IM_COL32(0, 0, 0, 56) & IM_COL32_A_MASK);
  float top = ring[0].y, bottom = ring[0].y;
  for (int i = 1; i < count; ++i) top = std::min(top, ring[i].y), bottom = std::max(bottom, ring[i].y);
  std::vector<float> crossings;
  // Rows 2 px apart drawn 2 px thick: solid, and even-odd so holes stay open.
  for (float y = std::floor(top) + 1.0f; y < bottom; y += 2.0f) {
    crossings.clear();
    for (int i = 0, j = count - 1; i < count; j = i++) {
      const ImVec2 a = ring[i], b = ring[j];
      if ((a.y > y) != (b.y > y)) crossings.push_back(a.x + (y - a.y) * (b.x - a.x) / (b.y - a.y));
    }
    std::sort(crossings.begin(), crossings.end());
    for (size_t k = 0; k + 1 < crossings.size(); k += 2)
      draw->AddLine(ImVec2(crossings[k], y), ImVec2(crossings[k + 1], y), fill, 2.0f);
  }
}

void draw_defect_legend() {
  ImDrawList* draw = ImGui::GetWindowDrawList();
  const float f = ImGui::GetFontSize();
  int n = 0;
  const DefectFamily* families = defect_families(n);
  for (int i = 0; i < n; ++i) {
    const ImVec2 p = ImGui::GetCursorScreenPos();
    draw->AddRectFilled(ImVec2(p.x, p.y + f * 0.2f), ImVec2(p.x + f * 1.6f, p.y + f * 1.0f), families[i].colour);
    ImGui::Dummy(ImVec2(f * 1.8f, f * 1.2f));
    ImGui::SameLine();
    ImGui::TextUnformatted(families[i].name);
  }
  const unsigned int ink = palette().ink;
  auto row = [&](int kind, const char* meaning) {
    const ImVec2 p = ImGui::GetCursorScreenPos();
    const ImVec2 c(p.x + f * 0.8f, p.y + f * 0.6f);
    if (kind == 0) draw->AddCircleFilled(c, severity_radius(3, f), ink);
    if (kind == 1)
      draw->AddLine(ImVec2(c.x - f * 0.7f, c.y + f * 0.3f), ImVec2(c.x + f * 0.7f, c.y - f * 0.3f), ink,
                    severity_thickness(3, f));
    if (kind == 2) {
      const ImVec2 ring[] = {ImVec2(c.x - f * 0.7f, c.y - f * 0.45f), ImVec2(c.x + f * 0.7f, c.y - f * 0.45f),
                             ImVec2(c.x + f * 0.7f, c.y + f * 0.45f), ImVec2(c.x - f * 0.7f, c.y + f * 0.45f)};
      draw_area_fill(draw, ring, 4, ink);
      draw->AddPolyline(ring, 4, ink, true, area_outline_thickness(f));
    }
    if (kind == 3) {
      draw->AddLine(ImVec2(c.x - f * 0.7f, c.y + f * 0.3f), ImVec2(c.x + f * 0.7f, c.y - f * 0.3f), ink, f * 0.15f);
      draw->AddCircle(ImVec2(c.x - f * 0.7f, c.y + f * 0.3f), f * 0.3f, ink, 0, 2.0f);
    }
    ImGui::Dummy(ImVec2(f * 1.8f, f * 1.2f));
    ImGui::SameLine();
    ImGui::TextUnformatted(meaning);
  };
  row(0, "point defect: a dot (Point: tap where it is)");
  row(1, "crack or other line: a polyline, thicker for a higher severity (Crack line: drag along it)");
  row(2, "area: its outline over a light fill (Area outline: drag round it, or tap its corners)");
  row(3, "in ink (black in the sunlight theme): a line being drawn, or the halo of the selected defect");
  // Severity: the dot grows from 1 to 5 and the number follows the reference.
  const ImVec2 p = ImGui::GetCursorScreenPos();
  for (int s = 1; s <= 5; ++s) {
    const ImVec2 c(p.x + f * (0.6f + 1.2f * (s - 1)), p.y + f * 0.6f);
    draw->AddCircleFilled(c, severity_radius(s, f), ink);
  }
  ImGui::Dummy(ImVec2(f * 6.2f, f * 1.3f));
  ImGui::SameLine();
  ImGui::TextUnformatted("severity 1 to 5 (5 = worst), also written after the reference: D05 ·3");
  ImGui::TextWrapped("1 noted; 2 slight, recheck next visit; 3 moderate, monitor; 4 severe, refer to the engineer; "
                     "5 urgent, escalate from site.");
  ImGui::TextWrapped("Barrel: s along the intrados from the named springing, y from the named face, seen looking up. "
                     "Walls, piers and abutments: x along the span, z up; a downstream face is drawn as seen from "
                     "downstream, so its x = 0 end is on the right. Lengths (lines) and areas are worked out from "
                     "the drawn points and stored as measured facts, apart from the severity.");
}

}  // namespace soffit::gui
