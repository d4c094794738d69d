#include "geometry/fit/circle_algebraic.hpp"

#include <cmath>

#include "geometry/fit/point_spread.hpp"

namespace soffit {

namespace {

// Moments (means) of the centred, scaled data; Mz = Mxx + Myy = 1 by the scaling.
struct CircleMoments {
  double mx = 0, my = 0, scale = 1;  // centroid and RMS distance from it
  double xx = 0, yy = 0, xy = 0, xz = 0, yz = 0, zz = 0, z = 0;
};

std::optional<CircleMoments> centred_moments(std::span<const Point2> points) {
  const std::size_t n = points.size();
  if (n < 3) return std::nullopt;
  const auto spread = point_spread(points);
  if (!spread || is_collinear(*spread, kCircleCollinearRelative)) return std::nullopt;
  CircleMoments m;
  m.mx = spread->mx;
  m.my = spread->mz;
  m.scale = spread->rms;
  const double inv = 1.0 / m.scale;
  for (const Point2& p : points) {
    const double x = (p.x - m.mx) * inv, y = (p.z - m.my) * inv, z = x * x + y * y;
    m.xx += x * x;
    m.yy += y * y;
    m.xy += x * y;
    m.xz += x * z;
    m.yz += y * z;
    m.zz += z * z;
  }
  for (double* v : {&m.xx, &m.yy, &m.xy, &m.xz, &m.yz, &m.zz}) *v /= double(n);
  m.z = m.xx + m.yy;
  return m;
}

// The circle of the generalised eigenvector for eigenvalue eta (Chernov 2010,
// §5–7): rows 2–3 of (M − ηN)v = 0 give the centre; row 4 gives D, hence R.
// extra_r2 is −D/A − Mz: 0 for Kåsa and Taubin, 2η for Pratt.
std::optional<Circle> circle_at(const CircleMoments& m, double eta, double extra_r2) {
  const double det = eta * eta - eta * m.z + (m.xx * m.yy - m.xy * m.xy);
  const double cx = (m.xz * (m.yy - eta) - m.yz * m.xy) / (2.0 * det);
  const double cy = (m.yz * (m.xx - eta) - m.xz * m.xy) / (2.0 * det);
  const double r2 = cx * cx + cy * cy + m.z + extra_r2;
  if (!std::isfinite(cx) || !std::isfinite(cy) || !(r2 > 0) || !std::isfinite(r2)) return std::nullopt;
  return Circle{m.mx + m.scale * cx, m.my + m.scale * cy, m.scale * std::sqrt(r2)};
}

// Smallest non-negative root of P(η) = f(η)·Δ(η) − g(η), with
//   Δ(η) = η² − Mz η + (MxxMyy − Mxy²),
//   g(η) = Mxz²(Myy − η) + Myz²(Mxx − η) − 2 Mxz Myz Mxy,
// and f the first row of (M − ηN)v after eliminating B, C, D:
//   Taubin f = Mzz − Mz² − 4 Mz η,   Pratt f = Mzz − (Mz + 2η)².
// Newton from η = 0 descends monotonically to that root (Chernov 2010, §5.5);
// the loop stops when |P| stops decreasing, i.e. at rounding level.
template <class F, class DF>
double smallest_root(const CircleMoments& m, F f, DF df) {
  const double cov = m.xx * m.yy - m.xy * m.xy;
  auto poly = [&](double e) {
    const double delta = e * e - m.z * e + cov;
    const double g = m.xz * m.xz * (m.yy - e) + m.yz * m.yz * (m.xx - e) - 2 * m.xz * m.yz * m.xy;
    return f(e) * delta - g;
  };
  auto dpoly = [&](double e) {
    const double delta = e * e - m.z * e + cov;
    return df(e) * delta + f(e) * (2 * e - m.z) + (m.xz * m.xz + m.yz * m.yz);
  };
  double eta = 0, p = poly(0);
  for (int i = 0; i < 100 && p != 0; ++i) {
    const double next = eta - p / dpoly(eta);
    if (!std::isfinite(next) || next == eta) break;
    const double pn = poly(next);
    if (std::abs(pn) >= std::abs(p)) break;
    eta = next;
    p = pn;
  }
  return eta;
}

}  // namespace

std::optional<Circle> fit_circle_kasa(std::span<const Point2> points) {
  const auto m = centred_moments(points);
  if (!m) return std::nullopt;
  return circle_at(*m, 0.0, 0.0);  // A = 1: η = 0 in the same equations
}

std::optional<Circle> fit_circle_taubin(std::span<const Point2> points) {
  const auto m = centred_moments(points);
  if (!m) return std::nullopt;
  const double var_z = m->zz - m->z * m->z;
  const double eta = smallest_root(
      *m, [&](double e) { return var_z - 4 * m->z * e; }, [&](double) { return -4 * m->z; });
  return circle_at(*m, eta, 0.0);
}

std::optional<Circle> fit_circle_pratt(std::span<const Point2> points) {
  const auto m = centred_moments(points);
  if (!m) return std::nullopt;
  const double eta = smallest_root(
      *m, [&](double e) { return m->zz - (m->z + 2 * e) * (m->z + 2 * e); },
      [&](double e) { return -4 * (m->z + 2 * e); });
  return circle_at(*m, eta, 2 * eta);
}

}  // namespace soffit
