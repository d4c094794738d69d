#include "storage/section_readings.hpp"

#include <optional>

#include "storage/row_stamp.hpp"
#include "storage/sheet_json.hpp"
#include "storage/sqlite_statement.hpp"
#include "storage/storage_error.hpp"

namespace soffit::storage {
namespace {

// A reading row as stored, for finding what an edit changed.
struct StoredRow {
  std::string id;
  Reading reading;
  std::string raw_cells_json;
};

std::optional<std::string> non_empty(const std::string& s) {
  if (s.empty()) return std::nullopt;
  return s;
}

bool same(const StoredRow& row, const Reading& r, const std::string& raw_json) {
  const Reading& s = row.reading;
  return s.x == r.x && s.z == r.z && s.sigma == r.sigma && s.excluded == r.excluded &&
         s.exclusion_reason == r.exclusion_reason && s.check == r.check && s.source_line == r.source_line &&
         s.note == r.note && row.raw_cells_json == raw_json;
}

std::vector<StoredRow> stored_rows(Connection& db, const std::string& section_id) {
  Statement q(db,
              "SELECT id, x_m, z_m, sigma_m, excluded, coalesce(exclusion_reason, ''), is_check, source_line, "
              "coalesce(note, ''), coalesce(raw_cells_json, '') FROM reading WHERE section_id = ?1 ORDER BY seq");
  q.bind(1, section_id);
  std::vector<StoredRow> rows;
  while (q.step()) {
    StoredRow row;
    row.id = q.column_text(0);
    row.reading.x = q.column_double(1);
    row.reading.z = q.column_double(2);
    row.reading.sigma = q.column_double(3);
    row.reading.excluded = q.column_int64(4) != 0;
    row.reading.exclusion_reason = q.column_text(5);
    row.reading.check = q.column_int64(6) != 0;
    row.reading.source_line = static_cast<int>(q.column_int64(7));
    row.reading.note = q.column_text(8);
    row.raw_cells_json = q.column_text(9);
    rows.push_back(std::move(row));
  }
  return rows;
}

}  // namespace

std::vector<std::string> section_reading_ids(Connection& db, const std::string& section_id) {
  Statement q(db, "SELECT id FROM reading WHERE section_id = ?1 ORDER BY seq");
  q.bind(1, section_id);
  std::vector<std::string> ids;
  while (q.step()) ids.push_back(q.column_text(0));
  return ids;
}

void save_section_rows(Connection& db, const std::string& author, const std::string& section_id,
                       const SurveySheet& sheet) {
  {
    Statement q(db, "SELECT 1 FROM section_survey WHERE id = ?1");
    q.bind(1, section_id);
    if (!q.step()) throw StorageError(ErrorKind::not_found, db.path(), "no section " + section_id);
  }
  const std::vector<StoredRow> stored = stored_rows(db, section_id);
  const std::string now = utc_now();
  Statement update(db,
                   "UPDATE reading SET x_m = ?2, z_m = ?3, sigma_m = ?4, excluded = ?5, exclusion_reason = ?6, "
                   "is_check = ?7, source_line = ?8, raw_cells_json = ?9, note = ?10, modified_at = ?11, "
                   "author = ?12 WHERE id = ?1");
  Statement insert(db,
                   "INSERT INTO reading (id, section_id, seq, x_m, z_m, sigma_m, excluded, exclusion_reason, "
                   "is_check, source_line, raw_cells_json, note, created_at, modified_at, author) "
                   "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?13, ?14)");
  for (size_t i = 0; i < sheet.readings.size(); ++i) {
    const Reading& r = sheet.readings[i];
    const std::string raw = i < sheet.raw_rows.size() ? cells_to_json(sheet.raw_rows[i].cells) : std::string();
    if (i < stored.size()) {
      if (same(stored[i], r, raw)) continue;
      update.reset();
      update.bind_all(stored[i].id, r.x, r.z, r.sigma, r.excluded, non_empty(r.exclusion_reason), r.check,
                      r.source_line, non_empty(raw), non_empty(r.note), now, author);
      update.run();
    } else {
      insert.reset();
      insert.bind_all(new_uuid(), section_id, static_cast<long long>(i), r.x, r.z, r.sigma, r.excluded,
                      non_empty(r.exclusion_reason), r.check, r.source_line, non_empty(raw), non_empty(r.note),
                      now, author);
      insert.run();
    }
  }
  if (stored.size() > sheet.readings.size()) {
    Statement remove(db, "DELETE FROM reading WHERE section_id = ?1 AND seq >= ?2");
    remove.bind_all(section_id, static_cast<long long>(sheet.readings.size()));
    remove.run();
  }
  Statement touch(db, "UPDATE section_survey SET modified_at = ?2, author = ?3 WHERE id = ?1");
  touch.bind_all(section_id, now, author);
  touch.run();
}

}  // namespace soffit::storage
