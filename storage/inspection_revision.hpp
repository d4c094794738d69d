#pragma once
// Correcting an issued inspection (issue 3: "an issued inspection is
// read-only; a correction becomes a new revision with who, when and why").
#include <string>

#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

// Makes a draft revision (revision + 1, supersedes the issued one) holding a
// copy of every section with its readings, ring count, fill depth and defect
// with its photo links, under new keys; the issued inspection is not touched.
// Who is `author`, when is now, why is `reason` (required). Refuses (invalid)
// an inspection that is not issued, or one that already has a newer revision.
// Call inside Project::edit, like every edit.
std::string create_inspection_revision(Connection& db, const std::string& author, const std::string& inspection_id,
                                       const std::string& reason);

}  // namespace soffit::storage
