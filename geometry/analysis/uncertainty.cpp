#include "geometry/analysis/uncertainty.hpp"

#include <Eigen/Core>
#include <algorithm>
#include <cmath>
#include <limits>
#include <sstream>

#include "geometry/analysis/derived.hpp"
#include "geometry/analysis/distributions.hpp"
#include "geometry/analysis/random_normal.hpp"
#include "geometry/core/end_readings.hpp"
#include "geometry/core/numeric_derivative.hpp"

namespace soffit {

namespace {

constexpr double kZ975 = 1.959963984540054;
constexpr double kZ95 = 1.6448536269514722;  // one-sided 95% normal quantile
// Below this, the 2.5% and 97.5% order statistics are not estimated at all.
constexpr int kMinimumDraws = 100;

// Every derived value in one flat vector: geometry first, then parameters.
std::optional<Eigen::VectorXd> flatten(const ShapeFamily& family, const SolverVector& params,
                                       double springing_z) {
  const auto d = derive(family, params, springing_z);
  if (!d) return std::nullopt;
  Eigen::VectorXd v(static_cast<Eigen::Index>(d->geometry.size() + d->parameters.size()));
  Eigen::Index k = 0;
  for (double g : d->geometry) v[k++] = g;
  for (const auto& [name, value] : d->parameters) v[k++] = value;
  return v;
}

// The same, all NaN (outside the domain, for numeric_derivative) when empty.
Eigen::VectorXd flatten_or_nan(const ShapeFamily& family, const SolverVector& params, double springing_z,
                               Eigen::Index size) {
  auto v = flatten(family, params, springing_z);
  return v ? std::move(*v) : Eigen::VectorXd::Constant(size, std::numeric_limits<double>::quiet_NaN());
}

// q-quantile with linear interpolation between order statistics (the sample
// quantile JCGM 101 §7.7 builds its coverage interval from). Reorders `v`.
double percentile(std::vector<double>& v, double q) {
  const double pos = q * static_cast<double>(v.size() - 1);
  const size_t i = static_cast<size_t>(pos);
  const double f = pos - static_cast<double>(i);
  std::nth_element(v.begin(), v.begin() + static_cast<long>(i), v.end());
  const double lower = v[i];
  if (f == 0.0 || i + 1 >= v.size()) return lower;
  const double upper = *std::min_element(v.begin() + static_cast<long>(i) + 1, v.end());
  return lower * (1 - f) + upper * f;
}

void split(const std::vector<Estimate>& flat, const NamedValues& names, size_t geometry_count,
           std::vector<Estimate>& geometry, std::vector<std::pair<std::string, Estimate>>& params) {
  geometry.assign(flat.begin(), flat.begin() + static_cast<long>(geometry_count));
  params.clear();
  for (size_t k = 0; k < names.size(); ++k) params.emplace_back(names[k].first, flat[geometry_count + k]);
}

}  // namespace

Uncertainty propagate_uncertainty(const ShapeFit& fit, const Readings& readings,
                                  const UncertaintyOptions& options) {
  const ShapeFamily& family = *fit.family;
  Uncertainty out;
  out.seed = options.seed;
  out.reduced_chi2_limit = chi_square_quantile(fit.dof, kZ95) / fit.dof;
  if (fit.reduced_chi2 > out.reduced_chi2_limit) {
    out.widened = true;
    out.scale = std::sqrt(fit.reduced_chi2);
    std::ostringstream note;
    note.precision(3);
    note << "the scatter about the fit exceeds the stated precision (reduced chi-square "
         << fit.reduced_chi2 << " on " << fit.dof << " degrees of freedom, 95% limit "
         << out.reduced_chi2_limit << "): every range is widened by a factor " << out.scale;
    out.notes.push_back(note.str());
  }
  const double scale2 = out.scale * out.scale;

  const auto nominal_derived = derive(family, fit.params, fit.outline);
  const NamedValues& names = nominal_derived.parameters;
  const size_t geometry_count = nominal_derived.geometry.size();
  Eigen::VectorXd nominal(static_cast<Eigen::Index>(geometry_count + names.size()));
  {
    Eigen::Index k = 0;
    for (double g : nominal_derived.geometry) nominal[k++] = g;
    for (const auto& nv : names) nominal[k++] = nv.second;
  }
  const Eigen::Index q = nominal.size();
  const Eigen::Index p = fit.params.size();

  // --- Linearised propagation -------------------------------------------
  const double level = fit.outline.z_springing;
  // A quantity that cannot be evaluated on either side of the estimate adds
  // nothing; on one side only (a fit on the edge of its family, such as a
  // pointed arch with ρ = h), numeric_derivative takes the one-sided difference.
  const auto finite_or_zero = [](const Eigen::MatrixXd& m) -> Eigen::MatrixXd {
    return m.unaryExpr([](double v) { return std::isfinite(v) ? v : 0.0; });
  };
  const Eigen::MatrixXd gradient = finite_or_zero(numeric_jacobian(
      [&](const SolverVector& params) { return flatten_or_nan(family, params, level, q); }, fit.params, nominal));
  Eigen::MatrixXd covariance = scale2 * gradient * Eigen::MatrixXd(fit.covariance) * gradient.transpose();
  if (fit.springing_from_ends) {
    const EndReadings ends = *find_end_readings(readings, fit.used);
    // The end readings also pull on the fitted parameters, so the level and the
    // parameters are correlated: δθ = −C Σ Jᵢᵀ wᵢ δdᵢ with δdᵢ = nᵢ·δpᵢ, hence
    // Cov(θ, ℓ) = −½ C Σ_{ends} Jᵢᵀ wᵢ σᵢ² n_zᵢ.
    const double var_level = scale2 * end_readings_level_variance(fit, readings);
    Eigen::VectorXd cross = Eigen::VectorXd::Zero(p);
    for (size_t i : {ends.first, ends.last}) {
      const Point2 at{readings[i].x, readings[i].z};
      double jac[kMaxSolverParameters];
      distance_with_gradient(family, fit.params, at, jac);
      const double nz = distance_gradient_at_point(family, fit.params, at).z;
      for (Eigen::Index j = 0; j < p; ++j) cross[j] += jac[j] * fit.weights[i] * nz;
    }
    cross = -0.5 * scale2 * (Eigen::MatrixXd(fit.covariance) * cross);
    const Eigen::VectorXd g = finite_or_zero(numeric_derivative(
        [&](double z) { return flatten_or_nan(family, fit.params, z, q); }, level, nominal));
    const Eigen::VectorXd gc = gradient * cross;
    covariance += var_level * g * g.transpose() + gc * g.transpose() + g * gc.transpose();
  }
  const double k95 = out.widened ? student_t_975(fit.dof) : kZ975;
  std::vector<Estimate> linear(static_cast<size_t>(q));
  for (Eigen::Index i = 0; i < q; ++i) {
    const double sd = std::sqrt(std::max(0.0, covariance(i, i)));
    linear[static_cast<size_t>(i)] = {nominal[i], sd, nominal[i] - k95 * sd, nominal[i] + k95 * sd};
  }
  split(linear, names, geometry_count, out.geometry_linearised, out.parameters_linearised);

  out.draws_requested = std::max(0, options.monte_carlo_draws);
  if (out.draws_requested == 0) {
    out.method = "linearised";
    out.geometry = out.geometry_linearised;
    out.parameters = out.parameters_linearised;
    return out;
  }

  // --- Monte Carlo propagation -----------------------------------------
  std::vector<Point2> base;
  std::vector<double> sigma, weights;
  for (size_t i = 0; i < readings.size(); ++i) {
    if (!fit.used[i]) continue;
    base.push_back({readings[i].x, readings[i].z});
    sigma.push_back(fit.sigmas[i] * out.scale);
    weights.push_back(fit.weights[i] / (fit.sigmas[i] * fit.sigmas[i]));
  }
  NormalSource normal(options.seed);
  std::vector<std::vector<double>> columns(static_cast<size_t>(q));
  for (auto& c : columns) c.reserve(static_cast<size_t>(out.draws_requested));
  std::vector<Point2> perturbed(base.size());
  for (int draw = 0; draw < out.draws_requested; ++draw) {
    for (size_t k = 0; k < base.size(); ++k) {
      perturbed[k].x = base[k].x + sigma[k] * normal.next();
      perturbed[k].z = base[k].z + sigma[k] * normal.next();
    }
    const auto params = refit_points(family, perturbed, weights, fit.params);
    if (!params) continue;
    const double draw_level = fit.springing_from_ends ? end_readings_level(perturbed) : level;
    const auto values = flatten(family, *params, draw_level);
    if (!values || !values->allFinite()) continue;
    for (Eigen::Index i = 0; i < q; ++i) columns[static_cast<size_t>(i)].push_back((*values)[i]);
  }
  out.draws_used = static_cast<int>(columns[0].size());
  if (out.draws_used < kMinimumDraws || out.draws_used < out.draws_requested / 2) {
    out.method = "linearised";
    out.notes.push_back(
        out.draws_used < out.draws_requested / 2
            ? "most Monte Carlo refits failed (" + std::to_string(out.draws_used) + " of " +
                  std::to_string(out.draws_requested) +
                  " succeeded): ranges are the linearised ones and may understate the uncertainty"
            : std::to_string(out.draws_requested) + " Monte Carlo draws are too few for a 95% interval (at least " +
                  std::to_string(kMinimumDraws) + " are needed): ranges are the linearised ones");
    out.geometry = out.geometry_linearised;
    out.parameters = out.parameters_linearised;
    return out;
  }
  if (out.draws_used < out.draws_requested) {
    out.notes.push_back(std::to_string(out.draws_requested - out.draws_used) + " of " +
                        std::to_string(out.draws_requested) +
                        " Monte Carlo refits failed and were left out");
  }
  out.method = "monte-carlo";
  std::vector<Estimate> mc(static_cast<size_t>(q));
  for (Eigen::Index i = 0; i < q; ++i) {
    std::vector<double>& c = columns[static_cast<size_t>(i)];
    double mean = 0.0;
    for (double v : c) mean += v;
    mean /= static_cast<double>(c.size());
    double ss = 0.0;
    for (double v : c) ss += (v - mean) * (v - mean);
    mc[static_cast<size_t>(i)] = {nominal[i], std::sqrt(ss / static_cast<double>(c.size() - 1)),
                                  percentile(c, 0.025), percentile(c, 0.975)};
  }
  split(mc, names, geometry_count, out.geometry, out.parameters);
  return out;
}

}  // namespace soffit
