#include "app/gui/section_workspace.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <chrono>
#include <cstdio>
#include <filesystem>

#include "app/gui/profile_plot.hpp"
#include "app/gui/touch_scroll.hpp"
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
    check_typed(entry);
    entries_.push_back(std::move(entry));
  }
  if (!entries_.empty()) select(0);
}

void SectionWorkspace::load_sheets(std::vector<std::pair<std::string, SurveySheet>> sheets) {
  if (pending_.valid()) pending_.wait();  // a fit of the old sections may still be running
  pending_ = {};
  refit_wanted_ = false;
  locked_.clear();
  heading_ = "Sections";
  entries_.clear();
  analysis_.reset();
  for (auto& [label, sheet] : sheets) {
    Entry entry;
    entry.label = label;
    entry.path = sheet.source;
    entry.sheet = std::move(sheet);
    check_typed(entry);
    entries_.push_back(std::move(entry));
  }
  selected_ = 0;
  if (!entries_.empty()) select(0);
}

void SectionWorkspace::check_typed(Entry& entry) {
  if (!entry.sheet) return;
  // A very long scan is not re-read at opening (a frame must not wait); a typed
  // cell is still checked by the reader when it is made.
  if (entry.sheet->raw_rows.size() > 2000) {  // a few ms of parsing at most on opening
    entry.typed = entry.sheet->raw_rows.size() == entry.sheet->readings.size() && !entry.sheet->columns.empty();
    if (!entry.typed) entry.typed_note = "this section's rows were not kept as typed, so they are shown only";
    return;
  }
  entry.typed = app::rows_reduce_again(*entry.sheet, entry.typed_note);
}

void SectionWorkspace::select(size_t index) {
  if (index >= entries_.size()) return;
  selected_ = index;
  grid_.reset();
  message_.clear();
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

bool SectionWorkspace::store_edit(const app::RowEdit& edit, bool forward) {
  const std::optional<app::RowState>& to = forward ? edit.after : edit.before;
  const std::optional<app::RowState>& from = forward ? edit.before : edit.after;
  const bool exclusion_only = to && from && to->cells == from->cells && to->line == from->line;
  try {
    if (exclusion_only && store_) {
      store_(selected_, edit.index, to->excluded ? to->reason : std::string());
    } else if (rows_store_) {
      rows_store_(selected_, *entries_[selected_].sheet, forward ? edit.label : "undo " + edit.label);
    } else {
      save_state_ = "kept for this session only";
      return true;
    }
    save_state_ = "saved to the project";
    return true;
  } catch (const std::exception& ex) {
    save_state_ = std::string("not saved: ") + ex.what();
    return false;
  }
}

void SectionWorkspace::apply_edit(app::RowEdit edit) {
  Entry& e = entries_[selected_];
  const app::RowEdit made = edit;
  try {
    e.history.apply(*e.sheet, std::move(edit));
  } catch (const std::exception& ex) {
    // The reader refused the typed value: nothing changed; say where and why.
    message_ = std::string("Not taken: ") + ex.what();
    grid_.refused();
    return;
  }
  message_.clear();
  if (!made.before) e.draft.assign(e.sheet->columns.size(), std::string());  // the new reading is in
  // Keep the view and the file in step: a refused store undoes the edit here too.
  if (!store_edit(made, true)) e.history.undo(*e.sheet);
  start_fit();
}

void SectionWorkspace::undo() {
  Entry& e = entries_[selected_];
  if (!e.sheet || !e.history.can_undo()) return;
  try {
    const app::RowEdit* edit = e.history.undo(*e.sheet);
    if (!store_edit(*edit, false)) e.history.redo(*e.sheet);
  } catch (const std::exception& ex) {
    message_ = std::string("Cannot undo: ") + ex.what();
  }
  start_fit();
}

void SectionWorkspace::redo() {
  Entry& e = entries_[selected_];
  if (!e.sheet || !e.history.can_redo()) return;
  try {
    const app::RowEdit* edit = e.history.redo(*e.sheet);
    if (!store_edit(*edit, true)) e.history.undo(*e.sheet);
  } catch (const std::exception& ex) {
    message_ = std::string("Cannot redo: ") + ex.what();
  }
  start_fit();
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
  if (locked_.empty()) {
    ImGui::SameLine();
    grid_.draw_entry_switch();
  }
  if (!save_state_.empty()) {
    // The autosave indicator: where the last change went, said plainly.
    ImGui::SameLine();
    ImGui::AlignTextToFramePadding();
    ImGui::TextDisabled("%s", save_state_.c_str());
  }
}

void SectionWorkspace::draw_readings_table() {
  Entry& e = entries_[selected_];
  // A dialog asked for by a screenshot opens on the middle reading.
  const size_t rows = e.sheet->readings.size();
  if (screenshot_dialog_ == "keypad" && rows > 0) grid_.open_keypad_on(*e.sheet, rows / 2);
  if (screenshot_dialog_ == "exclude" && rows > 0) grid_.open_exclude_on(rows / 2);
  if (screenshot_dialog_ == "keyboard") {
    grid_.set_keypad_entry(false);
    ImGui::SetScrollHereY(0.0f);  // the grid at the top of the view: the screenshot is of it
  }
  screenshot_dialog_.clear();

  if (!message_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().residual_below));
    ImGui::TextWrapped("%s", message_.c_str());
    ImGui::PopStyleColor();
  }
  if (!locked_.empty())
    ImGui::TextDisabled("%s", locked_.c_str());
  else if (!e.typed && !e.typed_note.empty())
    ImGui::TextDisabled("%s", e.typed_note.c_str());
  const ShapeFit* fit = analysis_ && analysis_->ok() && !busy() ? &*analysis_->fit : nullptr;
  if (std::optional<app::RowEdit> edit = grid_.draw(*e.sheet, e.typed, !locked_.empty(), fit, e.draft))
    apply_edit(std::move(*edit));
}

void SectionWorkspace::draw_sheet_list() {
  ImGui::TextWrapped("%s", heading_.c_str());
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
  ImGui::Text("%s  %s", e.label.c_str(), heading_ == "Sections" ? "" : heading_.c_str());
  if (!e.error.empty()) {
    ImGui::TextWrapped("This sheet cannot be read: %s", e.error.c_str());
    return;
  }
  draw_edit_bar();
  // Without a fit the readings are still shown, so a bad value can be put right.
  if (!analysis_) {
    ImGui::TextUnformatted("Fitting...");
    draw_readings_table();
    return;
  }
  if (!analysis_->ok()) {
    int used = 0;
    for (const Reading& r : e.sheet->readings) used += (!r.excluded && !r.check) ? 1 : 0;
    if (used < 4) {
      // A section being keyed in: say what is needed rather than every family's refusal.
      ImGui::TextWrapped("No fit yet: %d reading%s to fit; at least 4 are needed (about 9 per section is usual: "
                         "springings, quarter and eighth points, crown).",
                         used, used == 1 ? "" : "s");
      probe("no-fit:more-readings");
    } else {
      ImGui::TextWrapped("No fit: %s", analysis_->error.c_str());
    }
    draw_readings_table();
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
  // The grid needs the width more: the list takes at most a fifth of it.
  const float list_width = std::min(ImGui::GetFontSize() * 8, ImGui::GetContentRegionAvail().x * 0.2f);
  const float paging_row = ImGui::GetFrameHeightWithSpacing();
  ImGui::BeginChild("sheets", ImVec2(list_width, 0), true);
  draw_sheet_list();
  drag_to_scroll();
  ImGui::EndChild();
  ImGui::SameLine();
  ImGui::BeginGroup();
  // The results scroll by finger and by page: the grid of a long section is below the plot.
  ImGui::BeginChild("results", ImVec2(0, -paging_row), true);
  draw_results();
  drag_to_scroll();
  ImGui::EndChild();
  paging_buttons("results");
  ImGui::EndGroup();
}

}  // namespace soffit::gui
