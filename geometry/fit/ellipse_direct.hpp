#pragma once
// Direct least-squares ellipse fit: minimises the algebraic distance
// Σ (A x² + B x z + C z² + D x + E z + F)² under 4AC − B² = 1, which makes the
// result an ellipse whenever one exists.
//   A. Fitzgibbon, M. Pilu, R. B. Fisher, "Direct least square fitting of
//   ellipses", IEEE TPAMI 21(5) (1999) 476–480;
//   R. Halíř, J. Flusser, "Numerically stable direct least squares fitting of
//   ellipses", Proc. WSCG'98 (1998) 125–132 — the reduced 3×3 eigenproblem
//   used here.
//
// Conditioning: the points are centred on their centroid and scaled by their
// RMS distance from it first; without this, coordinates near 1e6 (national
// grid) break the fit. The ellipse is computed in that frame and mapped back.
// The eigenvector is chosen by the sign of aᵀCa = 4AC − B² > 0, not by the
// sign of its eigenvalue, which for exact data is 0 ± rounding.
//
// Returns std::nullopt for fewer than 5 points, non-finite or collinear data
// (relative test as for circles, kEllipseCollinearRelative), or when the best
// conic is not a real ellipse.
#include <optional>
#include <span>

#include "geometry/core/reading.hpp"
#include "geometry/fit/ellipse_conic.hpp"

namespace soffit {

constexpr double kEllipseCollinearRelative = 1e-10;

struct DirectEllipseFit {
  // In the caller's coordinates, scaled to unit Euclidean norm with A + C > 0.
  // At large coordinate offsets its D, E, F are ill-conditioned: use `ellipse`.
  Conic conic;
  Ellipse ellipse;  // computed in the centred, scaled frame, then mapped back
};

std::optional<DirectEllipseFit> fit_ellipse_direct(std::span<const Point2> points);

}  // namespace soffit
