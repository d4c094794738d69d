#pragma once
// Where the measured profile departs from the fitted ideal shape by more than
// its uncertainty. Readings are taken in order along the span; a zone is
//  - a run of at least two neighbouring readings on the same side of the curve,
//    each beyond 1σ, whose standardised mean Σ(rᵢ/σᵢ)/√m exceeds 3, or
//  - a single reading beyond 3σ (a protruding unit, a recessed joint, or a
//    local movement: FIELD practice is to flag it, never to delete it).
// σ is each reading's stated precision, never the widened one: a blunder that
// inflates the scatter must not hide itself. Zones are observations, not judgements.
#include <string>
#include <vector>

#include "geometry/analysis/profile_fit.hpp"

namespace soffit {

struct DeformationZone {
  double x_from = 0.0, x_to = 0.0;   // m along the span
  std::vector<size_t> readings;       // indices into the readings, along the span
  double mean_departure_m = 0.0;      // signed: − below the ideal intrados (sag, flattening)
  double peak_departure_m = 0.0;      // signed, largest magnitude
  double significance = 0.0;          // |Σ rᵢ/σᵢ| / √m
  std::string kind;                   // "below ideal" or "above ideal"
  std::string description;
};

std::vector<DeformationZone> find_deformation_zones(const ShapeFit& fit, const Readings& readings);

}  // namespace soffit
