#pragma once
// Fitting one shape family to a section's readings: weighted orthogonal-distance
// least squares by Levenberg–Marquardt, optionally robust (iteratively
// reweighted with Tukey's biweight, so a reading taken on a protruding voussoir
// stops pulling the curve and is reported instead).
//
// What the covariance assumes: readings independent, isotropic Gaussian errors
// with the stated σ, the model exact, the fit at an interior minimum with every
// parameter determined. It is (JᵀWJ)⁻¹ with W = diag(1/σ²); it is NOT scaled by
// the reduced χ² here (uncertainty.hpp decides whether to widen it).
#include <optional>
#include <string>
#include <vector>

#include "geometry/core/end_readings.hpp"
#include "geometry/core/reading.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit {

struct FitOptions {
  // Springing level for families whose shape does not fix it (segmental,
  // parabolic). Empty: the mean level of the two end readings.
  std::optional<double> springing_z;
  bool robust = false;
  double fallback_sigma_m = 0.003;  // for readings that state no σ
};

struct ShapeFit {
  const ShapeFamily* family = nullptr;
  SolverVector params;
  SolverMatrix covariance;      // (JᵀWJ)⁻¹ at the solution, a-priori σ
  bool springing_from_ends = false;  // outline.z_springing is end_readings_z
  double end_readings_z = 0.0;  // mean level of the two end readings used
  double data_rise = 0.0;       // highest reading used above end_readings_z
  Outline outline;              // its z_springing is the springing level used
  int iterations = 0;

  // Per reading, in the order of the input (excluded and check readings too).
  std::vector<double> residuals;  // signed orthogonal distance, m (+ above the intrados)
  std::vector<double> sigmas;     // σ used, m
  std::vector<double> weights;    // robust weight in [0, 1]; 1 when not robust; 0 if not used
  std::vector<bool> used;

  int n_used = 0;
  int dof = 0;
  double chi2 = 0.0;            // Σ w (r/σ)² over the readings used
  double reduced_chi2 = 0.0;    // chi2 / dof
  double rms_m = 0.0;           // √(Σ r²/n), readings used and kept by the robust fit, unweighted
  double max_abs_m = 0.0;       // over the same readings
  double aic = 0.0, bic = 0.0;  // Gaussian likelihood with σ known up to one common scale
  std::vector<size_t> downweighted;  // readings the robust fit set aside (weight < 0.5)
};

struct FitOutcome {
  std::optional<ShapeFit> fit;
  std::string error;  // why there is no fit
};

FitOutcome fit_shape(const ShapeFamily& family, const Readings& readings, const FitOptions& options);

// Refit from `start` to perturbed points with fixed weights, for Monte Carlo
// draws: no robust loop, no bookkeeping. Empty when the fit fails.
std::optional<SolverVector> refit_points(const ShapeFamily& family, const std::vector<Point2>& points,
                                         const std::vector<double>& weights,
                                         const SolverVector& start);

// How far the end readings lie above the springing line of a shape that fixes
// its own (semicircular, elliptical, pointed, three-centred), as a fraction of
// the rise the readings cover. Near 0 when the profile starts and ends at the
// springings; large when the shape extrapolates far below the readings, as a
// full circle does through a segmental arch's readings.
double springing_gap_ratio(const ShapeFit& fit);
// 0.35: readings that stop short of the springings (silt, a hidden skewback)
// are common; a full circle through a segmental arch's readings (span/rise 4:
// gap 1.5 times the rise) is not an arch.
constexpr double kMaxSpringingGapRatio = 0.35;

// Variance of the springing level taken from the end readings (their mean z):
// (σ₁² + σ₂²)/4 with the σ the fit used for them. `readings` are the fitted ones.
double end_readings_level_variance(const ShapeFit& fit, const Readings& readings);

}  // namespace soffit
