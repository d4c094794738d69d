// Segmental: a circular arc whose centre lies below the springing line. The
// springing line is not part of the shape: it is the level of the end readings
// or the level the surveyor gives. R = (L²/4 + r²)/(2r).
// Parameters: centre x, centre z, radius.
#include <cmath>

#include "geometry/shapes/circular_family.hpp"
#include "geometry/shapes/families.hpp"

namespace soffit {
namespace {

class Segmental final : public CircularFamily {
 public:
  std::string_view name() const override { return "segmental"; }
  std::string_view description() const override {
    return "circular arc cut by the springing line (centre below it)";
  }
  int simplicity_rank() const override { return 1; }
  bool springing_from_shape() const override { return false; }

  std::optional<Outline> outline(const SolverVector& p, double springing_z) const override {
    // The springing line must lie above the centre (or on it): below it the
    // arc is more than a semicircle (horseshoe), which this family does not describe.
    const double dz = springing_z - p[1];
    if (!(p[2] > 0.0) || !(dz >= 0.0) || !(dz < p[2])) return std::nullopt;
    const double half_chord = std::sqrt(p[2] * p[2] - dz * dz);
    Outline o;
    o.z_springing = springing_z;
    o.add({OutlinePiece::Kind::circular, p[0], p[1], p[2], 0.0, p[0] - half_chord,
           p[0] + half_chord});
    return o;
  }
};

}  // namespace

const ShapeFamily& segmental_family() {
  static const Segmental family;
  return family;
}

}  // namespace soffit
