#pragma once
// Angle units of surveying instruments.
//
// The gon (grad) is defined as 1/400 of a full turn, so 1 gon = 0.9 degree
// exactly (ISO 80000-3). Zenith angles are measured down from the vertical;
// elevation (vertical) angles up from the horizontal: elevation = 90° − zenith.
namespace soffit {

double degrees_to_radians(double deg);
double gon_to_radians(double gon);
double radians_to_degrees(double rad);
double gon_to_degrees(double gon);
double elevation_from_zenith(double zenith_rad);

}  // namespace soffit
