#include "geometry/analysis/distributions.hpp"

#include <cmath>

namespace soffit {

double chi_square_quantile(int dof, double z) {
  const double k = dof;
  const double c = 2.0 / (9.0 * k);
  const double base = 1.0 - c + z * std::sqrt(c);
  return k * base * base * base;
}

double student_t_975(int dof) {
  // t(0.975) for 1–4 degrees of freedom, where the expansion is poor.
  static constexpr double small[] = {12.7062, 4.3027, 3.1824, 2.7764};
  if (dof < 1) dof = 1;
  if (dof <= 4) return small[dof - 1];
  const double z = 1.959963984540054, v = dof;
  const double z3 = z * z * z, z5 = z3 * z * z, z7 = z5 * z * z, z9 = z7 * z * z;
  return z + (z3 + z) / (4 * v) + (5 * z5 + 16 * z3 + 3 * z) / (96 * v * v) +
         (3 * z7 + 19 * z5 + 17 * z3 - 15 * z) / (384 * v * v * v) +
         (79 * z9 + 776 * z7 + 1482 * z5 - 1920 * z3 - 945 * z) / (92160 * v * v * v * v);
}

}  // namespace soffit
