#pragma once
// Observations of one inspection and the fixed details of a span, as plain
// structs (no SQL here). Units are in the field names: _m, _mm, _deg.
#include <optional>
#include <string>
#include <vector>

namespace soffit::storage {

// FIELD.md §4: rings counted at a face, with the measured face depth and the
// representativeness range (best / lower / upper and the basis).
struct RingCountFields {
  std::string inspection_id, span_id;
  std::string face;      // US, DS…
  std::string position;  // "W springing", "crown", "E springing" or "s 3.10"
  int rings = 0;
  std::optional<double> unit_depth_mm, thickness_mm, thickness_lower_mm, thickness_upper_mm;
  std::string confidence;  // low, medium, high or empty
  std::string basis;       // "face count only", "core at …"
  std::string notes;
};

// FIELD.md §5: fill depth (road surface to extrados, surfacing included) at a chainage.
struct FillDepthFields {
  std::string inspection_id, span_id;
  double chainage_m = 0;  // x along the span
  std::optional<double> offset_y_m;
  std::string method;     // trial_pit, core, gpr, estimate
  double depth_m = 0;
  std::optional<double> uncertainty_m, surfacing_m;
  std::string notes;
};

enum class DefectFrame { soffit, elevation };
enum class DefectGeometry { point, line, area };

struct DefectFields {
  std::string inspection_id;
  std::string span_id;  // empty for a defect not on a span (a pier, a wing wall)
  std::string ref;      // the inspector's label, e.g. D01
  std::string defect_type;  // a key of defect_vocabulary.md
  std::string element;      // barrel, DS spandrel wall, pier…
  DefectFrame frame = DefectFrame::soffit;
  // soffit: "<springing>; <face>" that s and y are measured from;
  // elevation: the elevation and its origin, e.g. "DS spandrel, W end".
  std::string frame_origin;
  DefectGeometry geometry = DefectGeometry::point;
  std::vector<std::pair<double, double>> points;  // (s, y) or (x, z) in metres
  std::optional<double> length_m, width_mm, area_m2;
  std::string severity_scale = "soffit-1-5";
  std::optional<int> severity;
  std::string notes;
};

// A spandrel wall as seen in section (issue 3: external and internal walls).
struct SpandrelWall {
  std::string side;       // US, DS, or "internal"
  bool internal = false;
  std::optional<double> thickness_m, height_m;
  std::optional<double> position_m;  // across the width from the reference face
};

// A pier or abutment (issue 3: pier and abutment dimensions).
struct SupportDimensions {
  std::string name;  // "W abutment", "pier 1"
  std::string kind;  // abutment, pier
  std::optional<double> thickness_m, height_m, length_m;
  std::string notes;
};

struct SpanDetails {
  std::string nominal_shape;  // shape family key, e.g. segmental
  std::optional<double> barrel_width_m, skew_deg;
  std::string ring_material;  // brick, stone, mixed, other
  std::optional<double> unit_depth_mm, joint_thickness_mm;
  std::string fill_material;
  std::optional<double> surfacing_depth_m, haunch_backing_height_m;
  std::vector<SpandrelWall> spandrel_walls;
  std::vector<SupportDimensions> supports;
  std::string notes;
};

// The visit itself (FIELD.md §1.3, §10.1). Instruments carry their precision.
struct Instrument {
  std::string name;
  std::optional<double> precision_mm;
};

struct InspectionDetails {
  std::string kind, inspector, weather;
  std::optional<double> air_temperature_c;
  std::vector<Instrument> instruments;
  std::string parts_not_inspected;
  std::string notes;
};

}  // namespace soffit::storage
