#include "app/gui/new_section_dialog.hpp"

#include <imgui.h>

#include <cstdio>

#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"

namespace soffit::gui {
namespace {

constexpr const char* kPopup = "New section";

// A choice among a few, as buttons with the chosen one marked: no hover, no drop-down.
bool choice(const char* label, bool chosen, const std::string& probe_name) {
  if (chosen) ImGui::PushStyleColor(ImGuiCol_Button, ImGui::GetStyle().Colors[ImGuiCol_ButtonActive]);
  const bool pressed = ImGui::Button(label);
  probe(probe_name);
  if (chosen) ImGui::PopStyleColor();
  return pressed;
}

}  // namespace

void NewSectionDialog::request(const std::string& structure_ref, const std::string& date,
                               std::vector<storage::SpanRecord> spans) {
  spec_ = {};
  spec_.structure_ref = structure_ref;
  spec_.date = date;
  spec_.sigma_mm = 3.0;  // a laser level booked to the millimetre (FIELD.md §3.2)
  spec_.instrument = "laser-level";
  spans_ = std::move(spans);
  if (!spans_.empty()) spec_.span_index = spans_.front().index;
  label_[0] = '\0';
  error_.clear();
  open_ = true;
}

void NewSectionDialog::keypad_field(const char* label, std::optional<double>& value, const char* probe_name,
                                    int decimals) {
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted(label);
  ImGui::SameLine(ImGui::GetFontSize() * 14);
  char text[32] = "tap to enter";
  if (value) std::snprintf(text, sizeof text, "%.*f", decimals, *value);
  ImGui::PushID(probe_name);
  const bool pressed = ImGui::Button(text, ImVec2(ImGui::GetFontSize() * 8, 0));
  probe(probe_name);
  ImGui::PopID();
  if (pressed) {
    keypad_.begin_text(label, value ? std::string(text) : std::string());
    keypad_target_ = &value;
    open_keypad_ = true;
  }
}

std::optional<std::string> NewSectionDialog::draw(storage::Project* project) {
  std::optional<std::string> made;
  if (open_) {
    ImGui::OpenPopup(kPopup);
    open_ = false;
  }
  if (!ImGui::BeginPopupModal(kPopup, nullptr, ImGuiWindowFlags_AlwaysAutoResize)) return made;
  ImGui::Text("A section of the visit on %s, with no readings yet: type them in the section view.",
              spec_.date.c_str());

  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Span");
  for (const storage::SpanRecord& s : spans_) {
    ImGui::SameLine();
    const std::string name = s.label.empty() ? "S" + std::to_string(s.index) : s.label;
    if (choice(name.c_str(), spec_.span_index == s.index, "new-section:span:" + name)) spec_.span_index = s.index;
  }

  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Section");
  // The usual places (FIELD.md §3: each face and mid-width), one tap each, or any label typed.
  for (const char* quick : {"US", "MW", "DS"}) {
    ImGui::SameLine();
    if (choice(quick, std::string(label_) == quick, std::string("new-section:label:") + quick))
      std::snprintf(label_, sizeof label_, "%s", quick);
  }
  ImGui::SameLine();
  ImGui::SetNextItemWidth(ImGui::GetFontSize() * 8);
  ImGui::InputText("##label", label_, sizeof label_, ImGuiInputTextFlags_AutoSelectAll);  // a tap replaces a quick label
  probe("new-section:label");

  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Booked as");
  ImGui::SameLine();
  const bool offsets = spec_.booking == app::NewSectionBooking::offsets;
  if (choice("Offsets from a level line", offsets, "new-section:offsets"))
    spec_.booking = app::NewSectionBooking::offsets;
  ImGui::SameLine();
  if (choice("Points x, z (m)", !offsets, "new-section:xz")) spec_.booking = app::NewSectionBooking::xz;

  if (offsets) {
    keypad_field("Datum line RL (m)", spec_.datum_rl_m, "new-section:datum", 3);
    keypad_field("Springing line RL (m)", spec_.z_origin_rl_m, "new-section:springing", 3);
    ImGui::AlignTextToFramePadding();
    ImGui::TextUnformatted("Offsets measured");
    ImGui::SameLine(ImGui::GetFontSize() * 14);
    if (choice("up", !spec_.offsets_down, "new-section:up")) spec_.offsets_down = false;
    ImGui::SameLine();
    if (choice("down", spec_.offsets_down, "new-section:down")) spec_.offsets_down = true;
    keypad_field("Precision, 1 sd (mm)", spec_.sigma_mm, "new-section:sigma", 1);
  }

  if (!error_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().residual_below));
    ImGui::TextWrapped("Not made: %s", error_.c_str());
    ImGui::PopStyleColor();
  }
  const bool create = ImGui::Button("Create section");
  probe("new-section:create");
  ImGui::SameLine();
  const bool cancel = ImGui::Button("Cancel");
  probe("new-section:cancel");
  if (create && project) {
    spec_.label = label_;
    try {
      made = app::add_blank_section(*project, spec_);
      ImGui::CloseCurrentPopup();
    } catch (const std::exception& e) {
      error_ = e.what();
    }
  } else if (cancel) {
    ImGui::CloseCurrentPopup();
  }

  // The keypad opens over the form, on the field tapped.
  if (open_keypad_) {
    ImGui::OpenPopup(keypad_.popup_id().c_str());
    open_keypad_ = false;
  }
  if (keypad_target_) {
    if (const auto value = keypad_.draw()) {
      *keypad_target_ = *value;
      keypad_target_ = nullptr;
    } else if (!ImGui::IsPopupOpen(keypad_.popup_id().c_str())) {
      keypad_target_ = nullptr;
    }
  }
  ImGui::EndPopup();
  return made;
}

}  // namespace soffit::gui
