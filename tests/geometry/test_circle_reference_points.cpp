// Loads a point set of the team's reference fits (tests/data/reference/fits/*.csv:
// a '#' comment line, a header "x,y", then one point per line). Shared by the
// circle and ellipse tests, which declare it where they use it.
#include <doctest/doctest.h>

#include <fstream>
#include <sstream>
#include <stdexcept>
#include <string>
#include <vector>

#include "geometry/core/reading.hpp"

namespace soffit::test {

std::vector<Point2> reference_points(const std::string& name) {
  const std::string path = std::string(SOFFIT_TEST_DATA) + "/reference/fits/" + name;
  std::ifstream in(path);
  if (!in) throw std::runtime_error(path + ": cannot open");
  std::vector<Point2> points;
  std::string line;
  int line_number = 0;
  while (std::getline(in, line)) {
    ++line_number;
    if (line.empty() || line[0] == '#' || line.rfind("x,", 0) == 0) continue;
    std::istringstream fields(line);
    Point2 p;
    char comma = 0;
    if (!(fields >> p.x >> comma >> p.z) || comma != ',')
      throw std::runtime_error(path + ":" + std::to_string(line_number) + ": not 'x,y'");
    points.push_back(p);
  }
  return points;
}

}  // namespace soffit::test

TEST_CASE("reference point sets load with their published sizes") {
  // Sizes from reference_values.json ("n").
  CHECK(soffit::test::reference_points("C1_ggs_circle_6pts.csv").size() == 6);
  CHECK(soffit::test::reference_points("C2_segmental_arch_L10_f2.5_5mm.csv").size() == 15);
  CHECK(soffit::test::reference_points("C4_flat_segmental_L10_f1.25_2cm.csv").size() == 11);
  CHECK(soffit::test::reference_points("E1_ggs_ellipse_8pts.csv").size() == 8);
  CHECK(soffit::test::reference_points("E3_semi_ellipse_a5_b3_10mm.csv").size() == 21);
  CHECK(soffit::test::reference_points("E4_partial_semi_ellipse_30mm.csv").size() == 13);
  // GGS (1994) data, first and last point [REFERENCES.md §1, SRC].
  const auto c1 = soffit::test::reference_points("C1_ggs_circle_6pts.csv");
  CHECK(c1.front().x == 1.0);
  CHECK(c1.front().z == 7.0);
  CHECK(c1.back().x == 3.0);
  CHECK(c1.back().z == 7.0);
}
