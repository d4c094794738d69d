#include "storage/schema.hpp"

#include <string>

namespace soffit::storage {
namespace {

// Layout 2 → 3. Layout 1 made the rows of an issued inspection read-only
// (sections, readings, ring counts, fill depths, defects) but left two gaps:
// its photos and the links that place its defects on photos stayed open to
// change, and its UPDATE guards looked only at the row before the change, so
// a draft row could be moved into an issued inspection. These guards close
// both: a link whose defect is issued, or a photo given to an issued
// inspection, cannot be added, changed (from or into) or removed, and no row
// can be moved into an issued inspection.
//
// A revision (inspection_revision.cpp) copies the links onto the defects of
// the new draft inspection and leaves the photos where they are: the copies
// are links of a draft, so they pass, and the photos are not written.

// The status of the inspection a row belongs to, for `row` (NEW or OLD).
std::string photo_link_status(const char* row) {
  return std::string("(SELECT i.status FROM defect d JOIN inspection i ON i.id = d.inspection_id WHERE d.id = ") +
         row + ".defect_id)";
}
std::string inspection_status(const char* row) {
  return std::string("(SELECT status FROM inspection WHERE id = ") + row + ".inspection_id)";
}
std::string reading_status(const char* row) {
  return std::string("(SELECT i.status FROM section_survey s JOIN inspection i ON i.id = s.inspection_id "
                     "WHERE s.id = ") +
         row + ".section_id)";
}

// One guard; the message is the one the layout 1 guards give (schema.cpp).
std::string guard(const std::string& name, const std::string& op, const std::string& table, const std::string& when) {
  return "CREATE TRIGGER " + name + " BEFORE " + op + " ON " + table + "\nWHEN " + when +
         "\nBEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); "
         "END;\n";
}

std::string layout3_step() {
  std::string sql;
  const auto issued = [](const std::string& status) { return status + " = 'issued'"; };
  sql += guard("photo_defect_issued_no_INSERT", "INSERT", "photo_defect", issued(photo_link_status("NEW")));
  sql += guard("photo_defect_issued_no_UPDATE", "UPDATE", "photo_defect",
               issued(photo_link_status("OLD")) + " OR " + issued(photo_link_status("NEW")));
  sql += guard("photo_defect_issued_no_DELETE", "DELETE", "photo_defect", issued(photo_link_status("OLD")));
  sql += guard("photo_issued_no_INSERT", "INSERT", "photo", issued(inspection_status("NEW")));
  sql += guard("photo_issued_no_UPDATE", "UPDATE", "photo",
               issued(inspection_status("OLD")) + " OR " + issued(inspection_status("NEW")));
  sql += guard("photo_issued_no_DELETE", "DELETE", "photo", issued(inspection_status("OLD")));
  // Moving a row into an issued inspection (layout 1 guards the row it leaves).
  for (const char* table : {"section_survey", "ring_count", "fill_depth", "defect"})
    sql += guard(std::string(table) + "_issued_no_move_in", "UPDATE", table, issued(inspection_status("NEW")));
  sql += guard("reading_issued_no_move_in", "UPDATE", "reading", issued(reading_status("NEW")));
  return sql;
}

}  // namespace

const std::string& schema_v2_to_v3_sql() {
  static const std::string sql = layout3_step();
  return sql;
}

}  // namespace soffit::storage
