#pragma once
// Algebraic (non-iterative) circle fits: the starts for the geometric fit and
// the quick answers for a handful of readings.
//
// All three minimise Σ (A zᵢ + B xᵢ + C yᵢ + D)², zᵢ = xᵢ² + yᵢ², under a
// different normalisation of (A, B, C, D):
//   Kåsa   A = 1                       I. Kåsa, "A circle fitting procedure and its
//                                      error analysis", IEEE Trans. Instrum. Meas.
//                                      IM-25 (1976) 8–14. Biased towards small
//                                      radii on short arcs.
//   Pratt  B² + C² − 4AD = 1           V. Pratt, "Direct least-squares fitting of
//                                      algebraic surfaces", Computer Graphics 21(4)
//                                      (SIGGRAPH 1987) 145–152.
//   Taubin mean gradient norm = 1      G. Taubin, "Estimation of planar curves,
//                                      surfaces and nonplanar space curves defined by
//                                      implicit equations…", IEEE TPAMI 13(11)
//                                      (1991) 1115–1138.
// The formulation (moments of the centred data, smallest non-negative root of
// the characteristic polynomial found by Newton's method from 0) follows
// N. Chernov, "Circular and Linear Regression: Fitting Circles and Lines by
// Least Squares", CRC Press 2010 (its algebraic-fit chapters).
//
// Conditioning: the points are centred on their centroid and scaled by their
// RMS distance from it before any moment is formed, so survey coordinates
// (national grid, ~1e6 m) lose no digits.
//
// Degeneracy (returns std::nullopt): fewer than 3 points; a non-finite
// coordinate; all points coincident; or the points collinear to within
// rounding, decided relative to the data's own extent: the RMS spread across
// the principal line is below kCircleCollinearRelative times the RMS spread
// along it. Nearly (but measurably) straight data still gives a circle, with a
// radius that may be very large: that is the honest least-squares answer.
#include <optional>
#include <span>

#include "geometry/core/circle.hpp"
#include "geometry/core/reading.hpp"

namespace soffit {

// Relative thickness of the point cloud below which it counts as a line.
constexpr double kCircleCollinearRelative = 1e-10;

std::optional<Circle> fit_circle_kasa(std::span<const Point2> points);
std::optional<Circle> fit_circle_pratt(std::span<const Point2> points);
std::optional<Circle> fit_circle_taubin(std::span<const Point2> points);

}  // namespace soffit
