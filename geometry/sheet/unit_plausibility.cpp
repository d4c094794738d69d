#include "geometry/sheet/unit_plausibility.hpp"

#include <cmath>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_defaults.hpp"
#include "geometry/sheet/sheet_number.hpp"
#include "geometry/sheet/sheet_units.hpp"

namespace soffit {
namespace {

std::string with_unit(const std::string& field, const std::string& unit) {
  return split_unit_suffix(field).quantity + "_" + unit;
}

void check_metres(const ColumnValues& c, const std::string& file, const std::string& hint) {
  double lo = c.values.front().second, hi = lo;
  int line_hi = c.values.front().first;
  for (const auto& [line, v] : c.values) {
    lo = std::min(lo, v);
    if (v > hi) {
      hi = v;
      line_hi = line;
    }
  }
  const SheetLimits& lim = sheet_limits();
  const double limit = c.grid ? lim.grid_column_range_m : lim.metres_column_range_m;
  if (hi - lo <= limit) return;
  throw InputError(file, line_hi, c.field,
                   "the values run from " + format_fixed(lo, 3) + " to " + format_fixed(hi, 3) +
                       ", which looks like millimetres in a metres column; " +
                       (hint.empty() ? "rename the column " + with_unit(c.field, "mm") +
                                           " or divide the values by 1000"
                                     : hint));
}

void check_millimetres(const ColumnValues& c, const std::string& file, const std::string& hint) {
  const SheetLimits& lim = sheet_limits();
  if (c.precision) {
    for (const auto& [line, v] : c.values) {
      if (v > 0.0 && v < lim.sigma_mm_smallest) {
        throw InputError(file, line, c.field,
                         "a precision of " + format_fixed(v, 4) +
                             " mm is implausibly small: it looks like metres in a millimetres "
                             "column; " +
                             (hint.empty() ? "rename the column " + with_unit(c.field, "m") +
                                                 " or multiply the values by 1000"
                                           : hint));
      }
    }
    return;
  }
  for (const auto& [line, v] : c.values) {
    if (std::abs(v) > lim.mm_column_largest) {
      throw InputError(file, line, c.field,
                       "a value of " + format_fixed(v, 0) + " mm (" + format_fixed(v / 1000.0, 1) +
                           " m) is beyond any arch: check for a slip of x1000 or a stray digit");
    }
  }
  bool any_fraction = false;
  for (const auto& [line, v] : c.values) {
    if (std::abs(v) >= lim.mm_column_all_below) return;
    any_fraction = any_fraction || has_nonzero_fraction(v);
  }
  if (!any_fraction) return;
  throw InputError(file, c.values.front().first, c.field,
                   "every value is below " + format_fixed(lim.mm_column_all_below, 0) +
                       " with decimals, which looks like metres in a millimetres column; " +
                       (hint.empty() ? "rename the column " + with_unit(c.field, "m") +
                                           " or multiply the values by 1000"
                                     : hint));
}

}  // namespace

void check_column_units(const ColumnValues& column, const std::string& file,
                        const std::string& rename_hint) {
  if (column.values.empty()) return;
  if (column.unit == "m") check_metres(column, file, rename_hint);
  if (column.unit == "mm") check_millimetres(column, file, rename_hint);
}

}  // namespace soffit
