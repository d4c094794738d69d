#pragma once
// Writing one inspection's files for the analyst, shared by `soffit export`
// and the app's export dialog. Two steps so that the app's worker thread never
// touches the database: read everything on the caller's thread (a copy), then
// analyse and write from that copy, reporting progress.
#include <filesystem>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "exports/geometry_json.hpp"
#include "storage/export_queries.hpp"
#include "storage/report_queries.hpp"
#include "storage/sqlite_connection.hpp"

namespace soffit::app {

struct ExportFormats {
  bool json = true, csv = true, svg = true, geo = true, pdf = false;
};

struct ExportInput {
  storage::InspectionExportData data;
  std::vector<std::vector<storage::DefectThumbnail>> thumbnails;  // only when the PDF is wanted
};

struct ExportOutcome {
  std::vector<std::filesystem::path> written;
  std::vector<std::string> warnings;  // what had to be left out, one sentence each
};

// Throws storage::StorageError when the structure or visit is not there.
ExportInput load_export_input(storage::Connection& db, const std::string& structure_ref,
                              const std::optional<std::string>& date, bool with_thumbnails);

// Analyses every section and writes the chosen files into `out_dir` (created
// if missing). `progress(done, total)` is called after each step. Throws
// ExportPathError for an unusable folder or name; never writes outside it.
ExportOutcome write_inspection_export(const ExportInput& input, const std::string& out_dir,
                                      const ExportFormats& formats, const GeometryJsonOptions& options,
                                      const std::function<void(int, int)>& progress = {});

}  // namespace soffit::app
