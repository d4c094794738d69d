#include "geometry/analysis/profile_analysis.hpp"

#include <cmath>
#include <sstream>

namespace soffit {

namespace {

std::string mm(double metres) {
  std::ostringstream s;
  s.setf(std::ios::fixed);
  s.precision(1);
  s << metres * 1000.0;
  return s.str();
}

std::string metres(double value) {
  std::ostringstream s;
  s.setf(std::ios::fixed);
  s.precision(3);
  s << value;
  return s.str();
}

}  // namespace

ProfileAnalysis analyse_profile(const Readings& readings, const ProfileRequest& request) {
  ProfileAnalysis out;
  if (request.shape == "auto") {
    out.selection = select_shape(readings, request.fit);
    if (out.selection->chosen < 0) {
      out.error = out.selection->reason;
      for (const ShapeCandidate& c : out.selection->candidates)
        out.error += "; " + std::string(c.family->name()) + ": " + c.error;
      return out;
    }
    out.fit = out.selection->candidates[static_cast<size_t>(out.selection->chosen)].fit;
  } else {
    const ShapeFamily* family = find_shape_family(request.shape);
    if (!family) {
      out.error = "unknown shape '" + request.shape + "'";
      return out;
    }
    FitOutcome outcome = fit_shape(*family, readings, request.fit);
    if (!outcome.fit) {
      out.error = outcome.error;
      return out;
    }
    out.fit = std::move(outcome.fit);
  }

  const ShapeFit& fit = *out.fit;
  out.uncertainty = propagate_uncertainty(fit, readings, request.uncertainty);
  out.zones = find_deformation_zones(fit, readings);
  for (const std::string& note : out.uncertainty.notes) out.warnings.push_back(note);
  for (size_t i : fit.downweighted) {
    out.warnings.push_back("reading at x = " + metres(readings[i].x) + " m (line " +
                           std::to_string(readings[i].source_line) + ") was set aside by the robust fit: " +
                           mm(fit.residuals[i]) + " mm from the curve; it is kept in the data");
  }
  if (request.fit.springing_z && fit.family->springing_from_shape()) {
    out.warnings.push_back("--springing-z was not used: a " + std::string(fit.family->name()) +
                           " arch's springing line passes through its centres");
  }
  if (springing_gap_ratio(fit) > kMaxSpringingGapRatio) {
    out.warnings.push_back("the readings end " + mm(fit.end_readings_z - fit.outline.z_springing) +
                           " mm above this shape's springing line: its span and rise are extrapolated "
                           "below the surveyed profile; another family may describe it better");
  }
  if (fit.springing_from_ends && !request.fit.springing_z) {
    out.warnings.push_back(
        "the springing level is taken as the mean level of the two end readings; give "
        "--springing-z if the profile does not start and end at the springings");
  }
  if (fit.family->name() == "segmental" && fit.params[1] > fit.outline.z_springing) {
    out.warnings.push_back("the circle's centre lies above the springing level: the arch is more than a "
                           "semicircle (horseshoe or stilted); check the springing level");
  }
  return out;
}

}  // namespace soffit
