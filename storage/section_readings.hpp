#pragma once
// The readings of one stored section, as rows: their keys in the order
// load_section_sheet returns them, and writing an edited sheet back.
#include <string>
#include <vector>

#include "geometry/sheet/survey_sheet.hpp"
#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

std::vector<std::string> section_reading_ids(Connection& db, const std::string& section_id);

// Makes the section's stored readings those of `sheet` (readings[i] with
// raw_rows[i], in order): rows that changed are updated in place (their keys
// stay, so undo and other references follow them), new rows are added after
// the last, rows beyond the sheet's are removed. Unchanged rows are not
// touched, so a corrected cell in a 10⁵-point scan writes one row. Call inside
// Project::edit; an issued visit refuses (schema triggers) and nothing changes.
void save_section_rows(Connection& db, const std::string& author, const std::string& section_id,
                       const SurveySheet& sheet);

}  // namespace soffit::storage
