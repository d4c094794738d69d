#include "app/gui/structure_form.hpp"

#include <imgui.h>
#include <imgui_stdlib.h>

#include <algorithm>
#include <cfloat>
#include <charconv>

#include "app/gui/touch_scroll.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"
#include "storage/storage_error.hpp"

namespace soffit::gui {

namespace {

constexpr const char* kPopupId = "###structure-form";  // one popup whatever its title says

std::string trimmed(const std::string& s) {
  const size_t a = s.find_first_not_of(" \t\r\n");
  if (a == std::string::npos) return "";
  return s.substr(a, s.find_last_not_of(" \t\r\n") - a + 1);
}

// Shortest text that reads back as the same double, and never in the user's locale.
std::string number_text(double v) {
  char buf[32];
  const auto [end, ec] = std::to_chars(buf, buf + sizeof buf, v);
  return ec == std::errc() ? std::string(buf, end) : std::string();
}

// Empty text is "not recorded". A comma is taken as the decimal point, as
// inspectors in comma-decimal locales type it; a leading '+' is allowed.
bool read_degrees(const std::string& text, const char* field, std::optional<double>& out, std::string& error) {
  std::string t = trimmed(text);
  out.reset();
  if (t.empty()) return true;
  if (t.find('.') == std::string::npos) std::replace(t.begin(), t.end(), ',', '.');
  if (t[0] == '+') t.erase(0, 1);
  double v = 0;
  const auto [end, ec] = std::from_chars(t.data(), t.data() + t.size(), v);
  if (ec != std::errc() || end != t.data() + t.size()) {
    error = std::string(field) + ": '" + trimmed(text) + "' is not a number of decimal degrees (for example 51.4778)";
    return false;
  }
  out = v;
  return true;
}

bool read_count(const std::string& text, std::optional<int>& out, std::string& error) {
  const std::string t = trimmed(text);
  out.reset();
  if (t.empty()) return true;
  int v = 0;
  const auto [end, ec] = std::from_chars(t.data(), t.data() + t.size(), v);
  if (ec != std::errc() || end != t.data() + t.size()) {
    error = "number of spans: '" + t + "' is not a whole number";
    return false;
  }
  out = v;
  return true;
}

// StorageError puts the file's path in front; the person is looking at that file already.
std::string without_path(const std::exception& e) {
  std::string what = e.what();
  if (const auto* se = dynamic_cast<const storage::StorageError*>(&e); se && !se->path().empty()) {
    const std::string prefix = se->path() + ": ";
    if (what.rfind(prefix, 0) == 0) what.erase(0, prefix.size());
  }
  return what;
}

}  // namespace

void StructureForm::open_new() {
  ref_ = name_ = carries_ = crosses_ = spans_ = latitude_ = longitude_ = notes_ = "";
  fictitious_ = false;
  structure_id_.clear();
  editing_ref_.clear();
  error_.clear();
  error_field_.clear();
  open_ = open_requested_ = focus_first_ = true;
}

void StructureForm::open_edit(const storage::StructureRecord& s) {
  const storage::StructureFields& f = s.fields;
  ref_ = f.ref;
  name_ = f.name;
  carries_ = f.carries;
  crosses_ = f.crosses;
  spans_ = f.span_count ? std::to_string(*f.span_count) : "";
  latitude_ = f.latitude_deg ? number_text(*f.latitude_deg) : "";
  longitude_ = f.longitude_deg ? number_text(*f.longitude_deg) : "";
  notes_ = f.notes;
  fictitious_ = f.location_fictitious;
  structure_id_ = s.id;
  editing_ref_ = f.ref;
  error_.clear();
  error_field_.clear();
  open_ = open_requested_ = true;
  focus_first_ = false;
}

void StructureForm::fail(std::string message) {
  error_ = std::move(message);
  // The storage and the form both start a refusal with the field's name.
  error_field_.clear();
  for (const char* field : {"reference", "latitude", "longitude", "number of spans"})
    if (error_.rfind(std::string(field) + ":", 0) == 0) error_field_ = field;
}

bool StructureForm::read_fields(storage::StructureFields& out) {
  storage::StructureFields f;
  f.ref = trimmed(ref_);
  f.name = trimmed(name_);
  f.carries = trimmed(carries_);
  f.crosses = trimmed(crosses_);
  f.notes = trimmed(notes_);
  f.location_fictitious = fictitious_;
  std::string error;
  if (!read_count(spans_, f.span_count, error) || !read_degrees(latitude_, "latitude", f.latitude_deg, error) ||
      !read_degrees(longitude_, "longitude", f.longitude_deg, error)) {
    fail(error);
    return false;
  }
  out = std::move(f);
  return true;
}

void StructureForm::draw_input(const char* field, std::string& text, const char* probe_name) {
  const bool flagged = error_field_ == field;
  if (flagged) {
    ImGui::PushStyleColor(ImGuiCol_Border, ImGui::ColorConvertU32ToFloat4(palette().residual_below));
    ImGui::PushStyleVar(ImGuiStyleVar_FrameBorderSize, 3.0f);
  }
  ImGui::SetNextItemWidth(-FLT_MIN);  // the whole width: a large target for a finger
  ImGui::InputText((std::string("##") + probe_name).c_str(), &text);
  probe(probe_name);
  if (flagged) {
    ImGui::PopStyleVar();
    ImGui::PopStyleColor();
  }
}

void StructureForm::draw_row(const char* id, std::initializer_list<Field> fields, bool side_by_side) {
  // Side by side, labels take one table row and fields the next: in one row,
  // ImGui would lower a label to the text line of the field before it.
  if (side_by_side && fields.size() > 1 &&
      ImGui::BeginTable(id, static_cast<int>(fields.size()), ImGuiTableFlags_SizingStretchSame)) {
    ImGui::TableNextRow();
    for (const Field& f : fields) {
      ImGui::TableNextColumn();
      ImGui::TextWrapped("%s", f.label);  // a long label wraps in its column rather than being cut
    }
    ImGui::TableNextRow();
    for (const Field& f : fields) {
      ImGui::TableNextColumn();
      draw_input(f.key, *f.text, f.probe_name);
    }
    ImGui::EndTable();
    return;
  }
  for (const Field& f : fields) {
    ImGui::TextWrapped("%s", f.label);  // at a large text size the label takes two lines, not the edge
    draw_input(f.key, *f.text, f.probe_name);
  }
}

void StructureForm::draw_fields() {
  if (focus_first_) {
    ImGui::SetKeyboardFocusHere();  // the reference field: a label is not focusable
    focus_first_ = false;
  }
  // Short fields share a row when the form is wide enough for their labels
  // (laptop, or a tablet at small text); one field a row at large text.
  const bool wide = ImGui::GetContentRegionAvail().x >= ImGui::GetFontSize() * 34;
  draw_row("##ref", {{"Reference (required; the owner's, unique in the project)", "reference", &ref_, "form:reference"}},
           wide);
  draw_row("##name", {{"Name", "name", &name_, "form:name"}}, wide);
  draw_row("##route",
           {{"Carries (road, railway, path)", "carries", &carries_, "form:carries"},
            {"Crosses (river, road, railway)", "crosses", &crosses_, "form:crosses"}},
           wide);
  ImGui::Spacing();
  ImGui::TextWrapped("Location in decimal degrees, WGS84 as a phone or GPS gives it: north and east positive.");
  draw_row("##where",
           {{"Latitude (-90 to 90)", "latitude", &latitude_, "form:latitude"},
            {"Longitude (-180 to 180)", "longitude", &longitude_, "form:longitude"},
            {"Number of spans", "number of spans", &spans_, "form:spans"}},
           wide);
  // A checkbox label does not wrap, so the words are a wrapped text beside the box; a tap on them ticks it too.
  ImGui::Checkbox("##fictitious", &fictitious_);
  probe("form:fictitious");
  ImGui::SameLine();
  ImGui::AlignTextToFramePadding();
  ImGui::TextWrapped("Location is fictitious (a placeholder, not the real site)");
  if (ImGui::IsItemClicked()) fictitious_ = !fictitious_;
  ImGui::TextUnformatted("Notes");
  ImGui::InputTextMultiline("##notes", &notes_, ImVec2(-FLT_MIN, ImGui::GetTextLineHeight() * 5));
  probe("form:notes");
  drag_to_scroll();
}

bool StructureForm::draw(const Save& save) {
  if (!open_) return false;
  if (open_requested_) {
    ImGui::OpenPopup(kPopupId);
    open_requested_ = false;
  }
  const ImGuiViewport* vp = ImGui::GetMainViewport();
  const float width = std::min(vp->WorkSize.x * 0.94f, ImGui::GetFontSize() * 40);
  ImGui::SetNextWindowPos(ImVec2(vp->WorkPos.x + vp->WorkSize.x / 2, vp->WorkPos.y + vp->WorkSize.y / 2),
                          ImGuiCond_Always, ImVec2(0.5f, 0.5f));
  ImGui::SetNextWindowSize(ImVec2(width, vp->WorkSize.y * 0.92f), ImGuiCond_Always);
  const std::string title =
      (structure_id_.empty() ? std::string("Add a structure to the register") : "Edit details of " + editing_ref_) +
      kPopupId;
  if (!ImGui::BeginPopupModal(title.c_str(), nullptr, ImGuiWindowFlags_NoResize | ImGuiWindowFlags_NoMove)) {
    open_ = false;  // closed some other way (never by ImGui itself here, but do not stay stuck open)
    return false;
  }
  // The buttons and the reason for a refusal stay in view below the scrolling fields.
  // The reason is measured as it will wrap: at a large text size it can take several lines.
  const float error_h =
      error_.empty() ? 0.0f
                     : ImGui::CalcTextSize(("Not saved: " + error_).c_str(), nullptr, false,
                                           ImGui::GetContentRegionAvail().x)
                               .y +
                           ImGui::GetStyle().ItemSpacing.y;
  const float footer = ImGui::GetFrameHeightWithSpacing() * 1.5f + error_h;
  ImGui::BeginChild("fields", ImVec2(0, -footer));
  draw_fields();
  ImGui::EndChild();
  if (!error_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().residual_below));
    ImGui::TextWrapped("Not saved: %s", error_.c_str());
    ImGui::PopStyleColor();
    probe("form:error");
  }
  bool saved = false;
  // Both buttons on the one row the footer has room for, however narrow the display.
  const ImVec2 button(std::min(ImGui::GetFontSize() * 9, (ImGui::GetContentRegionAvail().x - ImGui::GetStyle().ItemSpacing.x) / 2),
                      ImGui::GetFrameHeight() * 1.3f);
  const bool save_pressed = ImGui::Button("Save", button);
  probe("form:save");
  ImGui::SameLine();
  const bool cancel_pressed = ImGui::Button("Cancel", button);
  probe("form:cancel");
  if (save_pressed) {
    storage::StructureFields f;
    if (read_fields(f)) {
      try {
        save(f);
        saved_ = f;
        saved = true;
        open_ = false;
        ImGui::CloseCurrentPopup();
      } catch (const std::exception& e) {
        fail(without_path(e));  // the form stays open with everything typed
      }
    }
  } else if (cancel_pressed) {
    open_ = false;  // nothing was written: the fields are discarded
    ImGui::CloseCurrentPopup();
  }
  ImGui::EndPopup();
  return saved;
}

}  // namespace soffit::gui
