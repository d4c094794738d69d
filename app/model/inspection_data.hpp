#pragma once
// One visit's observations as the defects and rings views show them: read
// through storage (load_inspection_export), changed only inside Project::edit
// so that every change is one undo step of the project file. No UI here.
#include <optional>
#include <string>
#include <vector>

#include "app/model/defect_shapes.hpp"
#include "storage/export_queries.hpp"
#include "storage/project_file.hpp"

namespace soffit::app {

// Where a new defect is recorded: its frame, span, element and the origin
// its coordinates are measured from (DefectFields of the same names).
struct DefectPlace {
  storage::DefectFrame frame = storage::DefectFrame::soffit;
  std::string span_id;  // empty: not on a span
  std::string element, origin;
};

// What the inspector chooses for a defect, new or edited.
struct DefectDraft {
  std::string type;  // a key of storage/defect_vocabulary.md
  int severity = 0;  // soffit-1-5
  std::optional<double> width_mm;
  std::string notes;
};

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
  // The measured size before it was stretched to take in the defects, for
  // placement_notes: meaningful only where arc_known / width_known.
  double surveyed_arc_m = 0, recorded_width_m = 0;
  DefectPlace place() const { return {storage::DefectFrame::soffit, span_id, span_label + " barrel", origin}; }
};

// A wall or support seen face on: x along the span, z up, in metres. Its size
// comes from the span's details and surveyed sections where recorded, else a
// stand-in the view states; it always takes in the defects already on it.
enum class ElevationKind { us_spandrel, ds_spandrel, support, other };
struct ElevationFrame {
  ElevationKind kind = ElevationKind::other;
  std::string span_id, span_label;
  std::string name;     // for the surface buttons: "DS spandrel", "pier", "US parapet"
  std::string element;  // stored with new defects: "S1 DS spandrel wall"
  std::string origin;   // frame_origin of new defects (that of the defects on it, if any)
  std::string record_span_id;  // span_id stored with new defects
  double x_min = 0, x_max = 1, z_min = 0, z_max = 1;
  std::string width_basis, height_basis;  // where the drawn size came from, for the screen
  bool width_assumed = false, height_assumed = false;
  // The downstream face is drawn as seen standing downstream of it: x grows to the left.
  bool seen_from_downstream = false;
  std::string x_zero_label, z_zero_label;  // what x = 0 and z = 0 are
  PlanePath intrados;          // spandrels: the surveyed intrados (x, z above the springing)
  // Spandrels: the surface as measured, before it was stretched to take in
  // the defects (for placement_notes); nullopt when not surveyed or recorded.
  std::optional<double> surveyed_span_m;    // x from 0 to this: end stations of a section
  std::optional<double> recorded_height_m;  // z from 0 to this: wall height in the span details
  std::vector<std::string> defect_ids;  // elevation defects shown on it
  DefectPlace place() const { return {storage::DefectFrame::elevation, record_span_id, element, origin}; }
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

  // The elevations of `span_id`: its US and DS spandrel walls, the supports
  // its details list, and any other elevation its visit's defects are on.
  // Elevation defects on no span go with the support they name, else the first span.
  std::vector<ElevationFrame> elevations(const std::string& span_id) const;
  std::vector<const DefectOnRecord*> elevation_defects(const ElevationFrame& frame) const;

  // Adds a point defect at (s, y) of `barrel` as one undoable edit; returns its reference (D11…).
  // Bad type or severity throws storage::StorageError naming the field.
  std::string add_point_defect(const BarrelFrame& barrel, const std::string& type, int severity, double s, double y);
  // Adds a point, line (>= 2 points) or area (>= 3 points, ring not repeated)
  // at `place` as one undoable edit, with its length_m (polyline) or area_m2
  // (shoelace) worked out here; returns its reference. Bad input throws
  // storage::StorageError naming the field and changes nothing.
  std::string add_defect(const DefectPlace& place, storage::DefectGeometry geometry, const PlanePath& points,
                         const DefectDraft& draft);
  // Changes type, severity, width and notes of the defect `id` as one undoable edit.
  void update_defect(const std::string& id, const DefectDraft& draft);
  // Deletes the defect with database key `id` as one undoable edit.
  void delete_defect(const std::string& id, const std::string& ref);
  bool undo();
  bool redo();
  std::string undo_label();
  std::string redo_label();

 private:
  std::vector<ElevationFrame> all_elevations() const;
  storage::Project* project_ = nullptr;
  std::string structure_ref_;
  std::optional<std::string> date_;
  storage::InspectionExportData data_;
  std::vector<DefectOnRecord> defects_;
};

// A defect drawn where its surface is not: almost certainly in the wrong
// frame or mistyped. Only a note for the inspector: the defect stays as recorded.
struct PlacementNote {
  std::string defect_id, ref;
  std::string text;  // "D03: 1.0 m above the springing at x 3.2 is below the intrados (1.59 m): check …"
};

// Spandrel elevations: a point in the arch opening (below the surveyed
// intrados), beyond the surveyed span, below the springing line, or above
// the wall height where it is recorded. One note per defect, for its first
// point that is off. Other elevations have no outline to check against.
std::vector<PlacementNote> placement_notes(const ElevationFrame& frame, const std::vector<const DefectOnRecord*>& defects);
// The unrolled barrel: a point with s outside 0 to the surveyed arc length,
// or y outside 0 to the recorded barrel width.
std::vector<PlacementNote> placement_notes(const BarrelFrame& barrel, const std::vector<const DefectOnRecord*>& defects);

// The next free "Dnn" after the highest numbered reference among `defects`.
std::string next_defect_ref(const std::vector<DefectOnRecord>& defects);

// Length of the polyline through the included readings, in x order: the arc
// length of the intrados between the first and last stations.
double polyline_length(const Readings& readings);

}  // namespace soffit::app
