#pragma once
// Rows of the register as plain structs (no SQL here), for edits and views.
#include <optional>
#include <string>
#include <vector>

namespace soffit::storage {

struct StructureFields {
  std::string ref;  // the owner's reference, unique in the project
  std::string name;
  std::optional<double> latitude_deg, longitude_deg;  // WGS84
  bool location_fictitious = false;
  std::string carries, crosses, notes;
  std::optional<int> span_count;
};

struct StructureRecord {
  std::string id;
  StructureFields fields;
  std::string created_at, modified_at, author;
};

struct SpanRecord {
  std::string id;
  int index = 0;
  std::string label;
};

struct SectionRecord {
  std::string id;
  std::string span_label;
  int span_index = 0;
  std::string label;
  std::optional<double> position_m;
  std::string reference_face, direction, method, datum;
  int reading_count = 0;
  int excluded_count = 0;
};

struct InspectionRecord {
  std::string id;
  std::string date, kind, inspector, status;
  int revision = 1;
  std::vector<SectionRecord> sections;
};

struct StructureSummary {
  StructureRecord structure;
  int span_count = 0, inspection_count = 0, section_count = 0;
  std::string latest_visit;               // YYYY-MM-DD; empty when never inspected
  std::optional<int> worst_severity;      // highest defect severity recorded at the latest visit
};

struct StructureDetail {
  StructureRecord structure;
  std::vector<SpanRecord> spans;
  std::vector<InspectionRecord> inspections;  // by date
};

}  // namespace soffit::storage
