#pragma once
// geometry_json straight from an open project: reads the inspection with
// storage (SQL stays there) and writes the JSON with exports. Header-only so
// that the exports library itself never links storage; include it only from
// targets that link both (the command line, the tests).
#include <optional>
#include <string>

#include "exports/geometry_json.hpp"
#include "storage/export_queries.hpp"
#include "storage/project_file.hpp"

namespace soffit {

// `inspection_date` YYYY-MM-DD, or nullopt for the latest inspection.
// Throws storage::StorageError naming the structure or date that is not there.
inline nlohmann::ordered_json geometry_json(storage::Project& project, const std::string& structure_ref,
                                            const std::optional<std::string>& inspection_date,
                                            const GeometryJsonOptions& options) {
  return geometry_json(storage::load_inspection_export(project.db(), structure_ref, inspection_date), options);
}

}  // namespace soffit
