#include "exports/section_gmsh_geo.hpp"

#include <stdexcept>
#include <vector>

#include "exports/fixed_decimal.hpp"
#include "exports/section_provenance.hpp"

namespace soffit {

namespace {

std::string number(double v) { return fixed_decimal(v, 6); }

std::string point(int id, Point2 p, const char* size) {
  return "Point(" + std::to_string(id) + ") = {" + number(p.x) + ", " + number(p.z) + ", 0, " + size + "};\n";
}

// Gmsh comments cannot hold a line break; provenance lines never do.
std::string comment(const std::string& text) { return "// " + text + "\n"; }

}  // namespace

std::string section_gmsh_geo(const SurveySheet& sheet, const ProfileAnalysis& analysis,
                             const RingFillOptions& options, const std::string& program) {
  const ShapeFit& fit = *analysis.fit;
  if (!options.ring_thickness_m)
    throw std::invalid_argument("the meshing script needs the ring thickness");
  if (const std::string problem = ring_fill_problem(fit, options); !problem.empty())
    throw std::invalid_argument(problem);
  const RingFill model = ring_fill(fit, analysis.uncertainty, options);
  const double d = *options.ring_thickness_m;
  const int n = static_cast<int>(model.band.stations.size());

  std::string out = comment("Soffit: 2D model of one span for finite-element meshing (Gmsh .geo, built-in kernel)");
  const SectionProvenance provenance = section_provenance(sheet, analysis, program);
  for (const std::string& line : provenance.lines) out += comment(line);
  out += comment("caution: " + provenance.caution);
  out += comment("Gmsh x = section x (m along the span); Gmsh y = section z (m, up).");
  out += comment("ring: fitted intrados to the extrados, the intrados offset along its normal by the given");
  out += comment("  ring thickness d = " + fixed_decimal(d * 1000.0, 1) + " mm (assumed constant: not measured by the fit).");
  if (model.road_z)
    out += comment("fill: extrados up to the given road level z = " + fixed_decimal(*model.road_z, 4) +
                   " m, between the verticals through the extrados ends.");
  else
    out += comment("fill: not modelled (no road level given).");
  out += comment("physical groups: surfaces \"ring\", \"fill\"; curves \"supports\" (springing faces), \"intrados\",");
  out += comment("  \"road\", \"fill_ends\". Mesh with: gmsh -2 this_file.geo");
  out += "\n// Element sizes (m): change these to refine or coarsen the mesh.\n";
  out += "ring_size = " + number(d / 4.0) + ";  // along the ring: four elements through d\n";
  out += "fill_size = " + number(d / 2.0) + ";  // at the road\n\n";

  out += "// Intrados, left springing to right springing\n";
  for (int i = 0; i < n; ++i) out += point(1 + i, model.band.stations[static_cast<size_t>(i)].at, "ring_size");
  out += "// Extrados\n";
  for (int i = 0; i < n; ++i) out += point(1 + n + i, model.extrados[static_cast<size_t>(i)], "ring_size");
  // One Spline per outline piece, so that a corner (the crown of a pointed arch)
  // stays a corner instead of being rounded by the spline.
  auto list = [](const std::vector<int>& ids, bool reversed) {
    std::string text;
    for (size_t k = 0; k < ids.size(); ++k) {
      const int id = reversed ? -ids[ids.size() - 1 - k] : ids[k];
      text += (k ? ", " : "") + std::to_string(id);
    }
    return text;
  };
  std::vector<int> intrados_curves, extrados_curves;
  int curve = 0;
  size_t from = 0;
  for (size_t end : model.piece_ends) {
    const std::string a = std::to_string(1 + from), b = std::to_string(1 + end);
    out += "Spline(" + std::to_string(++curve) + ") = {" + a + ":" + b + "};  // intrados\n";
    intrados_curves.push_back(curve);
    from = end;
  }
  from = 0;
  for (size_t end : model.piece_ends) {
    const std::string a = std::to_string(1 + n + from), b = std::to_string(1 + n + end);
    out += "Spline(" + std::to_string(++curve) + ") = {" + a + ":" + b + "};  // extrados\n";
    extrados_curves.push_back(curve);
    from = end;
  }
  const std::string N = std::to_string(n), N1 = std::to_string(n + 1), N2 = std::to_string(2 * n);
  const int right_face = ++curve, left_face = ++curve;
  out += "Line(" + std::to_string(right_face) + ") = {" + N + ", " + N2 + "};  // right springing face\n";
  out += "Line(" + std::to_string(left_face) + ") = {" + N1 + ", 1};  // left springing face\n";
  out += "Curve Loop(1) = {" + list(intrados_curves, false) + ", " + std::to_string(right_face) + ", " +
         list(extrados_curves, true) + ", " + std::to_string(left_face) + "};\nPlane Surface(1) = {1};\n";
  int fill_right = 0, road = 0, fill_left = 0;
  if (model.road_z) {
    const Point2 right{model.extrados.back().x, *model.road_z}, left{model.extrados.front().x, *model.road_z};
    const std::string R = std::to_string(2 * n + 1), L = std::to_string(2 * n + 2);
    out += "// Road level above the extrados ends\n";
    out += point(2 * n + 1, right, "fill_size");
    out += point(2 * n + 2, left, "fill_size");
    fill_right = ++curve, road = ++curve, fill_left = ++curve;
    out += "Line(" + std::to_string(fill_right) + ") = {" + N2 + ", " + R + "};  // right end of the fill\n";
    out += "Line(" + std::to_string(road) + ") = {" + R + ", " + L + "};  // road\n";
    out += "Line(" + std::to_string(fill_left) + ") = {" + L + ", " + N1 + "};  // left end of the fill\n";
    out += "Curve Loop(2) = {" + list(extrados_curves, false) + ", " + std::to_string(fill_right) + ", " +
           std::to_string(road) + ", " + std::to_string(fill_left) + "};\nPlane Surface(2) = {2};\n";
  }
  out += "\nPhysical Surface(\"ring\", 1) = {1};\n";
  if (model.road_z) out += "Physical Surface(\"fill\", 2) = {2};\n";
  out += "Physical Curve(\"supports\", 3) = {" + std::to_string(right_face) + ", " + std::to_string(left_face) + "};\n";
  out += "Physical Curve(\"intrados\", 4) = {" + list(intrados_curves, false) + "};\n";
  if (model.road_z) {
    out += "Physical Curve(\"road\", 5) = {" + std::to_string(road) + "};\n";
    out += "Physical Curve(\"fill_ends\", 6) = {" + std::to_string(fill_right) + ", " + std::to_string(fill_left) + "};\n";
  }
  return out;
}

}  // namespace soffit
