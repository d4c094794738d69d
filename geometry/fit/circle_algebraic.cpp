#include "geometry/fit/circle_algebraic.hpp"

#include <Eigen/Core>
#include <cmath>

#include "geometry/fit/point_spread.hpp"

namespace soffit {

namespace {

// Moments (means) of the centred, scaled data; Mz = Mxx + Myy = 1 by the scaling.
struct CircleMoments {
  double mx = 0, my = 0, scale = 1;  // centroid and RMS distance from it
  double xx = 0, yy = 0, xy = 0, xz = 0, yz = 0, zz = 0, z = 0;
};

// Two passes: the centroid, then every centred moment (unscaled; the scaling
// by the RMS radius s is applied to the sums, xz/s³, zz/s⁴, …).
std::optional<CircleMoments> centred_moments(std::span<const Point2> points) {
  const std::size_t n = points.size();
  if (n < 3) return std::nullopt;
  const auto c = centroid(points);
  if (!c) return std::nullopt;
  // Four points per step in Eigen::Array4d lanes (SIMD on any target): this
  // pass is part of every geometric fit of a 10⁶-point scan.
  using Lane = Eigen::Array4d;
  Lane xx = Lane::Zero(), yy = Lane::Zero(), xy = Lane::Zero(), xz = Lane::Zero(),
       yz = Lane::Zero(), zz = Lane::Zero();
  auto add = [&](const Lane& px, const Lane& pz, const Lane& keep) {
    const Lane x = (px - c->x) * keep, y = (pz - c->z) * keep, z = x * x + y * y;
    xx += x * x;
    yy += y * y;
    xy += x * y;
    xz += x * z;
    yz += y * z;
    zz += z * z;
  };
  std::size_t i = 0;
  for (; i + 4 <= n; i += 4) {
    const Point2* p = &points[i];
    add(Lane(p[0].x, p[1].x, p[2].x, p[3].x), Lane(p[0].z, p[1].z, p[2].z, p[3].z), Lane::Ones());
  }
  for (; i < n; ++i)
    add(Lane::Constant(points[i].x), Lane::Constant(points[i].z), Lane(1, 0, 0, 0));

  const double dn = double(n);
  const auto spread = point_spread(points, *c, xx.sum() / dn, yy.sum() / dn, xy.sum() / dn);
  if (!spread || is_collinear(*spread, kCircleCollinearRelative)) return std::nullopt;
  CircleMoments m;
  m.mx = c->x;
  m.my = c->z;
  m.scale = spread->rms;
  const double s2 = m.scale * m.scale;
  m.xx = xx.sum() / dn / s2;
  m.yy = yy.sum() / dn / s2;
  m.xy = xy.sum() / dn / s2;
  m.xz = xz.sum() / dn / (s2 * m.scale);
  m.yz = yz.sum() / dn / (s2 * m.scale);
  m.zz = zz.sum() / dn / (s2 * s2);
  m.z = m.xx + m.yy;
  return m;
}

// The circle of the generalised eigenvector for eigenvalue eta (Chernov 2010,
// the Pratt and Taubin chapters): rows 2–3 of (M − ηN)v = 0 give the centre; row 4 gives D, hence R.
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
// Newton from η = 0 descends monotonically to that root (Chernov 2010; from memory);
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
