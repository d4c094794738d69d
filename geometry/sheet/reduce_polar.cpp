#include "geometry/sheet/reduce_polar.hpp"

#include <cmath>

namespace soffit {

Point2 reduce_polar(const PolarSetup& setup, const PolarShot& shot) {
  const double c = std::cos(shot.elevation_rad);
  const double s = std::sin(shot.elevation_rad);
  double horizontal = shot.distance_m;
  double rise = 0.0;
  if (shot.slope) {
    horizontal = shot.distance_m * c;
    rise = shot.distance_m * s;
  } else {
    rise = shot.distance_m * s / c;
  }
  const double x = setup.instrument_x_m + shot.direction * horizontal - setup.x_origin_m;
  const double z = (setup.axis_rl_m - setup.z_origin_rl_m) + rise;
  return {x, z};
}

double polar_sigma(const PolarShot& shot, double distance_sigma_m, double distance_ppm,
                   double angle_sigma_rad) {
  const double sd = distance_sigma_m + distance_ppm * 1e-6 * shot.distance_m;
  const double c = std::cos(shot.elevation_rad);
  const double t = std::tan(shot.elevation_rad);
  double trace = 0.0;
  if (shot.slope) {
    // x = d cos a, z = d sin a: the distance error lies along the line of
    // sight, the angle error d·σa across it.
    trace = sd * sd + shot.distance_m * shot.distance_m * angle_sigma_rad * angle_sigma_rad;
  } else {
    // x = d, z = d tan a: ∂z/∂d = tan a, ∂z/∂a = d / cos² a.
    const double dz_da = shot.distance_m / (c * c);
    trace = sd * sd * (1.0 + t * t) + dz_da * dz_da * angle_sigma_rad * angle_sigma_rad;
  }
  return std::sqrt(trace / 2.0);
}

}  // namespace soffit
