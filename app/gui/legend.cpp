#include "app/gui/legend.hpp"

#include <imgui.h>

#include "app/gui/defect_marks.hpp"
#include "app/gui/ui_theme.hpp"

namespace soffit::gui {

namespace {

enum class Mark { dot, ring, line, bar };

void entry(Mark mark, unsigned int colour, const char* meaning) {
  ImDrawList* draw = ImGui::GetWindowDrawList();
  const float size = ImGui::GetFontSize();
  const ImVec2 p = ImGui::GetCursorScreenPos();
  const ImVec2 c(p.x + size, p.y + size * 0.6f);
  switch (mark) {
    case Mark::dot: draw->AddCircleFilled(c, size * 0.3f, colour); break;
    case Mark::ring: draw->AddCircle(c, size * 0.3f, colour, 0, 2.0f); break;
    case Mark::line: draw->AddLine(ImVec2(c.x - size * 0.8f, c.y), ImVec2(c.x + size * 0.8f, c.y), colour, 3.0f); break;
    case Mark::bar: draw->AddLine(ImVec2(c.x, c.y - size * 0.5f), ImVec2(c.x, c.y + size * 0.5f), colour, 3.0f); break;
  }
  ImGui::Dummy(ImVec2(size * 2.2f, size * 1.2f));
  ImGui::SameLine();
  ImGui::TextUnformatted(meaning);
}

}  // namespace

void draw_legend_popup(const char* popup_id) {
  if (!ImGui::BeginPopupModal(popup_id, nullptr, ImGuiWindowFlags_AlwaysAutoResize)) return;
  const Palette& c = palette();
  entry(Mark::dot, c.reading, "reading used in the fit");
  entry(Mark::ring, c.excluded, "reading excluded from the fit (kept, with its reason)");
  entry(Mark::line, c.fitted_curve, "fitted intrados between the springings");
  entry(Mark::line, c.band, "95% band of the fitted curve's position (drawn x50, like the bars)");
  entry(Mark::line, c.faint_ink, "springing line");
  entry(Mark::bar, c.residual_above, "reading above the fitted intrados (bar drawn x50)");
  entry(Mark::bar, c.residual_below, "reading below the fitted intrados: sag or flattening (bar drawn x50)");
  ImGui::TextWrapped("In the readings table a departure beyond twice the reading's precision is shown in the bar colours.");
  // The defects view's marks, so one legend explains every screen.
  ImGui::Separator();
  ImGui::TextUnformatted("Defects (barrel and elevations): colour by family, shape by what was drawn");
  draw_defect_legend();
  ImGui::Separator();
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(c.caution));
  ImGui::TextUnformatted("Caution text: survey data, not an assessment.");
  ImGui::PopStyleColor();
  if (ImGui::Button("Close")) ImGui::CloseCurrentPopup();
  ImGui::EndPopup();
}

}  // namespace soffit::gui
