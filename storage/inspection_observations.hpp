#pragma once
// What one inspection recorded besides its sections, for detail views and
// `soffit show`: ring counts, fill depths, and defects with their photo counts.
#include <optional>
#include <string>
#include <vector>

#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

struct RingCountRow {
  std::string span_label, face, position;
  int rings = 0;
  std::optional<double> unit_depth_mm, thickness_mm;
  std::string confidence;
};

struct FillDepthRow {
  std::string span_label;
  double chainage_m = 0;
  std::string method;
  double depth_m = 0;
  std::optional<double> uncertainty_m;
};

struct DefectRow {
  std::string ref, span_label, defect_type, element;
  std::string severity_scale;
  std::optional<long long> severity;
  std::optional<double> length_m, width_mm, area_m2;
  int photo_count = 0;  // photos linked to the defect (photo_defect)
};

struct InspectionObservations {
  std::vector<RingCountRow> ring_counts;  // by span, face, position
  std::vector<FillDepthRow> fill_depths;  // by span, chainage
  std::vector<DefectRow> defects;         // by reference
};

InspectionObservations inspection_observations(Connection& db, const std::string& inspection_id);

}  // namespace soffit::storage
