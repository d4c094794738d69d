#include "storage/observation_edits.hpp"

#include <algorithm>
#include <cmath>
#include <nlohmann/json.hpp>

#include "storage/row_stamp.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

using nlohmann::json;

// The keys of defect_vocabulary.md, in its order (FIELD.md §6.1). The schema
// holds the same list in a CHECK; this copy gives the user a readable refusal.
constexpr const char* kDefectTypes[] = {
    "longitudinal_crack", "transverse_crack", "diagonal_crack", "ring_separation", "spalling",
    "mortar_loss", "missing_unit", "dropped_voussoir", "deformation", "spandrel_bulge",
    "spandrel_lean", "spandrel_sliding", "spandrel_separation", "parapet_damage", "impact_damage",
    "seepage", "efflorescence", "vegetation", "scour", "previous_repair", "other"};

std::optional<std::string> text_or_null(const std::string& s) {
  if (s.empty()) return std::nullopt;
  return s;
}

[[noreturn]] void refuse(Connection& db, const std::string& what) {
  throw StorageError(ErrorKind::invalid, db.path(), what);
}

void require_text(Connection& db, const char* record, const char* field, const std::string& value) {
  if (value.find_first_not_of(" \t") == std::string::npos)
    refuse(db, std::string(record) + ": field '" + field + "' is empty");
}

void require_range(Connection& db, const char* record, const char* field, const std::optional<double>& v,
                   double lo, double hi) {
  if (!v) return;
  if (!std::isfinite(*v) || *v < lo || *v > hi)
    refuse(db, std::string(record) + ": field '" + field + "' is " + std::to_string(*v) + ", outside " +
                   std::to_string(lo) + " to " + std::to_string(hi));
}

void require_changed(Connection& db, const char* what, const std::string& id) {
  if (db.changes() == 0) throw StorageError(ErrorKind::not_found, db.path(), std::string("no ") + what + " " + id);
}

const char* frame_key(DefectFrame f) { return f == DefectFrame::soffit ? "soffit" : "elevation"; }

const char* geometry_key(DefectGeometry g) {
  switch (g) {
    case DefectGeometry::point: return "point";
    case DefectGeometry::line: return "line";
    case DefectGeometry::area: return "area";
  }
  return "point";
}

// Checks the defect and returns its geometry as stored: {"points": [[a, b], …]}.
std::string checked_defect_geometry(Connection& db, const DefectFields& f) {
  if (!is_defect_type(f.defect_type))
    refuse(db, "defect " + f.ref + ": field 'defect_type': '" + f.defect_type +
                   "' is not in the vocabulary (storage/defect_vocabulary.md)");
  require_text(db, "defect", "element", f.element);
  require_text(db, "defect", "frame_origin", f.frame_origin);
  const size_t needed = f.geometry == DefectGeometry::point ? 1 : f.geometry == DefectGeometry::line ? 2 : 3;
  if (f.points.size() < needed || (f.geometry == DefectGeometry::point && f.points.size() != 1))
    refuse(db, "defect " + f.ref + ": field 'points': a " + geometry_key(f.geometry) + " needs " +
                   (f.geometry == DefectGeometry::point ? "exactly 1 point" : "at least " + std::to_string(needed) + " points") +
                   ", got " + std::to_string(f.points.size()));
  json points = json::array();
  for (const auto& [a, b] : f.points) {
    if (!std::isfinite(a) || !std::isfinite(b)) refuse(db, "defect " + f.ref + ": field 'points': not a number");
    points.push_back({a, b});
  }
  require_range(db, "defect", "length_m", f.length_m, 0, 1e4);
  // Crack widths above 1 m are not cracks; the bound catches mm/m mix-ups.
  require_range(db, "defect", "width_mm", f.width_mm, 0, 1000);
  require_range(db, "defect", "area_m2", f.area_m2, 0, 1e6);
  if (f.severity_scale == "soffit-1-5" && f.severity && (*f.severity < 1 || *f.severity > 5))
    refuse(db, "defect " + f.ref + ": field 'severity' is " + std::to_string(*f.severity) +
                   "; the soffit-1-5 scale runs from 1 to 5");
  return json{{"points", points}}.dump();
}

}  // namespace

bool is_defect_type(const std::string& type) {
  return std::any_of(std::begin(kDefectTypes), std::end(kDefectTypes), [&](const char* k) { return type == k; });
}

namespace {

// One set of rules for a new and a changed ring count, so an edit cannot store what an add would refuse.
void check_ring_count(Connection& db, const RingCountFields& f) {
  require_text(db, "ring count", "face", f.face);
  require_text(db, "ring count", "position", f.position);
  if (f.rings < 1 || f.rings > 20)
    refuse(db, "ring count: field 'rings' is " + std::to_string(f.rings) + "; expected 1 to 20");
  require_range(db, "ring count", "unit_depth_mm", f.unit_depth_mm, 1, 2000);
  require_range(db, "ring count", "thickness_mm", f.thickness_mm, 1, 5000);
  require_range(db, "ring count", "thickness_lower_mm", f.thickness_lower_mm, 0, 5000);
  require_range(db, "ring count", "thickness_upper_mm", f.thickness_upper_mm, 0, 5000);
  if (f.thickness_lower_mm && f.thickness_upper_mm && *f.thickness_lower_mm > *f.thickness_upper_mm)
    refuse(db, "ring count: field 'thickness_lower_mm' is above 'thickness_upper_mm'");
  if (!f.confidence.empty() && f.confidence != "low" && f.confidence != "medium" && f.confidence != "high")
    refuse(db, "ring count: field 'confidence' is '" + f.confidence + "'; expected low, medium or high");
}

void check_fill_depth(Connection& db, const FillDepthFields& f) {
  if (f.method != "trial_pit" && f.method != "core" && f.method != "gpr" && f.method != "estimate")
    refuse(db, "fill depth: field 'method' is '" + f.method + "'; expected trial_pit, core, gpr or estimate");
  require_range(db, "fill depth", "chainage_m", f.chainage_m, -1e4, 1e4);
  require_range(db, "fill depth", "offset_y_m", f.offset_y_m, -1e4, 1e4);
  // Over 20 m of fill is not an arch bridge; the bound catches mm entered as m.
  require_range(db, "fill depth", "depth_m", f.depth_m, 0, 20);
  require_range(db, "fill depth", "uncertainty_m", f.uncertainty_m, 0, 20);
  require_range(db, "fill depth", "surfacing_m", f.surfacing_m, 0, 5);
  if (f.surfacing_m && *f.surfacing_m > f.depth_m)
    refuse(db, "fill depth: field 'surfacing_m' is deeper than 'depth_m' (the depth includes the surfacing)");
}

}  // namespace

std::string add_ring_count(Connection& db, const std::string& author, const RingCountFields& f) {
  check_ring_count(db, f);
  const std::string id = new_uuid();
  Statement(db,
            "INSERT INTO ring_count (id, inspection_id, span_id, face, position, rings, unit_depth_mm, thickness_mm, "
            "thickness_lower_mm, thickness_upper_mm, confidence, basis, notes, created_at, modified_at, author) "
            "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?14, ?14, ?15)")
      .bind_all(id, f.inspection_id, f.span_id, f.face, f.position, f.rings, f.unit_depth_mm, f.thickness_mm,
                f.thickness_lower_mm, f.thickness_upper_mm, text_or_null(f.confidence), text_or_null(f.basis),
                text_or_null(f.notes), utc_now(), author)
      .run();
  return id;
}

void update_ring_count(Connection& db, const std::string& author, const std::string& ring_count_id,
                       const RingCountFields& f) {
  check_ring_count(db, f);
  Statement(db,
            "UPDATE ring_count SET span_id = ?2, face = ?3, position = ?4, rings = ?5, unit_depth_mm = ?6, "
            "thickness_mm = ?7, thickness_lower_mm = ?8, thickness_upper_mm = ?9, confidence = ?10, basis = ?11, "
            "notes = ?12, modified_at = ?13, author = ?14 WHERE id = ?1")
      .bind_all(ring_count_id, f.span_id, f.face, f.position, f.rings, f.unit_depth_mm, f.thickness_mm,
                f.thickness_lower_mm, f.thickness_upper_mm, text_or_null(f.confidence), text_or_null(f.basis),
                text_or_null(f.notes), utc_now(), author)
      .run();
  require_changed(db, "ring count", ring_count_id);
}

void delete_ring_count(Connection& db, const std::string& ring_count_id) {
  Statement(db, "DELETE FROM ring_count WHERE id = ?1").bind(1, ring_count_id).run();
  require_changed(db, "ring count", ring_count_id);
}

std::string add_fill_depth(Connection& db, const std::string& author, const FillDepthFields& f) {
  check_fill_depth(db, f);
  const std::string id = new_uuid();
  Statement(db,
            "INSERT INTO fill_depth (id, inspection_id, span_id, chainage_m, offset_y_m, method, depth_m, "
            "uncertainty_m, surfacing_m, notes, created_at, modified_at, author) "
            "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?11, ?12)")
      .bind_all(id, f.inspection_id, f.span_id, f.chainage_m, f.offset_y_m, f.method, f.depth_m, f.uncertainty_m,
                f.surfacing_m, text_or_null(f.notes), utc_now(), author)
      .run();
  return id;
}

void update_fill_depth(Connection& db, const std::string& author, const std::string& fill_depth_id,
                       const FillDepthFields& f) {
  check_fill_depth(db, f);
  Statement(db,
            "UPDATE fill_depth SET span_id = ?2, chainage_m = ?3, offset_y_m = ?4, method = ?5, depth_m = ?6, "
            "uncertainty_m = ?7, surfacing_m = ?8, notes = ?9, modified_at = ?10, author = ?11 WHERE id = ?1")
      .bind_all(fill_depth_id, f.span_id, f.chainage_m, f.offset_y_m, f.method, f.depth_m, f.uncertainty_m,
                f.surfacing_m, text_or_null(f.notes), utc_now(), author)
      .run();
  require_changed(db, "fill depth", fill_depth_id);
}

void delete_fill_depth(Connection& db, const std::string& fill_depth_id) {
  Statement(db, "DELETE FROM fill_depth WHERE id = ?1").bind(1, fill_depth_id).run();
  require_changed(db, "fill depth", fill_depth_id);
}

std::string add_defect(Connection& db, const std::string& author, const DefectFields& f) {
  const std::string geometry = checked_defect_geometry(db, f);
  const std::string id = new_uuid();
  Statement(db,
            "INSERT INTO defect (id, inspection_id, span_id, ref, defect_type, element, location_frame, frame_origin, "
            "geometry_kind, geometry_json, length_m, width_mm, area_m2, severity_scale, severity, notes, "
            "created_at, modified_at, author) "
            "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?14, ?15, ?16, ?17, ?17, ?18)")
      .bind_all(id, f.inspection_id, text_or_null(f.span_id), text_or_null(f.ref), f.defect_type, f.element,
                frame_key(f.frame), f.frame_origin, geometry_key(f.geometry), geometry, f.length_m, f.width_mm,
                f.area_m2, f.severity_scale, f.severity, text_or_null(f.notes), utc_now(), author)
      .run();
  return id;
}

void update_defect(Connection& db, const std::string& author, const std::string& defect_id, const DefectFields& f) {
  const std::string geometry = checked_defect_geometry(db, f);
  Statement(db,
            "UPDATE defect SET span_id = ?2, ref = ?3, defect_type = ?4, element = ?5, location_frame = ?6, "
            "frame_origin = ?7, geometry_kind = ?8, geometry_json = ?9, length_m = ?10, width_mm = ?11, "
            "area_m2 = ?12, severity_scale = ?13, severity = ?14, notes = ?15, modified_at = ?16, author = ?17 "
            "WHERE id = ?1")
      .bind_all(defect_id, text_or_null(f.span_id), text_or_null(f.ref), f.defect_type, f.element,
                frame_key(f.frame), f.frame_origin, geometry_key(f.geometry), geometry, f.length_m, f.width_mm,
                f.area_m2, f.severity_scale, f.severity, text_or_null(f.notes), utc_now(), author)
      .run();
  require_changed(db, "defect", defect_id);
}

void delete_defect(Connection& db, const std::string& defect_id) {
  Statement(db, "DELETE FROM defect WHERE id = ?1").bind(1, defect_id).run();
  require_changed(db, "defect", defect_id);
}

void update_span_details(Connection& db, const std::string& author, const std::string& span_id,
                         const SpanDetails& d) {
  require_range(db, "span", "barrel_width_m", d.barrel_width_m, 0.1, 100);
  require_range(db, "span", "skew_deg", d.skew_deg, -89.9, 89.9);
  require_range(db, "span", "unit_depth_mm", d.unit_depth_mm, 1, 2000);
  require_range(db, "span", "joint_thickness_mm", d.joint_thickness_mm, 0, 200);
  require_range(db, "span", "surfacing_depth_m", d.surfacing_depth_m, 0, 5);
  require_range(db, "span", "haunch_backing_height_m", d.haunch_backing_height_m, 0, 50);
  if (!d.ring_material.empty() && d.ring_material != "brick" && d.ring_material != "stone" &&
      d.ring_material != "mixed" && d.ring_material != "other")
    refuse(db, "span: field 'ring_material' is '" + d.ring_material + "'; expected brick, stone, mixed or other");
  const auto number = [](const std::optional<double>& v) { return v ? json(*v) : json(nullptr); };
  std::optional<std::string> walls, supports;
  if (!d.spandrel_walls.empty()) {
    json j = json::array();
    for (const auto& w : d.spandrel_walls)
      j.push_back({{"side", w.side}, {"internal", w.internal}, {"thickness_m", number(w.thickness_m)},
                   {"height_m", number(w.height_m)}, {"position_m", number(w.position_m)}});
    walls = j.dump();
  }
  if (!d.supports.empty()) {
    json j = json::array();
    for (const auto& s : d.supports)
      j.push_back({{"name", s.name}, {"kind", s.kind}, {"thickness_m", number(s.thickness_m)},
                   {"height_m", number(s.height_m)}, {"length_m", number(s.length_m)}, {"notes", s.notes}});
    supports = j.dump();
  }
  Statement(db,
            "UPDATE span SET nominal_shape = ?2, barrel_width_m = ?3, skew_deg = ?4, ring_material = ?5, "
            "unit_depth_mm = ?6, joint_thickness_mm = ?7, fill_material = ?8, surfacing_depth_m = ?9, "
            "haunch_backing_height_m = ?10, spandrel_walls_json = ?11, supports_json = ?12, notes = ?13, "
            "modified_at = ?14, author = ?15 WHERE id = ?1")
      .bind_all(span_id, text_or_null(d.nominal_shape), d.barrel_width_m, d.skew_deg, text_or_null(d.ring_material),
                d.unit_depth_mm, d.joint_thickness_mm, text_or_null(d.fill_material), d.surfacing_depth_m,
                d.haunch_backing_height_m, walls, supports, text_or_null(d.notes), utc_now(), author)
      .run();
  require_changed(db, "span", span_id);
}

void update_inspection_details(Connection& db, const std::string& author, const std::string& inspection_id,
                               const InspectionDetails& d) {
  require_range(db, "inspection", "air_temperature_c", d.air_temperature_c, -60, 60);
  std::optional<std::string> instruments;
  if (!d.instruments.empty()) {
    json j = json::array();
    for (const auto& i : d.instruments)
      j.push_back({{"name", i.name}, {"precision_mm", i.precision_mm ? json(*i.precision_mm) : json(nullptr)}});
    instruments = j.dump();
  }
  Statement(db,
            "UPDATE inspection SET kind = ?2, inspector = ?3, weather = ?4, air_temperature_c = ?5, "
            "instruments_json = ?6, parts_not_inspected = ?7, notes = ?8, modified_at = ?9, author = ?10 "
            "WHERE id = ?1")
      .bind_all(inspection_id, text_or_null(d.kind), text_or_null(d.inspector), text_or_null(d.weather),
                d.air_temperature_c, instruments, text_or_null(d.parts_not_inspected), text_or_null(d.notes),
                utc_now(), author)
      .run();
  require_changed(db, "inspection", inspection_id);
}

}  // namespace soffit::storage
