#include "geometry/sheet/angles.hpp"

#include <numbers>

namespace soffit {

double degrees_to_radians(double deg) { return deg * (std::numbers::pi / 180.0); }
double gon_to_radians(double gon) { return gon * (std::numbers::pi / 200.0); }
double radians_to_degrees(double rad) { return rad * (180.0 / std::numbers::pi); }
double gon_to_degrees(double gon) { return gon * 0.9; }
double elevation_from_zenith(double zenith_rad) { return std::numbers::pi / 2.0 - zenith_rad; }

}  // namespace soffit
