#pragma once
// The defects of one visit on a span's barrel, unrolled: arc length s along
// the intrados across the screen, width y down it, one scale for both.
// Tap empty barrel to place a point defect (type, severity, confirm); tap a
// mark to select it, then delete it after a confirmation. Undo and redo go
// through the project file, so they also undo edits made elsewhere.
#include <functional>
#include <optional>
#include <string>

#include <imgui.h>

#include "app/model/inspection_data.hpp"

namespace soffit::gui {

class DefectsView {
 public:
  // Shows the visit on `date` (nullopt: the latest) of `structure_ref`. The
  // project must stay open while the view shows it (call close() before).
  // A visit that cannot be read is shown as a message, never thrown.
  void open(storage::Project& project, const std::string& structure_ref,
            const std::optional<std::string>& date = std::nullopt);
  void close();
  // Draws into the current window, filling the available space.
  void draw();

  // For tests and the lead's wiring.
  const app::InspectionData& data() const { return data_; }
  void select_span(size_t index) { span_ = index; }
  // Where (s, y) of the shown barrel was drawn in the last frame; empty before one.
  std::optional<ImVec2> screen_point(double s, double y) const;
  const std::string& message() const { return message_; }

 private:
  void draw_toolbar();
  void draw_barrel(const app::BarrelFrame& barrel, float height);
  void draw_selection();
  void draw_new_defect_popup(const app::BarrelFrame& barrel);
  void draw_delete_popup();
  void run(const char* what, const std::function<void()>& change);
  int hit_test(const app::BarrelFrame& barrel, ImVec2 pointer) const;

  app::InspectionData data_;
  size_t span_ = 0;
  std::string selected_id_;
  std::optional<std::pair<double, double>> pending_;  // (s, y) of a defect being placed
  std::string pending_type_;
  int pending_severity_ = 0;
  bool open_new_ = false, open_delete_ = false, open_legend_ = false;
  std::string message_;  // last refusal or error, for the person
  // Mapping of the last frame: screen = origin + (s, y) * scale (y sign per frame).
  ImVec2 origin_{0, 0};
  float scale_ = 0;
};

}  // namespace soffit::gui
