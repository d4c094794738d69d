#include "geometry/analysis/shape_selection.hpp"

#include <cmath>
#include <limits>
#include <sstream>

#include "geometry/core/numeric_derivative.hpp"
#include "geometry/shapes/families.hpp"

namespace soffit {

namespace {

constexpr double kSupportedDeltaAic = 2.0;
constexpr double kAgreementSigmas = 2.0;

int index_of(const ShapeSelection& s, const ShapeFamily& family) {
  for (size_t i = 0; i < s.candidates.size(); ++i)
    if (s.candidates[i].family == &family) return static_cast<int>(i);
  return -1;
}

// Standard deviation of gᵀθ under the fit's covariance, scaled by the reduced χ²
// when the scatter is larger than the stated σ allows for.
double linear_sd(const ShapeFit& fit, const SolverVector& g) {
  const double scale2 = std::max(1.0, fit.reduced_chi2);
  return std::sqrt(std::max(0.0, scale2 * g.dot(fit.covariance * g)));
}

std::string fmt(double v) {
  std::ostringstream s;
  s.setf(std::ios::fixed);
  s.precision(1);
  s << v;
  return s.str();
}

// Does the chosen family's own test say the arch is semicircular? Fills `why`.
// `level` is the springing level the readings imply (the end readings, or the
// level the surveyor gave) and `level_variance` its variance.
bool reduces_to_semicircle(const ShapeFit& fit, double level, double level_variance, std::string& why) {
  const std::string_view name = fit.family->name();
  const Eigen::Index p = fit.params.size();
  SolverVector g = SolverVector::Zero(p);
  double difference = 0.0, sd = 0.0;
  if (name == "segmental" || name == "semicircular") {
    // Both fit the same circle: compare its centre height with the springing level.
    g[1] = 1.0;
    difference = fit.params[1] - level;
    const double centre_sd = linear_sd(fit, g);
    sd = std::sqrt(centre_sd * centre_sd + std::max(1.0, fit.reduced_chi2) * level_variance);
    why = "the circle's centre lies " + fmt(difference * 1000) + " mm from the springing level (sd " +
          fmt(sd * 1000) + " mm)";
  } else if (name == "elliptical") {
    g[2] = 1.0;
    g[3] = -1.0;
    difference = fit.params[2] - fit.params[3];
    sd = linear_sd(fit, g);
    why = "the semi-axes differ by " + fmt(difference * 1000) + " mm (sd " + fmt(sd * 1000) + " mm)";
  } else if (name == "pointed") {
    g[3] = 1.0;
    g[2] = -1.0;
    difference = fit.params[3] - fit.params[2];
    sd = linear_sd(fit, g);
    why = "the arc radius exceeds the half-span by " + fmt(difference * 1000) + " mm (sd " +
          fmt(sd * 1000) + " mm)";
  } else if (name == "three-centred") {
    // R − r₁: the crown radius R is not a parameter but comes from the outline.
    const auto radii_difference = [&fit](const SolverVector& params) {
      const auto o = fit.family->outline(params, 0.0);
      return o ? o->pieces[1].a - params[4] : std::numeric_limits<double>::quiet_NaN();
    };
    difference = fit.outline.pieces[1].a - fit.params[4];
    numeric_gradient(radii_difference, fit.params, difference, g.data());
    g = g.unaryExpr([](double v) { return std::isfinite(v) ? v : 0.0; });  // no outline either side: no share
    sd = linear_sd(fit, g);
    why = "the crown and haunch radii differ by " + fmt(difference * 1000) + " mm (sd " +
          fmt(sd * 1000) + " mm)";
  } else {
    return false;
  }
  return std::abs(difference) <= kAgreementSigmas * sd;
}

}  // namespace

ShapeSelection select_shape(const Readings& readings, const FitOptions& options) {
  ShapeSelection s;
  for (const ShapeFamily* family : shape_families()) {
    ShapeCandidate c;
    c.family = family;
    FitOutcome outcome = fit_shape(*family, readings, options);
    c.fit = std::move(outcome.fit);
    c.error = std::move(outcome.error);
    if (c.fit && springing_gap_ratio(*c.fit) > kMaxSpringingGapRatio) {
      // Fits the readings, but only by extrapolating far below them: not supported.
      c.error = "its springing line lies " + fmt((c.fit->end_readings_z - c.fit->outline.z_springing) * 1000) +
                " mm below the end readings";
      c.supported = false;
    }
    s.candidates.push_back(std::move(c));
  }

  double best_aic = INFINITY;
  for (const ShapeCandidate& c : s.candidates)
    if (c.fit && c.supported) best_aic = std::min(best_aic, c.fit->aic);
  if (!std::isfinite(best_aic)) {
    s.reason = "no family could be fitted to these readings";
    return s;
  }
  for (size_t i = 0; i < s.candidates.size(); ++i) {
    const ShapeCandidate& c = s.candidates[i];
    if (!c.fit || !c.supported || c.fit->aic > best_aic + kSupportedDeltaAic) continue;
    if (s.chosen < 0) {
      s.chosen = static_cast<int>(i);
      continue;
    }
    const ShapeFamily& current = *s.candidates[static_cast<size_t>(s.chosen)].family;
    const bool fewer = c.family->parameter_count() < current.parameter_count();
    const bool as_few_but_simpler = c.family->parameter_count() == current.parameter_count() &&
                                    c.family->simplicity_rank() < current.simplicity_rank();
    if (fewer || as_few_but_simpler) s.chosen = static_cast<int>(i);
  }

  // Semicircular and segmental fit the same circle; the springing test decides.
  const bool chose_semicircle = s.candidates[static_cast<size_t>(s.chosen)].family == &semicircular_family();
  if (chose_semicircle) {
    const int seg = index_of(s, segmental_family());
    if (seg >= 0 && s.candidates[static_cast<size_t>(seg)].fit) s.chosen = seg;
  }

  const ShapeFit& chosen_fit = *s.candidates[static_cast<size_t>(s.chosen)].fit;
  const double level = options.springing_z.value_or(chosen_fit.end_readings_z);
  const double level_variance = options.springing_z ? 0.0 : end_readings_level_variance(chosen_fit, readings);
  std::string why;
  const int semi = index_of(s, semicircular_family());
  if (semi >= 0 && s.candidates[static_cast<size_t>(semi)].fit &&
      s.candidates[static_cast<size_t>(semi)].supported &&
      reduces_to_semicircle(chosen_fit, level, level_variance, why)) {
    s.reason = chosen_fit.family == &semicircular_family()
                   ? "semicircular: " + why + ", within twice its uncertainty"
                   : "semicircular: the " + std::string(chosen_fit.family->name()) +
                         " fit is not distinguishable from a semicircle (" + why + ")";
    s.chosen = semi;
    return s;
  }
  if (chosen_fit.family == &semicircular_family()) {
    s.reason = "semicircular: no segmental arc lies below the springing level (" + why + ")";
    return s;
  }
  s.reason = std::string(chosen_fit.family->name()) +
             ": the simplest family within 2 of the lowest AIC";
  if (!why.empty()) s.reason += " (" + why + ")";
  return s;
}

}  // namespace soffit
