#pragma once
// Polar readings from one instrument set-up in the plane of the section.
//
// The instrument axis sits at x = instrument_x_m (in the station frame) and at
// height axis_rl_m; each shot has a distance (horizontal or slope) and an
// elevation angle (zenith angles are converted by the reader), and goes
// towards +x or −x.
#include <optional>

#include "geometry/core/reading.hpp"

namespace soffit {

struct PolarSetup {
  double instrument_x_m = 0.0;
  double axis_rl_m = 0.0;        // ground height + instrument height
  int facing = +1;               // +1: shots go towards +x; −1: towards −x
  double x_origin_m = 0.0;       // station that becomes x = 0
  double z_origin_rl_m = 0.0;    // height that becomes z = 0
  // Stated precisions (metadata); unset parts come from the instrument class.
  std::optional<double> distance_sigma_m;
  std::optional<double> distance_ppm;
  std::optional<double> angle_sigma_rad;
};

struct PolarShot {
  double distance_m = 0.0;
  bool slope = false;        // true: slope distance; false: horizontal distance
  double elevation_rad = 0.0;
  int direction = +1;        // +1 / −1 along x
};

Point2 reduce_polar(const PolarSetup& setup, const PolarShot& shot);

// Isotropic 1σ of the reduced point, propagated from the distance precision
// (constant + ppm part) and the angle precision: √(trace(J·Σ·Jᵀ)/2), the
// root-mean-square over directions of the error ellipse (JCGM 100 §5.1 law of
// propagation; the isotropic summary is this reader's choice).
double polar_sigma(const PolarShot& shot, double distance_sigma_m, double distance_ppm,
                   double angle_sigma_rad);

}  // namespace soffit
