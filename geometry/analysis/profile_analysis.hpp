#pragma once
// The whole reduction of one section: choose or fit the family, propagate the
// uncertainty, find where the profile departs from the ideal. What `soffit fit`
// prints and what the app shows are both views of this one result.
#include <optional>
#include <string>
#include <vector>

#include "geometry/analysis/deformation.hpp"
#include "geometry/analysis/shape_selection.hpp"
#include "geometry/analysis/uncertainty.hpp"

namespace soffit {

struct ProfileRequest {
  std::string shape = "auto";  // a family name, or "auto"
  FitOptions fit;
  UncertaintyOptions uncertainty;
};

struct ProfileAnalysis {
  std::string error;                       // empty when a fit was made
  std::optional<ShapeSelection> selection; // present for "auto"
  std::optional<ShapeFit> fit;
  Uncertainty uncertainty;
  std::vector<DeformationZone> zones;
  std::vector<std::string> warnings;
  bool ok() const { return error.empty() && fit.has_value(); }
};

ProfileAnalysis analyse_profile(const Readings& readings, const ProfileRequest& request);

}  // namespace soffit
