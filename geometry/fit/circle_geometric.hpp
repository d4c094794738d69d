#pragma once
// Geometric (orthogonal-distance) circle fit for anything from six readings to
// a million scan points: minimises Σ wᵢ (|pᵢ − c| − R)².
//
// Start: Taubin's algebraic fit (circle_algebraic.hpp), whose bias is of second
// order in the noise, so Gauss–Newton is already in its quadratic region; then
// soffit::levenberg_marquardt. Each evaluation is ONE pass over the points that
// sums the 3×3 normal equations (JᵀWJ, JᵀWr, Σ w r²) in the residual loop: no
// Jacobian is stored and nothing is allocated per iteration. The method and its
// Jacobian are those of W. Gander, G. H. Golub, R. Strebel, "Least-squares
// fitting of circles and ellipses", BIT 34 (1994) 558–578, and N. Chernov,
// "Circular and Linear Regression", CRC Press 2010.
//
// Covariance: `jtj` is JᵀWJ at the solution in the parameter order
// (cx, cz, r). With weights wᵢ = 1/σᵢ² its inverse is the first-order
// covariance; with unit weights scale the inverse by rss / (n − 3). Both are
// first-order (linearised) results: on a flat arc the radius and the centre
// height are strongly correlated and the linearisation understates the tails.
#include <array>
#include <optional>
#include <span>
#include <string>

#include "geometry/core/circle.hpp"
#include "geometry/core/reading.hpp"

namespace soffit {

struct CircleFit {
  Circle circle;
  double rss = 0.0;        // Σ wᵢ (|pᵢ − c| − R)² at the solution
  int point_count = 0;     // points with non-zero weight
  int iterations = 0;      // solver iterations (each one pass over the points)
  bool converged = false;  // false: the circle is the last iterate, not a minimum
  std::string message;     // the solver's verdict, for the report
  std::array<std::array<double, 3>, 3> jtj{};  // JᵀWJ, order (cx, cz, r)
};

struct CircleFitOptions {
  int max_iterations = 100;
};

// weights: empty (all 1) or one non-negative finite weight per point.
// Returns std::nullopt when no circle can be started: fewer than 3 points (of
// non-zero weight), collinear or non-finite data (see circle_algebraic.hpp), or
// weights of the wrong count or with a negative or non-finite entry.
std::optional<CircleFit> fit_circle_geometric(std::span<const Point2> points,
                                              std::span<const double> weights = {},
                                              const CircleFitOptions& options = {});

}  // namespace soffit
