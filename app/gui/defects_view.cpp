#include "app/gui/defects_view.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <exception>

#include "app/gui/defect_marks.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"

namespace soffit::gui {

namespace {

// The vocabulary of storage/defect_vocabulary.md, in its order.
constexpr const char* kDefectTypes[] = {
    "longitudinal_crack", "transverse_crack", "diagonal_crack", "ring_separation", "spalling",
    "mortar_loss", "missing_unit", "dropped_voussoir", "deformation", "spandrel_bulge",
    "spandrel_lean", "spandrel_sliding", "spandrel_separation", "parapet_damage", "impact_damage",
    "seepage", "efflorescence", "vegetation", "scour", "previous_repair", "other"};

std::string words(std::string key) {
  std::replace(key.begin(), key.end(), '_', ' ');
  return key;
}

std::string metres(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.2f m", v);
  return buf;
}

float distance_to_segment(ImVec2 p, ImVec2 a, ImVec2 b) {
  const float dx = b.x - a.x, dy = b.y - a.y;
  const float len2 = dx * dx + dy * dy;
  float t = len2 > 0 ? ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2 : 0.0f;
  t = std::clamp(t, 0.0f, 1.0f);
  return std::hypot(p.x - (a.x + t * dx), p.y - (a.y + t * dy));
}

bool inside(ImVec2 p, const std::vector<ImVec2>& ring) {
  bool in = false;
  for (size_t i = 0, j = ring.size() - 1; i < ring.size(); j = i++)
    if ((ring[i].y > p.y) != (ring[j].y > p.y) &&
        p.x < (ring[j].x - ring[i].x) * (p.y - ring[i].y) / (ring[j].y - ring[i].y) + ring[i].x)
      in = !in;
  return in;
}

}  // namespace

void DefectsView::open(storage::Project& project, const std::string& structure_ref,
                       const std::optional<std::string>& date) {
  message_.clear();
  selected_id_.clear();
  span_ = 0;
  try {
    data_.load(project, structure_ref, date);
  } catch (const std::exception& e) {
    data_ = app::InspectionData();
    message_ = e.what();
  }
}

void DefectsView::close() {
  data_ = app::InspectionData();
  selected_id_.clear();
  pending_.reset();
}

std::optional<ImVec2> DefectsView::screen_point(double s, double y) const {
  if (scale_ <= 0) return std::nullopt;
  return ImVec2(origin_.x + static_cast<float>(s) * scale_, origin_.y + static_cast<float>(y) * scale_);
}

void DefectsView::run(const char* what, const std::function<void()>& change) {
  try {
    change();
    message_.clear();
  } catch (const std::exception& e) {
    message_ = std::string(what) + ": " + e.what();
  }
}

void DefectsView::draw() {
  if (!data_.loaded()) {
    ImGui::TextWrapped("%s", message_.empty() ? "Open a visit from the structure screen to see its defects."
                                              : message_.c_str());
    return;
  }
  const auto barrels = data_.barrels();
  if (span_ >= barrels.size()) span_ = 0;
  draw_toolbar();
  if (barrels.empty()) {
    ImGui::TextWrapped("This structure has no spans recorded, so there is no barrel to draw.");
    return;
  }
  const float f = ImGui::GetFontSize();
  const float height = std::max(f * 8.0f, ImGui::GetContentRegionAvail().y - f * 7.5f);
  draw_barrel(barrels[span_], height);
  draw_selection();
  draw_new_defect_popup(barrels[span_]);
  draw_delete_popup();
}

void DefectsView::draw_toolbar() {
  const auto& d = data_.data();
  ImGui::Text("Defects on the barrel: %s, visit %s", d.structure.fields.name.c_str(), d.inspection.date.c_str());
  const auto barrels = data_.barrels();
  for (size_t i = 0; i < barrels.size(); ++i) {
    if (i > 0) ImGui::SameLine();
    const bool chosen = i == span_;
    if (chosen) ImGui::PushStyleColor(ImGuiCol_Button, ImGui::GetStyleColorVec4(ImGuiCol_ButtonActive));
    if (ImGui::Button(("Span " + barrels[i].span_label).c_str())) {
      span_ = i;
      selected_id_.clear();
    }
    probe("span:" + barrels[i].span_label);
    if (chosen) ImGui::PopStyleColor();
  }
  ImGui::SameLine();
  const std::string undo_label = data_.undo_label(), redo_label = data_.redo_label();
  ImGui::BeginDisabled(undo_label.empty());
  if (ImGui::Button("Undo")) run("Undo", [&] { data_.undo(); });
  probe("undo");
  ImGui::EndDisabled();
  ImGui::SameLine();
  ImGui::BeginDisabled(redo_label.empty());
  if (ImGui::Button("Redo")) run("Redo", [&] { data_.redo(); });
  probe("redo");
  ImGui::EndDisabled();
  ImGui::SameLine();
  if (ImGui::Button("Legend")) open_legend_ = true;
  probe("legend");
  if (open_legend_) {
    ImGui::OpenPopup("Defect marks");
    open_legend_ = false;
  }
  if (ImGui::BeginPopupModal("Defect marks", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) {
    draw_defect_legend();
    if (ImGui::Button("Close")) ImGui::CloseCurrentPopup();
    probe("close legend");
    ImGui::EndPopup();
  }
  if (!undo_label.empty()) {
    ImGui::SameLine();
    ImGui::TextDisabled("next undo: %s", undo_label.c_str());
  }
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().caution));
  ImGui::TextWrapped("Survey data, not an assessment: local codes and a qualified engineer decide what a defect means.");
  ImGui::PopStyleColor();
  if (!message_.empty()) ImGui::TextWrapped("%s", message_.c_str());
}

int DefectsView::hit_test(const app::BarrelFrame& barrel, ImVec2 pointer) const {
  const float reach = ImGui::GetFontSize() * 0.9f;
  const auto marks = data_.soffit_defects(barrel.span_id);
  int best = -1;
  float best_distance = reach;
  for (size_t i = 0; i < marks.size(); ++i) {
    std::vector<ImVec2> pts;
    for (const auto& [s, y] : marks[i]->defect.fields.points) pts.push_back(*screen_point(s, y));
    if (pts.empty()) continue;
    float d = std::hypot(pointer.x - pts[0].x, pointer.y - pts[0].y);
    const bool area = marks[i]->defect.fields.geometry == storage::DefectGeometry::area;
    for (size_t k = 1; k < pts.size(); ++k) d = std::min(d, distance_to_segment(pointer, pts[k - 1], pts[k]));
    if (area && pts.size() > 2) {
      d = std::min(d, distance_to_segment(pointer, pts.back(), pts.front()));
      // Inside an area selects it too, but a mark on its edge or within it wins.
      if (inside(pointer, pts)) d = std::min(d, reach * 0.95f);
    }
    if (d < best_distance) {
      best_distance = d;
      best = static_cast<int>(i);
    }
  }
  return best;
}

void DefectsView::draw_barrel(const app::BarrelFrame& barrel, float height) {
  const Palette& c = palette();
  const float f = ImGui::GetFontSize();
  const ImVec2 top_left = ImGui::GetCursorScreenPos();
  const float width = ImGui::GetContentRegionAvail().x;
  // Margins hold the springing and face labels and the scale.
  const float left = f * 1.0f, right = f * 1.0f, top = f * 1.6f, bottom = f * 2.8f;
  const float plot_w = std::max(f, width - left - right), plot_h = std::max(f, height - top - bottom);
  scale_ = std::min(plot_w / static_cast<float>(barrel.arc_length_m), plot_h / static_cast<float>(barrel.width_m));
  const float bw = static_cast<float>(barrel.arc_length_m) * scale_, bh = static_cast<float>(barrel.width_m) * scale_;
  origin_ = ImVec2(top_left.x + left + (plot_w - bw) / 2, top_left.y + top + (plot_h - bh) / 2);
  const ImVec2 far(origin_.x + bw, origin_.y + bh);

  // One widget for the whole barrel: a tap anywhere on it selects or places.
  // InvisibleButton reports the tap on release over the barrel, as a finger lifts.
  const bool tapped = ImGui::InvisibleButton("##barrel", ImVec2(width, height));
  probe("barrel");
  ImDrawList* draw = ImGui::GetWindowDrawList();
  draw->AddRectFilled(origin_, far, c.paper);
  // A metre grid, so distances can be read off without a tool.
  for (int m = 1; m < barrel.arc_length_m; ++m)
    draw->AddLine(ImVec2(origin_.x + m * scale_, origin_.y), ImVec2(origin_.x + m * scale_, far.y), c.grid);
  for (int m = 1; m < barrel.width_m; ++m)
    draw->AddLine(ImVec2(origin_.x, origin_.y + m * scale_), ImVec2(far.x, origin_.y + m * scale_), c.grid);
  const float crown_x = origin_.x + bw / 2;
  for (float y = origin_.y; y < far.y; y += f * 0.8f)
    draw->AddLine(ImVec2(crown_x, y), ImVec2(crown_x, std::min(far.y, y + f * 0.4f)), c.faint_ink, 1.5f);
  draw->AddRect(origin_, far, c.ink, 0, 0, 2.0f);
  // Springings are the left and right edges; faces the top and bottom edges.
  const std::string first_face = barrel.y_from_upstream ? "upstream face" : "downstream face";
  const std::string second_face = barrel.y_from_upstream ? "downstream face" : "upstream face";
  // Springing labels beside the left and right edges, so they never meet the face labels.
  const float mid_y = (origin_.y + far.y) / 2 - f / 2;
  const std::string start_label = barrel.start_springing + " (s = 0)";
  draw->AddText(ImVec2(origin_.x - ImGui::CalcTextSize(start_label.c_str()).x - f * 0.5f, mid_y), c.ink,
                start_label.c_str());
  const std::string end_label = barrel.end_springing + " (s = " + metres(barrel.arc_length_m) + ")";
  draw->AddText(ImVec2(far.x + f * 0.5f, mid_y), c.ink, end_label.c_str());
  const std::string top_label = first_face + " (y = 0)";
  draw->AddText(ImVec2(crown_x - ImGui::CalcTextSize(top_label.c_str()).x / 2, top_left.y + f * 0.3f), c.ink,
                top_label.c_str());
  const std::string bottom_label = second_face + " (y = " + metres(barrel.width_m) + ")";
  draw->AddText(ImVec2(crown_x - ImGui::CalcTextSize(bottom_label.c_str()).x / 2, far.y + f * 0.2f), c.ink,
                bottom_label.c_str());
  draw->AddText(ImVec2(crown_x + f * 0.3f, origin_.y + f * 0.2f), c.faint_ink, "crown");
  // Scale bar: one metre.
  const float sy = far.y + f * 1.6f;
  draw->AddLine(ImVec2(origin_.x, sy), ImVec2(origin_.x + scale_, sy), c.ink, 3.0f);
  const std::string note = "1 m; s along the intrados" + std::string(barrel.arc_known ? "" : " (arc length not surveyed)") +
                           ", y across the barrel" + (barrel.width_known ? "" : " (width not recorded)");
  draw->AddText(ImVec2(origin_.x + scale_ + f * 0.5f, sy - f * 0.5f), c.ink, note.c_str());

  // Marks.
  const auto marks = data_.soffit_defects(barrel.span_id);
  draw->PushClipRect(top_left, ImVec2(top_left.x + width, top_left.y + height), true);
  for (const app::DefectOnRecord* m : marks) {
    const storage::DefectFields& fields = m->defect.fields;
    if (fields.points.empty()) continue;
    const unsigned int colour = defect_family(fields.defect_type).colour;
    const int severity = fields.severity.value_or(1);
    std::vector<ImVec2> pts;
    for (const auto& [s, y] : fields.points) pts.push_back(*screen_point(s, y));
    const bool selected = m->id == selected_id_;
    if (fields.geometry == storage::DefectGeometry::point || pts.size() == 1) {
      const float r = severity_radius(severity, f);
      if (selected) draw->AddCircle(pts[0], r + f * 0.3f, c.ink, 0, f * 0.15f);
      draw->AddCircleFilled(pts[0], r, colour);
    } else {
      const bool closed = fields.geometry == storage::DefectGeometry::area;
      const float t = closed ? f * 0.14f : severity_thickness(severity, f);
      if (selected) draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), c.ink, closed, t + f * 0.3f);
      draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), colour, closed, t);
    }
    const std::string label = fields.ref + (fields.severity ? " \xC2\xB7" + std::to_string(*fields.severity) : "");
    draw->AddText(ImVec2(pts[0].x + f * 0.5f, pts[0].y - f * 1.2f), c.ink, label.c_str());
  }
  if (pending_) {
    const ImVec2 p = *screen_point(pending_->first, pending_->second);
    draw->AddCircle(p, f * 0.6f, c.ink, 0, 2.0f);
    draw->AddLine(ImVec2(p.x - f, p.y), ImVec2(p.x + f, p.y), c.ink, 2.0f);
    draw->AddLine(ImVec2(p.x, p.y - f), ImVec2(p.x, p.y + f), c.ink, 2.0f);
  }
  draw->PopClipRect();

  if (tapped) {
    const ImVec2 pointer = ImGui::GetIO().MousePos;
    const int hit = hit_test(barrel, pointer);
    if (hit >= 0) {
      selected_id_ = marks[static_cast<size_t>(hit)]->id;
    } else if (pointer.x >= origin_.x && pointer.x <= far.x && pointer.y >= origin_.y && pointer.y <= far.y) {
      selected_id_.clear();
      pending_ = std::make_pair(static_cast<double>((pointer.x - origin_.x) / scale_),
                                static_cast<double>((pointer.y - origin_.y) / scale_));
      pending_type_.clear();
      pending_severity_ = 0;
      open_new_ = true;
    } else {
      selected_id_.clear();
    }
  }
}

void DefectsView::draw_selection() {
  const app::DefectOnRecord* chosen = nullptr;
  for (const auto& d : data_.defects())
    if (d.id == selected_id_) chosen = &d;
  if (!chosen) {
    selected_id_.clear();
    int elsewhere = 0;
    for (const auto& d : data_.defects())
      if (d.defect.fields.frame != storage::DefectFrame::soffit) ++elsewhere;
    ImGui::TextWrapped("Tap empty barrel to place a defect; tap a mark to select it. %d defects of this visit are on "
                       "elevations (walls, piers, parapets) and are not drawn here.",
                       elsewhere);
    return;
  }
  const storage::DefectFields& f = chosen->defect.fields;
  std::string text = f.ref + ": " + words(f.defect_type) + ", " + f.element;
  if (f.severity) text += ", severity " + std::to_string(*f.severity) + " (" + f.severity_scale + ")";
  if (f.length_m) text += ", length " + metres(*f.length_m);
  if (f.width_mm) text += ", width " + std::to_string(*f.width_mm).substr(0, 4) + " mm";
  if (chosen->defect.photo_count > 0) text += ", " + std::to_string(chosen->defect.photo_count) + " photo(s)";
  ImGui::TextWrapped("%s", text.c_str());
  if (!f.notes.empty()) ImGui::TextWrapped("%s", f.notes.c_str());
  if (ImGui::Button(("Delete " + f.ref + "...").c_str())) open_delete_ = true;
  probe("delete");
  ImGui::SameLine();
  if (ImGui::Button("Clear selection")) selected_id_.clear();
  probe("deselect");
}

void DefectsView::draw_new_defect_popup(const app::BarrelFrame& barrel) {
  if (open_new_) {
    ImGui::OpenPopup("New defect");
    open_new_ = false;
  }
  if (!ImGui::BeginPopupModal("New defect", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) return;
  const float f = ImGui::GetFontSize();
  if (!pending_) {
    ImGui::CloseCurrentPopup();
    ImGui::EndPopup();
    return;
  }
  ImGui::Text("Point defect on span %s at s %.2f m, y %.2f m", barrel.span_label.c_str(), pending_->first,
              pending_->second);
  ImGui::TextUnformatted("Type:");
  const ImVec4 chosen_colour = ImGui::GetStyleColorVec4(ImGuiCol_ButtonActive);
  int column = 0;
  for (const char* type : kDefectTypes) {
    if (column++ % 3 != 0) ImGui::SameLine();
    const bool chosen = pending_type_ == type;
    if (chosen) ImGui::PushStyleColor(ImGuiCol_Button, chosen_colour);
    if (ImGui::Button(words(type).c_str(), ImVec2(f * 11.0f, f * 2.2f))) pending_type_ = type;
    probe(std::string("type:") + type);
    if (chosen) ImGui::PopStyleColor();
  }
  ImGui::TextUnformatted("Severity (soffit-1-5):");
  for (int s = 1; s <= 5; ++s) {
    if (s > 1) ImGui::SameLine();
    const bool chosen = pending_severity_ == s;
    if (chosen) ImGui::PushStyleColor(ImGuiCol_Button, chosen_colour);
    if (ImGui::Button(std::to_string(s).c_str(), ImVec2(f * 3.0f, f * 2.2f))) pending_severity_ = s;
    probe("severity:" + std::to_string(s));
    if (chosen) ImGui::PopStyleColor();
  }
  ImGui::TextDisabled("1 noted, 2 slight, 3 moderate, 4 severe, 5 urgent");
  ImGui::BeginDisabled(pending_type_.empty() || pending_severity_ == 0);
  if (ImGui::Button("Place defect", ImVec2(f * 9.0f, f * 2.2f))) {
    const auto at = *pending_;
    run("Placing the defect",
        [&] { data_.add_point_defect(barrel, pending_type_, pending_severity_, at.first, at.second); });
    pending_.reset();
    ImGui::CloseCurrentPopup();
  }
  probe("confirm defect");
  ImGui::EndDisabled();
  ImGui::SameLine();
  if (ImGui::Button("Cancel", ImVec2(f * 6.0f, f * 2.2f))) {
    pending_.reset();
    ImGui::CloseCurrentPopup();
  }
  probe("cancel defect");
  ImGui::EndPopup();
}

void DefectsView::draw_delete_popup() {
  if (open_delete_) {
    ImGui::OpenPopup("Delete defect?");
    open_delete_ = false;
  }
  if (!ImGui::BeginPopupModal("Delete defect?", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) return;
  std::string ref, id = selected_id_;
  for (const auto& d : data_.defects())
    if (d.id == id) ref = d.defect.fields.ref;
  ImGui::Text("Delete %s and its photo links from this visit? Undo brings it back.", ref.c_str());
  const float f = ImGui::GetFontSize();
  if (ImGui::Button("Delete", ImVec2(f * 6.0f, f * 2.2f))) {
    if (!id.empty()) run("Deleting the defect", [&] { data_.delete_defect(id, ref); });
    selected_id_.clear();
    ImGui::CloseCurrentPopup();
  }
  probe("confirm delete");
  ImGui::SameLine();
  if (ImGui::Button("Keep", ImVec2(f * 6.0f, f * 2.2f))) ImGui::CloseCurrentPopup();
  probe("keep defect");
  ImGui::EndPopup();
}

}  // namespace soffit::gui
