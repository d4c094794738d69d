#include "app/gui/defects_view.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstring>
#include <exception>

#include "app/gui/defect_marks.hpp"
#include "app/gui/fitted_modal.hpp"
#include "app/gui/flow_layout.hpp"
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

constexpr const char* kBarrel = "Barrel";

std::string words(std::string key) {
  std::replace(key.begin(), key.end(), '_', ' ');
  return key;
}

std::string capitalised(std::string text) {
  if (!text.empty() && text[0] >= 'a' && text[0] <= 'z') text[0] = static_cast<char>(text[0] - 'a' + 'A');
  return text;
}

std::string metres(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.2f m", v);
  return buf;
}

std::string millimetres(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.2g mm", v);
  if (v >= 10) std::snprintf(buf, sizeof buf, "%.0f mm", v);
  return buf;
}

// Widths are measured across cracks and open joints (FIELD.md §6.1: crack
// width, ring separation gap).
bool has_width(const std::string& type, storage::DefectGeometry geometry) {
  return geometry == storage::DefectGeometry::line || type.find("crack") != std::string::npos ||
         type == "ring_separation" || type == "spandrel_separation";
}

// A drag whose pointer stays this close to where it went down is a tap
// (a finger wobbles a few pixels as it lands and lifts).
float tap_slop() { return ImGui::GetFontSize() * 0.6f; }
// Pointer movement between kept samples of a drag.
float sample_step() { return ImGui::GetFontSize() * 0.3f; }

// Room for a line of text starting at screen x `from`, up to the window's right edge.
float wrap_width(float from) {
  return std::max(ImGui::GetFontSize() * 10.0f, ImGui::GetWindowPos().x + ImGui::GetWindowContentRegionMax().x - from);
}

// Continues the row when a control `width` wide still fits, else starts a new
// one: rows of fixed-size buttons wrap at a large text size.
void same_line_if_room(float width) {
  const float right = ImGui::GetItemRectMax().x + ImGui::GetStyle().ItemSpacing.x + width;
  if (right <= ImGui::GetWindowPos().x + ImGui::GetWindowContentRegionMax().x) ImGui::SameLine();
}

bool button_choice(const char* label, bool chosen, ImVec2 size = ImVec2(0, 0)) {
  return choice_button(label, chosen, size);
}

}  // namespace

void DefectsView::open(storage::Project& project, const std::string& structure_ref,
                       const std::optional<std::string>& date) {
  message_.clear();
  selected_id_.clear();
  saved_.clear();
  span_ = 0;
  surface_ = kBarrel;
  try {
    data_.load(project, structure_ref, date);
  } catch (const std::exception& e) {
    data_ = app::InspectionData();
    message_ = e.what();
  }
}

void DefectsView::reload() {
  if (!data_.loaded()) return;
  try {
    data_.reload();
  } catch (const std::exception& e) {
    message_ = std::string("Reading the visit again: ") + e.what();
  }
}

void DefectsView::close() {
  data_ = app::InspectionData();
  photos_wanted_.reset();
  selected_id_.clear();
  pending_.reset();
  corners_.clear();
  stroke_.clear();
  dragging_ = false;
}

void DefectsView::show_for_screenshot(const std::string& span_label, const std::string& surface,
                                      const std::string& ref) {
  const auto barrels = data_.barrels();
  for (size_t i = 0; i < barrels.size(); ++i)
    if (barrels[i].span_label == span_label) span_ = i;
  surface_ = surface;
  for (const auto& d : data_.defects())
    if (d.defect.fields.ref == ref) selected_id_ = d.id;
}

ImVec2 DefectsView::to_screen(double a, double b) const {
  const double da = plane_.a_leftward ? plane_.a_max - a : a - plane_.a_min;
  const double db = plane_.b_up ? plane_.b_max - b : b - plane_.b_min;
  return ImVec2(origin_.x + static_cast<float>(da) * scale_, origin_.y + static_cast<float>(db) * scale_);
}

app::PlanePoint DefectsView::to_plane(ImVec2 p) const {
  const double da = (p.x - origin_.x) / scale_, db = (p.y - origin_.y) / scale_;
  const double a = plane_.a_leftward ? plane_.a_max - da : plane_.a_min + da;
  const double b = plane_.b_up ? plane_.b_max - db : plane_.b_min + db;
  return {std::clamp(a, plane_.a_min, plane_.a_max), std::clamp(b, plane_.b_min, plane_.b_max)};
}

bool DefectsView::on_plane(ImVec2 p) const {
  const ImVec2 a = to_screen(plane_.a_min, plane_.b_min), b = to_screen(plane_.a_max, plane_.b_max);
  return p.x >= std::min(a.x, b.x) && p.x <= std::max(a.x, b.x) && p.y >= std::min(a.y, b.y) &&
         p.y <= std::max(a.y, b.y);
}

std::optional<ImVec2> DefectsView::screen_point(double a, double b) const {
  if (scale_ <= 0) return std::nullopt;
  return to_screen(a, b);
}

void DefectsView::run(const char* what, const std::function<void()>& change) {
  try {
    change();
    message_.clear();
    saved_ = "saved in " + data_.data().project_file_name;
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
  const auto elevations = barrels.empty() ? std::vector<app::ElevationFrame>{} : data_.elevations(barrels[span_].span_id);
  const app::ElevationFrame* elevation = nullptr;
  for (const auto& e : elevations)
    if (e.name == surface_) elevation = &e;
  if (!elevation) surface_ = kBarrel;
  draw_toolbar(elevations);
  if (barrels.empty()) {
    ImGui::TextWrapped("This structure has no spans recorded, so there is no barrel to draw.");
    send_photos_request();
    return;
  }
  draw_modes();
  const float f = ImGui::GetFontSize();
  const app::BarrelFrame& barrel = barrels[span_];
  const auto notes = elevation ? app::placement_notes(*elevation, data_.elevation_defects(*elevation))
                               : app::placement_notes(barrel, data_.soffit_defects(barrel.span_id));
  // Room under the drawing for the notes (a line each, more when one wraps) and the selection.
  const float note_rows = notes.empty() ? 0.0f : 0.4f + 1.3f * static_cast<float>(notes.size());
  // At a large text size the rows above leave little room: the drawing keeps a
  // plan big enough to tap marks apart (its labels plus 40% of the display) and
  // the screen scrolls instead.
  const float least = f * 7.0f + std::max(f * 4.0f, ImGui::GetIO().DisplaySize.y * 0.4f);
  const float height = std::max(least, ImGui::GetContentRegionAvail().y - f * (4.0f + note_rows));
  if (elevation) {
    Plane p;
    p.a_min = elevation->x_min;
    p.a_max = elevation->x_max;
    p.b_min = elevation->z_min;
    p.b_max = elevation->z_max;
    p.a_leftward = elevation->seen_from_downstream;
    p.b_up = true;
    p.a_name = "x";
    p.b_name = "z";
    p.bottom_rows = 5.2f;  // one more line: where the drawn size came from
    // x = 0 at its own end, which is on the right for a face seen from downstream.
    const std::string zero = elevation->x_zero_label.empty() ? "x = 0" : elevation->x_zero_label + " (x = 0)";
    const std::string low = std::abs(p.a_min) < 1e-9 ? zero : "x = " + metres(p.a_min);
    const std::string high = std::abs(p.a_max) < 1e-9 ? zero : "x = " + metres(p.a_max);
    p.left_label = p.a_leftward ? high : low;
    p.right_label = p.a_leftward ? low : high;
    const std::string where = (elevation->span_label.empty() ? "" : elevation->span_label + " ") + elevation->name;
    draw_surface(p, data_.elevation_defects(*elevation), elevation->place(), where, height,
                 [&](ImDrawList* d, ImVec2 tl, ImVec2 n, ImVec2 fa) { decorate_elevation(*elevation, d, tl, n, fa); });
  } else {
    Plane p;
    p.a_max = barrel.arc_length_m;
    p.b_max = barrel.width_m;
    p.left_label = barrel.start_springing + " (s = 0)";
    p.right_label = barrel.end_springing + " (s = " + metres(barrel.arc_length_m) + ")";
    draw_surface(p, data_.soffit_defects(barrel.span_id), barrel.place(), barrel.span_label + " barrel", height,
                 [&](ImDrawList* d, ImVec2 tl, ImVec2 n, ImVec2 fa) { decorate_barrel(barrel, d, tl, n, fa); });
  }
  draw_placement_notes(notes);
  draw_selection();
  draw_new_defect_popup();
  draw_edit_popup();
  draw_delete_popup();
  send_photos_request();
}

void DefectsView::send_photos_request() {
  // Last in the frame, so that the owner may close this view or open another screen from the callback.
  if (!photos_wanted_) return;
  const std::optional<std::string> defect = *photos_wanted_;
  photos_wanted_.reset();
  if (photos_request_ && data_.loaded()) photos_request_(data_.data().inspection.id, defect);
}

void DefectsView::draw_placement_notes(const std::vector<app::PlacementNote>& notes) {
  if (notes.empty()) return;
  // Shown beside the drawing, never acted on: the inspector decides whether the mark or the frame is wrong.
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().caution));
  for (size_t i = 0; i < notes.size(); ++i) {
    ImGui::TextWrapped("%s", notes[i].text.c_str());
    if (i == 0) probe("placement notes");
  }
  ImGui::PopStyleColor();
}

void DefectsView::draw_toolbar(const std::vector<app::ElevationFrame>& elevations) {
  const auto& d = data_.data();
  ImGui::Text("%s, visit %s.", d.structure.fields.name.c_str(), d.inspection.date.c_str());
  // The caution beside the title only while it has room to read as a sentence, else under it.
  if (wrap_width(ImGui::GetItemRectMax().x + ImGui::GetStyle().ItemSpacing.x) >= ImGui::GetFontSize() * 16)
    ImGui::SameLine();
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().caution));
  ImGui::TextWrapped("Survey data, not an assessment: a qualified engineer decides what a defect means.");
  ImGui::PopStyleColor();
  const auto barrels = data_.barrels();
  for (size_t i = 0; i < barrels.size(); ++i) {
    if (i > 0) same_line_if_fits(("Span " + barrels[i].span_label).c_str());
    if (button_choice(("Span " + barrels[i].span_label).c_str(), i == span_)) {
      span_ = i;
      selected_id_.clear();
      corners_.clear();
    }
    probe("span:" + barrels[i].span_label);
  }
  // The surface row wraps like words at a large text size ("Pier" must stay reachable);
  // "Surface:" keeps its first button beside it.
  std::vector<std::string> names{kBarrel};
  for (const auto& e : elevations) names.push_back(e.name);
  same_line_if_fits(("  Surface: " + capitalised(names.front())).c_str());
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("  Surface:");
  for (size_t n = 0; n < names.size(); ++n) {
    const std::string& name = names[n];
    if (n == 0) ImGui::SameLine();
    else same_line_if_fits(capitalised(name).c_str());
    if (button_choice(capitalised(name).c_str(), name == surface_)) {
      surface_ = name;
      selected_id_.clear();
      corners_.clear();
      hint_.clear();
    }
    probe("surface:" + name);
  }
  if (photos_request_) {
    // On the same row when it fits, else on a row of its own: never off the edge with large text.
    const char* label = "Photos of this visit...";
    const ImGuiStyle& style = ImGui::GetStyle();
    const float wanted = ImGui::CalcTextSize(label).x + style.FramePadding.x * 2 + ImGui::GetFontSize() * 1.5f;
    const float right = ImGui::GetWindowPos().x + ImGui::GetWindowContentRegionMax().x;
    if (ImGui::GetItemRectMax().x + wanted <= right) ImGui::SameLine(0, ImGui::GetFontSize() * 1.5f);
    if (ImGui::Button(label)) photos_wanted_ = std::optional<std::string>();
    probe("photos:visit");
  }
  if (!message_.empty()) ImGui::TextWrapped("%s", message_.c_str());
}

void DefectsView::draw_modes() {
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Draw:");
  const std::pair<Mode, const char*> modes[] = {
      {Mode::point, "Point"}, {Mode::line, "Crack line"}, {Mode::area, "Area outline"}};
  for (const auto& [mode, label] : modes) {
    same_line_if_fits(label);
    if (button_choice(label, mode_ == mode)) {
      mode_ = mode;
      corners_.clear();
      hint_.clear();
    }
    probe(mode == Mode::point ? "mode:point" : mode == Mode::line ? "mode:line" : "mode:area");
  }
  if (mode_ == Mode::area && !corners_.empty()) {
    same_line_if_fits("Close area");
    ImGui::BeginDisabled(corners_.size() < 3);
    if (ImGui::Button("Close area")) close_area_ = true;
    probe("close area");
    ImGui::EndDisabled();
    same_line_if_fits("Remove last corner");
    if (ImGui::Button("Remove last corner")) corners_.pop_back();
    probe("remove corner");
  }
  // A gap sets Undo apart from the drawing modes when it fits on their line.
  if (ImGui::GetItemRectMax().x + ImGui::GetFontSize() * 1.5f + ImGui::CalcTextSize("Undo").x +
          ImGui::GetStyle().FramePadding.x * 2 <=
      ImGui::GetWindowPos().x + ImGui::GetWindowContentRegionMax().x)
    ImGui::SameLine(0, ImGui::GetFontSize() * 1.5f);
  const std::string undo_label = data_.undo_label(), redo_label = data_.redo_label();
  ImGui::BeginDisabled(undo_label.empty());
  if (ImGui::Button("Undo")) run("Undo", [&] { data_.undo(); });
  probe("undo");
  ImGui::EndDisabled();
  same_line_if_fits("Redo");
  ImGui::BeginDisabled(redo_label.empty());
  if (ImGui::Button("Redo")) run("Redo", [&] { data_.redo(); });
  probe("redo");
  ImGui::EndDisabled();
  same_line_if_fits("Legend");
  if (ImGui::Button("Legend")) open_legend_ = true;
  probe("legend");
  if (open_legend_) {
    ImGui::OpenPopup("Defect marks");
    open_legend_ = false;
  }
  static FittedModal legend;  // within the display at any text size, Close pinned below
  if (legend.begin("Defect marks", 40)) {
    draw_defect_legend();
    legend.footer();
    if (ImGui::Button("Close")) ImGui::CloseCurrentPopup();
    probe("close legend");
    legend.end_footer();
    ImGui::EndPopup();
  }
  if (!undo_label.empty()) {
    const std::string note = saved_ + (saved_.empty() ? "" : "; ") + "next undo: " + undo_label;
    same_line_if_fits(note.c_str());
    ImGui::AlignTextToFramePadding();
    ImGui::PushTextWrapPos(0.0f);  // a long note wraps at the window edge rather than running off it
    ImGui::TextDisabled("%s", note.c_str());
    ImGui::PopTextWrapPos();
  }
  // One line that says what a touch on the surface does now.
  const char* how = mode_ == Mode::point
                        ? "Point: tap an empty spot to place a defect there. Tap a mark to select it."
                    : mode_ == Mode::line
                        ? "Crack line: put a finger where the crack starts, drag along it, lift at its end. "
                          "Tap a mark to select it."
                        : "Area outline: drag round the area, or tap its corners in turn and press Close area.";
  ImGui::TextWrapped("%s", hint_.empty() ? how : hint_.c_str());
}

int DefectsView::hit_test(const Marks& marks, ImVec2 pointer) const {
  const float reach = ImGui::GetFontSize() * 0.9f;
  int best = -1;
  double best_distance = reach;
  for (size_t i = 0; i < marks.size(); ++i) {
    app::PlanePath pts;
    for (const auto& [a, b] : marks[i]->defect.fields.points) {
      const ImVec2 p = to_screen(a, b);
      pts.emplace_back(p.x, p.y);
    }
    if (pts.empty()) continue;
    const bool area = marks[i]->defect.fields.geometry == storage::DefectGeometry::area;
    double d = app::distance_to_path({pointer.x, pointer.y}, pts, area);
    // Inside an area selects it too, but a mark on its edge or within it wins.
    if (area && app::inside_ring({pointer.x, pointer.y}, pts)) d = std::min(d, reach * 0.95);
    if (d < best_distance) {
      best_distance = d;
      best = static_cast<int>(i);
    }
  }
  return best;
}

void DefectsView::draw_surface(const Plane& plane, const Marks& marks, const app::DefectPlace& place,
                               const std::string& where, float height, const Decorate& decorate) {
  const Palette& c = palette();
  const float f = ImGui::GetFontSize();
  const ImVec2 top_left = ImGui::GetCursorScreenPos();
  const float width = ImGui::GetContentRegionAvail().x;
  // Margins hold the end and edge labels, the scale and the frame's origin.
  const float left = f * 0.8f + ImGui::CalcTextSize(plane.left_label.c_str()).x;
  const float right = f * 0.8f + ImGui::CalcTextSize(plane.right_label.c_str()).x;
  const float top = f * 1.6f, bottom = f * plane.bottom_rows;
  const float plot_w = std::max(f, width - left - right), plot_h = std::max(f, height - top - bottom);
  const double span_a = plane.a_max - plane.a_min, span_b = plane.b_max - plane.b_min;
  plane_ = plane;
  scale_ = std::min(plot_w / static_cast<float>(span_a), plot_h / static_cast<float>(span_b));
  const float bw = static_cast<float>(span_a) * scale_, bh = static_cast<float>(span_b) * scale_;
  origin_ = ImVec2(top_left.x + left + (plot_w - bw) / 2, top_left.y + top + (plot_h - bh) / 2);
  const ImVec2 far(origin_.x + bw, origin_.y + bh);

  // One widget for the whole surface: taps and drags on it select, place and draw.
  // InvisibleButton reports the tap on release over it, as a finger lifts.
  const bool tapped = ImGui::InvisibleButton("##surface", ImVec2(width, height));
  probe("surface");
  probe("barrel");  // the name earlier tests and the lead's wiring know
  ImDrawList* draw = ImGui::GetWindowDrawList();
  draw->AddRectFilled(origin_, far, c.paper);
  // A metre grid, so distances can be read off without a tool.
  for (double m = std::ceil(plane.a_min); m < plane.a_max; m += 1.0) {
    if (m <= plane.a_min) continue;
    const float x = to_screen(m, plane.b_min).x;
    draw->AddLine(ImVec2(x, origin_.y), ImVec2(x, far.y), c.grid);
  }
  for (double m = std::ceil(plane.b_min); m < plane.b_max; m += 1.0) {
    if (m <= plane.b_min) continue;
    const float y = to_screen(plane.a_min, m).y;
    draw->AddLine(ImVec2(origin_.x, y), ImVec2(far.x, y), c.grid);
  }
  decorate(draw, top_left, origin_, far);
  const float mid_y = (origin_.y + far.y) / 2 - f / 2;
  draw->AddText(ImVec2(origin_.x - ImGui::CalcTextSize(plane.left_label.c_str()).x - f * 0.5f, mid_y), c.ink,
                plane.left_label.c_str());
  draw->AddText(ImVec2(far.x + f * 0.5f, mid_y), c.ink, plane.right_label.c_str());
  draw->AddRect(origin_, far, c.ink, 0, 0, 2.0f);
  // Scale bar: one metre, and the frame the numbers are measured in.
  const float sy = far.y + f * 1.6f;
  draw->AddLine(ImVec2(origin_.x, sy), ImVec2(origin_.x + scale_, sy), c.ink, 3.0f);
  draw->AddText(ImVec2(origin_.x - f * 0.2f, sy + f * 0.1f), c.ink, "1 m");

  draw->PushClipRect(top_left, ImVec2(top_left.x + width, top_left.y + height), true);
  draw_marks(draw, marks);
  // What is being drawn now, in ink so it stands apart from the recorded marks.
  if (dragging_ && stroke_.points().size() > 1) {
    std::vector<ImVec2> pts;
    for (const auto& [x, y] : stroke_.points()) pts.emplace_back(static_cast<float>(x), static_cast<float>(y));
    draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), c.ink, mode_ == Mode::area, f * 0.15f);
  }
  if (!corners_.empty() && corners_surface_ == where) {
    std::vector<ImVec2> pts;
    for (const auto& [a, b] : corners_) pts.push_back(to_screen(a, b));
    draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), c.ink, false, f * 0.15f);
    for (const ImVec2& p : pts) draw->AddCircle(p, f * 0.35f, c.ink, 0, 2.0f);
  }
  if (pending_) {
    std::vector<ImVec2> pts;
    for (const auto& [a, b] : pending_->points) pts.push_back(to_screen(a, b));
    if (pts.size() == 1) {
      const ImVec2 p = pts[0];
      draw->AddCircle(p, f * 0.6f, c.ink, 0, 2.0f);
      draw->AddLine(ImVec2(p.x - f, p.y), ImVec2(p.x + f, p.y), c.ink, 2.0f);
      draw->AddLine(ImVec2(p.x, p.y - f), ImVec2(p.x, p.y + f), c.ink, 2.0f);
    } else {
      draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), c.ink,
                        pending_->geometry == storage::DefectGeometry::area, f * 0.15f);
    }
  }
  draw->PopClipRect();
  handle_pointer(tapped, marks, place, where);
}

void DefectsView::decorate_barrel(const app::BarrelFrame& barrel, ImDrawList* draw, ImVec2 top_left, ImVec2 near,
                                  ImVec2 far) {
  const Palette& c = palette();
  const float f = ImGui::GetFontSize();
  const float crown_x = (near.x + far.x) / 2;
  for (float y = near.y; y < far.y; y += f * 0.8f)
    draw->AddLine(ImVec2(crown_x, y), ImVec2(crown_x, std::min(far.y, y + f * 0.4f)), c.faint_ink, 1.5f);
  draw->AddText(ImVec2(crown_x + f * 0.3f, near.y + f * 0.2f), c.faint_ink, "crown");
  // Springings are the left and right edges; faces the top and bottom edges.
  const std::string first_face = barrel.y_from_upstream ? "upstream face" : "downstream face";
  const std::string second_face = barrel.y_from_upstream ? "downstream face" : "upstream face";
  const std::string top_label = first_face + " (y = 0)";
  draw->AddText(ImVec2(crown_x - ImGui::CalcTextSize(top_label.c_str()).x / 2, top_left.y + f * 0.3f), c.ink,
                top_label.c_str());
  const std::string bottom_label = second_face + " (y = " + metres(barrel.width_m) + ")";
  draw->AddText(ImVec2(crown_x - ImGui::CalcTextSize(bottom_label.c_str()).x / 2, far.y + f * 0.2f), c.ink,
                bottom_label.c_str());
  const std::string note = "s along the intrados" + std::string(barrel.arc_known ? "" : " (arc length not surveyed)") +
                           ", y across the barrel" + (barrel.width_known ? "" : " (width not recorded)") +
                           ", seen looking up";
  draw->AddText(ImVec2(near.x + scale_ + f * 0.8f, far.y + f * 1.6f - f * 0.5f), c.ink, note.c_str());
  const std::string frame = "Frame: " + barrel.origin + " (s from that springing, y from that face).";
  draw->AddText(ImGui::GetFont(), f, ImVec2(near.x, far.y + f * 2.8f), c.faint_ink, frame.c_str(), nullptr,
                wrap_width(near.x));
}

void DefectsView::decorate_elevation(const app::ElevationFrame& e, ImDrawList* draw, ImVec2 top_left, ImVec2 near,
                                     ImVec2 far) {
  const Palette& c = palette();
  const float f = ImGui::GetFontSize();
  // The arch opening under a spandrel wall, from the surveyed intrados: it
  // shows where on the wall a mark sits and that the wall is seen face on.
  if (e.intrados.size() >= 3) {
    std::vector<ImVec2> pts;
    for (const auto& [x, z] : e.intrados) pts.push_back(to_screen(x, std::max(z, plane_.b_min)));
    // The opening itself lightly shaded, so that a mark drawn in it reads as off the wall.
    draw_area_fill(draw, pts.data(), static_cast<int>(pts.size()), c.faint_ink);
    draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), c.faint_ink, false, 2.0f);
    const float cx = to_screen((e.intrados.front().first + e.intrados.back().first) / 2, 0).x;
    const double rise = std::max_element(e.intrados.begin(), e.intrados.end(), [](const auto& a, const auto& b) {
                          return a.second < b.second;
                        })->second;
    const char* label = "intrados (surveyed)";
    const float crown_y = to_screen(0, rise).y;
    draw->AddText(ImVec2(cx - ImGui::CalcTextSize(label).x / 2, crown_y - f * 1.3f), c.faint_ink, label);
    const char* opening = "arch opening";
    const float opening_y = to_screen(0, std::max(0.0, plane_.b_min)).y - f * 1.4f;
    if (opening_y > crown_y + f * 0.2f)
      draw->AddText(ImVec2(cx - ImGui::CalcTextSize(opening).x / 2, opening_y), c.faint_ink, opening);
  }
  // z = 0 (springing line or footing top) when the surface reaches below it.
  if (plane_.b_min < 0 && plane_.b_max > 0) {
    const float y = to_screen(plane_.a_min, 0).y;
    for (float x = near.x; x < far.x; x += f * 0.8f)
      draw->AddLine(ImVec2(x, y), ImVec2(std::min(far.x, x + f * 0.4f), y), c.faint_ink, 1.5f);
    const std::string label = e.z_zero_label.empty() ? "z = 0" : e.z_zero_label + " (z = 0)";
    draw->AddText(ImVec2(far.x - ImGui::CalcTextSize(label.c_str()).x - f * 0.3f, y - f * 1.2f), c.faint_ink,
                  label.c_str());
  }
  // x = 0 inside the surface (a pier's centre line) gets a line of its own.
  const ImVec2 zero = to_screen(0, 0);
  const std::string zero_label = e.x_zero_label.empty() ? "x = 0" : e.x_zero_label + " (x = 0)";
  const bool zero_at_end = std::abs(plane_.a_min) < 1e-9 || std::abs(plane_.a_max) < 1e-9;
  if (!zero_at_end && zero.x > near.x && zero.x < far.x) {
    for (float y = near.y; y < far.y; y += f * 0.8f)
      draw->AddLine(ImVec2(zero.x, y), ImVec2(zero.x, std::min(far.y, y + f * 0.4f)), c.faint_ink, 1.5f);
    draw->AddText(ImVec2(zero.x + f * 0.3f, near.y + f * 0.2f), c.faint_ink, zero_label.c_str());
  }
  const std::string side = e.seen_from_downstream ? "seen from downstream" : "seen from upstream";
  const std::string top_label = "top (z = " + metres(plane_.b_max) + ")";
  const float cx = (near.x + far.x) / 2;
  draw->AddText(ImVec2(cx - ImGui::CalcTextSize(top_label.c_str()).x / 2, top_left.y + f * 0.3f), c.ink,
                top_label.c_str());
  const std::string bottom_label =
      plane_.b_min < 0 ? "z = " + metres(plane_.b_min) : e.z_zero_label.empty() ? "z = 0" : e.z_zero_label + " (z = 0)";
  draw->AddText(ImVec2(cx - ImGui::CalcTextSize(bottom_label.c_str()).x / 2, far.y + f * 0.2f), c.ink,
                bottom_label.c_str());
  const std::string note = "x along the span, z up, " + side +
                           (e.seen_from_downstream ? " (so x = 0 is on the right)" : "");
  draw->AddText(ImVec2(near.x + scale_ + f * 0.8f, far.y + f * 1.6f - f * 0.5f), c.ink, note.c_str());
  // The frame, and where the drawn size came from: a stand-in size is in the caution colour.
  const float text_x = top_left.x;  // in line with the placement notes under it
  const std::string frame = "Frame: " + e.origin + ".";
  draw->AddText(ImGui::GetFont(), f, ImVec2(text_x, far.y + f * 2.8f), c.faint_ink, frame.c_str(), nullptr,
                wrap_width(text_x));
  std::string basis = "Drawn size: " + e.width_basis;
  if (!e.height_basis.empty()) basis += "; " + e.height_basis;
  draw->AddText(ImGui::GetFont(), f, ImVec2(text_x, far.y + f * 4.0f),
                (e.width_assumed || e.height_assumed) ? c.caution : c.faint_ink, basis.c_str(), nullptr,
                wrap_width(text_x));
}

void DefectsView::draw_marks(ImDrawList* draw, const Marks& marks) {
  const Palette& c = palette();
  const float f = ImGui::GetFontSize();
  for (const app::DefectOnRecord* m : marks) {
    const storage::DefectFields& fields = m->defect.fields;
    if (fields.points.empty()) continue;
    const unsigned int colour = defect_family(fields.defect_type).colour;
    const int severity = fields.severity.value_or(1);
    std::vector<ImVec2> pts;
    for (const auto& [a, b] : fields.points) pts.push_back(to_screen(a, b));
    const bool selected = m->id == selected_id_;
    if (fields.geometry == storage::DefectGeometry::point || pts.size() == 1) {
      const float r = severity_radius(severity, f);
      if (selected) draw->AddCircle(pts[0], r + f * 0.3f, c.ink, 0, f * 0.15f);
      draw->AddCircleFilled(pts[0], r, colour);
    } else {
      const bool closed = fields.geometry == storage::DefectGeometry::area;
      const float t = closed ? area_outline_thickness(f) : severity_thickness(severity, f);
      if (closed) draw_area_fill(draw, pts.data(), static_cast<int>(pts.size()), colour);
      if (selected) draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), c.ink, closed, t + f * 0.3f);
      draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), colour, closed, t);
    }
    const std::string label = fields.ref + (fields.severity ? " \xC2\xB7" + std::to_string(*fields.severity) : "");
    draw->AddText(ImVec2(pts[0].x + f * 0.5f, pts[0].y - f * 1.2f), c.ink, label.c_str());
  }
}

void DefectsView::handle_pointer(bool tapped, const Marks& marks, const app::DefectPlace& place,
                                 const std::string& where) {
  const ImGuiIO& io = ImGui::GetIO();
  if (close_area_) {
    close_area_ = false;
    if (corners_.size() >= 3 && corners_surface_ == where) {
      start_pending(place, where, storage::DefectGeometry::area, corners_);
      corners_.clear();
    }
  }
  const bool drawing = mode_ == Mode::line || (mode_ == Mode::area && corners_.empty());
  if (!drawing) {
    if (tapped) tap_at(io.MousePos, marks, place, where);
    return;
  }
  // A drag draws; a press and lift that hardly moved is a tap.
  const ImVec2 down = io.MouseClickedPos[0];
  if (ImGui::IsItemActivated() && on_plane(down)) {
    stroke_ = app::StrokeSampler(sample_step());
    stroke_.start({down.x, down.y});
    dragging_ = true;
  }
  if (dragging_ && ImGui::IsItemActive()) {
    // Kept on the surface: a finger running off its edge draws along the edge.
    const ImVec2 near = to_screen(plane_.a_leftward ? plane_.a_max : plane_.a_min, plane_.b_up ? plane_.b_max : plane_.b_min);
    const ImVec2 far = to_screen(plane_.a_leftward ? plane_.a_min : plane_.a_max, plane_.b_up ? plane_.b_min : plane_.b_max);
    stroke_.move({std::clamp(io.MousePos.x, near.x, far.x), std::clamp(io.MousePos.y, near.y, far.y)});
  }
  if (ImGui::IsItemDeactivated()) {
    if (!dragging_) {
      if (tapped) tap_at(io.MousePos, marks, place, where);
      return;
    }
    dragging_ = false;
    const ImVec2 near = to_screen(plane_.a_leftward ? plane_.a_max : plane_.a_min, plane_.b_up ? plane_.b_max : plane_.b_min);
    const ImVec2 far = to_screen(plane_.a_leftward ? plane_.a_min : plane_.a_max, plane_.b_up ? plane_.b_min : plane_.b_max);
    stroke_.finish({std::clamp(io.MousePos.x, near.x, far.x), std::clamp(io.MousePos.y, near.y, far.y)});
    if (stroke_.reach() < tap_slop()) {
      tap_at(down, marks, place, where);
    } else {
      finish_stroke(place, where);
    }
    stroke_.clear();
  }
}

void DefectsView::tap_at(ImVec2 pointer, const Marks& marks, const app::DefectPlace& place,
                         const std::string& where) {
  const int hit = corners_.empty() ? hit_test(marks, pointer) : -1;
  if (hit >= 0) {
    selected_id_ = marks[static_cast<size_t>(hit)]->id;
    hint_.clear();
    return;
  }
  selected_id_.clear();
  if (!on_plane(pointer)) return;
  const app::PlanePoint at = to_plane(pointer);
  switch (mode_) {
    case Mode::point: start_pending(place, where, storage::DefectGeometry::point, {at}); break;
    case Mode::line:
      hint_ = "That was a tap: to draw a crack, keep the finger down from its start to its end, then lift.";
      break;
    case Mode::area:
      if (corners_surface_ != where) corners_.clear();
      corners_surface_ = where;
      // A tap back on the first corner closes the outline, as Close area does.
      if (corners_.size() >= 3) {
        const ImVec2 first = to_screen(corners_[0].first, corners_[0].second);
        if (std::hypot(first.x - pointer.x, first.y - pointer.y) < tap_slop() * 1.5f) {
          close_area_ = true;
          break;
        }
      }
      corners_.push_back(at);
      hint_ = std::to_string(corners_.size()) + " corner(s): tap the next corner; Close area when there are 3 or more.";
      break;
  }
}

void DefectsView::finish_stroke(const app::DefectPlace& place, const std::string& where) {
  // Stroke samples are screen pixels: thin to within a pixel, then into metres.
  const app::PlanePath thin = app::simplify_path(stroke_.points(), 1.0);
  app::PlanePath points;
  for (const auto& [x, y] : thin) points.push_back(to_plane(ImVec2(static_cast<float>(x), static_cast<float>(y))));
  if (mode_ == Mode::line) {
    if (points.size() < 2) return;
    start_pending(place, where, storage::DefectGeometry::line, points);
    return;
  }
  // An outline ends where it began: its last point closes on the first.
  if (points.size() > 3) {
    const ImVec2 a = to_screen(points.front().first, points.front().second);
    const ImVec2 b = to_screen(points.back().first, points.back().second);
    if (std::hypot(a.x - b.x, a.y - b.y) < tap_slop()) points.pop_back();
  }
  const double slop_m = tap_slop() / scale_;
  if (points.size() < 3 || app::shoelace_area(points) < slop_m * slop_m) {
    hint_ = "That outline encloses almost nothing: drag right round the area, or tap its corners.";
    return;
  }
  start_pending(place, where, storage::DefectGeometry::area, points);
}

void DefectsView::start_pending(const app::DefectPlace& place, const std::string& where,
                                storage::DefectGeometry geometry, app::PlanePath points) {
  Pending p;
  p.place = place;
  p.geometry = geometry;
  p.points = std::move(points);
  p.where = where;
  p.a_name = plane_.a_name;
  p.b_name = plane_.b_name;
  pending_ = std::move(p);
  draft_ = app::DefectDraft();
  notes_[0] = 0;
  form_error_.clear();
  hint_.clear();
  open_new_ = true;
}

void DefectsView::draw_selection() {
  const app::DefectOnRecord* chosen = nullptr;
  for (const auto& d : data_.defects())
    if (d.id == selected_id_) chosen = &d;
  if (!chosen) {
    selected_id_.clear();
    ImGui::TextWrapped("Nothing selected: tap a mark to select it. Walls, piers and abutments are under Surface.");
    return;
  }
  const storage::DefectFields& f = chosen->defect.fields;
  // Buttons first, so they keep their place however long the description is.
  if (ImGui::Button(("Edit " + f.ref + "...").c_str())) {
    draft_ = app::DefectDraft{f.defect_type, f.severity.value_or(0), f.width_mm, f.notes};
    std::snprintf(notes_, sizeof notes_, "%s", f.notes.c_str());
    form_error_.clear();
    open_edit_ = true;
  }
  probe("edit");
  if (photos_request_) {
    // The count on the button itself, so it is seen before the tap (FIELD.md §6.3: an overall view and a close-up per defect).
    const int n = chosen->defect.photo_count;
    const std::string label = n == 0   ? "No photos of " + f.ref + " yet..."
                              : n == 1 ? "1 photo of " + f.ref + "..."
                                       : std::to_string(n) + " photos of " + f.ref + "...";
    same_line_if_fits(label.c_str());
    if (ImGui::Button((label + "###photos").c_str())) photos_wanted_ = chosen->id;
    probe("photos:defect");
  }
  same_line_if_fits(("Delete " + f.ref + "...").c_str());
  if (ImGui::Button(("Delete " + f.ref + "...").c_str())) open_delete_ = true;
  probe("delete");
  same_line_if_fits("Clear selection");
  if (ImGui::Button("Clear selection")) selected_id_.clear();
  probe("deselect");
  std::string text = f.ref + ": " + words(f.defect_type) + ", " + f.element;
  // The scale's key (soffit-1-5) is for files; a person reads "of 5, 5 worst".
  if (f.severity)
    text += ", severity " + std::to_string(*f.severity) +
            (f.severity_scale == "soffit-1-5" ? std::string(" of 5 (5 = worst)") : " (" + f.severity_scale + ")");
  if (f.length_m) text += ", length " + metres(*f.length_m);
  if (f.area_m2) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.2f m\xC2\xB2", *f.area_m2);
    text += std::string(", area ") + buf;
  }
  if (f.width_mm) text += ", width " + millimetres(*f.width_mm);
  if (!photos_request_ && chosen->defect.photo_count > 0)  // else the Photos button says it
    text += ", " + std::to_string(chosen->defect.photo_count) + " photo(s)";
  if (!f.notes.empty()) text += ". " + f.notes;
  // Beside the buttons only while it has room to read as a sentence, else under them.
  if (wrap_width(ImGui::GetItemRectMax().x + ImGui::GetStyle().ItemSpacing.x) >= ImGui::GetFontSize() * 16)
    ImGui::SameLine();
  ImGui::TextWrapped("%s", text.c_str());
}

void DefectsView::draw_defect_form(storage::DefectGeometry geometry) {
  const float f = ImGui::GetFontSize();
  const ImVec2 big(f * 10.0f, f * 2.2f);
  ImGui::TextUnformatted("Type:");
  int column = 0;
  for (const char* type : kDefectTypes) {
    if (column++ > 0) same_line_if_room(big.x);  // four a row at scale 1, fewer at a large text size
    if (button_choice(words(type).c_str(), draft_.type == type, big)) draft_.type = type;
    probe(std::string("type:") + type);
  }
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Severity, 1 to 5 (5 = worst):");
  for (int s = 1; s <= 5; ++s) {
    same_line_if_room(f * 3.0f);
    if (button_choice(std::to_string(s).c_str(), draft_.severity == s, ImVec2(f * 3.0f, f * 2.2f))) draft_.severity = s;
    probe("severity:" + std::to_string(s));
  }
  same_line_if_fits("1 noted, 2 slight, 3 moderate, 4 severe, 5 urgent");
  ImGui::AlignTextToFramePadding();
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextDisabled("1 noted, 2 slight, 3 moderate, 4 severe, 5 urgent");
  ImGui::PopTextWrapPos();
  if (has_width(draft_.type, geometry)) {
    ImGui::AlignTextToFramePadding();
    ImGui::TextUnformatted("Width at its widest:");
    same_line_if_room(f * 8.0f);
    const std::string shown = draft_.width_mm ? millimetres(*draft_.width_mm) : std::string("not measured");
    if (ImGui::Button((shown + "###width").c_str(), ImVec2(f * 8.0f, f * 2.2f))) {
      // A width not yet measured starts empty: nothing to delete before typing it.
      if (draft_.width_mm)
        keypad_.begin("Width (mm)", *draft_.width_mm, 2);
      else
        keypad_.begin_text("Width (mm)", "");
      ImGui::OpenPopup(keypad_.popup_id().c_str());
    }
    probe("width");
    same_line_if_fits("Not measured");
    ImGui::BeginDisabled(!draft_.width_mm);
    if (ImGui::Button("Not measured", ImVec2(0, f * 2.2f))) draft_.width_mm.reset();
    probe("clear width");
    ImGui::EndDisabled();
    same_line_if_fits("mm, by card, microscope or calliper");
    ImGui::AlignTextToFramePadding();
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextDisabled("mm, by card, microscope or calliper");
    ImGui::PopTextWrapPos();
    if (const auto v = keypad_.draw()) {
      // The project file refuses widths above 1 m (storage/observation_edits.cpp); say so here first.
      if (*v < 0 || *v > 1000) {
        char buf[96];
        std::snprintf(buf, sizeof buf, "Width: %g mm was not kept; enter 0 to 1000 mm.", *v);
        form_error_ = buf;
      } else {
        draft_.width_mm = *v;
        form_error_.clear();
      }
    }
  }
  ImGui::TextUnformatted("Notes (optional):");
  ImGui::InputTextMultiline("##notes", notes_, sizeof notes_,
                            ImVec2(std::min(f * 30.0f, ImGui::GetContentRegionAvail().x), f * 3.0f));
  probe("notes");
  draft_.notes = notes_;
  if (!form_error_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().caution));
    ImGui::TextWrapped("%s", form_error_.c_str());
    ImGui::PopStyleColor();
  }
}

void DefectsView::draw_new_defect_popup() {
  if (open_new_) {
    ImGui::OpenPopup("New defect");
    open_new_ = false;
  }
  // Within the display at any text size, the save and cancel buttons pinned
  // below the form; one modal at a time, so one layout state per dialog.
  static FittedModal modal;
  if (!modal.begin("New defect", 42)) return;
  const float f = ImGui::GetFontSize();
  if (!pending_) {
    modal.footer();
    ImGui::CloseCurrentPopup();
    ImGui::EndPopup();
    return;
  }
  const Pending& p = *pending_;
  char what[200];
  if (p.geometry == storage::DefectGeometry::point) {
    std::snprintf(what, sizeof what, "Point defect on %s at %s %.2f m, %s %.2f m", p.where.c_str(), p.a_name,
                  p.points[0].first, p.b_name, p.points[0].second);
  } else if (p.geometry == storage::DefectGeometry::line) {
    std::snprintf(what, sizeof what, "Line on %s: %.2f m long through %zu points", p.where.c_str(),
                  app::path_length(p.points), p.points.size());
  } else {
    std::snprintf(what, sizeof what, "Area on %s: %.2f m\xC2\xB2 inside %zu corners", p.where.c_str(),
                  app::shoelace_area(p.points), p.points.size());
  }
  ImGui::TextWrapped("%s", what);
  draw_defect_form(p.geometry);
  modal.footer();
  const bool ready = !draft_.type.empty() && draft_.severity != 0;
  ImGui::BeginDisabled(!ready);
  if (ImGui::Button("Save defect", ImVec2(f * 9.0f, f * 2.2f))) {
    const Pending placed = *pending_;
    const app::DefectDraft draft = draft_;
    run("Saving the defect", [&] {
      const std::string ref = data_.add_defect(placed.place, placed.geometry, placed.points, draft);
      for (const auto& d : data_.defects())
        if (d.defect.fields.ref == ref) selected_id_ = d.id;
    });
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
  if (!ready) {
    same_line_if_fits("Choose a type and a severity to save.");
    ImGui::AlignTextToFramePadding();
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextDisabled("Choose a type and a severity to save.");
    ImGui::PopTextWrapPos();
  }
  modal.end_footer();
  ImGui::EndPopup();
}

void DefectsView::draw_edit_popup() {
  if (open_edit_) {
    ImGui::OpenPopup("Edit defect");
    open_edit_ = false;
  }
  static FittedModal modal;
  if (!modal.begin("Edit defect", 42)) return;
  const float f = ImGui::GetFontSize();
  const app::DefectOnRecord* chosen = nullptr;
  for (const auto& d : data_.defects())
    if (d.id == selected_id_) chosen = &d;
  if (!chosen) {
    modal.footer();
    ImGui::CloseCurrentPopup();
    ImGui::EndPopup();
    return;
  }
  ImGui::TextWrapped("Edit %s on %s (its position stays as drawn)", chosen->defect.fields.ref.c_str(),
                     chosen->defect.fields.element.c_str());
  draw_defect_form(chosen->defect.fields.geometry);
  modal.footer();
  ImGui::BeginDisabled(draft_.type.empty() || draft_.severity == 0);
  if (ImGui::Button("Save changes", ImVec2(f * 9.0f, f * 2.2f))) {
    const std::string id = chosen->id;
    const app::DefectDraft draft = draft_;
    run("Saving the changes", [&] { data_.update_defect(id, draft); });
    ImGui::CloseCurrentPopup();
  }
  probe("save edit");
  ImGui::EndDisabled();
  same_line_if_room(f * 6.0f);
  if (ImGui::Button("Cancel", ImVec2(f * 6.0f, f * 2.2f))) ImGui::CloseCurrentPopup();
  probe("cancel edit");
  modal.end_footer();
  ImGui::EndPopup();
}

void DefectsView::draw_delete_popup() {
  if (open_delete_) {
    ImGui::OpenPopup("Delete defect?");
    open_delete_ = false;
  }
  static FittedModal modal;
  if (!modal.begin("Delete defect?", 30)) return;
  std::string ref, id = selected_id_;
  for (const auto& d : data_.defects())
    if (d.id == id) ref = d.defect.fields.ref;
  ImGui::TextWrapped("Delete %s and its photo links from this visit? Undo brings it back.", ref.c_str());
  modal.footer();
  const float f = ImGui::GetFontSize();
  if (ImGui::Button("Delete", ImVec2(f * 6.0f, f * 2.2f))) {
    if (!id.empty()) run("Deleting the defect", [&] { data_.delete_defect(id, ref); });
    selected_id_.clear();
    ImGui::CloseCurrentPopup();
  }
  probe("confirm delete");
  same_line_if_room(f * 6.0f);
  if (ImGui::Button("Keep", ImVec2(f * 6.0f, f * 2.2f))) ImGui::CloseCurrentPopup();
  probe("keep defect");
  modal.end_footer();
  ImGui::EndPopup();
}

}  // namespace soffit::gui
