#pragma once
// What the inspection report shows beyond the geometry export: the thumbnails
// of the photos linked to each defect. Plain structs, so the report writer in
// exports/ reads them without touching SQL.
#include <string>
#include <vector>

#include "storage/export_queries.hpp"
#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

struct DefectThumbnail {
  std::string caption;    // the photo's caption, may be empty
  std::string png_bytes;  // the cached thumbnail (PNG, at most kThumbnailSide px); empty when none was stored
};

// One list per defect of `data`, in the order of data.defects (the same
// ordering as load_inspection_export: by reference, then order of entry),
// each list in the order the photos were linked.
std::vector<std::vector<DefectThumbnail>> load_defect_thumbnails(Connection& db, const InspectionExportData& data);

}  // namespace soffit::storage
