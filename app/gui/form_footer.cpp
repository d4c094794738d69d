#include "app/gui/form_footer.hpp"

#include <imgui.h>

#include "app/gui/flow_layout.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"

namespace soffit::gui {

FormAnswer create_or_cancel_footer(FittedModal& modal, const std::string& error, const char* create_label,
                                   const std::string& probe_prefix) {
  modal.footer();
  if (!error.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().residual_below));
    ImGui::TextWrapped("Not made: %s", error.c_str());
    ImGui::PopStyleColor();
  }
  const bool create = ImGui::Button(create_label);
  probe(probe_prefix + ":create");
  same_line_if_fits("Cancel");
  const bool cancel = ImGui::Button("Cancel");
  probe(probe_prefix + ":cancel");
  modal.end_footer();
  return create ? FormAnswer::create : cancel ? FormAnswer::cancel : FormAnswer::none;
}

}  // namespace soffit::gui
