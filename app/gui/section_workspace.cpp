#include "app/gui/section_workspace.hpp"

#include <imgui.h>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <filesystem>

#include "app/gui/profile_plot.hpp"
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

void SectionWorkspace::select(size_t index) {
  if (index >= entries_.size()) return;
  selected_ = index;
  analysis_.reset();
  start_fit();
}

void SectionWorkspace::start_fit() {
  const Entry& e = entries_[selected_];
  if (!e.sheet || pending_.valid()) return;
  // The job takes a copy in and hands a result out: the UI never shares state with it.
  ProfileRequest request;
  request.shape = shape_;
  request.uncertainty.monte_carlo_draws = 500;
  pending_ = std::async(std::launch::async, [readings = e.sheet->readings, request] {
    return analyse_profile(readings, request);
  });
}

void SectionWorkspace::poll() {
  if (pending_.valid() && pending_.wait_for(std::chrono::seconds(0)) == std::future_status::ready)
    analysis_ = pending_.get();
}

void SectionWorkspace::draw_sheet_list() {
  ImGui::TextUnformatted("Sections");
  for (size_t i = 0; i < entries_.size(); ++i) {
    const bool chosen = i == selected_;
    if (ImGui::Selectable(entries_[i].label.c_str(), chosen, 0,
                          ImVec2(0, ImGui::GetFrameHeight())) && !chosen && !busy())
      select(i);
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
  if (busy() || !analysis_) {
    ImGui::TextUnformatted("Fitting...");
    return;
  }
  if (!analysis_->ok()) {
    ImGui::TextWrapped("No fit: %s", analysis_->error.c_str());
    return;
  }
  const ShapeFit& fit = *analysis_->fit;
  const auto& g = analysis_->uncertainty.geometry;
  ImGui::Text("Shape: %s   span %.4f m (95%%: %.4f to %.4f)   rise %.1f mm (95%%: %.1f to %.1f)",
              std::string(fit.family->name()).c_str(), g[0].value, g[0].lo, g[0].hi, g[1].value * 1000,
              g[1].lo * 1000, g[1].hi * 1000);
  ImGui::Text("RMS residual %.1f mm, largest %.1f mm, %d readings used", fit.rms_m * 1000,
              fit.max_abs_m * 1000, fit.n_used);
  draw_profile_plot(e.sheet->readings, *analysis_, ImGui::GetContentRegionAvail().y * 0.55f);

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
