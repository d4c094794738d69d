#pragma once
// Read-only views of the register for lists and detail pages.
#include <optional>
#include <string>
#include <vector>

#include "storage/register_records.hpp"
#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

std::optional<StructureRecord> find_structure(Connection& db, const std::string& ref);

// Ordered by reference; `limit` rows from `offset` (a page of the register).
std::vector<StructureSummary> list_structures(Connection& db, int limit = 1000, int offset = 0);

std::optional<StructureDetail> structure_detail(Connection& db, const std::string& ref);

}  // namespace soffit::storage
