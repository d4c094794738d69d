#include "app/gui/rings_fill_view.hpp"

#include <imgui.h>

#include <algorithm>
#include <cstdio>
#include <exception>
#include <filesystem>
#include <initializer_list>
#include <utility>

#include "app/gui/flow_layout.hpp"
#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"
#include "app/model/local_time.hpp"
#include "app/model/ring_fill_records.hpp"
#include "exports/fit_report_json.hpp"

namespace soffit::gui {

namespace {

std::string mm(const std::optional<double>& v) {
  if (!v) return "-";
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.0f", *v);
  return buf;
}

std::string range_text(const std::optional<ThicknessRange>& r) {
  if (!r) return "-";
  std::string t = mm(r->value_mm);
  if (r->lower_mm && r->upper_mm) t += " (" + mm(r->lower_mm) + " to " + mm(r->upper_mm) + ")";
  return t;
}

std::string metres(const std::optional<double>& v, int decimals) {
  if (!v) return "-";
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, *v);
  return buf;
}

// One ring as brick + joint, spelled out so the sum explains itself (review item 11).
std::string ring_depth_text(const RingThicknessEstimate& e) {
  if (!e.unit_depth_mm) return "not recorded";
  if (!e.joint_mm) return mm(e.unit_depth_mm) + " + joint not recorded";
  return mm(e.unit_depth_mm) + " + " + mm(e.joint_mm) + " = " + mm(*e.unit_depth_mm + *e.joint_mm);
}

// The range the thickness is taken to lie in and why: the surveyor's own, or the rule's.
std::string range_used_text(const RingCountLine& l) {
  const auto& m = l.estimate.measured;
  if (!m || !m->lower_mm || !m->upper_mm) return l.count.basis.empty() ? "-" : "-; " + l.count.basis;
  std::string t = mm(m->lower_mm) + " to " + mm(m->upper_mm);
  const bool recorded = l.count.thickness_lower_mm && l.count.thickness_upper_mm;
  if (!recorded) t += l.estimate.verified ? " (\xC2\xB1" "10 mm, verified)" : " (\xC2\xB1" "1 ring)";
  if (!l.count.basis.empty()) t += "; " + l.count.basis;
  return t;
}

// A table of text cells for a finger at any text size: each narrow column
// as wide as its longest word (so a word never breaks mid-way, "springin g"),
// the one wide column taking the rest; rows as tall as a button. Headers
// may take two lines ("\n").
struct Column {
  const char* header;
  bool wide = false;
};

// The widest piece of `text` between separators: words (space or new line), or whole lines.
float widest_piece(const std::string& text, const char* separators) {
  float widest = 0;
  size_t start = 0;
  while (start <= text.size()) {
    size_t end = text.find_first_of(separators, start);
    if (end == std::string::npos) end = text.size();
    widest = std::max(widest, ImGui::CalcTextSize(text.data() + start, text.data() + end).x);
    start = end + 1;
  }
  return widest;
}

// Draws the table; `first_cell(row)` draws the first cell of a row (a selectable one, say).
void draw_table(const char* id, const std::vector<Column>& columns, const std::vector<std::vector<std::string>>& rows,
                const std::function<void(size_t)>& first_cell, bool tall_rows) {
  if (!ImGui::BeginTable(id, static_cast<int>(columns.size()), ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg))
    return;
  // Each narrow column unwrapped if all of them fit beside a readable wide
  // column, else as wide as its longest word.
  std::vector<float> whole(columns.size(), 0.0f), word(columns.size(), 0.0f);
  float sum_whole = 0;
  for (size_t c = 0; c < columns.size(); ++c) {
    if (columns[c].wide) continue;
    whole[c] = word[c] = widest_piece(columns[c].header, "\n");
    for (const auto& row : rows) {
      whole[c] = std::max(whole[c], widest_piece(row[c], "\n"));
      word[c] = std::max(word[c], widest_piece(row[c], " \n"));
    }
    sum_whole += whole[c] + ImGui::GetStyle().CellPadding.x * 2 + 1;
  }
  const bool unwrapped = sum_whole + ImGui::GetFontSize() * 14 <= ImGui::GetContentRegionAvail().x;
  for (size_t c = 0; c < columns.size(); ++c) {
    if (columns[c].wide)
      ImGui::TableSetupColumn(columns[c].header, ImGuiTableColumnFlags_WidthStretch);
    else
      ImGui::TableSetupColumn(columns[c].header, ImGuiTableColumnFlags_WidthFixed, unwrapped ? whole[c] : word[c]);
  }
  ImGui::TableHeadersRow();
  for (size_t r = 0; r < rows.size(); ++r) {
    ImGui::TableNextRow(0, tall_rows ? ImGui::GetFrameHeight() : 0.0f);
    ImGui::TableNextColumn();
    first_cell(r);
    for (size_t c = 1; c < columns.size(); ++c) {
      ImGui::TableNextColumn();
      ImGui::TextWrapped("%s", rows[r][c].c_str());
    }
  }
  ImGui::EndTable();
}

// The first cell of a row the inspector can pick, the whole row its target.
bool row_choice(const std::string& text, const std::string& id, bool chosen) {
  return ImGui::Selectable((text + "##" + id).c_str(), chosen,
                           ImGuiSelectableFlags_SpanAllColumns | ImGuiSelectableFlags_AllowItemOverlap,
                           ImVec2(0, ImGui::GetFrameHeight() - ImGui::GetStyle().CellPadding.y * 2));
}

void coloured_text(unsigned int colour, const std::string& text) {
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(colour));
  ImGui::TextWrapped("%s", text.c_str());
  ImGui::PopStyleColor();
}

void widen(std::optional<double>& lo, std::optional<double>& hi, double v) {
  lo = lo ? std::min(*lo, v) : v;
  hi = hi ? std::max(*hi, v) : v;
}

}  // namespace

std::vector<RingCountLine> ring_count_lines(const storage::InspectionExportData& data) {
  std::vector<RingCountLine> out;
  for (const storage::RingCountFields& c : data.ring_counts) {
    RingCountLine line;
    line.count = c;
    storage::SpanDetails details;
    for (const storage::ExportSpan& s : data.spans)
      if (s.record.id == c.span_id) {
        line.span_label = s.record.label;
        details = s.details;
      }
    line.estimate = ring_thickness_estimate(c, details);
    out.push_back(std::move(line));
  }
  return out;
}

std::vector<FaceThickness> face_thicknesses(const std::vector<RingCountLine>& lines) {
  std::vector<FaceThickness> out;
  for (const RingCountLine& l : lines) {
    const bool seen = std::any_of(out.begin(), out.end(), [&](const FaceThickness& f) {
      return f.span_label == l.span_label && f.face == l.count.face;
    });
    if (seen) continue;
    FaceThickness f;
    f.span_label = l.span_label;
    f.face = l.count.face;
    f.rings_min = f.rings_max = l.count.rings;
    // One count-based value per face only when every count at the face gives the same one.
    bool counts_agree = true;
    for (const RingCountLine& m : lines) {
      if (m.span_label != f.span_label || m.count.face != f.face) continue;
      ++f.counts;
      f.rings_min = std::min(f.rings_min, m.count.rings);
      f.rings_max = std::max(f.rings_max, m.count.rings);
      if (const auto& t = m.estimate.measured) {
        widen(f.measured_min_mm, f.measured_max_mm, t->value_mm);
        if (t->lower_mm) widen(f.measured_lower_mm, f.measured_upper_mm, *t->lower_mm);
        if (t->upper_mm) widen(f.measured_lower_mm, f.measured_upper_mm, *t->upper_mm);
      }
      const auto& c = m.estimate.from_counts;
      if (!c || (f.from_counts_mm && (*f.from_counts_mm != c->value_mm || f.count_lower_mm != c->lower_mm ||
                                      f.count_upper_mm != c->upper_mm)))
        counts_agree = false;
      else if (!f.from_counts_mm) {
        f.from_counts_mm = c->value_mm;
        f.count_lower_mm = c->lower_mm;
        f.count_upper_mm = c->upper_mm;
      }
    }
    if (!counts_agree) f.from_counts_mm = f.count_lower_mm = f.count_upper_mm = std::nullopt;
    out.push_back(f);
  }
  return out;
}

void RingsFillView::open(storage::Project& project, const std::string& structure_ref,
                         const std::optional<std::string>& date) {
  message_.clear();
  saved_.clear();
  selected_count_.clear();
  selected_fill_.clear();
  deleting_.reset();
  project_ = &project;
  try {
    data_.load(project, structure_ref, date);
  } catch (const std::exception& e) {
    data_ = app::InspectionData();
    project_ = nullptr;
    message_ = e.what();
  }
  rebuild();
}

void RingsFillView::close() {
  data_ = app::InspectionData();
  project_ = nullptr;
  lines_.clear();
  faces_.clear();
  count_ids_.clear();
  fill_ids_.clear();
  deleting_.reset();
}

void RingsFillView::reload() {
  if (!data_.loaded()) return;
  try {
    data_.reload();
  } catch (const std::exception& e) {
    message_ = std::string("Reading the visit again: ") + e.what();
  }
  rebuild();
}

void RingsFillView::rebuild() {
  lines_ = data_.loaded() ? ring_count_lines(data_.data()) : std::vector<RingCountLine>{};
  faces_ = face_thicknesses(lines_);
  count_ids_.clear();
  fill_ids_.clear();
  if (!data_.loaded() || !project_) return;
  try {
    const auto& d = data_.data();
    count_ids_ = app::ring_count_ids(project_->db(), d.inspection.id, d.ring_counts);
    fill_ids_ = app::fill_depth_ids(project_->db(), d.inspection.id, d.fill_depths);
  } catch (const std::exception& e) {
    message_ = std::string("Reading the keys of the rows: ") + e.what();
  }
  count_ids_.resize(lines_.size());
  fill_ids_.resize(data_.data().fill_depths.size());
  // A row undone away, or deleted, is no longer selected.
  if (std::find(count_ids_.begin(), count_ids_.end(), selected_count_) == count_ids_.end()) selected_count_.clear();
  if (std::find(fill_ids_.begin(), fill_ids_.end(), selected_fill_) == fill_ids_.end()) selected_fill_.clear();
}

void RingsFillView::show_add_count_for_screenshot() {
  if (read_only()) return;
  edit_id_.clear();
  count_dialog_.open_new(span_choices(), data_.data().inspection.id);
}

bool RingsFillView::read_only() const { return !data_.loaded() || data_.data().inspection.status == "issued"; }

std::vector<SpanChoice> RingsFillView::span_choices() const {
  std::vector<SpanChoice> out;
  for (const storage::ExportSpan& s : data_.data().spans) out.push_back({s.record.id, s.record.label, s.details});
  return out;
}

std::string RingsFillView::span_label(const std::string& span_id) const {
  for (const storage::ExportSpan& s : data_.data().spans)
    if (s.record.id == span_id) return s.record.label;
  return "?";
}

std::string RingsFillView::change(const std::string& done, const std::function<void()>& edit) {
  try {
    edit();
  } catch (const std::exception& e) {
    reload();
    return e.what();  // the edit was one transaction: nothing of it was kept
  }
  message_.clear();
  saved_ = done + ". Saved to the project file " + data_.data().project_file_name + " at " + app::clock_hhmm() + ".";
  reload();
  return "";
}

void RingsFillView::undo_or_redo(bool undo) {
  const std::string step = undo ? data_.undo_label() : data_.redo_label();
  try {
    if (!(undo ? data_.undo() : data_.redo())) return;
    message_.clear();
    saved_ = std::string(undo ? "Undone: " : "Redone: ") + step + ". Saved to the project file " +
             data_.data().project_file_name + " at " + app::clock_hhmm() + ".";
  } catch (const std::exception& e) {
    message_ = e.what();  // the journal refused: the file is as it was
  }
  rebuild();
}

void RingsFillView::draw() {
  if (!data_.loaded()) {
    ImGui::TextWrapped("%s", message_.empty() ? "Open a visit from the structure screen to see its rings and fill."
                                              : message_.c_str());
    return;
  }
  const auto& d = data_.data();
  ImGui::Text("Rings and fill: %s, visit %s (%s)", d.structure.fields.name.c_str(), d.inspection.date.c_str(),
              d.inspection.status.c_str());
  draw_actions();
  if (!message_.empty()) coloured_text(palette().caution, message_);
  draw_faces();
  ImGui::Spacing();
  // Fill before the long list of counts: both tables stay in reach without scrolling far.
  draw_fill();
  ImGui::Spacing();
  draw_counts();
  // Room under the last row, so it is not tapped against the screen's edge.
  ImGui::Dummy(ImVec2(0, ImGui::GetFrameHeight()));
  draw_delete_popup();
  const std::string inspection_id = d.inspection.id;
  count_dialog_.draw([&](const storage::RingCountFields& f) {
    const std::string name = app::ring_count_name(span_label(f.span_id), f);
    const std::string id = edit_id_;
    return id.empty() ? change("Added ring count " + name, [&] { selected_count_ = app::add_ring_count(*project_, name, f); })
                      : change("Changed ring count " + name, [&] { app::update_ring_count(*project_, name, id, f); });
  });
  fill_dialog_.draw([&](const storage::FillDepthFields& f) {
    const std::string name = app::fill_depth_name(span_label(f.span_id), f);
    const std::string id = edit_id_;
    return id.empty() ? change("Added fill depth " + name, [&] { selected_fill_ = app::add_fill_depth(*project_, name, f); })
                      : change("Changed fill depth " + name, [&] { app::update_fill_depth(*project_, name, id, f); });
  });
}

void RingsFillView::draw_actions() {
  if (read_only()) {
    coloured_text(palette().faint_ink,
                  "This visit is issued and read-only: counts and depths are shown as issued. To correct them, "
                  "start a new revision of the visit from the structure screen.");
    probe("rings:read-only");
    return;
  }
  const std::string inspection_id = data_.data().inspection.id;
  if (ImGui::Button("Add ring count...")) {
    edit_id_.clear();
    count_dialog_.open_new(span_choices(), inspection_id);
  }
  probe("rings:add-count");
  same_line_if_fits("Add fill depth...");
  if (ImGui::Button("Add fill depth...")) {
    edit_id_.clear();
    fill_dialog_.open_new(span_choices(), inspection_id);
  }
  probe("rings:add-fill");
  // The project's own journal: the step undone is named, and may be from another screen.
  const std::string undo_label = data_.undo_label(), redo_label = data_.redo_label();
  const std::string undo_text = (undo_label.empty() ? "Undo" : "Undo: " + undo_label) + "###undo";
  const std::string redo_text = (redo_label.empty() ? "Redo" : "Redo: " + redo_label) + "###redo";
  same_line_if_fits(undo_text.c_str());
  ImGui::BeginDisabled(undo_label.empty());
  const bool undo = ImGui::Button(undo_text.c_str());
  probe("rings:undo");
  ImGui::EndDisabled();
  same_line_if_fits(redo_text.c_str());
  ImGui::BeginDisabled(redo_label.empty());
  const bool redo = ImGui::Button(redo_text.c_str());
  probe("rings:redo");
  ImGui::EndDisabled();
  // Ctrl+Z / Ctrl+Y (or Ctrl+Shift+Z) only when no text is typed and no form is up:
  // a text field has its own undo, and a form's change is not made yet.
  const ImGuiIO& io = ImGui::GetIO();
  const bool keys_free = io.KeyCtrl && !io.WantTextInput &&
                         !ImGui::IsPopupOpen("", ImGuiPopupFlags_AnyPopupId | ImGuiPopupFlags_AnyPopupLevel);
  const bool key_z = keys_free && ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Z), false);
  const bool key_y = keys_free && ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Y), false);
  if ((undo || (key_z && !io.KeyShift)) && !undo_label.empty()) undo_or_redo(true);
  else if ((redo || key_y || (key_z && io.KeyShift)) && !redo_label.empty()) undo_or_redo(false);
  if (!saved_.empty()) {
    coloured_text(palette().reading, saved_);
    probe("rings:saved-note");
  }
}

void RingsFillView::draw_faces() {
  ImGui::TextUnformatted("Ring thickness by face");
  // Derived thicknesses are shown here: the caution goes with them.
  coloured_text(palette().caution, std::string(kSurveyDataCaution) +
                                       " A face count shows the face only: what lies behind it may differ.");
  if (faces_.empty()) {
    ImGui::TextDisabled("No ring counts recorded at this visit.");
    return;
  }
  std::vector<std::vector<std::string>> rows;
  for (const FaceThickness& f : faces_) {
    std::string c = mm(f.from_counts_mm);
    if (f.count_lower_mm && f.count_upper_mm) c += " (" + mm(f.count_lower_mm) + " to " + mm(f.count_upper_mm) + ")";
    if (!f.from_counts_mm) c = "- (counts differ or a depth is missing)";
    rows.push_back(
        {f.span_label, f.face,
         f.rings_min == f.rings_max ? std::to_string(f.rings_min)
                                    : std::to_string(f.rings_min) + " to " + std::to_string(f.rings_max),
         !f.measured_min_mm                         ? "-"
         : f.measured_min_mm == f.measured_max_mm ? mm(f.measured_min_mm)
                                                    : mm(f.measured_min_mm) + " to " + mm(f.measured_max_mm),
         f.measured_lower_mm ? mm(f.measured_lower_mm) + " to " + mm(f.measured_upper_mm) : "-", c});
  }
  draw_table("faces",
             {{"span"}, {"face"}, {"rings"}, {"taped\n(mm)"}, {"thickness range\nused (mm)"},
              {"from the count (mm)\nbest (range)", true}},
             rows, [&](size_t r) { ImGui::TextUnformatted(rows[r][0].c_str()); }, false);
}

void RingsFillView::draw_counts() {
  ImGui::TextUnformatted("Ring counts");
  if (lines_.empty()) return;
  const bool editable = !read_only();
  if (editable) {
    ImGui::SameLine();
    ImGui::TextDisabled("(tap a row to edit or delete it)");
  }
  std::vector<std::vector<std::string>> rows;
  for (const RingCountLine& l : lines_)
    rows.push_back({l.span_label, l.count.face, l.count.position, std::to_string(l.count.rings),
                    ring_depth_text(l.estimate), mm(l.count.thickness_mm), range_used_text(l),
                    l.count.confidence.empty() ? "-" : l.count.confidence, range_text(l.estimate.from_counts)});
  draw_table("counts",
             {{"span"}, {"face"}, {"position"}, {"rings"}, {"brick +\njoint (mm)"}, {"taped\n(mm)"},
              {"thickness range\nused (mm), basis", true}, {"confidence"}, {"from the\ncount (mm)"}},
             rows, [&](size_t i) {
               const std::string& id = count_ids_[i];
               if (!editable || id.empty()) return ImGui::TextUnformatted(rows[i][0].c_str());
               if (row_choice(rows[i][0], "count" + std::to_string(i), selected_count_ == id))
                 selected_count_ = selected_count_ == id ? std::string() : id;
               probe("rings:count:" + std::to_string(i));
             }, editable);
  for (size_t i = 0; i < lines_.size(); ++i) {
    if (!editable || count_ids_[i].empty() || count_ids_[i] != selected_count_) continue;
    const RingCountLine& l = lines_[i];
    const std::string name = app::ring_count_name(l.span_label, l.count);
    if (ImGui::Button(("Edit " + name + "...###edit-count").c_str())) {
      edit_id_ = count_ids_[i];
      count_dialog_.open_edit(span_choices(), l.count);
    }
    probe("rings:edit-count");
    same_line_if_fits(("Delete " + name + "...").c_str());
    if (ImGui::Button(("Delete " + name + "...###delete-count").c_str())) {
      deleting_ = Deleting{true, count_ids_[i], name};
      open_delete_ = true;
    }
    probe("rings:delete-count");
  }
  // The rules in words, once, and anything missing per count: never on hover.
  if (lines_.front().estimate.from_counts)
    ImGui::TextWrapped("From the count: n \xC3\x97 (brick + joint), range \xC2\xB1" "1 ring unless verified "
                       "through the barrel (common practice).");
  else if (!lines_.front().estimate.warnings.empty())
    ImGui::TextWrapped("From the count: n \xC3\x97 (brick + joint); needs both depths recorded.");
  ImGui::TextWrapped("Thickness range used: as recorded by the surveyor, else the taped depth \xC2\xB1" "1 ring "
                     "(\xC2\xB1" "10 mm when verified).");
  for (const RingCountLine& l : lines_)
    for (const std::string& w : l.estimate.warnings) ImGui::TextWrapped("%s %s", l.span_label.c_str(), w.c_str());
}

void RingsFillView::draw_fill() {
  ImGui::TextUnformatted("Fill depth (road surface to extrados, surfacing included)");
  const auto& fills = data_.data().fill_depths;
  const bool editable = !read_only();
  if (fills.empty()) {
    ImGui::TextDisabled("No fill depths recorded at this visit.");
    return;
  }
  if (editable) {
    ImGui::SameLine();
    ImGui::TextDisabled("(tap a row to edit or delete it)");
  }
  std::vector<std::vector<std::string>> rows;
  for (const storage::FillDepthFields& f : fills)
    rows.push_back({span_label(f.span_id), metres(f.chainage_m, 2), metres(f.offset_y_m, 2),
                    app::fill_method_words(f.method), metres(f.depth_m, 3),
                    f.uncertainty_m ? metres(f.uncertainty_m, 3) : "not recorded", metres(f.surfacing_m, 3),
                    f.notes.empty() ? "-" : f.notes});
  draw_table("fill",
             {{"span"}, {"chainage\nx (m)"}, {"offset\ny (m)"}, {"method"}, {"depth\n(m)"},
              {"uncertainty\n\xC2\xB1 (m)"}, {"surfacing\n(m)"}, {"notes", true}},
             rows, [&](size_t i) {
               const std::string& id = fill_ids_[i];
               if (!editable || id.empty()) return ImGui::TextUnformatted(rows[i][0].c_str());
               if (row_choice(rows[i][0], "fill" + std::to_string(i), selected_fill_ == id))
                 selected_fill_ = selected_fill_ == id ? std::string() : id;
               probe("rings:fill:" + std::to_string(i));
             }, editable);
  for (size_t i = 0; i < fills.size(); ++i) {
    if (!editable || fill_ids_[i].empty() || fill_ids_[i] != selected_fill_) continue;
    const std::string name = app::fill_depth_name(span_label(fills[i].span_id), fills[i]);
    if (ImGui::Button(("Edit fill depth " + name + "...###edit-fill").c_str())) {
      edit_id_ = fill_ids_[i];
      fill_dialog_.open_edit(span_choices(), fills[i]);
    }
    probe("rings:edit-fill");
    same_line_if_fits(("Delete fill depth " + name + "...").c_str());
    if (ImGui::Button(("Delete fill depth " + name + "...###delete-fill").c_str())) {
      deleting_ = Deleting{false, fill_ids_[i], name};
      open_delete_ = true;
    }
    probe("rings:delete-fill");
  }
}

void RingsFillView::draw_delete_popup() {
  constexpr const char* kPopup = "Delete?###rings-delete";
  if (open_delete_) {
    ImGui::OpenPopup(kPopup);
    open_delete_ = false;
  }
  if (!ImGui::BeginPopupModal(kPopup, nullptr, ImGuiWindowFlags_AlwaysAutoResize)) return;
  if (!deleting_) {
    ImGui::CloseCurrentPopup();
    ImGui::EndPopup();
    return;
  }
  const Deleting what = *deleting_;
  const std::string noun = what.count ? "ring count " : "fill depth ";
  ImGui::Text("Delete the %s%s from this visit?", noun.c_str(), what.name.c_str());
  ImGui::TextUnformatted("Undo brings it back.");
  const float f = ImGui::GetFontSize();
  if (ImGui::Button("Delete", ImVec2(f * 6.0f, 0))) {
    message_ = change("Deleted " + noun + what.name, [&] {
      if (what.count) app::delete_ring_count(*project_, what.name, what.id);
      else app::delete_fill_depth(*project_, what.name, what.id);
    });
    deleting_.reset();
    ImGui::CloseCurrentPopup();
  }
  probe("rings:confirm-delete");
  ImGui::SameLine();
  if (ImGui::Button("Keep", ImVec2(f * 6.0f, 0))) {
    deleting_.reset();
    ImGui::CloseCurrentPopup();
  }
  probe("rings:keep");
  ImGui::EndPopup();
}

}  // namespace soffit::gui
