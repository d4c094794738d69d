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
};

SurveySheet read_sheet_file(const std::string& path, const SheetOptions& opts);

SurveySheet parse_sheet(std::string_view text, const std::string& name_for_messages,
                        const SheetOptions& opts);

}  // namespace soffit
