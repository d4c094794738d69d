// Semicircular: a circle whose centre lies on the springing line; span 2R, rise R.
// Parameters: centre x, springing level (= centre z), radius.
#include "geometry/shapes/circular_family.hpp"
#include "geometry/shapes/families.hpp"

namespace soffit {
namespace {

class Semicircular final : public CircularFamily {
 public:
  std::string_view name() const override { return "semicircular"; }
  std::string_view description() const override {
    return "circle centred on the springing line (span = 2R, rise = R)";
  }
  int simplicity_rank() const override { return 0; }
  bool springing_from_shape() const override { return true; }

  std::optional<Outline> outline(const SolverVector& p, double) const override {
    if (!(p[2] > 0.0)) return std::nullopt;
    Outline o;
    o.z_springing = p[1];
    o.add({OutlinePiece::Kind::circular, p[0], p[1], p[2], 0.0, p[0] - p[2], p[0] + p[2]});
    return o;
  }
};

}  // namespace

const ShapeFamily& semicircular_family() {
  static const Semicircular family;
  return family;
}

}  // namespace soffit
