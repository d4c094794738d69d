#pragma once
// One visit's observations as the defects and rings views show them: read
// through storage (load_inspection_export), changed only inside Project::edit
// so that every change is one undo step of the project file. No UI here.
#include <optional>
#include <string>
#include <vector>

#include "storage/export_queries.hpp"
#include "storage/project_file.hpp"

namespace soffit::app {

struct DefectOnRecord {
  std::string id;  // database key, needed to delete
  storage::ExportDefect defect;
};

// The unrolled barrel of one span: s along the intrados from the springing
// named in the frame origin, y square from the named face.
struct BarrelFrame {
  std::string span_id, span_label;
  double arc_length_m = 0;  // from the readings polyline of the span's first section
  double width_m = 0;       // from the span record (else the widest defect)
  std::string origin;       // "<span> W springing; US face"
  std::string start_springing = "W springing", end_springing = "E springing";
  bool y_from_upstream = true;  // y = 0 is the upstream face
  bool width_known = false, arc_known = false;
};

class InspectionData {
 public:
  // Reads the visit on `date` (nullopt: the latest) of `structure_ref`.
  // Throws storage::StorageError as load_inspection_export does.
  void load(storage::Project& project, const std::string& structure_ref,
            const std::optional<std::string>& date = std::nullopt);
  void reload();
  bool loaded() const { return project_ != nullptr; }

  const storage::InspectionExportData& data() const { return data_; }
  const std::vector<DefectOnRecord>& defects() const { return defects_; }
  // Spans of the structure with their unrolled barrel frame.
  std::vector<BarrelFrame> barrels() const;
  // Defects drawn in the soffit frame of `span_id`.
  std::vector<const DefectOnRecord*> soffit_defects(const std::string& span_id) const;

  // Adds a point defect at (s, y) of `barrel` as one undoable edit; returns its reference (D11…).
  // Bad type or severity throws storage::StorageError naming the field.
  std::string add_point_defect(const BarrelFrame& barrel, const std::string& type, int severity, double s, double y);
  // Deletes the defect with database key `id` as one undoable edit.
  void delete_defect(const std::string& id, const std::string& ref);
  bool undo();
  bool redo();
  std::string undo_label();
  std::string redo_label();

 private:
  storage::Project* project_ = nullptr;
  std::string structure_ref_;
  std::optional<std::string> date_;
  storage::InspectionExportData data_;
  std::vector<DefectOnRecord> defects_;
};

// The next free "Dnn" after the highest numbered reference among `defects`.
std::string next_defect_ref(const std::vector<DefectOnRecord>& defects);

// Length of the polyline through the included readings, in x order: the arc
// length of the intrados between the first and last stations.
double polyline_length(const Readings& readings);

}  // namespace soffit::app
