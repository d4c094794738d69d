// The Gmsh meshing script (issue 5 "2D model geometry for open-source
// finite-element meshing"): Gmsh 4.8 (Debian's gmsh) meshes it without error,
// every physical group gets elements, and the meshed areas are those of the
// ring and fill computed from circle geometry.
#include <doctest/doctest.h>

#include <cmath>
#include <fstream>
#include <map>
#include <sstream>
#include <stdexcept>
#include <string>

#include "exports/section_gmsh_geo.hpp"
#include "tests/exports/export_test_support.hpp"

using namespace soffit;
using soffit::test::ExportDir;
using soffit::test::fitted_demo;

namespace {

// What a mesh holds per physical group, read from Gmsh's MSH 2.2 ASCII format
// (Gmsh reference manual, "MSH file format version 2"): element type 1 is a
// 2-node line, type 2 a 3-node triangle; the first tag is the physical group.
struct MeshGroups {
  std::map<std::string, int> physical_id;         // name → id
  std::map<int, long> triangles, lines;           // id → count
  std::map<int, double> area;                     // id → summed triangle area, m²
};

MeshGroups read_msh2(const std::string& path) {
  std::ifstream in(path);
  MeshGroups m;
  std::map<long, std::pair<double, double>> nodes;
  std::string token;
  while (in >> token) {
    if (token == "$PhysicalNames") {
      int n = 0;
      in >> n;
      for (int i = 0; i < n; ++i) {
        int dim = 0, id = 0;
        std::string name;
        in >> dim >> id >> name;
        m.physical_id[name.substr(1, name.size() - 2)] = id;
      }
    } else if (token == "$Nodes") {
      long n = 0;
      in >> n;
      for (long i = 0; i < n; ++i) {
        long id = 0;
        double x = 0, y = 0, z = 0;
        in >> id >> x >> y >> z;
        nodes[id] = {x, y};
      }
    } else if (token == "$Elements") {
      long n = 0;
      in >> n;
      std::string line;
      std::getline(in, line);
      for (long i = 0; i < n; ++i) {
        std::getline(in, line);
        std::istringstream row(line);
        long id = 0;
        int type = 0, tags = 0, physical = 0, ignored = 0;
        row >> id >> type >> tags >> physical;
        for (int t = 1; t < tags; ++t) row >> ignored;
        if (type == 1) ++m.lines[physical];
        if (type == 2) {
          long a = 0, b = 0, c = 0;
          row >> a >> b >> c;
          const auto [ax, ay] = nodes[a];
          const auto [bx, by] = nodes[b];
          const auto [cx, cy] = nodes[c];
          ++m.triangles[physical];
          m.area[physical] += 0.5 * std::abs((bx - ax) * (cy - ay) - (cx - ax) * (by - ay));
        }
      }
    }
  }
  return m;
}

double param(const ProfileAnalysis& a, const std::string& name) {
  for (const auto& [key, e] : a.uncertainty.parameters)
    if (key == name) return e.value;
  FAIL("no parameter " << name);
  return NAN;
}

// Meshes `geo` with Gmsh; empty groups when it fails (the failure is checked).
MeshGroups mesh(const ExportDir& dir, const std::string& geo) {
  const std::string in = dir.file("span.geo"), out = dir.file("span.msh");
  soffit::test::write_text(in, geo);
  const int rc = soffit::test::run_logged("gmsh -2 -format msh22 -o " + out + " " + in, dir.file("gmsh.log"));
  INFO(soffit::test::read_text(dir.file("gmsh.log")));
  CHECK(rc == 0);
  CHECK(soffit::test::read_text(dir.file("gmsh.log")).find("Error") == std::string::npos);
  return rc == 0 ? read_msh2(out) : MeshGroups{};
}

}  // namespace

TEST_CASE("section .geo: Gmsh meshes ring and fill, every physical group has elements, areas as geometry says") {
  if (!soffit::test::program_available("gmsh")) {
    MESSAGE("gmsh is missing (Debian gmsh; .ci/install-deps installs it): meshing check skipped");
    return;
  }
  const auto s = fitted_demo();
  RingFillOptions options;
  const double d = 0.465;             // FIELD.md §10.3: ring d best 0.465 m
  const double road = 12.052 - 9.500; // FIELD.md §10.3: road RL at the crown, springing RL 9.500
  options.ring_thickness_m = d;
  options.road_z_m = road;
  const std::string geo = section_gmsh_geo(s.sheet, s.analysis, options, "soffit test");
  CHECK(geo.find("ring_size = 0.116250;") != std::string::npos);  // d/4, the documented default
  CHECK(geo == section_gmsh_geo(s.sheet, s.analysis, options, "soffit test"));  // deterministic

  ExportDir dir;
  const MeshGroups m = mesh(dir, geo);
  REQUIRE(m.physical_id.size() == 6);
  const int ring = m.physical_id.at("ring"), fill = m.physical_id.at("fill");
  CHECK(m.triangles.at(ring) > 50);
  CHECK(m.triangles.at(fill) > 50);
  for (const char* curve : {"supports", "intrados", "road", "fill_ends"}) {
    CAPTURE(curve);
    CHECK(m.lines.at(m.physical_id.at(curve)) >= 2);
  }

  // Segmental arc of radius R, half-angle α with sin α = (span/2)/R. Annular
  // sector: area α((R+d)² − R²). Fill: rectangle between the extrados ends up
  // to the road, less the circular segment ½ρ²(2α − sin 2α) of the extrados
  // (ρ = R + d) above their chord (elementary geometry of the circle).
  const double R = param(s.analysis, "radius_m"), cz = param(s.analysis, "centre_z_m");
  const Outline& o = s.analysis.fit->outline;
  const double alpha = std::asin(o.span() / 2 / R), rho = R + d;
  const double ring_area = alpha * (rho * rho - R * R);
  const double chord_z = cz + rho * std::cos(alpha), chord = 2 * rho * std::sin(alpha);
  const double fill_area = chord * (road - chord_z) - 0.5 * rho * rho * (2 * alpha - std::sin(2 * alpha));
  CAPTURE(ring_area);
  CAPTURE(fill_area);
  // Straight-sided triangles on a 48-point spline lose ~0.1% of a curved area.
  CHECK(std::abs(m.area.at(ring) - ring_area) < 0.005 * ring_area);
  CHECK(std::abs(m.area.at(fill) - fill_area) < 0.005 * fill_area);
}

TEST_CASE("section .geo: without a road level the ring alone is meshed, and says so") {
  if (!soffit::test::program_available("gmsh")) {
    MESSAGE("gmsh is missing: meshing check skipped");
    return;
  }
  const auto s = fitted_demo("sallow-ford_S2-MW_2019.csv");
  RingFillOptions options;
  options.ring_thickness_m = 0.460;  // FIELD.md §10: S2 face counts 455–463 mm
  const std::string geo = section_gmsh_geo(s.sheet, s.analysis, options, "soffit test");
  CHECK(geo.find("fill: not modelled (no road level given)") != std::string::npos);
  ExportDir dir;
  const MeshGroups m = mesh(dir, geo);
  CHECK(m.physical_id.count("fill") == 0);
  REQUIRE(m.physical_id.count("ring") == 1);
  CHECK(m.triangles.at(m.physical_id.at("ring")) > 50);
  CHECK(m.lines.at(m.physical_id.at("supports")) >= 2);
}

TEST_CASE("section .geo: needs a ring thickness and a road above the ring") {
  const auto s = fitted_demo();
  CHECK_THROWS_WITH_AS(section_gmsh_geo(s.sheet, s.analysis, {}, "t"), "the meshing script needs the ring thickness",
                       std::invalid_argument);
  RingFillOptions options;
  options.ring_thickness_m = 0.465;
  options.road_z_m = 2.06;  // 1.597 + 0.465 = 2.062: the extrados crown sticks out
  CHECK_THROWS_WITH_AS(section_gmsh_geo(s.sheet, s.analysis, options, "t"),
                       doctest::Contains("road level z = 2.060 m is not above the top of the extrados"),
                       std::invalid_argument);
}
