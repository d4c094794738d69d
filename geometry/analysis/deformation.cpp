#include "geometry/analysis/deformation.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <iomanip>
#include <sstream>

namespace soffit {

namespace {

constexpr double kRunSignificance = 3.0;
constexpr double kSingleReadingSigmas = 3.0;

DeformationZone make_zone(const ShapeFit& fit, const Readings& readings, const std::vector<size_t>& run) {
  DeformationZone z;
  z.readings = run;
  z.x_from = readings[run.front()].x;
  z.x_to = readings[run.back()].x;
  double sum = 0.0, standardised = 0.0;
  for (size_t i : run) {
    sum += fit.residuals[i];
    standardised += fit.residuals[i] / fit.sigmas[i];
    if (std::abs(fit.residuals[i]) > std::abs(z.peak_departure_m)) z.peak_departure_m = fit.residuals[i];
  }
  const double m = static_cast<double>(run.size());
  z.mean_departure_m = sum / m;
  z.significance = std::abs(standardised) / std::sqrt(m);
  z.kind = z.mean_departure_m < 0 ? "below ideal" : "above ideal";
  std::ostringstream d;
  d.setf(std::ios::fixed);
  d.precision(1);
  if (run.size() == 1) {
    d << "single reading at x = " << std::setprecision(3) << z.x_from << " m lies "
      << std::setprecision(1) << std::abs(z.peak_departure_m) * 1000 << " mm "
      << (z.peak_departure_m < 0 ? "below" : "above")
      << " the fitted intrados (a protruding unit, a recessed joint or a local movement)";
  } else {
    d << run.size() << " readings from x = " << std::setprecision(3) << z.x_from << " to "
      << z.x_to << " m lie on average " << std::setprecision(1) << std::abs(z.mean_departure_m) * 1000
      << " mm " << (z.mean_departure_m < 0 ? "below the fitted intrados (flattening or local sag)"
                                            : "above the fitted intrados (local bulge or hump)");
  }
  z.description = d.str();
  return z;
}

}  // namespace

std::vector<DeformationZone> find_deformation_zones(const ShapeFit& fit, const Readings& readings) {
  std::vector<size_t> order;
  for (size_t i = 0; i < readings.size(); ++i)
    if (fit.used[i]) order.push_back(i);
  std::sort(order.begin(), order.end(), [&](size_t a, size_t b) { return readings[a].x < readings[b].x; });

  std::vector<DeformationZone> zones;
  auto sigma = [&](size_t i) { return fit.sigmas[i]; };
  auto close_run = [&](std::vector<size_t>& run) {
    if (run.size() >= 2) {
      DeformationZone z = make_zone(fit, readings, run);
      if (z.significance > kRunSignificance) zones.push_back(std::move(z));
    } else if (run.size() == 1 && std::abs(fit.residuals[run[0]]) > kSingleReadingSigmas * sigma(run[0])) {
      zones.push_back(make_zone(fit, readings, run));
    }
    run.clear();
  };

  std::vector<size_t> run;
  for (size_t i : order) {
    const double r = fit.residuals[i];
    const bool beyond = std::abs(r) > sigma(i);
    const bool same_side = !run.empty() && (r < 0) == (fit.residuals[run.back()] < 0);
    if (!beyond || (!run.empty() && !same_side)) close_run(run);
    if (beyond) run.push_back(i);
  }
  close_run(run);
  return zones;
}

}  // namespace soffit
