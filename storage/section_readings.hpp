#pragma once
// The keys of a section's readings, in the order load_section_sheet returns
// the readings, so that a view holding the sheet can edit a reading in place.
#include <string>
#include <vector>

#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

std::vector<std::string> section_reading_ids(Connection& db, const std::string& section_id);

}  // namespace soffit::storage
