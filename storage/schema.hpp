#pragma once
// The project file's layout. Version history (user_version):
//   0  the first layout: structures only, no stamps (kept for migration tests)
//   1  structures, spans, inspections with revisions, section surveys and
//      readings, ring counts, fill depths, defects, photos, fit cache, undo journal
//   2  photo image facts (file name, format, pixel size, thumbnail); FTS5
//      search over structures, inspection notes and defects (schema_v2.cpp)
//   3  an issued inspection's photos and photo-defect links are read-only
//      too (schema_v3.cpp)
#include <string>

namespace soffit::storage {

// PRAGMA application_id of every Soffit project: "SOFF" in ASCII. Any other
// value means the file belongs to another program and is never written.
inline constexpr int kApplicationId = 0x534F4646;
inline constexpr int kSchemaVersion = 3;

// Creates every table, index and trigger of layout 1 in an empty database.
// A new project runs this and then every later migration step, so that a new
// file and a migrated one are built by the same statements.
const std::string& schema_v1_sql();

// The step from layout 1 to 2 (schema_v2.cpp).
const std::string& schema_v1_to_v2_sql();

// The step from layout 2 to 3 (schema_v3.cpp).
const std::string& schema_v2_to_v3_sql();

// Tables whose rows are the user's work: the undo journal records changes to
// these and no others (derived data such as the fit cache is rebuilt instead).
const char* const* journaled_tables();

}  // namespace soffit::storage
