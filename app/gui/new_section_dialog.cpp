#include "app/gui/new_section_dialog.hpp"

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

constexpr const char* kPopup = "New section";

// A choice among a few, as buttons with the chosen one marked: no hover, no drop-down.
bool choice(const char* label, bool chosen, const std::string& probe_name) {
  const bool pressed = choice_button(label, chosen);
  probe(probe_name);
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

namespace {

// The labels of the number rows, for the column their fields line up on.
constexpr const char* kFieldLabels[] = {"Datum line RL (m)", "Springing line RL (m)", "Offsets measured",
                                        "Precision, 1 sd (mm)"};

// After a row's label: the field goes on the same line at the fields' column
// when both fit, else under the label (a large text scale on a narrow screen).
void to_field_column(float field_w) {
  const ImGuiStyle& st = ImGui::GetStyle();
  float column = 0;
  for (const char* l : kFieldLabels) column = std::max(column, ImGui::CalcTextSize(l).x);
  column += 2 * st.ItemSpacing.x;
  if (column + field_w <= ImGui::GetContentRegionMax().x) ImGui::SameLine(column);
}

// Like same_line_if_fits, for a control of known width (a text field).
void same_line_if_width_fits(float width) {
  const float right = ImGui::GetItemRectMax().x + ImGui::GetStyle().ItemSpacing.x + width;
  if (right <= ImGui::GetWindowPos().x + ImGui::GetWindowContentRegionMax().x) ImGui::SameLine();
}

}  // namespace

void NewSectionDialog::number_row(const char* label, std::optional<double>& value, const char* probe_name,
                                  int decimals) {
  const float field_w = ImGui::GetFontSize() * 8;
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted(label);
  to_field_column(field_w);
  numbers_.button(value, probe_name, field_w, label, decimals);
}

void NewSectionDialog::draw_body() {
  ImGui::TextWrapped("A section of the visit on %s, with no readings yet: type them in the section view.",
                     spec_.date.c_str());

  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Span");
  for (const storage::SpanRecord& s : spans_) {
    // snprintf, not "S" + to_string: GCC 12 warns falsely (-Wrestrict) on that concatenation.
    char numbered[16];
    std::snprintf(numbered, sizeof numbered, "S%d", s.index);
    const std::string name = s.label.empty() ? std::string(numbered) : s.label;
    same_line_if_fits(name.c_str());
    if (choice(name.c_str(), spec_.span_index == s.index, "new-section:span:" + name)) spec_.span_index = s.index;
  }

  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Section");
  // The usual places (FIELD.md §3: each face and mid-width), one tap each, or any label typed.
  for (const char* quick : {"US", "MW", "DS"}) {
    same_line_if_fits(quick);
    if (choice(quick, std::string(label_) == quick, std::string("new-section:label:") + quick))
      std::snprintf(label_, sizeof label_, "%s", quick);
  }
  const float label_w = ImGui::GetFontSize() * 8;
  same_line_if_width_fits(label_w);
  ImGui::SetNextItemWidth(label_w);
  ImGui::InputText("##label", label_, sizeof label_, ImGuiInputTextFlags_AutoSelectAll);  // a tap replaces a quick label
  probe("new-section:label");

  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Booked as");
  const bool was_offsets = spec_.booking == app::NewSectionBooking::offsets;
  same_line_if_fits("Offsets from a level line");
  if (choice("Offsets from a level line", was_offsets, "new-section:offsets"))
    spec_.booking = app::NewSectionBooking::offsets;
  same_line_if_fits("Points x, z (m)");
  if (choice("Points x, z (m)", !was_offsets, "new-section:xz")) spec_.booking = app::NewSectionBooking::xz;

  // Read again after the buttons: the rows below follow a tap on the frame it lands,
  // so the form is measured as it now is.
  if (spec_.booking == app::NewSectionBooking::offsets) {
    number_row("Datum line RL (m)", spec_.datum_rl_m, "new-section:datum", 3);
    number_row("Springing line RL (m)", spec_.z_origin_rl_m, "new-section:springing", 3);
    ImGui::AlignTextToFramePadding();
    ImGui::TextUnformatted("Offsets measured");
    to_field_column(ImGui::CalcTextSize("up").x + ImGui::CalcTextSize("down").x +
                    4 * ImGui::GetStyle().FramePadding.x + ImGui::GetStyle().ItemSpacing.x);
    if (choice("up", !spec_.offsets_down, "new-section:up")) spec_.offsets_down = false;
    same_line_if_fits("down");
    if (choice("down", spec_.offsets_down, "new-section:down")) spec_.offsets_down = true;
    number_row("Precision, 1 sd (mm)", spec_.sigma_mm, "new-section:sigma", 1);
  }
}

std::optional<std::string> NewSectionDialog::draw(storage::Project* project) {
  std::optional<std::string> made;
  if (open_) {
    ImGui::OpenPopup(kPopup);
    open_ = false;
  }
  // At a large text size the form is taller than a landscape tablet: the popup
  // keeps within the display, the form scrolls, Create and Cancel stay in view.
  if (!modal_.begin(kPopup, 40)) return made;
  draw_body();
  const FormAnswer answer = create_or_cancel_footer(modal_, error_, "Create section", "new-section");
  if (answer == FormAnswer::create && project) {
    spec_.label = label_;
    try {
      made = app::add_blank_section(*project, spec_);
      ImGui::CloseCurrentPopup();
    } catch (const std::exception& e) {
      error_ = e.what();
    }
  } else if (answer == FormAnswer::cancel) {
    ImGui::CloseCurrentPopup();
  }

  // The keypad opens over the form, on the field tapped.
  numbers_.draw();
  ImGui::EndPopup();
  return made;
}

}  // namespace soffit::gui
