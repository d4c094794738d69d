#include "geometry/core/numeric_derivative.hpp"

#include <cmath>
#include <limits>

namespace soffit {

// Why these steps (standard numerical analysis, e.g. Press et al., Numerical
// Recipes, "Numerical Derivatives"; from memory). With ε the machine epsilon,
// a central difference (f(x+h) − f(x−h)) / 2h has truncation error ≈ h²|f‴|/6
// and rounding error ≈ ε|f|/h; their sum is least for h ∝ ∛ε (≈ 6e-6), which
// gives about ε^(2/3) ≈ 4e-11 relative accuracy.
// Scaling by |x| keeps the step relative for large x (a mid-span at 50 m);
// the floor of 1 (one metre: everything here is in metres) keeps a usable step
// for a parameter near zero, such as a springing level at the datum.
double central_relative_step() {
  static const double kCbrtEpsilon = std::cbrt(std::numeric_limits<double>::epsilon());
  return kCbrtEpsilon;
}

}  // namespace soffit
