#pragma once
// A reduced reading: one point of the intrados in the section's own frame.
//
// Frame: x along the span (metres), z up (metres). Readings are facts: a fit
// never rewrites them; exclusion is a flag with a reason, never a deletion.
#include <string>
#include <vector>

namespace soffit {

struct Point2 {
  double x = 0.0;
  double z = 0.0;
};

struct Reading {
  double x = 0.0;             // m along the span
  double z = 0.0;             // m, up
  double sigma = 0.0;         // m, one standard deviation, isotropic; 0 = not stated
  bool excluded = false;      // left out of every fit, kept in every export
  std::string exclusion_reason;
  bool check = false;         // a closing-check repeat of an earlier station
  int source_line = 0;        // 1-based line in the source file; 0 = not from a file
  std::string note;           // surface hit, remarks
};

using Readings = std::vector<Reading>;

// Points of the readings that take part in fits (not excluded, not checks).
std::vector<Point2> included_points(const Readings& readings);

}  // namespace soffit
