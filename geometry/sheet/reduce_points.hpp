#pragma once
// Point lists (easting, northing, height) projected onto a vertical section plane.
//
// The plane is the total-least-squares line through the points' plan positions
// (the major axis of their 2×2 scatter matrix), or a line of given bearing
// through their centroid. Coordinates are centred on the first point before
// any sum, so national-grid values near 1e6 m keep sub-millimetre precision.
#include <optional>
#include <vector>

#include "geometry/core/reading.hpp"

namespace soffit {

struct GridPoint {
  double easting = 0.0;
  double northing = 0.0;
  double height = 0.0;
};

struct PointsSetup {
  std::optional<double> bearing_rad;      // plane direction, clockwise from grid north
  std::optional<double> origin_easting;   // x = 0 at this point's projection ...
  std::optional<double> origin_northing;  // ... else at the leftmost point
  double z_origin_rl_m = 0.0;             // height that becomes z = 0
};

struct SectionPlane {
  double centre_easting = 0.0;   // a point on the plane (centroid of the points used)
  double centre_northing = 0.0;
  double dir_easting = 1.0;      // unit vector along the plane, towards +x
  double dir_northing = 0.0;
  double bearing_deg = 90.0;     // of dir, clockwise from grid north, [0, 360)
  bool bearing_given = false;    // true: from the sheet; false: best fit
  double x_start_along = 0.0;    // along-plane coordinate (from the centre) where x = 0
  double scatter_rms_m = 0.0;    // out-of-plane distance of the points used: RMS ...
  double scatter_max_m = 0.0;    // ... and largest magnitude
  int points_used = 0;
};

// Fits (or places) the plane through the points with use[i] true. Throws
// std::invalid_argument when fewer than two distinct plan positions are used.
SectionPlane fit_section_plane(const std::vector<GridPoint>& points,
                               const std::vector<bool>& use, const PointsSetup& setup);

// Signed horizontal distance of a point from the plane (+ to the right looking along +x).
double out_of_plane_m(const SectionPlane& plane, const GridPoint& p);

Point2 project_to_section(const SectionPlane& plane, const GridPoint& p, double z_origin_rl_m);

}  // namespace soffit
