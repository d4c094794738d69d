#include "storage/export_queries.hpp"

#include <array>
#include <charconv>
#include <filesystem>
#include <nlohmann/json.hpp>
#include <set>

#include "storage/register_queries.hpp"
#include "storage/sha256.hpp"
#include "storage/sheet_export.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

using nlohmann::json;

std::optional<double> number_or_null(const json& j, const char* key) {
  const auto it = j.find(key);
  if (it == j.end() || !it->is_number()) return std::nullopt;
  return it->get<double>();
}

std::string text_of(const json& j, const char* key) {
  const auto it = j.find(key);
  return it != j.end() && it->is_string() ? it->get<std::string>() : std::string();
}

// The JSON columns were written by update_span_details / update_inspection_details;
// anything else in them (a hand-edited file) is read as far as it makes sense.
json parse_array(const std::string& text) {
  if (text.empty()) return json::array();
  json j = json::parse(text, nullptr, false);
  return j.is_array() ? j : json::array();
}

bool is_iso_date(const std::string& d) {
  if (d.size() != 10 || d[4] != '-' || d[7] != '-') return false;
  for (size_t i : {0, 1, 2, 3, 5, 6, 8, 9})
    if (d[i] < '0' || d[i] > '9') return false;
  return true;
}

SpanDetails span_details(Connection& db, const std::string& span_id) {
  Statement q(db,
              "SELECT nominal_shape, barrel_width_m, skew_deg, ring_material, unit_depth_mm, joint_thickness_mm, "
              "fill_material, surfacing_depth_m, haunch_backing_height_m, spandrel_walls_json, supports_json, notes "
              "FROM span WHERE id = ?1");
  q.bind(1, span_id);
  SpanDetails d;
  if (!q.step()) return d;
  d.nominal_shape = q.column_text(0);
  d.barrel_width_m = q.column_double_or_null(1);
  d.skew_deg = q.column_double_or_null(2);
  d.ring_material = q.column_text(3);
  d.unit_depth_mm = q.column_double_or_null(4);
  d.joint_thickness_mm = q.column_double_or_null(5);
  d.fill_material = q.column_text(6);
  d.surfacing_depth_m = q.column_double_or_null(7);
  d.haunch_backing_height_m = q.column_double_or_null(8);
  for (const json& w : parse_array(q.column_text(9))) {
    if (!w.is_object()) continue;
    SpandrelWall wall;
    wall.side = text_of(w, "side");
    wall.internal = w.value("internal", false);
    wall.thickness_m = number_or_null(w, "thickness_m");
    wall.height_m = number_or_null(w, "height_m");
    wall.position_m = number_or_null(w, "position_m");
    d.spandrel_walls.push_back(std::move(wall));
  }
  for (const json& s : parse_array(q.column_text(10))) {
    if (!s.is_object()) continue;
    SupportDimensions support;
    support.name = text_of(s, "name");
    support.kind = text_of(s, "kind");
    support.thickness_m = number_or_null(s, "thickness_m");
    support.height_m = number_or_null(s, "height_m");
    support.length_m = number_or_null(s, "length_m");
    support.notes = text_of(s, "notes");
    d.supports.push_back(std::move(support));
  }
  d.notes = q.column_text(11);
  return d;
}

// The visit to export: that date's (or the latest date's) newest revision
// that no other revision supersedes.
const InspectionRecord& choose_inspection(Connection& db, const StructureDetail& detail,
                                          const std::optional<std::string>& date) {
  std::set<std::string> superseded;
  {
    Statement q(db, "SELECT supersedes_id FROM inspection WHERE structure_id = ?1 AND supersedes_id IS NOT NULL");
    q.bind(1, detail.structure.id);
    while (q.step()) superseded.insert(q.column_text(0));
  }
  const InspectionRecord* chosen = nullptr;
  for (const InspectionRecord& i : detail.inspections) {  // by date, then revision
    if (superseded.count(i.id) || (date && i.date != *date)) continue;
    chosen = &i;
  }
  if (chosen) return *chosen;
  const std::string ref = detail.structure.fields.ref;
  if (detail.inspections.empty())
    throw StorageError(ErrorKind::not_found, db.path(), "structure '" + ref + "' has no inspection to export");
  std::string dates;
  for (const InspectionRecord& i : detail.inspections)
    if (dates.find(i.date) == std::string::npos) dates += (dates.empty() ? "" : ", ") + i.date;
  throw StorageError(ErrorKind::not_found, db.path(),
                     "structure '" + ref + "' has no inspection on " + *date + " (its inspections: " + dates + ")");
}

ExportInspection inspection_of(Connection& db, const InspectionRecord& record) {
  ExportInspection out;
  out.id = record.id;
  out.date = record.date;
  out.status = record.status;
  out.revision = record.revision;
  Statement q(db,
              "SELECT kind, inspector, weather, air_temperature_c, instruments_json, parts_not_inspected, notes, "
              "supersedes_id, revision_reason, revision_author, revision_at FROM inspection WHERE id = ?1");
  q.bind(1, record.id);
  if (!q.step()) throw StorageError(ErrorKind::not_found, db.path(), "no inspection " + record.id);
  InspectionDetails& d = out.details;
  d.kind = q.column_text(0);
  d.inspector = q.column_text(1);
  d.weather = q.column_text(2);
  d.air_temperature_c = q.column_double_or_null(3);
  for (const json& i : parse_array(q.column_text(4)))
    if (i.is_object()) d.instruments.push_back({text_of(i, "name"), number_or_null(i, "precision_mm")});
  d.parts_not_inspected = q.column_text(5);
  d.notes = q.column_text(6);
  out.supersedes_id = q.column_text(7);
  out.revision_reason = q.column_text(8);
  out.revision_author = q.column_text(9);
  out.revision_at = q.column_text(10);
  return out;
}

std::vector<RingCountFields> ring_counts_of(Connection& db, const std::string& inspection_id) {
  Statement q(db,
              "SELECT r.span_id, r.face, r.position, r.rings, r.unit_depth_mm, r.thickness_mm, r.thickness_lower_mm, "
              "r.thickness_upper_mm, r.confidence, r.basis, r.notes FROM ring_count r JOIN span s ON s.id = r.span_id "
              "WHERE r.inspection_id = ?1 ORDER BY s.span_index, r.face, r.rowid");
  q.bind(1, inspection_id);
  std::vector<RingCountFields> out;
  while (q.step()) {
    RingCountFields r;
    r.inspection_id = inspection_id;
    r.span_id = q.column_text(0);
    r.face = q.column_text(1);
    r.position = q.column_text(2);
    r.rings = static_cast<int>(q.column_int64(3));
    r.unit_depth_mm = q.column_double_or_null(4);
    r.thickness_mm = q.column_double_or_null(5);
    r.thickness_lower_mm = q.column_double_or_null(6);
    r.thickness_upper_mm = q.column_double_or_null(7);
    r.confidence = q.column_text(8);
    r.basis = q.column_text(9);
    r.notes = q.column_text(10);
    out.push_back(std::move(r));
  }
  return out;
}

std::vector<FillDepthFields> fill_depths_of(Connection& db, const std::string& inspection_id) {
  Statement q(db,
              "SELECT f.span_id, f.chainage_m, f.offset_y_m, f.method, f.depth_m, f.uncertainty_m, f.surfacing_m, "
              "f.notes FROM fill_depth f JOIN span s ON s.id = f.span_id WHERE f.inspection_id = ?1 "
              "ORDER BY s.span_index, f.chainage_m, f.offset_y_m, f.rowid");
  q.bind(1, inspection_id);
  std::vector<FillDepthFields> out;
  while (q.step()) {
    FillDepthFields f;
    f.inspection_id = inspection_id;
    f.span_id = q.column_text(0);
    f.chainage_m = q.column_double(1);
    f.offset_y_m = q.column_double_or_null(2);
    f.method = q.column_text(3);
    f.depth_m = q.column_double(4);
    f.uncertainty_m = q.column_double_or_null(5);
    f.surfacing_m = q.column_double_or_null(6);
    f.notes = q.column_text(7);
    out.push_back(std::move(f));
  }
  return out;
}

std::vector<ExportDefect> defects_of(Connection& db, const std::string& inspection_id) {
  Statement q(db,
              "SELECT d.span_id, s.label, d.ref, d.defect_type, d.element, d.location_frame, d.frame_origin, "
              "d.geometry_kind, d.geometry_json, d.length_m, d.width_mm, d.area_m2, d.severity_scale, d.severity, "
              "d.notes, (SELECT count(*) FROM photo_defect l WHERE l.defect_id = d.id) "
              "FROM defect d LEFT JOIN span s ON s.id = d.span_id WHERE d.inspection_id = ?1 "
              "ORDER BY d.ref, d.rowid");
  q.bind(1, inspection_id);
  std::vector<ExportDefect> out;
  while (q.step()) {
    ExportDefect e;
    DefectFields& f = e.fields;
    f.inspection_id = inspection_id;
    f.span_id = q.column_text(0);
    e.span_label = q.column_text(1);
    f.ref = q.column_text(2);
    f.defect_type = q.column_text(3);
    f.element = q.column_text(4);
    f.frame = q.column_text(5) == "elevation" ? DefectFrame::elevation : DefectFrame::soffit;
    f.frame_origin = q.column_text(6);
    const std::string kind = q.column_text(7);
    f.geometry = kind == "line" ? DefectGeometry::line : kind == "area" ? DefectGeometry::area : DefectGeometry::point;
    const json g = json::parse(q.column_text(8), nullptr, false);
    if (g.is_object() && g.contains("points") && g["points"].is_array())
      for (const json& p : g["points"])
        if (p.is_array() && p.size() == 2 && p[0].is_number() && p[1].is_number())
          f.points.emplace_back(p[0].get<double>(), p[1].get<double>());
    f.length_m = q.column_double_or_null(9);
    f.width_mm = q.column_double_or_null(10);
    f.area_m2 = q.column_double_or_null(11);
    f.severity_scale = q.column_text(12);
    if (auto s = q.column_int_or_null(13)) f.severity = static_cast<int>(*s);
    f.notes = q.column_text(14);
    e.photo_count = static_cast<int>(q.column_int64(15));
    out.push_back(std::move(e));
  }
  return out;
}

// Exact and locale-independent, as fit_cache does: equal text only for the same double.
std::string exact(double v) {
  std::array<char, 64> buf{};
  const auto r = std::to_chars(buf.data(), buf.data() + buf.size(), v, std::chars_format::hex);
  return std::string(buf.data(), r.ptr);
}

std::string exact(const std::optional<double>& v) { return v ? exact(*v) : std::string("null"); }

// Text fields may hold line breaks; their length first keeps the text unambiguous.
std::string quoted(const std::string& s) { return std::to_string(s.size()) + ":" + s; }

}  // namespace

InspectionExportData load_inspection_export(Connection& db, const std::string& structure_ref,
                                            const std::optional<std::string>& date) {
  if (date && !is_iso_date(*date))
    throw StorageError(ErrorKind::invalid, db.path(), "inspection date '" + *date + "' is not YYYY-MM-DD");
  const auto detail = structure_detail(db, structure_ref);
  if (!detail)
    throw StorageError(ErrorKind::not_found, db.path(), "no structure with reference '" + structure_ref + "'");
  InspectionExportData data;
  data.project_file_name = std::filesystem::path(db.path()).filename().string();
  data.structure = detail->structure;
  for (const SpanRecord& s : detail->spans) data.spans.push_back({s, span_details(db, s.id)});
  const InspectionRecord& visit = choose_inspection(db, *detail, date);
  data.inspection = inspection_of(db, visit);
  for (const SectionRecord& s : visit.sections) data.sections.push_back({s, load_section_sheet(db, s.id)});
  data.ring_counts = ring_counts_of(db, visit.id);
  data.fill_depths = fill_depths_of(db, visit.id);
  data.defects = defects_of(db, visit.id);
  const std::string text = export_inputs_text(data);
  data.inputs_sha256 = sha256_hex(text.data(), text.size());
  return data;
}

std::string export_inputs_text(const InspectionExportData& d) {
  // Rows point at spans by key; the hash uses the span's index instead, so
  // that the same survey entered into two projects hashes alike.
  const auto span_of = [&](const std::string& span_id) {
    for (const ExportSpan& s : d.spans)
      if (s.record.id == span_id) return std::to_string(s.record.index);
    return std::string("null");
  };
  std::string t = "soffit-geometry-input 1\n";
  const StructureFields& s = d.structure.fields;
  t += "structure " + quoted(s.ref) + " " + quoted(s.name) + " " + exact(s.latitude_deg) + " " +
       exact(s.longitude_deg) + " " + (s.location_fictitious ? "1" : "0") + " " + quoted(s.carries) + " " +
       quoted(s.crosses) + " " + (s.span_count ? std::to_string(*s.span_count) : "null") + " " + quoted(s.notes) +
       "\n";
  for (const ExportSpan& span : d.spans) {
    const SpanDetails& x = span.details;
    t += "span " + std::to_string(span.record.index) + " " + quoted(span.record.label) + " " +
         quoted(x.nominal_shape) + " " + exact(x.barrel_width_m) + " " + exact(x.skew_deg) + " " +
         quoted(x.ring_material) + " " + exact(x.unit_depth_mm) + " " + exact(x.joint_thickness_mm) + " " +
         quoted(x.fill_material) + " " + exact(x.surfacing_depth_m) + " " + exact(x.haunch_backing_height_m) + " " +
         quoted(x.notes) + "\n";
    for (const SpandrelWall& w : x.spandrel_walls)
      t += " wall " + quoted(w.side) + " " + (w.internal ? "1" : "0") + " " + exact(w.thickness_m) + " " +
           exact(w.height_m) + " " + exact(w.position_m) + "\n";
    for (const SupportDimensions& p : x.supports)
      t += " support " + quoted(p.name) + " " + quoted(p.kind) + " " + exact(p.thickness_m) + " " +
           exact(p.height_m) + " " + exact(p.length_m) + " " + quoted(p.notes) + "\n";
  }
  const ExportInspection& i = d.inspection;
  const InspectionDetails& v = i.details;
  t += "inspection " + i.date + " " + quoted(i.status) + " " + std::to_string(i.revision) + " " +
       quoted(i.revision_reason) + " " + quoted(v.kind) + " " + quoted(v.inspector) +
       " " + quoted(v.weather) + " " + exact(v.air_temperature_c) + " " + quoted(v.parts_not_inspected) + " " +
       quoted(v.notes) + "\n";
  for (const Instrument& in : v.instruments) t += " instrument " + quoted(in.name) + " " + exact(in.precision_mm) + "\n";
  for (const ExportSection& c : d.sections) {
    const SectionRecord& r = c.record;
    t += "section " + quoted(r.span_label) + " " + quoted(r.label) + " " + exact(r.position_m) + " " +
         quoted(r.reference_face) + " " + quoted(r.direction) + " " + quoted(r.method) + " " + quoted(r.datum) + "\n";
    for (const Reading& x : c.sheet.readings)
      t += " reading " + exact(x.x) + " " + exact(x.z) + " " + exact(x.sigma) + " " + (x.excluded ? "1" : "0") +
           " " + (x.check ? "1" : "0") + "\n";
  }
  for (const RingCountFields& r : d.ring_counts)
    t += "ring_count " + span_of(r.span_id) + " " + quoted(r.face) + " " + quoted(r.position) + " " +
         std::to_string(r.rings) + " " + exact(r.unit_depth_mm) + " " + exact(r.thickness_mm) + " " +
         exact(r.thickness_lower_mm) + " " + exact(r.thickness_upper_mm) + " " + quoted(r.confidence) + " " +
         quoted(r.basis) + "\n";
  for (const FillDepthFields& f : d.fill_depths)
    t += "fill_depth " + span_of(f.span_id) + " " + exact(f.chainage_m) + " " + exact(f.offset_y_m) + " " +
         quoted(f.method) + " " + exact(f.depth_m) + " " + exact(f.uncertainty_m) + " " + exact(f.surfacing_m) + "\n";
  for (const ExportDefect& e : d.defects) {
    const DefectFields& f = e.fields;
    t += "defect " + quoted(f.ref) + " " + quoted(e.span_label) + " " + quoted(f.defect_type) + " " +
         quoted(f.element) + " " + (f.frame == DefectFrame::soffit ? "soffit" : "elevation") + " " +
         quoted(f.frame_origin) + " " + std::to_string(static_cast<int>(f.geometry)) + " " + exact(f.length_m) + " " +
         exact(f.width_mm) + " " + exact(f.area_m2) + " " + quoted(f.severity_scale) + " " +
         (f.severity ? std::to_string(*f.severity) : "null") + "\n";
    for (const auto& [a, b] : f.points) t += " point " + exact(a) + " " + exact(b) + "\n";
  }
  return t;
}

}  // namespace soffit::storage
