#pragma once
// The project file's layout. Version history (user_version):
//   0  the first layout: structures only, no stamps (kept for migration tests)
//   1  structures, spans, inspections with revisions, section surveys and
//      readings, ring counts, fill depths, defects, photos, fit cache, undo journal
#include <string>

namespace soffit::storage {

// PRAGMA application_id of every Soffit project: "SOFF" in ASCII. Any other
// value means the file belongs to another program and is never written.
inline constexpr int kApplicationId = 0x534F4646;
inline constexpr int kSchemaVersion = 1;

// Creates every table, index and trigger of the current version in an empty database.
const std::string& schema_v1_sql();

// Tables whose rows are the user's work: the undo journal records changes to
// these and no others (derived data such as the fit cache is rebuilt instead).
const char* const* journaled_tables();

}  // namespace soffit::storage
