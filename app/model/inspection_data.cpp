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

std::string lower(std::string text) {
  std::transform(text.begin(), text.end(), text.begin(), [](unsigned char c) { return std::tolower(c); });
  return text;
}

std::string metres(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.2f m", v);
  return buf;
}

// The intrados of a span as surveyed, for drawing it on a spandrel wall: the
// section on that face if there is one, else the fullest; x from its first
// station, z above the mean of its two end (springing) stations.
struct SpanOutline {
  bool found = false;
  std::string section;
  double span_m = 0, rise_m = 0;
  PlanePath intrados;
};

SpanOutline span_outline(const storage::InspectionExportData& data, int span_index, const std::string& face) {
  const storage::ExportSection* best = nullptr;
  size_t best_count = 0;
  for (const storage::ExportSection& s : data.sections) {
    if (s.record.span_index != span_index) continue;
    size_t n = 0;
    for (const Reading& r : s.sheet.readings) n += !r.excluded && !r.check;
    const bool on_face = s.record.label == face;
    const bool best_on_face = best && best->record.label == face;
    if (n >= 3 && (!best || (on_face && !best_on_face) || (on_face == best_on_face && n > best_count))) {
      best = &s;
      best_count = n;
    }
  }
  SpanOutline out;
  if (!best) return out;
  PlanePath p;
  for (const Reading& r : best->sheet.readings)
    if (!r.excluded && !r.check) p.emplace_back(r.x, r.z);
  std::sort(p.begin(), p.end());
  const double x0 = p.front().first, z0 = (p.front().second + p.back().second) / 2;
  for (auto& [x, z] : p) {
    x -= x0;
    z -= z0;
    out.rise_m = std::max(out.rise_m, z);
  }
  out.span_m = p.back().first;
  if (out.span_m <= 0) return out;
  out.found = true;
  out.section = best->record.label;
  out.intrados = std::move(p);
  return out;
}

// Whether an elevation defect, by the words of its origin and element, is on `e`.
bool names_elevation(const ElevationFrame& e, const storage::DefectFields& d) {
  const std::string text = lower(d.frame_origin + " " + d.element);
  switch (e.kind) {
    case ElevationKind::us_spandrel:
      return d.span_id == e.span_id && (contains(text, "us spandrel") || contains(text, "upstream spandrel"));
    case ElevationKind::ds_spandrel:
      return d.span_id == e.span_id && (contains(text, "ds spandrel") || contains(text, "downstream spandrel"));
    case ElevationKind::support:
      return (d.span_id.empty() || d.span_id == e.span_id) && contains(text, lower(e.name));
    case ElevationKind::other: return d.frame_origin == e.origin && d.span_id == e.record_span_id;
  }
  return false;
}


// How far off a point may be before it gets a note: a finger-drawn mark or a
// taped position is good to a few centimetres (common practice), the
// stations to about 3 mm (FIELD.md §10.2).
constexpr double kPlacementSlackM = 0.05;

// "1.0", "3.2", "1.59": two decimals, a trailing zero dropped, as a person writes them.
std::string short_number(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.2f", v + 0.0);
  std::string text = buf;
  if (text == "-0.00") text = "0.00";
  if (text.back() == '0') text.pop_back();
  return text;
}

// z of the polyline `path` (sorted by x) at `x`, straight between stations;
// nullopt outside its stations. Between stations the chord lies under the
// curve of an arch, so this errs towards leaving a point unflagged.
std::optional<double> height_at(const PlanePath& path, double x) {
  if (path.size() < 2 || x < path.front().first || x > path.back().first) return std::nullopt;
  for (size_t i = 1; i < path.size(); ++i) {
    const auto& [x0, z0] = path[i - 1];
    const auto& [x1, z1] = path[i];
    if (x > x1) continue;
    if (x1 - x0 <= 0) return std::max(z0, z1);
    return z0 + (z1 - z0) * (x - x0) / (x1 - x0);
  }
  return path.back().second;
}

// "D07, point 1 of 4: " or "D03: ", so a line or an area says which point is off.
std::string note_prefix(const DefectOnRecord& d, size_t index) {
  const auto& points = d.defect.fields.points;
  if (points.size() <= 1) return d.defect.fields.ref + ": ";
  return d.defect.fields.ref + ", point " + std::to_string(index + 1) + " of " + std::to_string(points.size()) + ": ";
}

// Why a spandrel point is off the wall, or empty when it is on it.
std::string spandrel_problem(const ElevationFrame& e, double x, double z) {
  const std::string where = " at x " + short_number(x);
  if (e.surveyed_span_m && (x < -kPlacementSlackM || x > *e.surveyed_span_m + kPlacementSlackM))
    return "x " + short_number(x) + " is outside the span (0 to " + short_number(*e.surveyed_span_m) + " m surveyed)";
  if (z < -kPlacementSlackM)
    return short_number(-z) + " m below the springing" + where + " is under the springing line, off the wall";
  if (const auto intrados = height_at(e.intrados, x); intrados && z < *intrados - kPlacementSlackM)
    return short_number(z) + " m above the springing" + where + " is below the intrados (" + short_number(*intrados) +
           " m), in the arch opening";
  if (e.recorded_height_m && z > *e.recorded_height_m + kPlacementSlackM)
    return short_number(z) + " m above the springing" + where + " is above the recorded wall height (" +
           short_number(*e.recorded_height_m) + " m)";
  return {};
}

// Why a barrel point is off the soffit, or empty when it is on it.
std::string barrel_problem(const BarrelFrame& b, double s, double y) {
  // A taped arc runs up to 1 % longer than the chords between stations (chord = 2R sin(θ/2), R ≈ 4 m, stations ≤ 0.8 m apart).
  if (b.arc_known && (s < -kPlacementSlackM || s > b.surveyed_arc_m * 1.01 + kPlacementSlackM))
    return "s " + short_number(s) + " (y " + short_number(y) + ") is outside the arc (0 to " +
           short_number(b.surveyed_arc_m) + " m along the intrados)";
  if (b.width_known && (y < -kPlacementSlackM || y > b.recorded_width_m + kPlacementSlackM))
    return "y " + short_number(y) + " (s " + short_number(s) + ") is outside the barrel width (0 to " +
           short_number(b.recorded_width_m) + " m)";
  return {};
}

template <typename Problem>
std::vector<PlacementNote> notes_for(const std::vector<const DefectOnRecord*>& defects, const Problem& problem) {
  std::vector<PlacementNote> out;
  for (const DefectOnRecord* d : defects) {
    const auto& points = d->defect.fields.points;
    for (size_t i = 0; i < points.size(); ++i) {
      const std::string why = problem(points[i].first, points[i].second);
      if (why.empty()) continue;
      out.push_back({d->id, d->defect.fields.ref, note_prefix(*d, i) + why + ": check its position or frame"});
      break;
    }
  }
  return out;
}

}  // namespace

std::vector<PlacementNote> placement_notes(const ElevationFrame& frame, const std::vector<const DefectOnRecord*>& defects) {
  if (frame.kind != ElevationKind::us_spandrel && frame.kind != ElevationKind::ds_spandrel) return {};
  return notes_for(defects, [&](double x, double z) { return spandrel_problem(frame, x, z); });
}

std::vector<PlacementNote> placement_notes(const BarrelFrame& barrel, const std::vector<const DefectOnRecord*>& defects) {
  return notes_for(defects, [&](double s, double y) { return barrel_problem(barrel, s, y); });
}

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
      b.width_m = b.recorded_width_m = *span.details.barrel_width_m;
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
    b.surveyed_arc_m = b.arc_length_m;
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

std::vector<ElevationFrame> InspectionData::all_elevations() const {
  std::vector<ElevationFrame> out;
  for (const storage::ExportSpan& span : data_.spans) {
    const std::string& label = span.record.label;
    for (const std::string side : {"US", "DS"}) {
      ElevationFrame e;
      e.kind = side == "US" ? ElevationKind::us_spandrel : ElevationKind::ds_spandrel;
      e.span_id = e.record_span_id = span.record.id;
      e.span_label = label;
      e.name = side + " spandrel";
      e.element = label + " " + side + " spandrel wall";
      e.origin = label + " " + side + " spandrel elevation: x from the " + label + " W springing, z above the springing";
      e.seen_from_downstream = side == "DS";
      e.x_zero_label = label + " W springing";
      e.z_zero_label = "springing line";
      const SpanOutline o = span_outline(data_, span.record.index, side);
      if (o.found) {
        e.x_max = o.span_m;
        e.surveyed_span_m = o.span_m;
        e.width_basis = "span " + metres(o.span_m) + " (end stations of section " + o.section + ")";
        e.intrados = o.intrados;
      } else {
        e.x_max = 6.0;
        e.width_assumed = true;
        e.width_basis = "span not surveyed: drawn 6.00 m wide";
      }
      std::optional<double> height;
      for (const storage::SpandrelWall& w : span.details.spandrel_walls)
        if (!w.internal && w.side == side && w.height_m && *w.height_m > 0) height = w.height_m;
      if (height) {
        e.z_max = *height;
        e.recorded_height_m = height;
        e.height_basis = "wall height " + metres(*height) + " (span details)";
      } else {
        // A stand-in only: the wall reaches at least the crown, and there is
        // fill and surfacing above that (FIELD.md §5, about 0.3–1 m over the crown).
        e.z_max = (o.found ? o.rise_m : 2.0) + 1.0;
        e.height_assumed = true;
        e.height_basis = "wall height not recorded, drawn " + metres(e.z_max) + " (rise + 1 m)";
      }
      out.push_back(std::move(e));
    }
    for (const storage::SupportDimensions& sup : span.details.supports) {
      ElevationFrame e;
      e.kind = ElevationKind::support;
      e.span_id = e.record_span_id = span.record.id;
      e.span_label = label;
      e.name = sup.name;
      e.element = sup.name;
      const bool pier = sup.kind == "pier";
      const bool east = contains(lower(sup.name), "e abutment") || contains(lower(sup.name), "east");
      const double t = sup.thickness_m && *sup.thickness_m > 0 ? *sup.thickness_m : 1.0;
      const double h = sup.height_m && *sup.height_m > 0 ? *sup.height_m : 2.0;
      e.width_assumed = !(sup.thickness_m && *sup.thickness_m > 0);
      e.height_assumed = !(sup.height_m && *sup.height_m > 0);
      e.width_basis = e.width_assumed ? "thickness not recorded: drawn 1.00 m" : "thickness " + metres(t) + " (span details)";
      e.height_basis = e.height_assumed ? "height not recorded: drawn 2.00 m" : "height " + metres(h) + " (span details)";
      e.x_min = pier ? -t / 2 : east ? 0 : -t;
      e.x_max = pier ? t / 2 : east ? t : 0;
      e.z_max = h;
      e.x_zero_label = pier ? "centre line" : "face under the springing";
      e.z_zero_label = "footing top";
      e.origin = sup.name + ", seen from upstream: x along the span from its " + e.x_zero_label +
                 ", z up from the footing top";
      out.push_back(std::move(e));
    }
  }
  // Each elevation defect goes to the first frame it names; the rest make frames of their own.
  for (const DefectOnRecord& d : defects_) {
    const storage::DefectFields& f = d.defect.fields;
    if (f.frame != storage::DefectFrame::elevation) continue;
    auto it = std::find_if(out.begin(), out.end(), [&](const ElevationFrame& e) { return names_elevation(e, f); });
    if (it == out.end()) {
      ElevationFrame e;
      e.kind = ElevationKind::other;
      e.record_span_id = f.span_id;
      e.span_id = !f.span_id.empty() || data_.spans.empty() ? f.span_id : data_.spans.front().record.id;
      for (const storage::ExportSpan& span : data_.spans)
        if (span.record.id == e.span_id) e.span_label = span.record.label;
      e.name = f.element;
      if (!e.span_label.empty() && e.name.rfind(e.span_label + " ", 0) == 0) e.name.erase(0, e.span_label.size() + 1);
      e.element = f.element;
      e.origin = f.frame_origin;
      e.x_max = e.z_max = 0;
      e.width_assumed = e.height_assumed = true;
      e.width_basis = "no dimensions recorded: drawn to take in the defects on it";
      // x_zero_label and z_zero_label stay empty: only the frame's own words say where 0 is.
      out.push_back(std::move(e));
      it = out.end() - 1;
    }
    if (it->defect_ids.empty()) it->origin = f.frame_origin;  // keep to the frame the visit already uses
    it->defect_ids.push_back(d.id);
    for (const auto& [x, z] : f.points) {
      const double margin = it->kind == ElevationKind::other ? 0.5 : 0.0;
      it->x_min = std::min(it->x_min, x - margin);
      it->x_max = std::max(it->x_max, x + margin);
      it->z_min = std::min(it->z_min, z - margin);
      it->z_max = std::max(it->z_max, z + margin);
    }
  }
  for (ElevationFrame& e : out) {
    if (e.x_max - e.x_min < 1.0) e.x_max = e.x_min + 1.0;
    if (e.z_max - e.z_min < 1.0) e.z_max = e.z_min + 1.0;
  }
  return out;
}

std::vector<ElevationFrame> InspectionData::elevations(const std::string& span_id) const {
  std::vector<ElevationFrame> out;
  for (ElevationFrame& e : all_elevations())
    if (e.span_id == span_id) out.push_back(std::move(e));
  return out;
}

std::vector<const DefectOnRecord*> InspectionData::elevation_defects(const ElevationFrame& frame) const {
  std::vector<const DefectOnRecord*> out;
  for (const DefectOnRecord& d : defects_)
    if (std::find(frame.defect_ids.begin(), frame.defect_ids.end(), d.id) != frame.defect_ids.end()) out.push_back(&d);
  return out;
}

std::string InspectionData::add_point_defect(const BarrelFrame& barrel, const std::string& type, int severity,
                                             double s, double y) {
  return add_defect(barrel.place(), storage::DefectGeometry::point, {{s, y}}, DefectDraft{type, severity, {}, {}});
}

std::string InspectionData::add_defect(const DefectPlace& place, storage::DefectGeometry geometry,
                                       const PlanePath& points, const DefectDraft& draft) {
  if (!project_) return {};
  storage::DefectFields f;
  f.inspection_id = data_.inspection.id;
  f.span_id = place.span_id;
  f.ref = next_defect_ref(defects_);
  f.defect_type = draft.type;
  f.element = place.element;
  f.frame = place.frame;
  f.frame_origin = place.origin;
  f.geometry = geometry;
  f.points = points;
  // Measured facts, kept apart from the grade (FIELD.md §6.2).
  if (geometry == storage::DefectGeometry::line) f.length_m = path_length(points);
  if (geometry == storage::DefectGeometry::area) f.area_m2 = shoelace_area(points);
  f.width_mm = draft.width_mm;
  f.severity = draft.severity;
  f.notes = draft.notes;
  const std::string ref = f.ref;
  const int severity = draft.severity;
  project_->edit("add defect " + ref, [&](storage::Connection& db) {
    if (severity < 1 || severity > 5)
      throw storage::StorageError(storage::ErrorKind::invalid, db.path(),
                                  "defect " + ref + ": severity " + std::to_string(severity) + " is not 1–5");
    storage::add_defect(db, project_->author(), f);
  });
  reload();
  return ref;
}

void InspectionData::update_defect(const std::string& id, const DefectDraft& draft) {
  if (!project_) return;
  const auto it = std::find_if(defects_.begin(), defects_.end(), [&](const DefectOnRecord& d) { return d.id == id; });
  if (it == defects_.end()) throw storage::StorageError(storage::ErrorKind::not_found, project_->db().path(), "no defect " + id);
  storage::DefectFields f = it->defect.fields;
  f.inspection_id = data_.inspection.id;
  f.defect_type = draft.type;
  f.severity = draft.severity;
  f.width_mm = draft.width_mm;
  f.notes = draft.notes;
  const std::string ref = f.ref;
  project_->edit("edit defect " + ref, [&](storage::Connection& db) {
    if (draft.severity < 1 || draft.severity > 5)
      throw storage::StorageError(storage::ErrorKind::invalid, db.path(),
                                  "defect " + ref + ": severity " + std::to_string(draft.severity) + " is not 1–5");
    storage::update_defect(db, project_->author(), id, f);
  });
  reload();
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
