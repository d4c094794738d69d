#include "app/gui/new_visit_dialog.hpp"

#include <imgui.h>

#include <algorithm>
#include <cstdio>

#include "app/gui/fitted_modal.hpp"
#include "app/gui/flow_layout.hpp"
#include "app/gui/form_footer.hpp"
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
  temperature_.button(visit_.details.air_temperature_c, "new-visit:temperature", 0, "Air temperature (C)", 1);

  ImGui::TextUnformatted("Parts not inspected");
  ImGui::SetNextItemWidth(field);
  ImGui::InputText("##not-inspected", not_inspected_, sizeof not_inspected_);
  probe("new-visit:not-inspected");

  const FormAnswer answer = create_or_cancel_footer(modal_, error_, "Start visit", "new-visit");
  if (answer == FormAnswer::create && project) {
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
  } else if (answer == FormAnswer::cancel) {
    ImGui::CloseCurrentPopup();
  }

  temperature_.draw();  // over the form, once tapped
  ImGui::EndPopup();
  return made;
}

}  // namespace soffit::gui
