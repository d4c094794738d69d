#pragma once
// The two file forms behind parse_sheet (internal to geometry/sheet).
#include <string>
#include <vector>

#include "geometry/sheet/csv_rows.hpp"
#include "geometry/sheet/reading_checks.hpp"
#include "geometry/sheet/sheet_metadata.hpp"
#include "geometry/sheet/sheet_reader.hpp"

namespace soffit {

SurveySheet read_plain_xz(const std::vector<CsvRow>& rows, const std::string& file,
                          const SheetOptions& opts);
SurveySheet read_soffit_sheet(const std::vector<CsvRow>& rows, const std::string& file,
                              const SheetOptions& opts);

// What a method's reduction hands back besides the x, z it writes into
// sheet.readings (whose flags are already set).
struct MethodReduction {
  std::vector<StationKey> keys;                     // one per reading
  bool match_nearest = false;                       // checks may pair by position
  std::vector<std::optional<double>> derived_sigma;  // polar: from distance and angle
};

MethodReduction reduce_offsets_sheet(SurveySheet& sheet, const SheetMetadataLines& meta);
MethodReduction reduce_polar_sheet(SurveySheet& sheet, const SheetMetadataLines& meta);
MethodReduction reduce_points_sheet(SurveySheet& sheet, const SheetMetadataLines& meta);

// Numbers of one column of the raw rows, in SI, in row order (nullopt where empty).
std::vector<std::optional<double>> column_si(const SurveySheet& sheet, const char* quantity);

}  // namespace soffit
