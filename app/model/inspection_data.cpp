#include "app/model/inspection_data.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdio>

#include "storage/observation_edits.hpp"
#include "storage/storage_error.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::app {

namespace {

// The export carries no database keys; these come in the export's own order
// (by reference, then order of entry) so the two lists pair up one to one.
std::vector<std::string> defect_ids_in_export_order(storage::Connection& db, const std::string& inspection_id) {
  storage::Statement q(db, "SELECT id FROM defect WHERE inspection_id = ?1 ORDER BY ref, rowid");
  q.bind(1, inspection_id);
  std::vector<std::string> ids;
  while (q.step()) ids.push_back(q.column_text(0));
  return ids;
}

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

}  // namespace

double polyline_length(const Readings& readings) {
  std::vector<std::pair<double, double>> p;
  for (const Reading& r : readings)
    if (!r.excluded && !r.check) p.emplace_back(r.x, r.z);
  std::sort(p.begin(), p.end());
  double length = 0;
  for (size_t i = 1; i < p.size(); ++i) length += std::hypot(p[i].first - p[i - 1].first, p[i].second - p[i - 1].second);
  return length;
}

std::string next_defect_ref(const std::vector<DefectOnRecord>& defects) {
  int highest = 0;
  for (const DefectOnRecord& d : defects) {
    const std::string& ref = d.defect.fields.ref;
    if (ref.size() < 2 || (ref[0] != 'D' && ref[0] != 'd')) continue;
    if (!std::all_of(ref.begin() + 1, ref.end(), [](unsigned char c) { return std::isdigit(c); })) continue;
    if (ref.size() > 7) continue;  // not a number we would have made
    highest = std::max(highest, std::stoi(ref.substr(1)));
  }
  char buf[16];
  std::snprintf(buf, sizeof buf, "D%02d", highest + 1);
  return buf;
}

void InspectionData::load(storage::Project& project, const std::string& structure_ref,
                          const std::optional<std::string>& date) {
  project_ = &project;
  structure_ref_ = structure_ref;
  date_ = date;
  reload();
}

void InspectionData::reload() {
  if (!project_) return;
  data_ = storage::load_inspection_export(project_->db(), structure_ref_, date_);
  const auto ids = defect_ids_in_export_order(project_->db(), data_.inspection.id);
  defects_.clear();
  for (size_t i = 0; i < data_.defects.size() && i < ids.size(); ++i) defects_.push_back({ids[i], data_.defects[i]});
}

std::vector<BarrelFrame> InspectionData::barrels() const {
  std::vector<BarrelFrame> out;
  for (const storage::ExportSpan& span : data_.spans) {
    BarrelFrame b;
    b.span_id = span.record.id;
    b.span_label = span.record.label;
    b.origin = span.record.label + " W springing; US face";
    if (span.details.barrel_width_m && *span.details.barrel_width_m > 0) {
      b.width_m = *span.details.barrel_width_m;
      b.width_known = true;
    }
    for (const storage::ExportSection& s : data_.sections)
      if (s.record.span_index == span.record.index) {
        const double l = polyline_length(s.sheet.readings);
        if (l > b.arc_length_m) {  // the longest section's polyline: the fullest profile
          b.arc_length_m = l;
          b.arc_known = true;
        }
      }
    double max_s = 0, max_y = 0;
    for (const DefectOnRecord* d : soffit_defects(b.span_id)) {
      b.origin = d->defect.fields.frame_origin;  // keep to the frame the visit already uses
      for (const auto& [s, y] : d->defect.fields.points) {
        max_s = std::max(max_s, s);
        max_y = std::max(max_y, y);
      }
    }
    if (contains(b.origin, "E springing")) std::swap(b.start_springing, b.end_springing);
    b.y_from_upstream = !contains(b.origin, "DS face");
    // Defects beyond the measured outline still have to show.
    if (max_s > b.arc_length_m) b.arc_length_m = max_s;
    if (max_y > b.width_m) b.width_m = max_y;
    if (b.arc_length_m <= 0) b.arc_length_m = 1.0;
    if (b.width_m <= 0) b.width_m = 1.0;
    out.push_back(b);
  }
  return out;
}

std::vector<const DefectOnRecord*> InspectionData::soffit_defects(const std::string& span_id) const {
  std::vector<const DefectOnRecord*> out;
  for (const DefectOnRecord& d : defects_)
    if (d.defect.fields.frame == storage::DefectFrame::soffit && d.defect.fields.span_id == span_id)
      out.push_back(&d);
  return out;
}

std::string InspectionData::add_point_defect(const BarrelFrame& barrel, const std::string& type, int severity,
                                             double s, double y) {
  if (!project_) return {};
  storage::DefectFields f;
  f.inspection_id = data_.inspection.id;
  f.span_id = barrel.span_id;
  f.ref = next_defect_ref(defects_);
  f.defect_type = type;
  f.element = barrel.span_label + " barrel";
  f.frame = storage::DefectFrame::soffit;
  f.frame_origin = barrel.origin;
  f.geometry = storage::DefectGeometry::point;
  f.points = {{s, y}};
  f.severity = severity;
  const std::string ref = f.ref;
  project_->edit("add defect " + ref, [&](storage::Connection& db) {
    if (severity < 1 || severity > 5)
      throw storage::StorageError(storage::ErrorKind::invalid, db.path(),
                                  "defect " + ref + ": severity " + std::to_string(severity) + " is not 1–5");
    storage::add_defect(db, project_->author(), f);
  });
  reload();
  return ref;
}

void InspectionData::delete_defect(const std::string& id, const std::string& ref) {
  if (!project_) return;
  project_->edit("delete defect " + ref, [&](storage::Connection& db) { storage::delete_defect(db, id); });
  reload();
}

bool InspectionData::undo() {
  const bool done = project_ && project_->undo();
  if (done) reload();
  return done;
}

bool InspectionData::redo() {
  const bool done = project_ && project_->redo();
  if (done) reload();
  return done;
}

std::string InspectionData::undo_label() { return project_ ? project_->undo_label() : std::string(); }
std::string InspectionData::redo_label() { return project_ ? project_->redo_label() : std::string(); }

}  // namespace soffit::app
