#include <array>

#include "geometry/shapes/families.hpp"

namespace soffit {

std::span<const ShapeFamily* const> shape_families() {
  // To add a family: write its file, declare its accessor in families.hpp, list it here.
  static const std::array<const ShapeFamily*, 6> all = {
      &semicircular_family(), &segmental_family(), &parabolic_family(),
      &elliptical_family(),   &pointed_family(),   &three_centred_family(),
  };
  return all;
}

const ShapeFamily* find_shape_family(std::string_view name) {
  for (const ShapeFamily* family : shape_families())
    if (family->name() == name) return family;
  return nullptr;
}

}  // namespace soffit
