#pragma once
// Catches the commonest blunder of a survey sheet: millimetres in a metres
// column or metres in a millimetres column (FIELD.md §3.3, "units mixed").
#include <string>
#include <utility>
#include <vector>

namespace soffit {

struct ColumnValues {
  std::string field;                         // column name as written, for messages
  std::string unit;                          // "m", "mm", ...
  bool grid = false;                         // easting/northing: larger ranges are normal
  bool precision = false;                    // a sigma column: small values are normal
  std::vector<std::pair<int, double>> values;  // (line, value in the written unit)
};

// Throws InputError naming the column and a line, saying what the values look
// like and what to do. `rename_hint` replaces the advice to rename the column
// (the plain x,z form has fixed column names).
void check_column_units(const ColumnValues& column, const std::string& file,
                        const std::string& rename_hint = "");

}  // namespace soffit
