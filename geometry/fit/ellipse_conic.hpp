#pragma once
// An ellipse in the section plane, and its conversion from a general conic.
#include <optional>

namespace soffit {

// Centre (cx, cz), semi-axes a ≥ b > 0, and alpha, the angle of the major axis
// from +x towards +z, in (−π/2, π/2]. For a circle (a = b) alpha is 0.
struct Ellipse {
  double cx = 0.0;
  double cz = 0.0;
  double a = 0.0;
  double b = 0.0;
  double alpha = 0.0;
};

// A x² + B x z + C z² + D x + E z + F = 0.
struct Conic {
  double A = 0.0, B = 0.0, C = 0.0, D = 0.0, E = 0.0, F = 0.0;
};

// The ellipse the conic describes, or std::nullopt when it describes none
// (hyperbola, parabola, imaginary or degenerate ellipse, non-finite values).
// Centre from ∇Q = 0; semi-axes from the eigenvalues of [[A, B/2], [B/2, C]]
// and the conic's value at the centre (any analytic-geometry text).
std::optional<Ellipse> conic_to_ellipse(const Conic& conic);

}  // namespace soffit
