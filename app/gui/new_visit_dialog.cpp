#include "app/gui/new_visit_dialog.hpp"

#include <imgui.h>

#include <algorithm>
#include <cstdio>

#include "app/gui/fitted_modal.hpp"
#include "app/gui/flow_layout.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"

namespace soffit::gui {
namespace {

constexpr const char* kPopup = "New visit";

}  // namespace

void NewVisitDialog::request(const std::string& structure_ref, const std::string& inspector) {
  structure_ref_ = structure_ref;
  visit_ = {};
  visit_.details.kind = "principal";
  std::snprintf(date_, sizeof date_, "%s", app::today_iso().c_str());
  std::snprintf(inspector_, sizeof inspector_, "%s", inspector.c_str());
  weather_[0] = not_inspected_[0] = '\0';
  error_.clear();
  open_ = true;
}

std::optional<std::string> NewVisitDialog::draw(storage::Project* project) {
  std::optional<std::string> made;
  if (open_) {
    ImGui::OpenPopup(kPopup);
    open_ = false;
  }
  // Never larger than the window: the form scrolls, Start visit and Cancel stay in view.
  if (!modal_.begin(kPopup, 26)) return made;
  const float field = std::min(ImGui::GetFontSize() * 22, ImGui::GetContentRegionAvail().x);

  ImGui::TextUnformatted("Date (YYYY-MM-DD)");
  ImGui::SetNextItemWidth(field);
  ImGui::InputText("##date", date_, sizeof date_, ImGuiInputTextFlags_AutoSelectAll);
  probe("new-visit:date");

  ImGui::TextUnformatted("Kind of inspection");
  bool first = true;
  for (const char* kind : {"general", "principal", "special", "for assessment"}) {
    if (!first) same_line_if_fits(kind);
    first = false;
    if (choice_button(kind, visit_.details.kind == kind)) visit_.details.kind = kind;
    probe(std::string("new-visit:kind:") + kind);
  }

  ImGui::TextUnformatted("Inspector");
  ImGui::SetNextItemWidth(field);
  ImGui::InputText("##inspector", inspector_, sizeof inspector_);
  probe("new-visit:inspector");
  ImGui::TextUnformatted("Weather");
  ImGui::SetNextItemWidth(field);
  ImGui::InputText("##weather", weather_, sizeof weather_);
  probe("new-visit:weather");

  // Air temperature matters to crack widths read on the day (FIELD.md §6.2): on the keypad.
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Air temperature (C)");
  ImGui::SameLine();
  char temp[32] = "tap to enter";
  if (visit_.details.air_temperature_c) std::snprintf(temp, sizeof temp, "%.1f", *visit_.details.air_temperature_c);
  if (ImGui::Button(temp)) {
    keypad_.begin_text("Air temperature (C)", visit_.details.air_temperature_c ? std::string(temp) : "");
    open_keypad_ = true;
  }
  probe("new-visit:temperature");

  ImGui::TextUnformatted("Parts not inspected");
  ImGui::SetNextItemWidth(field);
  ImGui::InputText("##not-inspected", not_inspected_, sizeof not_inspected_);
  probe("new-visit:not-inspected");

  modal_.footer();
  if (!error_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().residual_below));
    ImGui::TextWrapped("Not made: %s", error_.c_str());
    ImGui::PopStyleColor();
  }
  const bool create = ImGui::Button("Start visit");
  probe("new-visit:create");
  same_line_if_fits("Cancel");
  const bool cancel = ImGui::Button("Cancel");
  probe("new-visit:cancel");
  modal_.end_footer();
  if (create && project) {
    visit_.date = date_;
    visit_.details.inspector = inspector_;
    visit_.details.weather = weather_;
    visit_.details.parts_not_inspected = not_inspected_;
    try {
      app::add_visit(*project, structure_ref_, visit_);
      made = visit_.date;
      ImGui::CloseCurrentPopup();
    } catch (const std::exception& e) {
      error_ = e.what();
    }
  } else if (cancel) {
    ImGui::CloseCurrentPopup();
  }

  if (open_keypad_) {
    ImGui::OpenPopup(keypad_.popup_id().c_str());
    open_keypad_ = false;
    keypad_live_ = true;
  }
  if (keypad_live_) {
    if (const auto v = keypad_.draw()) {
      visit_.details.air_temperature_c = *v;
      keypad_live_ = false;
    } else if (!ImGui::IsPopupOpen(keypad_.popup_id().c_str())) {
      keypad_live_ = false;
    }
  }
  ImGui::EndPopup();
  return made;
}

}  // namespace soffit::gui
