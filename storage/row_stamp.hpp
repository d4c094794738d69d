#pragma once
// Keys and stamps carried by every row, so that projects edited on several
// laptops can later be merged into one register without key clashes.
#include <string>

namespace soffit::storage {

// A random (version 4) UUID, lower-case hex with hyphens (RFC 4122 §4.4).
std::string new_uuid();

// Now in UTC, ISO 8601 with milliseconds: 2025-05-21T08:40:12.345Z.
std::string utc_now();

}  // namespace soffit::storage
