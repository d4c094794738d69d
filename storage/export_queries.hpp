#pragma once
// Everything one inspection of one structure holds, read in one go for the
// project-level geometry export (exports/geometry_json.hpp): the structure,
// its spans with their fixed details, the visit, its sections with their
// sheets, ring counts, fill depths and defects. Plain structs only, so the
// exporters read them without touching SQL.
//
// inputs_sha256 is the SHA-256 of a canonical text of exactly these rows
// (numbers as exact hexadecimal floating point; no row stamps, no keys: spans
// by index), so that the same survey data always carries the same hash, and
// a changed reading, count or defect changes it.
#include <optional>
#include <string>
#include <vector>

#include "geometry/sheet/survey_sheet.hpp"
#include "storage/register_records.hpp"
#include "storage/sqlite_connection.hpp"
#include "storage/survey_records.hpp"

namespace soffit::storage {

struct ExportSpan {
  SpanRecord record;  // id, index, label
  SpanDetails details;
};

struct ExportInspection {
  std::string id, date, status;
  int revision = 1;
  std::string supersedes_id, revision_reason, revision_author, revision_at;  // empty for a first issue
  InspectionDetails details;
};

struct ExportSection {
  SectionRecord record;
  SurveySheet sheet;  // load_section_sheet: stored readings, layout as written
};

struct ExportDefect {
  DefectFields fields;
  std::string span_label;  // empty when the defect is not on a span
  int photo_count = 0;
};

struct InspectionExportData {
  std::string project_file_name;  // the file name only, never the folder
  StructureRecord structure;
  std::vector<ExportSpan> spans;  // by span index
  ExportInspection inspection;
  std::vector<ExportSection> sections;       // by span, position, label
  std::vector<RingCountFields> ring_counts;  // by span, face, order of entry
  std::vector<FillDepthFields> fill_depths;  // by span, chainage, offset
  std::vector<ExportDefect> defects;         // by reference, order of entry
  std::string inputs_sha256;
};

// `date` (YYYY-MM-DD) picks that visit; nullopt the latest. Where a visit has
// revisions, the newest revision is read (superseded ones never are).
// Throws StorageError(not_found) naming the structure reference or the date
// (with the dates there are), (invalid) for a malformed date.
InspectionExportData load_inspection_export(Connection& db, const std::string& structure_ref,
                                            const std::optional<std::string>& date);

// The canonical text that inputs_sha256 hashes.
std::string export_inputs_text(const InspectionExportData& data);

}  // namespace soffit::storage
