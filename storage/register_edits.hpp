#pragma once
// Single-row changes to the register. Call them inside Project::edit so each
// user action is one transaction and one undo step; `author` stamps the rows.
#include <optional>
#include <string>

#include "storage/register_records.hpp"
#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

// Both refuse bad fields before any SQL runs, with StorageError(invalid) whose
// message starts with the field as the form names it ("reference: ...",
// "latitude: ...", "longitude: ...", "number of spans: ..."): an empty or
// duplicate reference, a latitude outside -90..90 or longitude outside
// -180..180 degrees (WGS84), fewer than one span. The schema's CHECKs stay as
// the last guard, but their SQLite text names no field a person would know.
std::string insert_structure(Connection& db, const std::string& author, const StructureFields& f);
// Rewrites every field of the structure (an empty text clears it) and stamps
// modified_at and author; not_found if there is no such structure.
void update_structure(Connection& db, const std::string& author, const std::string& structure_id,
                      const StructureFields& f);
void update_structure_notes(Connection& db, const std::string& author, const std::string& structure_id,
                            const std::string& notes);

// The span with this index, created (labelled S<index>) if missing.
std::string ensure_span(Connection& db, const std::string& author, const std::string& structure_id, int index);

// A draft or checked inspection of the structure on `date`, created as a draft
// if there is none (an issued one is never added to).
std::string ensure_inspection(Connection& db, const std::string& author, const std::string& structure_id,
                              const std::string& date);

// draft → checked → issued; an issued inspection refuses every change (schema triggers).
void set_inspection_status(Connection& db, const std::string& author, const std::string& inspection_id,
                           const std::string& status);

// Exclusion is a flag with a reason; an empty reason includes the reading again.
void set_reading_exclusion(Connection& db, const std::string& author, const std::string& reading_id,
                           const std::string& reason);

}  // namespace soffit::storage
