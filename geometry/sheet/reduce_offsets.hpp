#pragma once
// Offsets from a datum line: stations along the line, offsets to the soffit.
//
// z = datum height at the station − sag drop of a taut line + signed offset,
// then shifted so that z = 0 at z_origin_rl_m (usually the springing line).
#include <optional>

#include "geometry/core/reading.hpp"

namespace soffit {

struct DatumMark {
  double station_m = 0.0;
  double rl_m = 0.0;
};

struct OffsetSetup {
  double datum_rl_m = 0.0;               // level datum height
  std::optional<DatumMark> datum_start;  // sloping datum: both marks or neither
  std::optional<DatumMark> datum_end;
  bool offsets_down = false;             // offsets measured downward from the line
  double sag_m = 0.0;                    // mid-length sag of a taut line; 0 = none
  double line_start_station_m = 0.0;     // ends of the taut line (used only with sag)
  double line_end_station_m = 0.0;
  double x_origin_m = 0.0;               // station that becomes x = 0
  double z_origin_rl_m = 0.0;            // height that becomes z = 0
};

// Datum height at a station: level, or linear between the two marks (and
// extrapolated beyond them along the same line).
double datum_height_at(const OffsetSetup& setup, double station_m);

// How far a taut line hangs below the straight chord between its ends:
// parabolic, sag·4u(1−u) with u the fraction of the way along; 0 outside the ends.
double sag_drop_at(const OffsetSetup& setup, double station_m);

// One reading in the section frame (x along the span, z up; metres).
Point2 reduce_offset(const OffsetSetup& setup, double station_m, double offset_m);

}  // namespace soffit
