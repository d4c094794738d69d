#include "app/gui/rings_fill_view.hpp"

#include <imgui.h>

#include <algorithm>
#include <cstdio>
#include <exception>

#include "app/gui/ui_theme.hpp"

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
  try {
    data_.load(project, structure_ref, date);
  } catch (const std::exception& e) {
    data_ = app::InspectionData();
    message_ = e.what();
  }
  lines_ = data_.loaded() ? ring_count_lines(data_.data()) : std::vector<RingCountLine>{};
  faces_ = face_thicknesses(lines_);
}

void RingsFillView::close() {
  data_ = app::InspectionData();
  lines_.clear();
  faces_.clear();
}

void RingsFillView::reload() {
  if (!data_.loaded()) return;
  try {
    data_.reload();
    message_.clear();
  } catch (const std::exception& e) {
    message_ = e.what();
  }
  lines_ = ring_count_lines(data_.data());
  faces_ = face_thicknesses(lines_);
}

void RingsFillView::draw() {
  if (!data_.loaded()) {
    ImGui::TextWrapped("%s", message_.empty() ? "Open a visit from the structure screen to see its rings and fill."
                                              : message_.c_str());
    return;
  }
  const auto& d = data_.data();
  ImGui::Text("Rings and fill: %s, visit %s", d.structure.fields.name.c_str(), d.inspection.date.c_str());
  ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().caution));
  ImGui::TextWrapped("Survey data, not an assessment: a face count shows the face only; local codes and a qualified "
                     "engineer decide the thickness used.");
  ImGui::PopStyleColor();
  if (!message_.empty()) ImGui::TextWrapped("%s", message_.c_str());
  draw_faces();
  draw_counts();
  draw_fill();
}

void RingsFillView::draw_faces() {
  ImGui::TextUnformatted("Ring thickness by face (mm)");
  if (faces_.empty()) {
    ImGui::TextDisabled("No ring counts recorded at this visit.");
    return;
  }
  if (!ImGui::BeginTable("faces", 5, ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg)) return;
  for (const char* h : {"span", "face", "rings", "measured (range)", "from the count (range)"})
    ImGui::TableSetupColumn(h);
  ImGui::TableHeadersRow();
  for (const FaceThickness& f : faces_) {
    ImGui::TableNextRow();
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(f.span_label.c_str());
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(f.face.c_str());
    ImGui::TableNextColumn();
    if (f.rings_min == f.rings_max) ImGui::Text("%d", f.rings_min);
    else ImGui::Text("%d to %d", f.rings_min, f.rings_max);
    ImGui::TableNextColumn();
    std::string m = f.measured_min_mm ? mm(f.measured_min_mm) + " to " + mm(f.measured_max_mm) : "-";
    if (f.measured_lower_mm) m += " (" + mm(f.measured_lower_mm) + " to " + mm(f.measured_upper_mm) + ")";
    ImGui::TextUnformatted(m.c_str());
    ImGui::TableNextColumn();
    std::string c = mm(f.from_counts_mm);
    if (f.count_lower_mm && f.count_upper_mm) c += " (" + mm(f.count_lower_mm) + " to " + mm(f.count_upper_mm) + ")";
    ImGui::TextUnformatted(c.c_str());
  }
  ImGui::EndTable();
}

void RingsFillView::draw_counts() {
  ImGui::TextUnformatted("Ring counts");
  if (lines_.empty()) return;
  if (!ImGui::BeginTable("counts", 8, ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg)) return;
  for (const char* h : {"span", "face", "position", "rings", "unit depth mm", "measured mm (range)", "confidence",
                        "from the count mm (range)"})
    ImGui::TableSetupColumn(h);
  ImGui::TableHeadersRow();
  for (const RingCountLine& l : lines_) {
    ImGui::TableNextRow();
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(l.span_label.c_str());
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(l.count.face.c_str());
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(l.count.position.c_str());
    ImGui::TableNextColumn();
    ImGui::Text("%d", l.count.rings);
    ImGui::TableNextColumn();
    const std::string unit = mm(l.estimate.unit_depth_mm) +
                             (l.estimate.unit_depth_from.empty() ? "" : " (" + l.estimate.unit_depth_from + ")");
    ImGui::TextUnformatted(unit.c_str());
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(range_text(l.estimate.measured).c_str());
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(l.count.confidence.empty() ? "-" : l.count.confidence.c_str());
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(range_text(l.estimate.from_counts).c_str());
  }
  ImGui::EndTable();
  // The rule in words, once, and anything missing per count: never on hover.
  if (!lines_.empty()) {
    if (const auto& c = lines_.front().estimate.from_counts) ImGui::TextWrapped("From the count: %s.", c->rule.c_str());
    if (const auto& m = lines_.front().estimate.measured) ImGui::TextWrapped("Measured: %s.", m->rule.c_str());
  }
  for (const RingCountLine& l : lines_)
    for (const std::string& w : l.estimate.warnings) ImGui::TextWrapped("%s %s", l.span_label.c_str(), w.c_str());
}

void RingsFillView::draw_fill() {
  ImGui::TextUnformatted("Fill depth (road surface to extrados, surfacing included)");
  const auto& fills = data_.data().fill_depths;
  if (fills.empty()) {
    ImGui::TextDisabled("No fill depths recorded at this visit.");
    return;
  }
  if (!ImGui::BeginTable("fill", 6, ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg)) return;
  for (const char* h : {"span", "chainage m", "offset y m", "method", "depth m", "surfacing m"})
    ImGui::TableSetupColumn(h);
  ImGui::TableHeadersRow();
  for (const storage::FillDepthFields& f : fills) {
    std::string span;
    for (const storage::ExportSpan& s : data_.data().spans)
      if (s.record.id == f.span_id) span = s.record.label;
    ImGui::TableNextRow();
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(span.c_str());
    ImGui::TableNextColumn();
    ImGui::Text("%.2f", f.chainage_m);
    ImGui::TableNextColumn();
    if (f.offset_y_m) ImGui::Text("%.2f", *f.offset_y_m);
    else ImGui::TextUnformatted("-");
    ImGui::TableNextColumn();
    ImGui::TextUnformatted(f.method.c_str());
    ImGui::TableNextColumn();
    if (f.uncertainty_m) ImGui::Text("%.3f +- %.3f", f.depth_m, *f.uncertainty_m);
    else ImGui::Text("%.3f (uncertainty not recorded)", f.depth_m);
    ImGui::TableNextColumn();
    if (f.surfacing_m) ImGui::Text("%.3f", *f.surfacing_m);
    else ImGui::TextUnformatted("-");
  }
  ImGui::EndTable();
}

}  // namespace soffit::gui
