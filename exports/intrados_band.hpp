#pragma once
// The fitted intrados sampled for drawing and meshing, with the outward normal
// at each sample and the 95% band of the curve's position.
//
// How the band is computed (linearised, JCGM 100:2008 §5): a change δθ of the
// fitted parameters moves the curve at a point P of it by −∇θ d(P)·δθ along
// the normal, where d is the family's signed orthogonal distance. Its variance
// is gᵀ C g with g = ∇θ d(P) and C the fit covariance (JᵀWJ)⁻¹, scaled by the
// same factor as every other range when the scatter exceeds the stated σ
// (uncertainty.hpp); the half-width is 1.96 sd, or Student's t when widened.
// It is the band of the curve's *position*: the uncertainty of where the
// springing line lies (end readings) moves the ends of the arch, not the
// curve, and is stated in the span and rise ranges instead.
#include <string>
#include <vector>

#include "geometry/analysis/profile_fit.hpp"
#include "geometry/analysis/uncertainty.hpp"

namespace soffit {

struct IntradosStation {
  Point2 at;                      // on the fitted intrados, m
  Point2 normal;                  // unit vector, outward: into the masonry
  double position_sd_m = 0.0;     // sd of the curve's position along the normal
  double half_width_95_m = 0.0;   // coverage_factor × position_sd_m
};

struct IntradosBand {
  std::vector<IntradosStation> stations;  // left springing to right springing
  double coverage_factor = 0.0;           // 1.96, or Student's t when the ranges were widened
};

// `points_per_piece` samples per outline piece (sample_outline).
IntradosBand intrados_band(const ShapeFit& fit, const Uncertainty& uncertainty, int points_per_piece);

// Outward unit normal of one outline piece at a point of it, from the
// piece's own curve (circle, axis-aligned ellipse, parabola): exact, and
// unambiguous at the springings where a distance gradient can pick the
// wrong branch.
Point2 piece_normal(const OutlinePiece& piece, Point2 at);

// Index, among sample_outline(outline, points_per_piece), of the last sample
// of each piece: the junctions, then the right springing.
std::vector<size_t> piece_end_indices(const Outline& outline, int points_per_piece);

// The point `distance` metres from the station along its outward normal
// (the extrados when `distance` is the ring thickness).
Point2 offset_point(const IntradosStation& station, double distance);

}  // namespace soffit
