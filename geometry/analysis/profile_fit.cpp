#include "geometry/analysis/profile_fit.hpp"

#include <Eigen/Cholesky>
#include <Eigen/Eigenvalues>
#include <algorithm>
#include <cmath>

namespace soffit {

namespace {

constexpr double kTukeyC = 4.685;  // 95% efficiency at the normal (Tukey biweight)
constexpr int kMaxRobustRounds = 30;

NormalEquationsFn make_problem(const ShapeFamily& family, const std::vector<Point2>& points,
                               const std::vector<double>& weights) {
  return [&family, &points, &weights](const SolverVector& params, bool want_derivatives,
                                      NormalEquations& ne) {
    return family.normal_equations(params, points, weights, want_derivatives, ne);
  };
}

// Readings much farther from the reported intrados (the upper branch between
// the springings, sampled finely) than from the fitted curve itself: more than
// 5σ + 5 mm beyond their residual. A full circle or ellipse can pass close to
// readings on its underside; the intrados reported from it does not.
int readings_off_the_arch(const ShapeFamily& family, const SolverVector& params, const Outline& outline,
                          const std::vector<Point2>& points, const std::vector<double>& inverse_variance) {
  const std::vector<Point2> curve = sample_outline(outline, 256);
  int off = 0;
  for (size_t k = 0; k < points.size(); ++k) {
    const Point2 p = points[k];
    double best = INFINITY;
    for (size_t i = 1; i < curve.size(); ++i) {
      const double ax = curve[i - 1].x, az = curve[i - 1].z;
      const double bx = curve[i].x - ax, bz = curve[i].z - az;
      const double len2 = bx * bx + bz * bz;
      const double t = len2 > 0 ? std::clamp(((p.x - ax) * bx + (p.z - az) * bz) / len2, 0.0, 1.0) : 0.0;
      best = std::min(best, std::hypot(p.x - ax - t * bx, p.z - az - t * bz));
    }
    const double residual = std::abs(family.signed_distance(params, p, nullptr));
    if (best > residual + 5.0 / std::sqrt(inverse_variance[k]) + 0.005) ++off;
  }
  return off;
}

// Smallest over largest spread of the points about their centroid: zero for
// points on one straight line, whatever its direction.
double straightness(const std::vector<Point2>& points) {
  Eigen::Vector2d mean = Eigen::Vector2d::Zero();
  for (const Point2& p : points) mean += Eigen::Vector2d(p.x, p.z);
  mean /= static_cast<double>(points.size());
  Eigen::Matrix2d scatter = Eigen::Matrix2d::Zero();
  for (const Point2& p : points) {
    const Eigen::Vector2d d = Eigen::Vector2d(p.x, p.z) - mean;
    scatter += d * d.transpose();
  }
  Eigen::SelfAdjointEigenSolver<Eigen::Matrix2d> eig(scatter);
  const double big = eig.eigenvalues()[1];
  return big > 0.0 ? std::sqrt(std::max(0.0, eig.eigenvalues()[0]) / big) : 0.0;
}

double median(std::vector<double> v) {
  if (v.empty()) return 0.0;
  const size_t mid = v.size() / 2;
  std::nth_element(v.begin(), v.begin() + static_cast<long>(mid), v.end());
  double m = v[mid];
  if (v.size() % 2 == 0) m = (m + *std::max_element(v.begin(), v.begin() + static_cast<long>(mid))) / 2;
  return m;
}

}  // namespace

double springing_gap_ratio(const ShapeFit& fit) {
  if (!fit.family->springing_from_shape() || !(fit.data_rise > 0.0)) return 0.0;
  return (fit.end_readings_z - fit.outline.z_springing) / fit.data_rise;
}

double end_readings_level_variance(const ShapeFit& fit, const Readings& readings) {
  const auto ends = find_end_readings(readings, fit.used);
  if (!ends) return 0.0;
  const double s1 = fit.sigmas[ends->first], s2 = fit.sigmas[ends->last];
  return (s1 * s1 + s2 * s2) / 4;
}

std::optional<SolverVector> refit_points(const ShapeFamily& family, const std::vector<Point2>& points,
                                         const std::vector<double>& weights,
                                         const SolverVector& start) {
  SolverOptions options;
  options.max_iterations = 60;
  // A draw's answer only needs to be far finer than its own scatter (σ ≈ mm):
  // 1e-9 of the parameters' size is well below a micrometre on any arch.
  options.relative_step_tolerance = 1e-9;
  options.relative_cost_tolerance = 1e-12;
  options.initial_damping = 1e-6;  // the start is a solution for nearby data: begin near Gauss–Newton
  options.check_conditioning = false;
  const SolverResult r = levenberg_marquardt(make_problem(family, points, weights), start, options);
  if (r.status != SolverStatus::converged) return std::nullopt;
  return r.params;
}

FitOutcome fit_shape(const ShapeFamily& family, const Readings& readings, const FitOptions& options) {
  FitOutcome outcome;
  ShapeFit fit;
  fit.family = &family;
  const size_t total = readings.size();
  fit.residuals.assign(total, 0.0);
  fit.sigmas.assign(total, options.fallback_sigma_m);
  fit.weights.assign(total, 0.0);
  fit.used.assign(total, false);

  std::vector<Point2> points;
  std::vector<size_t> index;  // points[k] is readings[index[k]]
  std::vector<double> inverse_variance;
  for (size_t i = 0; i < total; ++i) {
    const Reading& r = readings[i];
    if (r.sigma > 0.0) fit.sigmas[i] = r.sigma;
    if (r.excluded || r.check) continue;
    fit.used[i] = true;
    points.push_back({r.x, r.z});
    index.push_back(i);
    inverse_variance.push_back(1.0 / (fit.sigmas[i] * fit.sigmas[i]));
  }
  const int p = family.parameter_count();
  const int n = static_cast<int>(points.size());
  if (n <= p) {
    outcome.error = std::to_string(n) + " usable readings are too few for a " +
                    std::string(family.name()) + " fit, which has " + std::to_string(p) +
                    " parameters: at least " + std::to_string(p + 1) + " are needed";
    return outcome;
  }
  if (straightness(points) < 1e-6) {
    outcome.error = "the readings lie on a straight line: no arch can be fitted to them";
    return outcome;
  }
  const auto start = family.initial_guess(points);
  if (!start) {
    outcome.error = "no starting shape found: the readings do not look like a " +
                    std::string(family.name()) + " arch";
    return outcome;
  }

  std::vector<double> robust(static_cast<size_t>(n), 1.0);
  std::vector<double> weights = inverse_variance;
  SolverResult solved = levenberg_marquardt(make_problem(family, points, weights), *start);
  for (int round = 0; options.robust && solved.ok() && round < kMaxRobustRounds; ++round) {
    // Tukey's biweight on residuals in units of σ times a robust scale (never
    // below 1: the stated precision is the floor).
    std::vector<double> standardized(static_cast<size_t>(n));
    for (int k = 0; k < n; ++k) {
      const double d = family.signed_distance(solved.params, points[static_cast<size_t>(k)], nullptr);
      standardized[static_cast<size_t>(k)] = d * std::sqrt(inverse_variance[static_cast<size_t>(k)]);
    }
    std::vector<double> magnitudes(standardized.size());
    std::transform(standardized.begin(), standardized.end(), magnitudes.begin(),
                   [](double u) { return std::abs(u); });
    const double scale = std::max(1.0, median(magnitudes) / 0.6745);
    double change = 0.0;
    for (size_t k = 0; k < robust.size(); ++k) {
      const double u = standardized[k] / (kTukeyC * scale);
      const double w = std::abs(u) < 1.0 ? (1 - u * u) * (1 - u * u) : 0.0;
      change = std::max(change, std::abs(w - robust[k]));
      robust[k] = w;
      weights[k] = w * inverse_variance[k];
    }
    if (change < 1e-4) break;
    const SolverResult next = levenberg_marquardt(make_problem(family, points, weights), solved.params);
    if (!next.ok()) break;
    solved = next;
  }
  if (!solved.ok()) {
    outcome.error = "the " + std::string(family.name()) + " fit failed: " + solved.message;
    return outcome;
  }

  fit.params = solved.params;
  fit.iterations = solved.iterations;
  fit.covariance = solved.jtj.ldlt().solve(SolverMatrix::Identity(p, p));
  fit.end_readings_z = end_readings_level(points);
  for (const Point2& q : points) fit.data_rise = std::max(fit.data_rise, q.z - fit.end_readings_z);
  double springing_level = 0.0;  // ignored by a shape that fixes its own springing line
  if (!family.springing_from_shape()) {
    springing_level = options.springing_z.value_or(fit.end_readings_z);
    fit.springing_from_ends = !options.springing_z;
  }
  const auto outline = family.outline(fit.params, springing_level);
  if (!outline) {
    outcome.error = "no " + std::string(family.name()) +
                    " arch fits between the springings at that level (it lies above the crown, or "
                    "below the centre of the curve): check the springing level";
    return outcome;
  }
  fit.outline = *outline;
  if (const int off = readings_off_the_arch(family, fit.params, *outline, points, inverse_variance); off * 4 > n) {
    // The full curve fits, but the readings lie on its underside: the arch
    // reported would not pass through them.
    outcome.error = std::to_string(off) + " of " + std::to_string(n) +
                    " readings are not on the upper side of the fitted " + std::string(family.name()) +
                    " curve: do the readings sag downward? Check the sign of the offsets "
                    "(offset_direction) and the datum";
    return outcome;
  }

  double sum_sq = 0.0;
  int effective = 0;
  for (size_t i = 0; i < total; ++i)
    fit.residuals[i] = family.signed_distance(fit.params, {readings[i].x, readings[i].z}, nullptr);
  for (int k = 0; k < n; ++k) {
    const size_t i = index[static_cast<size_t>(k)];
    const double d = fit.residuals[i];
    fit.weights[i] = robust[static_cast<size_t>(k)];
    fit.chi2 += weights[static_cast<size_t>(k)] * d * d;
    if (fit.weights[i] < 0.5) {
      fit.downweighted.push_back(i);  // reported on its own; not in the RMS of the fit
      continue;
    }
    sum_sq += d * d;
    fit.max_abs_m = std::max(fit.max_abs_m, std::abs(d));
    ++effective;
  }
  fit.n_used = n;
  fit.dof = std::max(1, effective - p);
  fit.reduced_chi2 = fit.chi2 / fit.dof;
  fit.rms_m = std::sqrt(sum_sq / std::max(1, effective));
  const double log_term = n * std::log(std::max(fit.chi2, 1e-300) / n);
  fit.aic = log_term + 2.0 * p;
  fit.bic = log_term + p * std::log(static_cast<double>(n));
  outcome.fit = std::move(fit);
  return outcome;
}

}  // namespace soffit
