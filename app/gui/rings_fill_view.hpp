#pragma once
// Rings and fill of one visit: ring counts per span and face with the ring
// thickness derived from them (exports/ring_thickness_estimate, the one rule
// the exports use), a summary per face, and the fill-depth observations.
// On a visit not yet issued the inspector adds, edits and deletes counts and
// depths on site, each one undoable edit of the project file.
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "app/gui/ring_fill_dialogs.hpp"
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
  // The "rings-add" screenshot: the Add ring count form, open.
  void show_add_count_for_screenshot();
  // Issued visits are shown, never changed (the schema refuses it too).
  bool read_only() const;
  // The database key of each row of lines() / data().fill_depths ("" if unknown).
  const std::vector<std::string>& count_ids() const { return count_ids_; }
  const std::vector<std::string>& fill_ids() const { return fill_ids_; }
  // "Added ring count …. Saved to the project file …": where the last change went.
  const std::string& saved_note() const { return saved_; }

 private:
  void rebuild();
  void draw_actions();
  void draw_faces();
  void draw_counts();
  void draw_fill();
  void draw_delete_popup();
  std::vector<SpanChoice> span_choices() const;
  std::string span_label(const std::string& span_id) const;
  // Runs one change of the project file; on success notes where it went, on
  // refusal returns the message (and the screen shows it).
  std::string change(const std::string& done, const std::function<void()>& edit);
  void undo_or_redo(bool undo);

  storage::Project* project_ = nullptr;
  app::InspectionData data_;
  std::vector<RingCountLine> lines_;
  std::vector<FaceThickness> faces_;
  std::vector<std::string> count_ids_, fill_ids_;
  std::string selected_count_, selected_fill_;  // database keys
  RingCountDialog count_dialog_;
  FillDepthDialog fill_dialog_;
  std::string edit_id_;  // the row the open dialog edits ("" when adding)
  struct Deleting {
    bool count = true;
    std::string id, name;
  };
  std::optional<Deleting> deleting_;
  bool open_delete_ = false;
  std::string message_, saved_;
};

}  // namespace soffit::gui
