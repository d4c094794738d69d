#pragma once
// Forward migrations: step k turns a layout of version k into version k + 1.
// All pending steps run in one transaction with the new user_version, so a
// file is either fully migrated or untouched.
#include <string>

#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

// The earliest layout (version 0), kept verbatim so that tests can build such
// a file and prove every step from it: structures only, without stamps.
const std::string& schema_v0_sql();

// Runs every step from `from_version` to kSchemaVersion inside the caller's
// transaction; `author` stamps rows the migration creates.
void migrate(Connection& db, int from_version, const std::string& author);

}  // namespace soffit::storage
