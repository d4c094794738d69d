#pragma once
// Quantities an engineer takes from a fitted profile, in a fixed order, so the
// linearised and Monte Carlo propagation treat every one of them alike.
#include <optional>
#include <string>
#include <vector>

#include "geometry/shapes/shape_family.hpp"

namespace soffit {

// Keys of the geometric quantities common to every family, with units.
// rq is the rise at the quarter points (L/4 from each springing); rc the rise at the crown.
inline const std::vector<std::string>& geometry_quantity_keys() {
  static const std::vector<std::string> keys = {
      "span_m",          "rise_m",          "span_rise_ratio",     "springing_z_m",
      "springing_left_x_m", "springing_right_x_m", "crown_x_m",     "crown_z_m",
      "rise_quarter_m",  "rq_rc_ratio",     "radius_crown_m",      "radius_quarter_m",
      "arc_length_m",
  };
  return keys;
}

struct DerivedValues {
  std::vector<double> geometry;   // aligned with geometry_quantity_keys()
  NamedValues parameters;         // the family's reported parameters
};

// Empty when the parameters give no arch at that springing level.
std::optional<DerivedValues> derive(const ShapeFamily& family, const SolverVector& params,
                                    double springing_z);
DerivedValues derive(const ShapeFamily& family, const SolverVector& params, const Outline& outline);

}  // namespace soffit
