#include "geometry/sheet/reduce_points.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <numbers>
#include <stdexcept>

namespace soffit {
namespace {

double along(const SectionPlane& plane, double e, double n) {
  return (e - plane.centre_easting) * plane.dir_easting +
         (n - plane.centre_northing) * plane.dir_northing;
}

}  // namespace

double out_of_plane_m(const SectionPlane& plane, const GridPoint& p) {
  // Right-hand normal of (dir_e, dir_n) in plan, with north up: (dir_n, −dir_e).
  return (p.easting - plane.centre_easting) * plane.dir_northing -
         (p.northing - plane.centre_northing) * plane.dir_easting;
}

SectionPlane fit_section_plane(const std::vector<GridPoint>& points,
                               const std::vector<bool>& use, const PointsSetup& setup) {
  // Centre on the first used point: differences of nearby grid values are
  // exact, and the sums below then stay of the size of the section.
  int first = -1;
  for (size_t i = 0; i < points.size(); ++i) {
    if (use[i]) {
      first = static_cast<int>(i);
      break;
    }
  }
  if (first < 0) throw std::invalid_argument("no points to place the section plane on");
  const double e0 = points[first].easting;
  const double n0 = points[first].northing;
  double se = 0.0, sn = 0.0;
  int count = 0;
  for (size_t i = 0; i < points.size(); ++i) {
    if (!use[i]) continue;
    se += points[i].easting - e0;
    sn += points[i].northing - n0;
    ++count;
  }
  const double me = se / count, mn = sn / count;
  double see = 0.0, snn = 0.0, sen = 0.0;
  for (size_t i = 0; i < points.size(); ++i) {
    if (!use[i]) continue;
    const double de = (points[i].easting - e0) - me;
    const double dn = (points[i].northing - n0) - mn;
    see += de * de;
    snn += dn * dn;
    sen += de * dn;
  }

  SectionPlane plane;
  plane.centre_easting = e0 + me;
  plane.centre_northing = n0 + mn;
  plane.points_used = count;
  if (setup.bearing_rad) {
    plane.bearing_given = true;
    plane.dir_easting = std::sin(*setup.bearing_rad);
    plane.dir_northing = std::cos(*setup.bearing_rad);
  } else {
    if (see + snn == 0.0) {
      throw std::invalid_argument("all points have the same plan position");
    }
    // Major axis of [[see, sen], [sen, snn]]: angle from the easting axis.
    const double theta = 0.5 * std::atan2(2.0 * sen, see - snn);
    plane.dir_easting = std::cos(theta);
    plane.dir_northing = std::sin(theta);
    // A best-fit line has no direction: x runs eastward (northward if due N–S).
    if (plane.dir_easting < 0.0 || (plane.dir_easting == 0.0 && plane.dir_northing < 0.0)) {
      plane.dir_easting = -plane.dir_easting;
      plane.dir_northing = -plane.dir_northing;
    }
  }
  double bearing = std::atan2(plane.dir_easting, plane.dir_northing) * 180.0 / std::numbers::pi;
  if (bearing < 0.0) bearing += 360.0;
  plane.bearing_deg = bearing;

  // Scatter about the plane, computed from the centred differences again.
  double sum_sq = 0.0, max_abs = 0.0;
  double min_along = std::numeric_limits<double>::infinity();
  for (size_t i = 0; i < points.size(); ++i) {
    if (!use[i]) continue;
    const double w = out_of_plane_m(plane, points[i]);
    sum_sq += w * w;
    max_abs = std::max(max_abs, std::abs(w));
    min_along = std::min(min_along, along(plane, points[i].easting, points[i].northing));
  }
  plane.scatter_rms_m = std::sqrt(sum_sq / count);
  plane.scatter_max_m = max_abs;
  if (setup.origin_easting && setup.origin_northing) {
    plane.x_start_along = along(plane, *setup.origin_easting, *setup.origin_northing);
  } else {
    plane.x_start_along = min_along;
  }
  return plane;
}

Point2 project_to_section(const SectionPlane& plane, const GridPoint& p, double z_origin_rl_m) {
  return {along(plane, p.easting, p.northing) - plane.x_start_along, p.height - z_origin_rl_m};
}

}  // namespace soffit
