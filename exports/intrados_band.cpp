#include "exports/intrados_band.hpp"

#include <Eigen/Core>
#include <algorithm>
#include <cmath>

#include "geometry/analysis/distributions.hpp"

namespace soffit {

namespace {

constexpr double kZ975 = 1.959963984540054;  // two-sided 95% normal quantile

}  // namespace

// Outward normal of one outline piece at a point of it (each piece is the
// upper branch of a circle, an axis-aligned ellipse or a parabola).
Point2 piece_normal(const OutlinePiece& p, Point2 at) {
  double nx = 0.0, nz = 1.0;
  switch (p.kind) {
    case OutlinePiece::Kind::circular: nx = at.x - p.cx, nz = at.z - p.cz; break;
    case OutlinePiece::Kind::elliptical: nx = (at.x - p.cx) / (p.a * p.a), nz = (at.z - p.cz) / (p.b * p.b); break;
    case OutlinePiece::Kind::parabolic: nx = 2.0 * p.a * (at.x - p.cx), nz = 1.0; break;
  }
  const double length = std::hypot(nx, nz);
  return length > 0.0 ? Point2{nx / length, nz / length} : Point2{0.0, 1.0};
}

std::vector<size_t> piece_end_indices(const Outline& outline, int points_per_piece) {
  // sample_outline: n points for the first piece, n − 1 more for each next one.
  const size_t n = static_cast<size_t>(std::max(points_per_piece, 2));
  std::vector<size_t> ends;
  for (int j = 0; j < outline.count; ++j) ends.push_back((n - 1) * static_cast<size_t>(j + 1));
  return ends;
}

IntradosBand intrados_band(const ShapeFit& fit, const Uncertainty& uncertainty, int points_per_piece) {
  const ShapeFamily& family = *fit.family;
  IntradosBand band;
  band.coverage_factor = uncertainty.widened ? student_t_975(fit.dof) : kZ975;
  const Eigen::Index p = fit.params.size();
  const Eigen::MatrixXd covariance = uncertainty.scale * uncertainty.scale * Eigen::MatrixXd(fit.covariance);
  const std::vector<Point2> samples = sample_outline(fit.outline, points_per_piece);
  const std::vector<size_t> ends = piece_end_indices(fit.outline, points_per_piece);
  size_t piece = 0;
  for (size_t i = 0; i < samples.size(); ++i) {
    const Point2 at = samples[i];
    // A junction station takes the normal of the piece on its left (as
    // radius_of_curvature_at does); section_ring_fill handles corners.
    while (piece + 1 < ends.size() && i > ends[piece]) ++piece;
    IntradosStation s;
    s.at = at;
    s.normal = piece_normal(fit.outline.pieces[piece], at);
    double gradient[kMaxSolverParameters] = {};
    distance_with_gradient(family, fit.params, at, gradient);
    const Eigen::Map<const Eigen::VectorXd> g(gradient, p);
    const double variance = g.dot(covariance * g);
    s.position_sd_m = std::sqrt(std::max(0.0, variance));
    s.half_width_95_m = band.coverage_factor * s.position_sd_m;
    band.stations.push_back(s);
  }
  return band;
}

Point2 offset_point(const IntradosStation& station, double distance) {
  return {station.at.x + distance * station.normal.x, station.at.z + distance * station.normal.z};
}

}  // namespace soffit
