#include "app/gui/export_dialog.hpp"

#include <imgui.h>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <iterator>
#include <utility>

#include "app/gui/fitted_modal.hpp"
#include "app/gui/flow_layout.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"
#include "app/model/project_session.hpp"

namespace soffit::gui {
namespace {

// same_line_if_fits for a checkbox: its box, then its label.
void same_line_if_checkbox_fits(const char* label) {
  const ImGuiStyle& style = ImGui::GetStyle();
  const float width = ImGui::GetFrameHeight() + style.ItemInnerSpacing.x + ImGui::CalcTextSize(label).x;
  if (ImGui::GetItemRectMax().x + style.ItemSpacing.x + width <= ImGui::GetWindowPos().x + ImGui::GetWindowContentRegionMax().x)
    ImGui::SameLine();
}

}  // namespace

void ExportDialog::request(storage::Project& project, std::string structure_ref, std::string date) {
  if (running()) return;
  project_ = &project;
  ref_ = std::move(structure_ref);
  date_ = std::move(date);
  const std::string folder = app::app_data_dir() + "/exports/" + ref_ + "_" + date_;
  std::snprintf(folder_, sizeof folder_, "%s", folder.c_str());
  outcome_.reset();
  error_.clear();
  open_requested_ = true;
}

void ExportDialog::start() {
  error_.clear();
  outcome_.reset();
  try {
    // Read on this (the UI) thread: the worker gets a copy and never touches the database.
    auto input = std::make_shared<app::ExportInput>(
        app::load_export_input(project_->db(), ref_, date_, formats_.pdf));
    progress_ = std::make_shared<Progress>();
    GeometryJsonOptions options;
    options.program = "soffit (app)";
    job_ = std::async(std::launch::async, [input, folder = std::string(folder_), formats = formats_, options,
                                           progress = progress_] {
      return app::write_inspection_export(*input, folder, formats, options, [progress](int done, int total) {
        progress->total = total;
        progress->done = done;
      });
    });
  } catch (const std::exception& e) {
    error_ = e.what();
  }
}

void ExportDialog::draw() {
  if (open_requested_) {
    ImGui::OpenPopup("Export visit");
    open_requested_ = false;
  }
  if (job_.valid() && job_.wait_for(std::chrono::seconds(0)) == std::future_status::ready) {
    try {
      outcome_ = job_.get();
    } catch (const std::exception& e) {
      error_ = e.what();
    }
  }
  // One export dialog is open at a time: its layout state lives here (the class's header is not this file's).
  static FittedModal modal;
  if (!modal.begin("Export visit", 34)) return;
  const Palette& c = palette();
  ImGui::TextWrapped("%s, visit %s", ref_.c_str(), date_.c_str());
  ImGui::TextUnformatted("Folder:");
  ImGui::SetNextItemWidth(std::min(ImGui::GetFontSize() * 30, ImGui::GetContentRegionAvail().x));
  ImGui::InputText("##folder", folder_, sizeof folder_);
  // The formats wrap like words at a large text size.
  const std::pair<const char*, bool*> formats[] = {{"geometry (JSON)", &formats_.json},
                                                   {"points (CSV)", &formats_.csv},
                                                   {"elevations (SVG)", &formats_.svg},
                                                   {"mesh script (Gmsh .geo)", &formats_.geo},
                                                   {"report (PDF)", &formats_.pdf}};
  for (size_t i = 0; i < std::size(formats); ++i) {
    if (i > 0) same_line_if_checkbox_fits(formats[i].first);
    ImGui::Checkbox(formats[i].first, formats[i].second);
  }
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(c.caution));
  ImGui::TextWrapped("Every file states that it holds survey data, not an assessment.");
  ImGui::PopStyleColor();
  if (outcome_) {
    for (const std::string& w : outcome_->warnings) {
      ImGui::Bullet();
      ImGui::TextWrapped("%s", w.c_str());
    }
  }
  modal.footer();

  if (running()) {
    const int total = std::max(1, progress_->total.load());
    const float fraction = static_cast<float>(progress_->done.load()) / static_cast<float>(total);
    char label[64];
    std::snprintf(label, sizeof label, "%d of %d steps", progress_->done.load(), total);
    ImGui::ProgressBar(fraction, ImVec2(std::min(ImGui::GetFontSize() * 30, ImGui::GetContentRegionAvail().x), 0),
                       label);
  } else {
    const bool go = ImGui::Button("Export");
    probe("export:go");
    if (go) start();
    same_line_if_fits("Close");
    if (ImGui::Button("Close")) ImGui::CloseCurrentPopup();
  }
  if (!error_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(c.residual_below));
    ImGui::TextWrapped("Not exported: %s", error_.c_str());
    ImGui::PopStyleColor();
  }
  // Where the files went stays in view with the buttons; any warnings are above, in the body.
  if (outcome_) ImGui::TextWrapped("%zu files written to %s", outcome_->written.size(), folder_);
  modal.end_footer();
  ImGui::EndPopup();
}

}  // namespace soffit::gui
