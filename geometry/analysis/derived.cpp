#include "geometry/analysis/derived.hpp"

namespace soffit {

DerivedValues derive(const ShapeFamily& family, const SolverVector& params, const Outline& o) {
  const double span = o.span();
  const double left = o.x_left(), right = o.x_right();
  const double crown_x = (left + right) / 2.0;  // every family here is symmetric
  const double crown_z = height_at(o, crown_x);
  const double rise = crown_z - o.z_springing;
  const double quarter_left = left + span / 4.0, quarter_right = right - span / 4.0;
  const double rq =
      (height_at(o, quarter_left) + height_at(o, quarter_right)) / 2.0 - o.z_springing;
  const double radius_quarter =
      (radius_of_curvature_at(o, quarter_left) + radius_of_curvature_at(o, quarter_right)) / 2.0;
  DerivedValues out;
  out.geometry = {span,   rise,   span / rise, o.z_springing,
                  left,   right,  crown_x,     crown_z,
                  rq,     rq / rise, radius_of_curvature_at(o, crown_x), radius_quarter,
                  arc_length(o)};
  out.parameters = family.reported_parameters(params, o);
  return out;
}

std::optional<DerivedValues> derive(const ShapeFamily& family, const SolverVector& params,
                                    double springing_z) {
  const auto o = family.outline(params, springing_z);
  if (!o) return std::nullopt;
  return derive(family, params, *o);
}

}  // namespace soffit
