#include "storage/section_readings.hpp"

#include "storage/sqlite_statement.hpp"

namespace soffit::storage {

std::vector<std::string> section_reading_ids(Connection& db, const std::string& section_id) {
  Statement q(db, "SELECT id FROM reading WHERE section_id = ?1 ORDER BY seq");
  q.bind(1, section_id);
  std::vector<std::string> ids;
  while (q.step()) ids.push_back(q.column_text(0));
  return ids;
}

}  // namespace soffit::storage
