#pragma once
// Centroid and principal spreads of a point set: the conditioning (centre,
// scale) and the collinearity test shared by the algebraic circle and direct
// ellipse fits.
#include <optional>
#include <span>

#include "geometry/core/reading.hpp"

namespace soffit {

struct PointSpread {
  double mx = 0.0, mz = 0.0;  // centroid
  double rms = 0.0;           // RMS distance from the centroid (> 0)
  double along = 0.0;         // RMS spread along the principal line
  double across = 0.0;        // RMS spread across it (0 for collinear points)
};

// std::nullopt for an empty set, a non-finite coordinate or coincident points.
// `across` is computed directly from the perpendicular offsets when it is small,
// so its accuracy is that of the coordinates, not of a cancelling determinant.
std::optional<PointSpread> point_spread(std::span<const Point2> points);

// The same from moments a caller has already summed in its own pass: the
// centroid and the centred second moments (means) xx, zz, xz. `points` is read
// again only for nearly collinear data.
std::optional<PointSpread> point_spread(std::span<const Point2> points, Point2 centroid,
                                        double xx, double zz, double xz);

// Mean of the points; std::nullopt when empty or not finite.
std::optional<Point2> centroid(std::span<const Point2> points);

// Whether the points lie on a line to within `relative` of their extent:
// across ≤ relative · along.
bool is_collinear(const PointSpread& spread, double relative);

}  // namespace soffit
