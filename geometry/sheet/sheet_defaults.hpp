#pragma once
// Every editable default of the sheet reader, in one place.
//
// The precisions are FIELD.md §3.1 typical values, marked there "from memory":
// they are owner-editable defaults used only when a sheet states no precision,
// never rules. The plausibility limits are common practice, not standards.
#include <string>
#include <string_view>
#include <vector>

#include "geometry/sheet/survey_method.hpp"

namespace soffit {

struct InstrumentClass {
  std::string key;          // the word a sheet writes after "instrument"
  std::string description;
  double sigma_m;           // one reading, 1σ, used when nothing else is stated
  double distance_sigma_m;  // polar only: distance precision, constant part (0 = n/a)
  double distance_ppm;      // polar only: distance precision, part per million of the distance
  double angle_sigma_rad;   // polar only: vertical angle precision (0 = n/a)
};

const std::vector<InstrumentClass>& instrument_classes();
const InstrumentClass* find_instrument_class(std::string_view key);
// "string-line, laser-level, ..." for messages.
std::string instrument_class_list();
// The class assumed when a sheet names none.
const InstrumentClass& default_instrument_class(SurveyMethod method);

struct SheetLimits {
  // A metres column whose values span more than this looks like millimetres
  // (the longest masonry arch spans are a few tens of metres).
  double metres_column_range_m = 100.0;
  // The same for grid coordinates of one section (a slice is never this long).
  double grid_column_range_m = 1000.0;
  // A millimetre column whose values are all below this, with decimals,
  // looks like metres (no arch soffit is within 5 mm of its datum everywhere).
  double mm_column_all_below = 5.0;
  // A millimetre value beyond this (100 m) is no offset or distance on an
  // arch: a slip of ×1000 or a stray digit.
  double mm_column_largest = 100000.0;
  // A precision below this (in mm) looks like metres written in a mm column.
  double sigma_mm_smallest = 0.1;
  // Out-of-plane scatter of a point list above which a warning is given; a
  // 10–20 mm scan slice (FIELD.md §3.1) stays well inside these.
  double plane_rms_warn_m = 0.010;
  double plane_max_warn_m = 0.025;
  // A check reading without a station or id pairs with the nearest earlier
  // reading within this distance along x.
  double check_match_m = 0.05;
};

const SheetLimits& sheet_limits();

}  // namespace soffit
