#include "storage/photo_queries.hpp"

#include <cmath>

#include "storage/row_stamp.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

// marker_json is written by link_photo_to_defect as {"x":…,"y":…}; a file
// edited by other tools may hold anything json_valid accepts, so each field
// is checked and a bad one named rather than drawn somewhere wrong.
void read_marker(const Statement& q, int x_col, PhotoDefectLink& link) {
  if (q.is_null(x_col - 1)) return;  // no marker_json: the whole photo
  const auto x = q.column_double_or_null(x_col), y = q.column_double_or_null(x_col + 1);
  const auto in_range = [](const std::optional<double>& v) { return v && std::isfinite(*v) && *v >= 0 && *v <= 1; };
  if (!in_range(x)) {
    link.marker_problem = "marker field 'x' is missing or not from 0 to 1";
  } else if (!in_range(y)) {
    link.marker_problem = "marker field 'y' is missing or not from 0 to 1";
  } else {
    link.marker = PhotoMarker{*x, *y};
  }
}

}  // namespace

VisitPhotos load_visit_photos(Connection& db, const std::string& inspection_id) {
  VisitPhotos out;
  out.inspection_id = inspection_id;
  {
    Statement q(db, "SELECT inspection_date, status FROM inspection WHERE id = ?1");
    q.bind(1, inspection_id);
    if (!q.step()) throw StorageError(ErrorKind::not_found, db.path(), "no inspection with id " + inspection_id);
    out.date = q.column_text(0);
    out.status = q.column_text(1);
  }
  {
    Statement q(db, "SELECT id, coalesce(ref, ''), defect_type, element FROM defect WHERE inspection_id = ?1 "
                    "ORDER BY ref, rowid");
    q.bind(1, inspection_id);
    while (q.step()) out.defects.push_back({q.column_text(0), q.column_text(1), q.column_text(2), q.column_text(3)});
  }
  {
    Statement q(db,
                "SELECT id, coalesce(file_name, ''), coalesce(original_name, ''), coalesce(caption, ''), "
                "coalesce(image_format, ''), exif_taken_at, coalesce(byte_size, 0), coalesce(width_px, 0), "
                "coalesce(height_px, 0), coalesce(exif_orientation, 1), thumbnail_png FROM photo "
                "WHERE inspection_id = ?1 OR id IN (SELECT l.photo_id FROM photo_defect l "
                "JOIN defect d ON d.id = l.defect_id WHERE d.inspection_id = ?1) "
                "ORDER BY exif_taken_at IS NULL, exif_taken_at, created_at, rowid");
    q.bind(1, inspection_id);
    while (q.step()) {
      VisitPhoto p;
      p.id = q.column_text(0);
      p.file_name = q.column_text(1);
      p.original_name = q.column_text(2);
      p.caption = q.column_text(3);
      p.image_format = q.column_text(4);
      p.exif_taken_at = q.column_text_or_null(5);
      p.byte_size = q.column_int64(6);
      p.width_px = static_cast<int>(q.column_int64(7));
      p.height_px = static_cast<int>(q.column_int64(8));
      p.orientation = static_cast<int>(q.column_int64(9));
      if (!q.is_null(10)) p.thumbnail_png = q.column_blob(10);
      out.photos.push_back(std::move(p));
    }
  }
  Statement links(db,
                  "SELECT l.id, d.id, coalesce(d.ref, ''), l.marker_json, "
                  "CASE WHEN json_type(l.marker_json, '$.x') IN ('integer', 'real') "
                  "THEN json_extract(l.marker_json, '$.x') END, "
                  "CASE WHEN json_type(l.marker_json, '$.y') IN ('integer', 'real') "
                  "THEN json_extract(l.marker_json, '$.y') END "
                  "FROM photo_defect l JOIN defect d ON d.id = l.defect_id "
                  "WHERE l.photo_id = ?1 AND d.inspection_id = ?2 ORDER BY d.ref, l.rowid");
  for (VisitPhoto& p : out.photos) {
    links.reset();
    links.bind(1, p.id).bind(2, inspection_id);
    while (links.step()) {
      PhotoDefectLink link;
      link.link_id = links.column_text(0);
      link.defect_id = links.column_text(1);
      link.defect_ref = links.column_text(2);
      read_marker(links, 4, link);
      p.links.push_back(std::move(link));
    }
  }
  return out;
}

void unlink_photo_from_defect(Connection& db, const std::string& photo_id, const std::string& defect_id) {
  Statement(db, "DELETE FROM photo_defect WHERE photo_id = ?1 AND defect_id = ?2").bind_all(photo_id, defect_id).run();
  if (db.changes() == 0)
    throw StorageError(ErrorKind::not_found, db.path(), "the photo is not linked to that defect");
}

bool give_photo_to_visit(Connection& db, const std::string& author, const std::string& photo_id,
                         const std::string& inspection_id) {
  Statement(db, "UPDATE photo SET inspection_id = ?1, modified_at = ?2, author = ?3 "
                "WHERE id = ?4 AND inspection_id IS NULL")
      .bind_all(inspection_id, utc_now(), author, photo_id)
      .run();
  return db.changes() > 0;
}

}  // namespace soffit::storage
