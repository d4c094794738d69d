#include "storage/register_edits.hpp"

#include <locale>
#include <sstream>

#include "storage/row_stamp.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

std::optional<std::string> text_or_null(const std::string& s) {
  if (s.empty()) return std::nullopt;
  return s;
}

void require_changed(Connection& db, const char* what, const std::string& id) {
  if (db.changes() == 0) throw StorageError(ErrorKind::not_found, db.path(), std::string("no ") + what + " " + id);
}

[[noreturn]] void refuse(Connection& db, const std::string& message) {
  throw StorageError(ErrorKind::invalid, db.path(), message);
}

std::string degrees(double v) {
  std::ostringstream out;
  out.imbue(std::locale::classic());  // a point for decimals whatever the user's locale
  out << v;
  return out.str();
}

// `own_id` is the structure being edited (empty for a new one): it may keep its own reference.
void check_structure_fields(Connection& db, const StructureFields& f, const std::string& own_id) {
  if (f.ref.find_first_not_of(" \t\r\n") == std::string::npos) refuse(db, "reference: must not be empty");
  {
    Statement same(db, "SELECT 1 FROM structure WHERE ref = ?1 AND id <> ?2");
    same.bind_all(f.ref, own_id);
    if (same.step()) refuse(db, "reference: " + f.ref + " is already used by another structure in this project");
  }
  // Written as !(inside) so that NaN is refused too.
  if (f.latitude_deg && !(*f.latitude_deg >= -90.0 && *f.latitude_deg <= 90.0))
    refuse(db, "latitude: " + degrees(*f.latitude_deg) + " is outside -90 to 90 degrees");
  if (f.longitude_deg && !(*f.longitude_deg >= -180.0 && *f.longitude_deg <= 180.0))
    refuse(db, "longitude: " + degrees(*f.longitude_deg) + " is outside -180 to 180 degrees");
  if (f.span_count && *f.span_count < 1)
    refuse(db, "number of spans: " + std::to_string(*f.span_count) + " is fewer than one");
}

}  // namespace

std::string insert_structure(Connection& db, const std::string& author, const StructureFields& f) {
  check_structure_fields(db, f, "");
  const std::string id = new_uuid();
  const std::string now = utc_now();
  Statement s(db,
              "INSERT INTO structure (id, ref, name, latitude_deg, longitude_deg, location_fictitious, carries, "
              "crosses, span_count, notes, created_at, modified_at, author) "
              "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?11, ?12)");
  s.bind_all(id, f.ref, text_or_null(f.name), f.latitude_deg, f.longitude_deg, f.location_fictitious,
             text_or_null(f.carries), text_or_null(f.crosses), f.span_count, text_or_null(f.notes), now, author);
  s.run();
  return id;
}

void update_structure(Connection& db, const std::string& author, const std::string& structure_id,
                      const StructureFields& f) {
  {
    Statement exists(db, "SELECT 1 FROM structure WHERE id = ?1");
    exists.bind(1, structure_id);
    if (!exists.step()) throw StorageError(ErrorKind::not_found, db.path(), "no structure " + structure_id);
  }
  check_structure_fields(db, f, structure_id);
  Statement(db,
            "UPDATE structure SET ref = ?2, name = ?3, latitude_deg = ?4, longitude_deg = ?5, "
            "location_fictitious = ?6, carries = ?7, crosses = ?8, span_count = ?9, notes = ?10, "
            "modified_at = ?11, author = ?12 WHERE id = ?1")
      .bind_all(structure_id, f.ref, text_or_null(f.name), f.latitude_deg, f.longitude_deg, f.location_fictitious,
                text_or_null(f.carries), text_or_null(f.crosses), f.span_count, text_or_null(f.notes), utc_now(),
                author)
      .run();
  require_changed(db, "structure", structure_id);
}

void update_structure_notes(Connection& db, const std::string& author, const std::string& structure_id,
                            const std::string& notes) {
  Statement(db, "UPDATE structure SET notes = ?2, modified_at = ?3, author = ?4 WHERE id = ?1")
      .bind_all(structure_id, text_or_null(notes), utc_now(), author)
      .run();
  require_changed(db, "structure", structure_id);
}

std::string ensure_span(Connection& db, const std::string& author, const std::string& structure_id, int index) {
  {
    Statement find(db, "SELECT id FROM span WHERE structure_id = ?1 AND span_index = ?2");
    find.bind_all(structure_id, index);
    if (find.step()) return find.column_text(0);
  }
  const std::string id = new_uuid();
  std::string label = "S";  // appended, not "S" + …: GCC 12 warns falsely (-Wrestrict) on that form
  label += std::to_string(index);
  Statement(db,
            "INSERT INTO span (id, structure_id, span_index, label, created_at, modified_at, author) "
            "VALUES (?1, ?2, ?3, ?4, ?5, ?5, ?6)")
      .bind_all(id, structure_id, index, label, utc_now(), author)
      .run();
  return id;
}

std::string ensure_inspection(Connection& db, const std::string& author, const std::string& structure_id,
                              const std::string& date) {
  {
    Statement find(db,
                   "SELECT id FROM inspection WHERE structure_id = ?1 AND inspection_date = ?2 "
                   "AND status <> 'issued' ORDER BY revision DESC LIMIT 1");
    find.bind_all(structure_id, date);
    if (find.step()) return find.column_text(0);
  }
  const std::string id = new_uuid();
  Statement(db,
            "INSERT INTO inspection (id, structure_id, inspection_date, status, created_at, modified_at, author) "
            "VALUES (?1, ?2, ?3, 'draft', ?4, ?4, ?5)")
      .bind_all(id, structure_id, date, utc_now(), author)
      .run();
  return id;
}

void set_inspection_status(Connection& db, const std::string& author, const std::string& inspection_id,
                           const std::string& status) {
  Statement(db, "UPDATE inspection SET status = ?2, modified_at = ?3, author = ?4 WHERE id = ?1")
      .bind_all(inspection_id, status, utc_now(), author)
      .run();
  require_changed(db, "inspection", inspection_id);
}

void set_reading_exclusion(Connection& db, const std::string& author, const std::string& reading_id,
                           const std::string& reason) {
  Statement(db,
            "UPDATE reading SET excluded = ?2, exclusion_reason = ?3, modified_at = ?4, author = ?5 WHERE id = ?1")
      .bind_all(reading_id, !reason.empty(), text_or_null(reason), utc_now(), author)
      .run();
  require_changed(db, "reading", reading_id);
}

}  // namespace soffit::storage
