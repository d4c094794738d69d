#pragma once
// Derivatives by central differences, for what has no closed form: the
// distance to a pointed or three-centred arch, the span and rise derived from
// a fit, the normal of a drawn curve.
//
// A function signals "outside my domain" with a non-finite value (NaN). Where
// only one side of x lies inside, the derivative is the one-sided difference
// from f(x); where neither does, it is not finite.
//
// Function values are double or an Eigen vector (a Jacobian column).
//
// relative_step: ∛ε suits a smooth function. A function with kinks (the
// distance to an arch made of pieces) is blended across a kink within one step
// of it; a caller that must resolve finer than that passes a smaller step.
#include <Eigen/Core>
#include <algorithm>
#include <cmath>

namespace soffit {

// The step at x is relative_step · max(|x|, 1); central_relative_step() is
// ∛ε, the usual choice for a central difference (numeric_derivative.cpp says why).
double central_relative_step();
inline double difference_step(double x, double relative_step) {
  return relative_step * std::max(std::abs(x), 1.0);
}

namespace numeric_derivative_detail {
inline bool all_finite(double v) { return std::isfinite(v); }
template <class Derived>
bool all_finite(const Eigen::MatrixBase<Derived>& v) {
  return v.allFinite();
}
}  // namespace numeric_derivative_detail

// df/dx at x, where f(x) = fx is already known.
template <class Function, class Value>
Value numeric_derivative(const Function& f, double x, const Value& fx,
                         double relative_step = central_relative_step()) {
  using numeric_derivative_detail::all_finite;
  const double h = difference_step(x, relative_step);
  const Value f_up = f(x + h), f_down = f(x - h);
  const bool up_ok = all_finite(f_up), down_ok = all_finite(f_down);
  if (up_ok == down_ok) return Value((f_up - f_down) / (2 * h));  // not finite when neither side is
  // At the edge of the domain: one-sided, on the same step. Its error is of
  // order h rather than h², ample for a standard deviation or a search direction.
  return up_ok ? Value((f_up - fx) / h) : Value((fx - f_down) / h);
}

// ∂f/∂x_j for every j, written to gradient[0 .. x.size()), where f maps an
// Eigen vector to a double and f(x) = fx.
template <class Function, class Vector>
void numeric_gradient(const Function& f, const Vector& x, double fx, double* gradient,
                      double relative_step = central_relative_step()) {
  Vector probe = x;
  for (Eigen::Index j = 0; j < x.size(); ++j) {
    gradient[j] = numeric_derivative(
        [&](double t) {
          probe[j] = t;
          return f(probe);
        },
        x[j], fx, relative_step);
    probe[j] = x[j];
  }
}

// The Jacobian ∂f_i/∂x_j of f mapping an Eigen vector to an Eigen::VectorXd,
// where f(x) = fx.
template <class Function, class Vector>
Eigen::MatrixXd numeric_jacobian(const Function& f, const Vector& x, const Eigen::VectorXd& fx) {
  Eigen::MatrixXd jacobian(fx.size(), x.size());
  Vector probe = x;
  for (Eigen::Index j = 0; j < x.size(); ++j) {
    jacobian.col(j) = numeric_derivative(
        [&](double t) -> Eigen::VectorXd {
          probe[j] = t;
          return f(probe);
        },
        x[j], fx);
    probe[j] = x[j];
  }
  return jacobian;
}

}  // namespace soffit
