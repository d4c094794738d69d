#pragma once
// Quantiles needed to judge a fit's scatter and to state intervals.
namespace soffit {

// Upper quantile of χ² with `dof` degrees of freedom (Wilson–Hilferty cube-root
// approximation, accurate to about 1% for dof ≥ 3). `z` is the standard normal
// quantile of the same probability (2.326 for 99%).
double chi_square_quantile(int dof, double z);

// Two-sided 95% quantile of Student's t with `dof` degrees of freedom
// (Cornish–Fisher expansion, Abramowitz & Stegun 26.7.5; exact table below 5).
double student_t_975(int dof);

}  // namespace soffit
