#pragma once
// Uncertainty of every derived quantity: value, standard deviation and 95% interval.
//
// Two propagations (JCGM 100:2008 and JCGM 101:2008):
//  - linearised: the parameter covariance (JᵀWJ)⁻¹ pushed through a numerical
//    Jacobian of the derived quantities (first order, symmetric intervals);
//  - Monte Carlo: each draw perturbs every reading by its σ (isotropic normal),
//    refits from the estimate and recomputes every quantity; the interval is
//    the 2.5–97.5 percentile range of the draws. Seeded and reproducible.
// When the springing level comes from the end readings, it is recomputed from
// the perturbed readings in each draw (linearised: its own variance is added).
//
// Honesty rule: when the scatter about the fit exceeds what the stated σ
// allows (reduced χ² above its 95% limit), every σ is scaled by √(reduced χ²)
// and the linearised interval uses Student's t; the report says so. (At 95%,
// correct σ are widened one time in twenty, a small cost in coverage; σ
// understated by half are caught most of the time.)
#include <cstdint>
#include <string>
#include <utility>
#include <vector>

#include "geometry/analysis/profile_fit.hpp"

namespace soffit {

struct Estimate {
  double value = 0.0;
  double sd = 0.0;
  double lo = 0.0;  // 95% interval
  double hi = 0.0;
};

struct UncertaintyOptions {
  int monte_carlo_draws = 2000;  // 0: linearised only
  std::uint64_t seed = 1;
};

struct Uncertainty {
  std::string method;  // "monte-carlo" or "linearised": which one `geometry` and `parameters` hold
  int draws_requested = 0;
  int draws_used = 0;
  std::uint64_t seed = 0;
  double reduced_chi2_limit = 0.0;  // 95% quantile of χ²/dof
  bool widened = false;
  double scale = 1.0;  // factor applied to every σ
  std::vector<Estimate> geometry;   // aligned with geometry_quantity_keys()
  std::vector<std::pair<std::string, Estimate>> parameters;
  std::vector<Estimate> geometry_linearised;
  std::vector<std::pair<std::string, Estimate>> parameters_linearised;
  std::vector<std::string> notes;
};

Uncertainty propagate_uncertainty(const ShapeFit& fit, const Readings& readings,
                                  const UncertaintyOptions& options);

}  // namespace soffit
