#include "exports/section_ring_fill.hpp"

#include <algorithm>
#include <cmath>

#include "exports/fixed_decimal.hpp"

namespace soffit {

namespace {

double highest_z(const std::vector<Point2>& points) {
  double top = -HUGE_VAL;
  for (const Point2& p : points) top = std::max(top, p.z);
  return top;
}

// Where the offsets of two pieces meeting at a corner cross: the upper
// intersection of the two offset circles when both are arcs (a pointed arch),
// otherwise of the two offset tangent lines.
Point2 offset_corner(const OutlinePiece& left, const OutlinePiece& right, Point2 at, double d) {
  if (left.kind == OutlinePiece::Kind::circular && right.kind == OutlinePiece::Kind::circular) {
    const double r1 = left.a + d, r2 = right.a + d;
    const double dx = right.cx - left.cx, dz = right.cz - left.cz, dist = std::hypot(dx, dz);
    if (dist > 0.0 && dist < r1 + r2 && dist > std::abs(r1 - r2)) {
      const double along = (r1 * r1 - r2 * r2 + dist * dist) / (2 * dist);
      const double h = std::sqrt(std::max(0.0, r1 * r1 - along * along));
      const double mx = left.cx + along * dx / dist, mz = left.cz + along * dz / dist;
      const Point2 a{mx - h * dz / dist, mz + h * dx / dist}, b{mx + h * dz / dist, mz - h * dx / dist};
      return a.z >= b.z ? a : b;
    }
  }
  const Point2 nl = piece_normal(left, at), nr = piece_normal(right, at);
  const Point2 pl{at.x + d * nl.x, at.z + d * nl.z}, pr{at.x + d * nr.x, at.z + d * nr.z};
  const Point2 tl{nl.z, -nl.x}, tr{nr.z, -nr.x};
  const double det = tl.x * tr.z - tl.z * tr.x;
  if (std::abs(det) < 1e-12) return pl;
  const double s = ((pr.x - pl.x) * tr.z - (pr.z - pl.z) * tr.x) / det;
  return {pl.x + s * tl.x, pl.z + s * tl.z};
}

std::vector<Point2> extrados_of(const Outline& outline, const IntradosBand& band,
                                const std::vector<size_t>& ends, double thickness) {
  std::vector<Point2> out;
  out.reserve(band.stations.size());
  for (const IntradosStation& s : band.stations) out.push_back(offset_point(s, thickness));
  for (int j = 0; j + 1 < outline.count; ++j) {
    const size_t i = ends[static_cast<size_t>(j)];
    if (i >= band.stations.size()) break;
    const OutlinePiece& left = outline.pieces[static_cast<size_t>(j)];
    const OutlinePiece& right = outline.pieces[static_cast<size_t>(j + 1)];
    const Point2 at = band.stations[i].at;
    const Point2 nl = piece_normal(left, at), nr = piece_normal(right, at);
    // Tangent pieces (three-centred) share their normal; only a corner needs this.
    if (nl.x * nr.x + nl.z * nr.z < std::cos(0.5 * M_PI / 180.0))
      out[i] = offset_corner(left, right, at, thickness);
  }
  return out;
}

// Only the geometry of the curve matters here, not its band.
std::vector<Point2> ring_top(const ShapeFit& fit, const RingFillOptions& options) {
  Uncertainty none;
  const IntradosBand band = intrados_band(fit, none, options.points_per_piece);
  if (options.ring_thickness_m)
    return extrados_of(fit.outline, band, piece_end_indices(fit.outline, options.points_per_piece),
                       *options.ring_thickness_m);
  std::vector<Point2> intrados;
  for (const IntradosStation& s : band.stations) intrados.push_back(s.at);
  return intrados;
}

}  // namespace

std::string ring_fill_problem(const ShapeFit& fit, const RingFillOptions& options) {
  if (options.ring_thickness_m) {
    const double d = *options.ring_thickness_m;
    if (!std::isfinite(d) || d <= 0.0) return "the ring thickness must be a positive number of millimetres";
    if (d > fit.outline.span())
      return "a ring thickness of " + fixed_decimal(d * 1000.0, 0) + " mm is more than the span (" +
             fixed_decimal(fit.outline.span(), 3) + " m): check the unit (millimetres)";
  }
  if (options.road_z_m) {
    if (!std::isfinite(*options.road_z_m)) return "the road level must be a number of metres";
    const double top = highest_z(ring_top(fit, options));
    if (*options.road_z_m < top + kMinimumFillDepthM)
      return "road level z = " + fixed_decimal(*options.road_z_m, 3) + " m is not above the top of the " +
             (options.ring_thickness_m ? "extrados" : "intrados") + " (z = " + fixed_decimal(top, 3) +
             " m) by at least " + fixed_decimal(kMinimumFillDepthM * 1000.0, 0) +
             " mm: give it in the section frame (z up from the same origin as the readings)";
  }
  return {};
}

RingFill ring_fill(const ShapeFit& fit, const Uncertainty& uncertainty, const RingFillOptions& options) {
  RingFill out;
  out.band = intrados_band(fit, uncertainty, options.points_per_piece);
  std::vector<Point2> intrados;
  for (const IntradosStation& s : out.band.stations) intrados.push_back(s.at);
  out.piece_ends = piece_end_indices(fit.outline, options.points_per_piece);
  if (options.ring_thickness_m)
    out.extrados = extrados_of(fit.outline, out.band, out.piece_ends, *options.ring_thickness_m);
  out.top_of_ring_z = highest_z(out.extrados.empty() ? intrados : out.extrados);
  out.road_z = options.road_z_m;
  return out;
}

}  // namespace soffit
