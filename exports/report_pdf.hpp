#pragma once
// The inspection report as PDF (cairo, A4 portrait): what was surveyed and by
// whom, the caution that it is survey data and not an assessment, and per
// span each section's elevation and fit with its ranges, the ring counts, the
// fill observations, the defects with their photos and their places on the
// unrolled soffit. Every page carries the program, the inputs' SHA-256 and
// its number. The PDF's creation date is the inspection date, so the same
// data gives the same document metadata.
#include <string>
#include <vector>

#include "exports/structure_geometry.hpp"
#include "storage/export_queries.hpp"
#include "storage/report_queries.hpp"

namespace soffit {

inline constexpr const char* kReportCautionTitle = "Survey data, not an assessment";
inline constexpr const char* kReportCaution =
    "This report records what was measured and seen on the day of the inspection, with how sure each "
    "number is. It does not assess the bridge: defer to the local codes and a qualified engineer for "
    "what the geometry and the defects mean for its capacity and safety.";

struct ReportPdfInput {
  const storage::InspectionExportData* data = nullptr;
  const StructureGeometry* geometry = nullptr;
  // One list per defect, aligned with data->defects; may be empty (no photos shown).
  std::vector<std::vector<storage::DefectThumbnail>> thumbnails;
  std::string program;  // e.g. "soffit 0.1.0"
};

// The PDF bytes. Throws std::runtime_error when cairo fails.
std::string report_pdf(const ReportPdfInput& input);

}  // namespace soffit
