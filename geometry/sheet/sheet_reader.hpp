#pragma once
// Reads a section's survey: a plain x,z CSV or a Soffit survey sheet
// (format: geometry/sheet/SHEET_FORMAT.md), and reduces it to readings.
//
// Every problem with the data throws soffit::InputError naming the file, the
// line and the field; doubtful but usable data adds a warning instead.
#include <optional>
#include <string>
#include <string_view>

#include "geometry/sheet/survey_sheet.hpp"

namespace soffit {

struct SheetOptions {
  // From the command line (--sigma-mm): replaces the sheet's default
  // precision, but not a per-reading sigma column.
  std::optional<double> default_sigma_m;
  // A section being keyed in on site: fewer than 3 usable readings are kept
  // (the fit then says it needs more) instead of refusing the sheet.
  bool allow_few_readings = false;
};

SurveySheet read_sheet_file(const std::string& path, const SheetOptions& opts);

SurveySheet parse_sheet(std::string_view text, const std::string& name_for_messages,
                        const SheetOptions& opts);

}  // namespace soffit
