#include "app/gui/section_workspace.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <chrono>
#include <cstdio>
#include <filesystem>

#include "app/gui/profile_plot.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"
#include "exports/fit_report_json.hpp"
#include "geometry/analysis/derived.hpp"
#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit::gui {

void SectionWorkspace::load_folder(const std::string& folder) {
  std::vector<std::filesystem::path> paths;
  std::error_code ec;
  for (const auto& e : std::filesystem::directory_iterator(folder, ec))
    if (e.path().extension() == ".csv") paths.push_back(e.path());
  std::sort(paths.begin(), paths.end());
  for (const auto& p : paths) {
    Entry entry;
    entry.path = p.string();
    entry.label = p.stem().string();
    try {
      entry.sheet = read_sheet_file(entry.path, {});
    } catch (const InputError& e) {
      entry.error = e.what();
    }
    entries_.push_back(std::move(entry));
  }
  if (!entries_.empty()) select(0);
}

void SectionWorkspace::load_sheets(std::vector<std::pair<std::string, SurveySheet>> sheets) {
  if (pending_.valid()) pending_.wait();  // a fit of the old sections may still be running
  pending_ = {};
  refit_wanted_ = false;
  entries_.clear();
  analysis_.reset();
  for (auto& [label, sheet] : sheets) {
    Entry entry;
    entry.label = label;
    entry.path = sheet.source;
    entry.sheet = std::move(sheet);
    entries_.push_back(std::move(entry));
  }
  selected_ = 0;
  if (!entries_.empty()) select(0);
}

void SectionWorkspace::select(size_t index) {
  if (index >= entries_.size()) return;
  selected_ = index;
  save_state_.clear();
  analysis_.reset();
  start_fit();
}

void SectionWorkspace::start_fit() {
  const Entry& e = entries_[selected_];
  if (!e.sheet) return;
  if (pending_.valid()) {
    refit_wanted_ = true;  // started again when the running fit comes back
    return;
  }
  // The job takes a copy in and hands a result out: the UI never shares state with it.
  ProfileRequest request;
  request.shape = shape_;
  request.uncertainty.monte_carlo_draws = 500;
  pending_ = std::async(std::launch::async, [readings = e.sheet->readings, request] {
    return analyse_profile(readings, request);
  });
}

void SectionWorkspace::poll() {
  if (pending_.valid() && pending_.wait_for(std::chrono::seconds(0)) == std::future_status::ready) {
    analysis_ = pending_.get();
    band_.reset();
    if (analysis_->ok()) band_ = intrados_band(*analysis_->fit, analysis_->uncertainty, 48);
    if (refit_wanted_) {
      refit_wanted_ = false;
      start_fit();
    }
  }
}

bool SectionWorkspace::store_exclusion(const Reading& before, const Reading& after, size_t reading) {
  const bool exclusion_changed =
      before.excluded != after.excluded || before.exclusion_reason != after.exclusion_reason;
  if (!exclusion_changed) {
    save_state_ = store_ ? "kept for this session only: corrections are not written to the project yet"
                         : "kept for this session only";
    return true;
  }
  if (!store_) {
    save_state_ = "kept for this session only";
    return true;
  }
  try {
    store_(selected_, reading, after.excluded ? after.exclusion_reason : std::string());
    save_state_ = "saved to the project";
    return true;
  } catch (const std::exception& ex) {
    save_state_ = std::string("not saved: ") + ex.what();
    return false;
  }
}

void SectionWorkspace::apply_edit(app::ReadingEdit edit) {
  Entry& e = entries_[selected_];
  const size_t index = edit.index;
  const Reading before = edit.before, after = edit.after;
  e.history.apply(e.sheet->readings, std::move(edit));
  if (!store_exclusion(before, after, index)) e.history.undo(e.sheet->readings);  // keep view and file in step
  start_fit();
}

void SectionWorkspace::undo() {
  Entry& e = entries_[selected_];
  if (!e.sheet) return;
  if (const app::ReadingEdit* edit = e.history.undo(e.sheet->readings)) {
    if (!store_exclusion(edit->after, edit->before, edit->index)) e.history.redo(e.sheet->readings);
    start_fit();
  }
}

void SectionWorkspace::redo() {
  Entry& e = entries_[selected_];
  if (!e.sheet) return;
  if (const app::ReadingEdit* edit = e.history.redo(e.sheet->readings)) {
    if (!store_exclusion(edit->before, edit->after, edit->index)) e.history.undo(e.sheet->readings);
    start_fit();
  }
}

void SectionWorkspace::draw_edit_bar() {
  const Entry& e = entries_[selected_];
  ImGui::BeginDisabled(!e.history.can_undo());
  const bool undo_pressed = ImGui::Button("Undo");
  probe("undo");
  if (undo_pressed || (e.history.can_undo() && ImGui::GetIO().KeyCtrl &&
                       ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Z))))
    undo();
  ImGui::EndDisabled();
  ImGui::SameLine();
  ImGui::BeginDisabled(!e.history.can_redo());
  const bool redo_pressed = ImGui::Button("Redo");
  probe("redo");
  if (redo_pressed || (e.history.can_redo() && ImGui::GetIO().KeyCtrl &&
                       ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Y))))
    redo();
  ImGui::EndDisabled();
  if (!save_state_.empty()) {
    // The autosave indicator: where the last change went, said plainly.
    ImGui::SameLine();
    ImGui::AlignTextToFramePadding();
    ImGui::TextDisabled("%s", save_state_.c_str());
  }
}

void SectionWorkspace::draw_readings_table() {
  const Palette& c = palette();
  Entry& e = entries_[selected_];
  const ShapeFit& fit = *analysis_->fit;
  const Readings& readings = e.sheet->readings;
  const size_t rows = std::min(readings.size(), fit.residuals.size());
  // A dialog asked for by a screenshot opens on the middle reading.
  if (screenshot_dialog_ == "keypad" && rows > 0) request_keypad(rows / 2);
  if (screenshot_dialog_ == "exclude" && rows > 0) request_exclude(rows / 2);
  screenshot_dialog_.clear();

  if (ImGui::BeginTable("readings", 6, ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg)) {
    ImGui::TableSetupColumn("#");
    ImGui::TableSetupColumn("x m");
    ImGui::TableSetupColumn("z m");
    ImGui::TableSetupColumn("off curve mm");
    ImGui::TableSetupColumn("state");
    ImGui::TableSetupColumn("action");
    ImGui::TableHeadersRow();
    // Only the rows on screen are built: a scan slice has 10⁵ readings.
    ImGuiListClipper clipper;
    clipper.Begin(static_cast<int>(rows));
    while (clipper.Step()) {
      for (int row = clipper.DisplayStart; row < clipper.DisplayEnd; ++row) {
        const size_t i = static_cast<size_t>(row);
        const Reading& r = readings[i];
        ImGui::PushID(row);
        ImGui::TableNextRow();
        ImGui::TableNextColumn();
        ImGui::Text("%zu", i + 1);
        ImGui::TableNextColumn();
        ImGui::Text("%.3f", r.x);
        ImGui::TableNextColumn();
        // Tap the height to correct a misread value on the keypad (recorded, undoable).
        char z_label[32];
        std::snprintf(z_label, sizeof z_label, "%.3f", r.z);
        const bool correct = ImGui::Button(z_label);
        probe("z:" + std::to_string(i + 1));
        if (correct) request_keypad(i);
        ImGui::TableNextColumn();
        // Beyond 2σ is shown in the departure colours: out of tolerance, look again.
        const double res = fit.residuals[i];
        const bool beyond = std::abs(res) > 2.0 * fit.sigmas[i];
        if (beyond)
          ImGui::PushStyleColor(ImGuiCol_Text,
                                ImGui::ColorConvertU32ToFloat4(res < 0 ? c.residual_below : c.residual_above));
        ImGui::Text("%+.1f%s", res * 1000, beyond ? "  (> 2 sigma)" : "");
        if (beyond) ImGui::PopStyleColor();
        ImGui::TableNextColumn();
        if (r.excluded)
          ImGui::TextWrapped("excluded: %s", r.exclusion_reason.c_str());
        else if (r.check)
          ImGui::TextUnformatted("closing check");
        else
          ImGui::TextUnformatted("used");
        ImGui::TableNextColumn();
        if (!r.check) {
          if (r.excluded) {
            const bool pressed = ImGui::Button("Use again");
            probe("use again:" + std::to_string(i + 1));
            if (pressed) {
              app::ReadingEdit edit{i, r, r, "use reading " + std::to_string(i + 1) + " again"};
              edit.after.excluded = false;
              edit.after.exclusion_reason.clear();
              apply_edit(std::move(edit));
            }
          } else {
            const bool pressed = ImGui::Button("Exclude...");
            probe("exclude:" + std::to_string(i + 1));
            if (pressed) request_exclude(i);
          }
        }
        ImGui::PopID();
      }
    }
    ImGui::EndTable();
  }

  // Dialogs live outside the table so a row scrolled out of view cannot close them.
  if (open_exclude_) {
    ImGui::OpenPopup("Exclude reading");
    open_exclude_ = false;
  }
  draw_exclude_dialog();
  if (open_keypad_) {
    ImGui::OpenPopup(keypad_.popup_id().c_str());
    open_keypad_ = false;
  }
  if (correcting_) {
    if (const auto value = keypad_.draw()) {
      const size_t i = *correcting_;
      correcting_.reset();
      if (i < readings.size()) {
        const Reading& r = readings[i];
        app::ReadingEdit edit{i, r, r, "correct reading " + std::to_string(i + 1)};
        edit.after.z = *value;
        apply_edit(std::move(edit));
      }
    } else if (!ImGui::IsPopupOpen(keypad_.popup_id().c_str())) {
      correcting_.reset();
    }
  }
}

void SectionWorkspace::request_keypad(size_t i) {
  const Reading& r = entries_[selected_].sheet->readings[i];
  correcting_ = i;
  keypad_.begin("Height z (m) of reading " + std::to_string(i + 1), r.z, 3);
  open_keypad_ = true;
}

void SectionWorkspace::request_exclude(size_t i) {
  excluding_ = i;
  reason_[0] = '\0';
  open_exclude_ = true;
}

void SectionWorkspace::draw_exclude_dialog() {
  if (!ImGui::BeginPopupModal("Exclude reading", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) return;
  Entry& e = entries_[selected_];
  const size_t i = excluding_.value_or(0);
  ImGui::Text("Exclude reading %zu from the fit? It stays in the data with its reason.", i + 1);
  // Reasons from the trade's common errors (FIELD.md §3.3), one tap each.
  for (const char* quick : {"protruding unit", "recessed joint", "deposit or vegetation", "blunder"}) {
    const bool pressed = ImGui::Button(quick);
    probe(std::string("reason:") + quick);
    if (pressed) std::snprintf(reason_, sizeof reason_, "%s", quick);
    ImGui::SameLine();
  }
  ImGui::NewLine();
  ImGui::SetNextItemWidth(ImGui::GetFontSize() * 24);
  ImGui::InputText("reason", reason_, sizeof reason_);
  const bool has_reason = reason_[0] != '\0';
  ImGui::BeginDisabled(!has_reason);
  const bool confirm = ImGui::Button("Exclude");
  probe("confirm exclude");
  if (confirm && has_reason && i < e.sheet->readings.size()) {
    const Reading& r = e.sheet->readings[i];
    app::ReadingEdit edit{i, r, r, "exclude reading " + std::to_string(i + 1)};
    edit.after.excluded = true;
    edit.after.exclusion_reason = reason_;
    apply_edit(std::move(edit));
    excluding_.reset();
    ImGui::CloseCurrentPopup();
  }
  ImGui::EndDisabled();
  ImGui::SameLine();
  if (ImGui::Button("Cancel")) {
    excluding_.reset();
    ImGui::CloseCurrentPopup();
  }
  ImGui::EndPopup();
}

void SectionWorkspace::draw_sheet_list() {
  ImGui::TextUnformatted("Sections");
  for (size_t i = 0; i < entries_.size(); ++i) {
    const bool chosen = i == selected_;
    const bool pressed = ImGui::Selectable(entries_[i].label.c_str(), chosen, 0,
                                           ImVec2(0, ImGui::GetFrameHeight()));
    probe("sheet:" + entries_[i].label);
    if (pressed && !chosen && !busy()) select(i);
  }
}

void SectionWorkspace::draw_results() {
  const Palette& c = palette();
  if (entries_.empty()) {
    ImGui::TextWrapped("No survey sheets found.");
    return;
  }
  const Entry& e = entries_[selected_];
  ImGui::Text("%s", e.label.c_str());
  if (!e.error.empty()) {
    ImGui::TextWrapped("This sheet cannot be read: %s", e.error.c_str());
    return;
  }
  draw_edit_bar();
  if (!analysis_) {
    ImGui::TextUnformatted("Fitting...");
    return;
  }
  if (!analysis_->ok()) {
    ImGui::TextWrapped("No fit: %s", analysis_->error.c_str());
    return;
  }
  const ShapeFit& fit = *analysis_->fit;
  const auto& g = analysis_->uncertainty.geometry;
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(c.caution));
  ImGui::TextWrapped("Survey data, not an assessment: a qualified engineer decides what it means.");
  ImGui::PopStyleColor();
  ImGui::Text("Shape: %s", std::string(fit.family->name()).c_str());
  ImGui::TextWrapped("Span %.4f m (95%%: %.4f to %.4f)    rise %.1f mm (95%%: %.1f to %.1f)", g[0].value, g[0].lo,
              g[0].hi, g[1].value * 1000, g[1].lo * 1000, g[1].hi * 1000);
  ImGui::Text("RMS residual %.1f mm, largest %.1f mm, %d readings used", fit.rms_m * 1000,
              fit.max_abs_m * 1000, fit.n_used);
  if (busy()) ImGui::TextUnformatted("Refitting...");
  draw_profile_plot(e.sheet->readings, *analysis_, band_ ? &*band_ : nullptr, ImGui::GetFontSize() * 16);
  draw_readings_table();

  if (analysis_->selection && ImGui::BeginTable("families", 4, ImGuiTableFlags_Borders)) {
    ImGui::TableSetupColumn("Family");
    ImGui::TableSetupColumn("RMS mm");
    ImGui::TableSetupColumn("AIC");
    ImGui::TableSetupColumn("Chosen");
    ImGui::TableHeadersRow();
    for (size_t i = 0; i < analysis_->selection->candidates.size(); ++i) {
      const ShapeCandidate& cand = analysis_->selection->candidates[i];
      ImGui::TableNextRow();
      ImGui::TableNextColumn();
      ImGui::TextUnformatted(std::string(cand.family->name()).c_str());
      ImGui::TableNextColumn();
      if (cand.fit) ImGui::Text("%.1f", cand.fit->rms_m * 1000); else ImGui::TextUnformatted("-");
      ImGui::TableNextColumn();
      if (cand.fit && cand.supported) ImGui::Text("%.1f", cand.fit->aic); else ImGui::TextUnformatted("not supported");
      ImGui::TableNextColumn();
      ImGui::TextUnformatted(static_cast<int>(i) == analysis_->selection->chosen ? "yes" : "");
    }
    ImGui::EndTable();
  }
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(c.caution));
  ImGui::TextWrapped("%s", kSurveyDataCaution);
  ImGui::PopStyleColor();
}

void SectionWorkspace::draw() {
  const float list_width = ImGui::GetFontSize() * 16;
  ImGui::BeginChild("sheets", ImVec2(list_width, 0), true);
  draw_sheet_list();
  ImGui::EndChild();
  ImGui::SameLine();
  ImGui::BeginChild("results", ImVec2(0, 0), true);
  draw_results();
  ImGui::EndChild();
}

}  // namespace soffit::gui
