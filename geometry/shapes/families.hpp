#pragma once
// One accessor per family; each is defined in its own file beside this one.
#include "geometry/shapes/shape_family.hpp"

namespace soffit {
const ShapeFamily& semicircular_family();
const ShapeFamily& segmental_family();
const ShapeFamily& parabolic_family();
const ShapeFamily& elliptical_family();
const ShapeFamily& pointed_family();
const ShapeFamily& three_centred_family();
}  // namespace soffit
