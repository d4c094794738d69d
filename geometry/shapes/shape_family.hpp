#pragma once
// One family of arch profile (semicircular, segmental, …): what the fitter and
// the uncertainty machinery need to know about it. A family is one .cpp file
// plus one line in registry.cpp.
//
// Conventions: x along the span, z up, metres. A signed distance is positive
// above/outside the intrados (into the masonry) and negative below it (into the
// opening), so a sagging soffit shows negative residuals.
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "geometry/core/reading.hpp"
#include "geometry/shapes/outline.hpp"
#include "geometry/solver/levenberg_marquardt.hpp"

namespace soffit {

using NamedValues = std::vector<std::pair<std::string, double>>;

class ShapeFamily {
 public:
  virtual ~ShapeFamily() = default;

  virtual std::string_view name() const = 0;        // as on the command line
  virtual std::string_view description() const = 0;  // one line, for listings
  virtual int parameter_count() const = 0;           // number of fitted parameters
  // Lower is simpler; used to prefer the simpler of two equally good families.
  virtual int simplicity_rank() const = 0;

  // True when the springing line is part of the shape (it passes through the
  // centres); false when it is set by the end readings or by the user.
  virtual bool springing_from_shape() const = 0;

  // Starting values from the points (algebraic fits, geometric construction).
  virtual std::optional<SolverVector> initial_guess(std::span<const Point2> points) const = 0;

  // Signed orthogonal distance from p to the curve. When `gradient` is not null
  // and has_analytic_gradient(), writes ∂d/∂params there. Returns NaN when the
  // parameters are outside the family's domain.
  virtual double signed_distance(const SolverVector& params, Point2 p, double* gradient) const = 0;
  virtual bool has_analytic_gradient() const { return true; }

  // Normal equations of the weighted orthogonal-distance problem at `params`
  // (see NormalEquationsFn). The default calls signed_distance per point; a
  // family with a cheap closed form overrides it to inline the loop.
  virtual bool normal_equations(const SolverVector& params, std::span<const Point2> points,
                                std::span<const double> weights, bool want_derivatives,
                                NormalEquations& out) const;

  // The fitted intrados between its springings. `springing_z` is used only when
  // !springing_from_shape(). Empty when no arch exists at that level.
  virtual std::optional<Outline> outline(const SolverVector& params, double springing_z) const = 0;

  // The family's own parameters as reported, keyed with their units
  // ("radius_m", "semi_axis_x_m", …).
  virtual NamedValues reported_parameters(const SolverVector& params,
                                          const Outline& outline) const = 0;
};

// Signed distance and its gradient; numeric (central differences) for
// families without an analytic gradient.
double distance_with_gradient(const ShapeFamily& family, const SolverVector& params, Point2 p,
                              double* gradient);
// ∂d/∂(x, z), the gradient of the signed distance with respect to the point:
// the unit normal of the curve at the foot of p, pointing into the masonry
// (numeric, central differences).
Point2 distance_gradient_at_point(const ShapeFamily& family, const SolverVector& params, Point2 p);

// Every family, simplest first.
std::span<const ShapeFamily* const> shape_families();
// The family with this name, or null.
const ShapeFamily* find_shape_family(std::string_view name);

}  // namespace soffit
