#include "geometry/sheet/reduce_offsets.hpp"

namespace soffit {

double datum_height_at(const OffsetSetup& setup, double station_m) {
  if (!setup.datum_start || !setup.datum_end) return setup.datum_rl_m;
  const DatumMark& a = *setup.datum_start;
  const DatumMark& b = *setup.datum_end;
  const double t = (station_m - a.station_m) / (b.station_m - a.station_m);
  return a.rl_m + t * (b.rl_m - a.rl_m);
}

double sag_drop_at(const OffsetSetup& setup, double station_m) {
  if (setup.sag_m == 0.0) return 0.0;
  const double length = setup.line_end_station_m - setup.line_start_station_m;
  if (length == 0.0) return 0.0;
  const double u = (station_m - setup.line_start_station_m) / length;
  if (u <= 0.0 || u >= 1.0) return 0.0;  // the line is held at its ends
  return setup.sag_m * 4.0 * u * (1.0 - u);
}

Point2 reduce_offset(const OffsetSetup& setup, double station_m, double offset_m) {
  // Subtract the origin from the datum first: with a level datum this is one
  // exact difference of two close heights (9.800 − 9.500), so z = offset + 0.300.
  const double line = (datum_height_at(setup, station_m) - setup.z_origin_rl_m) -
                      sag_drop_at(setup, station_m);
  const double signed_offset = setup.offsets_down ? -offset_m : offset_m;
  return {station_m - setup.x_origin_m, line + signed_offset};
}

}  // namespace soffit
