// Parabolic: z = z_apex − c (x − x_apex)², vertical axis; z = 4r·x(L − x)/L²
// from the left springing. The springing line is the level of the end readings
// or the level the surveyor gives.
// Parameters: apex x, apex z, c (1/m).
#include <Eigen/Dense>
#include <algorithm>
#include <array>
#include <cmath>
#include <numbers>

#include "geometry/shapes/families.hpp"

namespace soffit {
namespace {

// Real roots of u³ + P u + Q = 0 (Cardano; trigonometric form for three roots).
int depressed_cubic_roots(double P, double Q, std::array<double, 3>& roots) {
  const double disc = Q * Q / 4.0 + P * P * P / 27.0;
  if (disc >= 0.0) {
    const double s = std::sqrt(disc);
    roots[0] = std::cbrt(-Q / 2.0 + s) + std::cbrt(-Q / 2.0 - s);
    return 1;
  }
  const double m = 2.0 * std::sqrt(-P / 3.0);
  const double theta = std::acos(std::clamp(3.0 * Q / (P * m), -1.0, 1.0)) / 3.0;
  for (int k = 0; k < 3; ++k) roots[k] = m * std::cos(theta - 2.0 * std::numbers::pi * k / 3.0);
  return 3;
}

class Parabolic final : public ShapeFamily {
 public:
  std::string_view name() const override { return "parabolic"; }
  std::string_view description() const override { return "parabola with a vertical axis"; }
  int parameter_count() const override { return 3; }
  int simplicity_rank() const override { return 2; }
  bool springing_from_shape() const override { return false; }

  std::optional<SolverVector> initial_guess(std::span<const Point2> points) const override {
    if (points.size() < 3) return std::nullopt;
    double mean_x = 0.0;
    for (const Point2& p : points) mean_x += p.x;
    mean_x /= static_cast<double>(points.size());
    Eigen::MatrixXd a(static_cast<Eigen::Index>(points.size()), 3);
    Eigen::VectorXd z(static_cast<Eigen::Index>(points.size()));
    for (size_t i = 0; i < points.size(); ++i) {
      const double u = points[i].x - mean_x;
      a.row(static_cast<Eigen::Index>(i)) << 1.0, u, u * u;
      z[static_cast<Eigen::Index>(i)] = points[i].z;
    }
    const Eigen::Vector3d coef = a.colPivHouseholderQr().solve(z);
    if (!(coef[2] < 0.0)) return std::nullopt;  // opens upward: no arch
    SolverVector p(3);
    p << mean_x - coef[1] / (2.0 * coef[2]), coef[0] - coef[1] * coef[1] / (4.0 * coef[2]),
        -coef[2];
    return p;
  }

  double signed_distance(const SolverVector& p, Point2 q, double* gradient) const override {
    const double xa = p[0], za = p[1], c = p[2];
    if (!(c > 0.0)) return std::nan("");
    // Foot point: d/du of the squared distance gives 2c²u³ + (1 + 2c·w)u − pu = 0,
    // with u = x − x_apex, pu = px − x_apex, w = pz − z_apex.
    const double pu = q.x - xa, w = q.z - za;
    std::array<double, 3> roots{};
    const int count =
        depressed_cubic_roots((1.0 + 2.0 * c * w) / (2.0 * c * c), -pu / (2.0 * c * c), roots);
    double best_u = pu, best = INFINITY;
    for (int k = 0; k < count; ++k) {
      double u = roots[k];
      for (int it = 0; it < 2; ++it) {  // polish against cancellation in Cardano
        const double f = 2.0 * c * c * u * u * u + (1.0 + 2.0 * c * w) * u - pu;
        const double df = 6.0 * c * c * u * u + 1.0 + 2.0 * c * w;
        if (df != 0.0) u -= f / df;
      }
      const double dx = pu - u, dz = w + c * u * u;
      const double d2 = dx * dx + dz * dz;
      if (d2 < best) {
        best = d2;
        best_u = u;
      }
    }
    const double u = best_u;
    const double norm = std::sqrt(1.0 + 4.0 * c * c * u * u);
    const double nx = 2.0 * c * u / norm, nz = 1.0 / norm;  // upward unit normal
    const double d = nx * (pu - u) + nz * (w + c * u * u);
    if (gradient) {
      // ∂d/∂θ = −n·∂q/∂θ at the fixed foot point (the foot's own motion is tangential).
      gradient[0] = -nz * 2.0 * c * u;
      gradient[1] = -nz;
      gradient[2] = nz * u * u;
    }
    return d;
  }

  std::optional<Outline> outline(const SolverVector& p, double springing_z) const override {
    if (!(p[2] > 0.0) || !(p[1] > springing_z)) return std::nullopt;
    const double half = std::sqrt((p[1] - springing_z) / p[2]);
    Outline o;
    o.z_springing = springing_z;
    o.add({OutlinePiece::Kind::parabolic, p[0], p[1], p[2], 0.0, p[0] - half, p[0] + half});
    return o;
  }

  NamedValues reported_parameters(const SolverVector& p, const Outline&) const override {
    return {{"apex_x_m", p[0]}, {"apex_z_m", p[1]}, {"coefficient_per_m", p[2]}};
  }
};

}  // namespace

const ShapeFamily& parabolic_family() {
  static const Parabolic family;
  return family;
}

}  // namespace soffit
