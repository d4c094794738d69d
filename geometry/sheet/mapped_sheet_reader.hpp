#pragma once
// Reads a spreadsheet export through a column mapping (column_mapping.hpp):
// the export's header is found, its mapped columns become the readings table
// of a Soffit survey sheet and the mapping's settings its metadata, and the
// result goes through the same reader as a Soffit sheet (SHEET_FORMAT.md).
//
// Every message refers to the export as written: its file name, its own line
// numbers and its own column names ("field 'Offset mm' (mapped as
// offset_mm)"); a problem with a setting names where the setting was given.
// Units are checked per mapped column before reading, so that millimetres
// mapped as metres (and the reverse) are reported with the line and column.
#include <string>
#include <string_view>

#include "geometry/sheet/column_mapping.hpp"
#include "geometry/sheet/sheet_reader.hpp"

namespace soffit {

SurveySheet read_mapped_sheet_file(const std::string& path, const ColumnMapping& mapping,
                                   const SheetOptions& opts);

SurveySheet parse_mapped_sheet(std::string_view text, const std::string& name_for_messages,
                               const ColumnMapping& mapping, const SheetOptions& opts);

}  // namespace soffit
