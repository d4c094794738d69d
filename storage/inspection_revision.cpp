#include "storage/inspection_revision.hpp"

#include <vector>

#include "storage/row_stamp.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

// Copies of child rows: `parent` is the column that points at the copied
// parent; `columns` are copied as they are. The names are fixed here, never
// taken from user data.
struct ChildTable {
  const char* table;
  const char* parent;
  const char* columns;
};

constexpr ChildTable kSection{"section_survey", "inspection_id",
                              "span_id, label, position_m, reference_face, direction, method, datum, sheet_json, notes"};
constexpr ChildTable kReading{"reading", "section_id",
                              "seq, x_m, z_m, sigma_m, excluded, exclusion_reason, is_check, source_line, "
                              "raw_cells_json, note"};
constexpr ChildTable kRingCount{"ring_count", "inspection_id",
                                "span_id, face, position, rings, unit_depth_mm, thickness_mm, thickness_lower_mm, "
                                "thickness_upper_mm, confidence, basis, notes"};
constexpr ChildTable kFillDepth{"fill_depth", "inspection_id",
                                "span_id, chainage_m, offset_y_m, method, depth_m, uncertainty_m, surfacing_m, notes"};
constexpr ChildTable kDefect{"defect", "inspection_id",
                             "span_id, ref, defect_type, element, location_frame, frame_origin, geometry_kind, "
                             "geometry_json, length_m, width_mm, area_m2, severity_scale, severity, notes"};
constexpr ChildTable kPhotoLink{"photo_defect", "defect_id", "photo_id, marker_json"};

struct CopiedRow {
  std::string old_id, new_id;
};

// Copies every row of `t` whose parent is `old_parent` to `new_parent`.
std::vector<CopiedRow> copy_children(Connection& db, const ChildTable& t, const std::string& old_parent,
                                     const std::string& new_parent, const std::string& now, const std::string& author) {
  std::vector<CopiedRow> rows;
  {
    Statement q(db, std::string("SELECT id FROM ") + t.table + " WHERE " + t.parent + " = ?1");
    q.bind(1, old_parent);
    while (q.step()) rows.push_back({q.column_text(0), new_uuid()});
  }
  Statement ins(db, std::string("INSERT INTO ") + t.table + " (id, " + t.parent + ", " + t.columns +
                        ", created_at, modified_at, author) SELECT ?1, ?2, " + t.columns + ", ?3, ?3, ?4 FROM " +
                        t.table + " WHERE id = ?5");
  for (const auto& r : rows) {
    ins.reset();
    ins.bind_all(r.new_id, new_parent, now, author, r.old_id).run();
  }
  return rows;
}

[[noreturn]] void refuse(Connection& db, const std::string& what) {
  throw StorageError(ErrorKind::invalid, db.path(), what);
}

}  // namespace

std::string create_inspection_revision(Connection& db, const std::string& author, const std::string& inspection_id,
                                       const std::string& reason) {
  if (reason.find_first_not_of(" \t\r\n") == std::string::npos)
    refuse(db, "a new revision needs a reason (field 'reason' is empty)");
  std::string status;
  {
    Statement q(db, "SELECT status FROM inspection WHERE id = ?1");
    q.bind(1, inspection_id);
    if (!q.step()) throw StorageError(ErrorKind::not_found, db.path(), "no inspection " + inspection_id);
    status = q.column_text(0);
  }
  if (status != "issued")
    refuse(db, "the inspection is " + status + ", not issued: correct it directly rather than making a revision");
  {
    Statement q(db, "SELECT revision, status FROM inspection WHERE supersedes_id = ?1");
    q.bind(1, inspection_id);
    if (q.step())
      refuse(db, "the inspection already has revision " + std::to_string(q.column_int64(0)) + " (" +
                     q.column_text(1) + "); correct that one instead");
  }

  const std::string id = new_uuid();
  const std::string now = utc_now();
  Statement(db,
            "INSERT INTO inspection (id, structure_id, inspection_date, kind, inspector, weather, air_temperature_c, "
            "instruments_json, parts_not_inspected, status, revision, supersedes_id, revision_author, revision_at, "
            "revision_reason, notes, created_at, modified_at, author) "
            "SELECT ?1, structure_id, inspection_date, kind, inspector, weather, air_temperature_c, instruments_json, "
            "parts_not_inspected, 'draft', revision + 1, id, ?2, ?3, ?4, notes, ?3, ?3, ?2 "
            "FROM inspection WHERE id = ?5")
      .bind_all(id, author, now, reason, inspection_id)
      .run();

  for (const auto& section : copy_children(db, kSection, inspection_id, id, now, author))
    copy_children(db, kReading, section.old_id, section.new_id, now, author);
  copy_children(db, kRingCount, inspection_id, id, now, author);
  copy_children(db, kFillDepth, inspection_id, id, now, author);
  for (const auto& defect : copy_children(db, kDefect, inspection_id, id, now, author))
    copy_children(db, kPhotoLink, defect.old_id, defect.new_id, now, author);
  return id;
}

}  // namespace soffit::storage
