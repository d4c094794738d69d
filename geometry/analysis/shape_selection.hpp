#pragma once
// Choosing a family: fit them all, compare, and name the simplest one the data
// support. Rules, in order:
//  1. Rank the families that fitted by AIC; every family whose AIC is within 2
//     of the best is "supported" (Burnham & Anderson, Model Selection and
//     Multimodel Inference, 2002, §2.6: ΔAIC ≤ 2 means substantial support).
//  2. Among the supported families take the one with the fewest parameters, then
//     the lower simplicity rank.
//  0. A family that fixes its own springing line is not supported when that
//     line lies far below the end readings (springing_gap_ratio).
//  3. A circular arc whose centre lies on the end readings' level within twice its
//     standard deviation is semicircular, not segmental; an ellipse whose
//     semi-axes agree within twice the standard deviation of their difference
//     is semicircular too (and so is a pointed arch whose centres coincide
//     within their uncertainty, or a three-centred one whose radii agree).
#include <string>
#include <vector>

#include "geometry/analysis/profile_fit.hpp"

namespace soffit {

struct ShapeCandidate {
  const ShapeFamily* family = nullptr;
  std::optional<ShapeFit> fit;
  std::string error;  // why it did not fit, or why it is not supported
  bool supported = true;  // false: fitted, but its springing lies far below the readings
};

struct ShapeSelection {
  std::vector<ShapeCandidate> candidates;  // one per family, registry order
  int chosen = -1;                         // index into candidates; −1 when none fitted
  std::string reason;                      // one sentence for the report
};

ShapeSelection select_shape(const Readings& readings, const FitOptions& options);

}  // namespace soffit
