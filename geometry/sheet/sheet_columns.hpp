#pragma once
// The readings table of a survey sheet: which columns each method takes, and
// the reading of the header row and the data rows into raw cells and numbers.
#include <string>
#include <string_view>
#include <vector>

#include "geometry/sheet/csv_rows.hpp"
#include "geometry/sheet/survey_method.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit {

// True for a quantity that is a column of some method ("station", "zenith").
bool is_known_column_quantity(std::string_view quantity);

// Checks every header cell against the columns of `method`: a known quantity
// with an unknown unit, a numeric column without a unit, a repeated column, a
// column of another method or a missing required column throws (naming the
// expected columns); an unknown extra column becomes a warning and is kept.
std::vector<SheetColumn> read_header_row(const CsvRow& header, SurveyMethod method,
                                         const std::string& file,
                                         std::vector<std::string>& warnings);

// Reads one data row against the columns: numbers parsed in the column's unit;
// a required number missing, or more cells than columns, throws.
RawRow read_data_row(const CsvRow& row, const std::vector<SheetColumn>& columns,
                     SurveyMethod method, const std::string& file);

// Index of the column with this quantity, or −1.
int column_index(const std::vector<SheetColumn>& columns, std::string_view quantity);

// "station_m (or _mm), offset_mm (or _m); optional: id, sigma_mm, ..." for messages.
std::string expected_columns(SurveyMethod method);

}  // namespace soffit
