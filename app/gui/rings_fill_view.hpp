#pragma once
// Rings and fill of one visit: ring counts per span and face with the ring
// thickness derived from them (exports/ring_thickness_estimate, the one rule
// the exports use), a summary per face, and the fill-depth observations.
#include <optional>
#include <string>
#include <vector>

#include "app/model/inspection_data.hpp"
#include "exports/ring_thickness_estimate.hpp"

namespace soffit::gui {

struct RingCountLine {
  std::string span_label;
  storage::RingCountFields count;
  RingThicknessEstimate estimate;
};

// Every count at one face of one span, taken together.
struct FaceThickness {
  std::string span_label, face;
  int counts = 0, rings_min = 0, rings_max = 0;
  std::optional<double> measured_min_mm, measured_max_mm;            // taped face depths seen
  std::optional<double> measured_lower_mm, measured_upper_mm;        // widest range of those
  std::optional<double> from_counts_mm, count_lower_mm, count_upper_mm;  // when every count agrees
};

std::vector<RingCountLine> ring_count_lines(const storage::InspectionExportData& data);
std::vector<FaceThickness> face_thicknesses(const std::vector<RingCountLine>& lines);

class RingsFillView {
 public:
  // As DefectsView::open; the project must stay open while shown.
  void open(storage::Project& project, const std::string& structure_ref,
            const std::optional<std::string>& date = std::nullopt);
  void close();
  // Re-reads the visit (after an edit elsewhere).
  void reload();
  void draw();

  const std::vector<RingCountLine>& lines() const { return lines_; }
  const std::vector<FaceThickness>& faces() const { return faces_; }
  const app::InspectionData& data() const { return data_; }

 private:
  void draw_faces();
  void draw_counts();
  void draw_fill();

  app::InspectionData data_;
  std::vector<RingCountLine> lines_;
  std::vector<FaceThickness> faces_;
  std::string message_;
};

}  // namespace soffit::gui
