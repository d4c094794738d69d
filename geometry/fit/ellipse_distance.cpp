#include "geometry/fit/ellipse_distance.hpp"

#include <cmath>
#include <algorithm>
#include <limits>

namespace soffit {

namespace {

struct Quadrant {
  double x0, x1;  // foot in the first quadrant, larger axis first
};

// Root of F in σ = s + 1 > 0, with k = r₀ − 1 ≥ 0 formed without cancellation:
//   F(σ) = (r₀z₀/(σ + k))² + (z₁/σ)² − 1,  F(1) = g = z₀² + z₁² − 1,
// bracketed by [z₁, 1] inside and [max(z₁, 1), |(r₀z₀, z₁)|] outside (Eberly
// 2013, shifted by one so that a tiny z₁ does not round the left end onto
// the pole at s = −1). z₀, z₁ > 0.
double root_of_secular(double r0, double k, double z0, double z1, double g) {
  const double n0 = r0 * z0;
  // F and F' together: two divisions per evaluation.
  auto eval = [&](double sg, double* slope) {
    const double i0 = 1.0 / (sg + k), i1 = 1.0 / sg;
    const double q0 = n0 * i0, q1 = z1 * i1;
    const double a0 = q0 * q0, a1 = q1 * q1;
    if (slope) *slope = -2 * (a0 * i0 + a1 * i1);
    return a0 + a1 - 1;
  };
  constexpr double eps = std::numeric_limits<double>::epsilon();
  double lo = g < 0 ? z1 : std::max(z1, 1.0);               // F(lo) ≥ 0
  double hi = g < 0 ? 1.0 : std::sqrt(n0 * n0 + z1 * z1);   // F(hi) ≤ 0
  double sg = lo, slope = 0, fs = 0;
  bool started = false;
  if (g < 0) {
    // Points near the curve have their root near σ = 1. By convexity a Newton
    // step from the right end lands left of the root: a good left end.
    double slope_at_1 = 0;
    eval(1.0, &slope_at_1);
    const double from_right = 1.0 - g / slope_at_1;
    if (from_right > lo && from_right < hi) {
      fs = eval(from_right, &slope);
      if (fs < 0) return from_right;  // past the root only by rounding
      lo = sg = from_right;
      started = true;
    }
  }
  if (!started) fs = eval(sg, &slope);
  double previous_step = hi - lo;
  for (int i = 0; i < 200 && fs > 0; ++i) {
    const double step = -fs / slope;
    // The step changes the foot point by about step/σ: stop at rounding.
    if (!(step > 2 * eps * sg)) {
      if (sg + step < hi) sg += step;
      break;
    }
    double next = sg + step;
    // Newton from the left is monotone but crawls away from the pole (×1.5
    // a step); bisect whenever it does not at least halve its step.
    const bool newton = next < hi && !(step > 0.5 * previous_step);
    if (!newton) next = 0.5 * (lo + hi);
    if (!(next > lo && next < hi)) break;  // bracket down to adjacent doubles
    double next_slope = 0;
    const double fn = eval(next, &next_slope);
    if (fn >= 0) {
      slope = next_slope;
      previous_step = next - sg;
      lo = sg = next;
      fs = fn;
    } else if (newton) {
      // Convexity keeps Newton from the left short of the root; F < 0 here is
      // rounding, so `next` is the root to working precision.
      sg = next;
      break;
    } else {
      hi = next;
    }
  }
  return sg;
}

// Eberly 2013 for e0 ≥ e1 > 0 and y0, y1 ≥ 0.
Quadrant foot_first_quadrant(double e0, double e1, double y0, double y1) {
  if (y1 > 0) {
    if (y0 > 0) {
      const double z0 = y0 / e0, z1 = y1 / e1;
      const double g = z0 * z0 + z1 * z1 - 1;
      if (g == 0) return {y0, y1};
      const double r0 = (e0 / e1) * (e0 / e1);
      const double k = (e0 - e1) * (e0 + e1) / (e1 * e1);
      const double sg = root_of_secular(r0, k, z0, z1, g);
      return {r0 * y0 / (sg + k), y1 / sg};
    }
    return {0.0, e1};  // on the minor axis: the minor vertex (e0 ≥ e1)
  }
  // On the major axis. Inside the evolute's cusp the foot leaves the axis.
  const double numer = e0 * y0, denom = e0 * e0 - e1 * e1;
  if (numer < denom) {
    const double xde0 = numer / denom;
    return {e0 * xde0, e1 * std::sqrt(std::max(0.0, 1 - xde0 * xde0))};
  }
  return {e0, 0.0};
}

}  // namespace

EllipseFoot closest_point_on_ellipse(double a, double b, Point2 p) {
  const bool swap = b > a;  // Eberly's form wants the larger axis first
  const double e0 = swap ? b : a, e1 = swap ? a : b;
  const double u = swap ? p.z : p.x, v = swap ? p.x : p.z;
  const Quadrant q = foot_first_quadrant(e0, e1, std::abs(u), std::abs(v));
  const double fu = std::copysign(q.x0, u), fv = std::copysign(q.x1, v);

  EllipseFoot r;
  r.foot = swap ? Point2{fv, fu} : Point2{fu, fv};
  r.t = std::atan2(r.foot.z / b, r.foot.x / a);
  // Outward normal ∝ ∇(x²/a² + z²/b²) at the foot.
  const double nx = r.foot.x / (a * a), nz = r.foot.z / (b * b);
  const double nn = std::sqrt(nx * nx + nz * nz);
  r.normal = {nx / nn, nz / nn};
  const double dist = std::sqrt((p.x - r.foot.x) * (p.x - r.foot.x) + (p.z - r.foot.z) * (p.z - r.foot.z));
  const double level = (p.x / a) * (p.x / a) + (p.z / b) * (p.z / b) - 1;
  r.signed_distance = level < 0 ? -dist : dist;
  return r;
}

}  // namespace soffit
