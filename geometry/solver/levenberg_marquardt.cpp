// Levenberg–Marquardt with Marquardt's diagonal scaling and Nielsen's damping
// update (H. B. Nielsen, "Damping parameter in Marquardt's method", IMM DTU
// report 1999; K. Madsen, H. B. Nielsen, O. Tingleff, "Methods for non-linear
// least squares problems", 2004, §3.2).
//
// The scaling keeps the largest diagonal of JᵀWJ seen so far (as MINPACK does),
// so a parameter whose column vanishes (a start that runs off to a plateau) can
// not make the damped system singular; that parameter is then caught by the
// conditioning check at the end and reported as not determined.
#include "geometry/solver/levenberg_marquardt.hpp"

#include <Eigen/Cholesky>
#include <Eigen/Eigenvalues>
#include <algorithm>
#include <cmath>
#include <memory>

namespace soffit {

namespace {

bool all_finite(const SolverVector& v) {
  for (Eigen::Index i = 0; i < v.size(); ++i)
    if (!std::isfinite(v[i])) return false;
  return true;
}

// Scaled gradient: the cosine between the residual vector and each Jacobian
// column, as MINPACK's gtol measures it. Zero at a stationary point.
double scaled_gradient(const NormalEquations& ne) {
  if (ne.cost <= 0.0) return 0.0;
  double worst = 0.0;
  for (Eigen::Index j = 0; j < ne.jtr.size(); ++j) {
    const double column = ne.jtj(j, j);
    if (column <= 0.0) continue;
    worst = std::max(worst, std::abs(ne.jtr[j]) / std::sqrt(column * ne.cost));
  }
  return worst;
}

// Reciprocal condition number of JᵀWJ after scaling its diagonal to one.
double scaled_rcond(const SolverMatrix& jtj) {
  const Eigen::Index n = jtj.rows();
  SolverVector d(n);
  for (Eigen::Index j = 0; j < n; ++j) {
    if (!(jtj(j, j) > 0.0)) return 0.0;
    d[j] = 1.0 / std::sqrt(jtj(j, j));
  }
  SolverMatrix s = d.asDiagonal() * jtj * d.asDiagonal();
  Eigen::SelfAdjointEigenSolver<SolverMatrix> eig(s, Eigen::EigenvaluesOnly);
  const auto& ev = eig.eigenvalues();
  if (ev.size() == 0 || !(ev.maxCoeff() > 0.0)) return 0.0;
  return std::max(0.0, ev.minCoeff()) / ev.maxCoeff();
}

// True when some parameter's first-order standard deviation dwarfs its own
// size: the data no longer move it (a start that slid onto a plateau, such as
// an exponential rate running to infinity). Exact data (zero cost) pass.
bool has_undetermined_parameter(const SolverVector& params, const SolverMatrix& jtj, double cost,
                                int residual_count) {
  const Eigen::Index n = params.size();
  if (cost <= 0.0 || residual_count <= n) return false;
  const double s2 = cost / static_cast<double>(residual_count - n);
  const SolverMatrix inverse = jtj.ldlt().solve(SolverMatrix::Identity(n, n));
  const double size = params.cwiseAbs().maxCoeff();
  for (Eigen::Index j = 0; j < n; ++j) {
    const double sd = std::sqrt(std::abs(s2 * inverse(j, j)));
    const double scale = std::max(std::abs(params[j]), 1e-3 * size);
    if (!std::isfinite(sd) || sd > 1e6 * scale) return true;
  }
  return false;
}

}  // namespace

const char* to_string(SolverStatus status) {
  switch (status) {
    case SolverStatus::converged: return "converged";
    case SolverStatus::max_iterations: return "did not converge within the iteration limit";
    case SolverStatus::diverged: return "diverged";
    case SolverStatus::invalid_start: return "the starting values are outside the model";
    case SolverStatus::singular: return "a parameter is not determined by the data";
  }
  return "unknown";
}

SolverResult levenberg_marquardt(const NormalEquationsFn& evaluate, const SolverVector& start,
                                 const SolverOptions& options) {
  SolverResult result;
  const Eigen::Index n = start.size();
  result.params = start;

  NormalEquations current;
  if (n == 0 || n > kMaxSolverParameters || !all_finite(start) ||
      !evaluate(start, true, current) || !std::isfinite(current.cost)) {
    result.status = SolverStatus::invalid_start;
    result.message = to_string(result.status);
    return result;
  }

  SolverVector params = start;
  SolverVector scale = current.jtj.diagonal().cwiseMax(0.0);
  double lambda = options.initial_damping;
  double nu = 2.0;
  bool converged = current.cost == 0.0 || scaled_gradient(current) <= options.gradient_tolerance;
  NormalEquations trial;
  int iteration = 0;

  while (!converged && iteration < options.max_iterations) {
    ++iteration;
    for (Eigen::Index j = 0; j < n; ++j) scale[j] = std::max(scale[j], current.jtj(j, j));
    const double largest = std::max(scale.maxCoeff(), 1e-300);

    SolverMatrix damped = current.jtj;
    for (Eigen::Index j = 0; j < n; ++j)
      damped(j, j) += lambda * std::max(scale[j], 1e-12 * largest);
    const SolverVector step = damped.ldlt().solve(-current.jtr);
    if (!all_finite(step)) {
      lambda *= nu;
      nu *= 2.0;
      if (lambda > 1e30) break;
      continue;
    }

    const SolverVector candidate = params + step;
    if (!all_finite(candidate) || candidate.cwiseAbs().maxCoeff() > 1e30) {
      result.status = SolverStatus::diverged;
      result.params = params;
      result.jtj = current.jtj;
      result.cost = current.cost;
      result.residual_count = current.residual_count;
      result.iterations = iteration;
      result.message = "diverged: parameters ran off to infinity";
      return result;
    }

    // Gain ratio: actual over predicted reduction of Σ w r² (Nielsen).
    const double predicted = -(2.0 * step.dot(current.jtr) + step.dot(current.jtj * step));
    const bool valid = evaluate(candidate, true, trial) && std::isfinite(trial.cost);
    const double actual = valid ? current.cost - trial.cost : -1.0;
    if (valid && actual > 0.0 && predicted > 0.0) {
      const double rho = actual / predicted;
      const double relative_step =
          step.norm() / (params.norm() + options.relative_step_tolerance);
      const double relative_reduction = actual / current.cost;
      params = candidate;
      std::swap(current, trial);
      lambda *= std::max(1.0 / 3.0, 1.0 - std::pow(2.0 * rho - 1.0, 3));
      nu = 2.0;
      converged = current.cost == 0.0 || relative_reduction <= options.relative_cost_tolerance ||
                  relative_step <= options.relative_step_tolerance ||
                  scaled_gradient(current) <= options.gradient_tolerance;
    } else {
      // A refused step that is already below the step tolerance means no
      // representable step lowers the cost: this is the minimum.
      const double relative_step =
          step.norm() / (params.norm() + options.relative_step_tolerance);
      if (valid && relative_step <= options.relative_step_tolerance) {
        converged = true;
        break;
      }
      lambda *= nu;
      nu *= 2.0;
      if (lambda > 1e30) {
        converged = scaled_gradient(current) <= 1e-8;
        break;
      }
    }
  }

  result.params = params;
  result.jtj = current.jtj;
  result.cost = current.cost;
  result.residual_count = current.residual_count;
  result.iterations = iteration;
  if (!converged) {
    result.status = SolverStatus::max_iterations;
  } else if (options.check_conditioning &&
             (scaled_rcond(current.jtj) < options.singular_rcond ||
             has_undetermined_parameter(params, current.jtj, current.cost,
                                        current.residual_count))) {
    result.status = SolverStatus::singular;
  } else {
    result.status = SolverStatus::converged;
  }
  result.message = to_string(result.status);
  return result;
}

NormalEquationsFn from_residuals(int residual_count, ResidualFn residuals) {
  struct Scratch {
    Eigen::VectorXd p, r;
    Eigen::MatrixXd jacobian;
  };
  auto scratch = std::make_shared<Scratch>();
  return [residual_count, residuals = std::move(residuals), scratch](
             const SolverVector& params, bool want_derivatives, NormalEquations& out) {
    Scratch& s = *scratch;
    s.p = params;
    s.r.resize(residual_count);
    if (want_derivatives) s.jacobian.resize(residual_count, params.size());
    if (!residuals(s.p, s.r, want_derivatives ? &s.jacobian : nullptr)) return false;
    out.cost = s.r.squaredNorm();
    out.residual_count = residual_count;
    if (want_derivatives) {
      out.jtj = s.jacobian.transpose() * s.jacobian;
      out.jtr = s.jacobian.transpose() * s.r;
    }
    return true;
  };
}

}  // namespace soffit
