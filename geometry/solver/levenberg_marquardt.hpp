#pragma once
// Levenberg–Marquardt for small parameter vectors (at most kMaxSolverParameters).
//
// The caller hands over normal equations (JᵀWJ, JᵀWr, Σ w r²) rather than a
// Jacobian matrix, so that a fit over a million scan points never stores one:
// it sums the normal equations in its residual loop. Problems with an explicit
// residual vector (the NIST StRD tests) go through `from_residuals`.
//
// Failure is part of the answer (see SolverStatus): a start that leads off to
// infinity, or a minimum where some parameter is not determined, is reported,
// never returned as a fit.
#include <Eigen/Core>
#include <functional>
#include <string>

namespace soffit {

constexpr int kMaxSolverParameters = 8;
using SolverMatrix = Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, 0,
                                   kMaxSolverParameters, kMaxSolverParameters>;
using SolverVector = Eigen::Matrix<double, Eigen::Dynamic, 1, 0, kMaxSolverParameters, 1>;

struct NormalEquations {
  SolverMatrix jtj;        // Σ w Jᵢᵀ Jᵢ
  SolverVector jtr;        // Σ w Jᵢᵀ rᵢ
  double cost = 0.0;       // Σ w rᵢ²
  int residual_count = 0;  // number of residuals summed
};

// Evaluates the problem at `params`. Must set `cost` and `residual_count`; sets
// `jtj` and `jtr` (sized to params) when `want_derivatives`. Returns false when
// the parameters are outside the model's domain (the step is then refused).
using NormalEquationsFn =
    std::function<bool(const SolverVector& params, bool want_derivatives, NormalEquations& out)>;

enum class SolverStatus {
  converged,        // a minimum with every parameter determined
  max_iterations,   // ran out of iterations before converging
  diverged,         // parameters ran off to infinity or became non-finite
  invalid_start,    // the start is outside the model's domain
  singular,         // stationary, but JᵀWJ is singular there: a parameter is not determined
};

struct SolverOptions {
  int max_iterations = 200;
  double relative_step_tolerance = 1e-12;
  double relative_cost_tolerance = 1e-15;
  double gradient_tolerance = 1e-14;   // on the scaled gradient, relative to cost
  double initial_damping = 1e-3;       // λ relative to diag(JᵀWJ)
  double singular_rcond = 1e-13;       // reciprocal condition of the scaled JᵀWJ
  // Off for refits that start at a solution already checked (Monte Carlo draws):
  // the conditioning tests cost as much as an iteration.
  bool check_conditioning = true;
};

struct SolverResult {
  SolverVector params;
  SolverMatrix jtj;     // JᵀWJ at the solution (its inverse is the covariance for unit σ)
  double cost = 0.0;    // Σ w r² at the solution
  int residual_count = 0;
  int iterations = 0;
  SolverStatus status = SolverStatus::invalid_start;
  std::string message;
  bool ok() const { return status == SolverStatus::converged; }
};

SolverResult levenberg_marquardt(const NormalEquationsFn& evaluate, const SolverVector& start,
                                 const SolverOptions& options = {});

// Explicit residuals r (size m) and optional Jacobian J (m × p) at p.
using ResidualFn =
    std::function<bool(const Eigen::VectorXd& p, Eigen::VectorXd& r, Eigen::MatrixXd* jacobian)>;
NormalEquationsFn from_residuals(int residual_count, ResidualFn residuals);

const char* to_string(SolverStatus status);

}  // namespace soffit
