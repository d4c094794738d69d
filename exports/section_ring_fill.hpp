#pragma once
// The 2D model of one span that the elevation and the meshing script share:
// the fitted intrados, the extrados as the intrados offset along its outward
// normal by the ring thickness d (so each springing face is the normal at the
// springing: the skewback of a segmental arch, a level bed of a semicircular
// one), and the fill block from the extrados up to a level road between the
// verticals through the extrados ends.
//
// The thickness and the road level are the surveyor's, given as options: the
// fit knows neither. A constant d is the common modelling assumption (FIELD.md
// §4: face counts give one d per face, with ±1 ring representativeness).
#include <optional>
#include <string>
#include <vector>

#include "exports/intrados_band.hpp"

namespace soffit {

struct RingFillOptions {
  std::optional<double> ring_thickness_m;  // d, normal to the intrados
  std::optional<double> road_z_m;          // road level in the section frame (z up, as the readings)
  int points_per_piece = 48;               // samples per outline piece
};

// The fill must be at least this deep at the top of the ring for a block to exist.
inline constexpr double kMinimumFillDepthM = 0.010;

struct RingFill {
  IntradosBand band;              // intrados samples with normals and the 95% band
  std::vector<Point2> extrados;   // one per band station; empty without a thickness
  // Index of the last station of each outline piece (the junctions, then the
  // right springing): a pointed arch has a corner at its crown junction, and
  // its extrados point there is where the two offset arcs meet.
  std::vector<size_t> piece_ends;
  double top_of_ring_z = 0.0;     // highest extrados point (intrados without a thickness)
  std::optional<double> road_z;
};

// Empty when the options suit this fit; otherwise why not, naming the option.
std::string ring_fill_problem(const ShapeFit& fit, const RingFillOptions& options);

RingFill ring_fill(const ShapeFit& fit, const Uncertainty& uncertainty, const RingFillOptions& options);

}  // namespace soffit
