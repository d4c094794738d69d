#pragma once
// Loads a reference point set (x,y per line, '#' comments) from tests/data.
#include <algorithm>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include "geometry/core/reading.hpp"

namespace soffit::test {

inline std::vector<Point2> load_reference_points(const std::string& name) {
  std::ifstream in(std::string(SOFFIT_TEST_DATA) + "/reference/fits/" + name);
  std::vector<Point2> points;
  std::string line;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#' || line[0] == 'x') continue;
    std::replace(line.begin(), line.end(), ',', ' ');
    std::istringstream ls(line);
    Point2 p;
    if (ls >> p.x >> p.z) points.push_back(p);
  }
  return points;
}

}  // namespace soffit::test
