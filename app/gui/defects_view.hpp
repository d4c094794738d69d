#pragma once
// The defects of one visit, drawn to scale on the surface they are on: a
// span's barrel unrolled (arc length s along the intrados across the screen,
// width y down it) or an elevation (a spandrel wall, a pier, an abutment:
// x along the span, z up). One scale for both directions.
// Draw modes: tap to place a point; press-drag-lift to draw a crack line;
// drag round an area, or tap its corners and Close area. The same dialog then
// asks type, severity and (for cracks) width. Tap a mark to select it, then
// edit it or delete it after a confirmation. Every change is one undoable
// edit of the project file, so Undo and Redo also undo edits made elsewhere.
#include <functional>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include <imgui.h>

#include "app/gui/numeric_keypad.hpp"
#include "app/model/defect_shapes.hpp"
#include "app/model/inspection_data.hpp"

namespace soffit::gui {

class DefectsView {
 public:
  // Asks the owner to show photos: of the visit, or of one of its defects
  // (database keys). Called at the end of draw(), never in the middle of it.
  using PhotosRequest =
      std::function<void(const std::string& inspection_id, const std::optional<std::string>& defect_id)>;

  // Shows the visit on `date` (nullopt: the latest) of `structure_ref`. The
  // project must stay open while the view shows it (call close() before).
  // A visit that cannot be read is shown as a message, never thrown.
  void open(storage::Project& project, const std::string& structure_ref,
            const std::optional<std::string>& date = std::nullopt);
  void close();
  // Reads the visit again, e.g. after the photo viewer linked photos to its defects.
  void reload();
  // Without one, the Photos buttons are not drawn.
  void set_photos_request(PhotosRequest request) { photos_request_ = std::move(request); }
  // Draws into the current window, filling the available space.
  void draw();

  // For tests and the lead's wiring.
  const app::InspectionData& data() const { return data_; }
  void select_span(size_t index) { span_ = index; }
  // "Barrel" or the name of one of the span's elevations ("DS spandrel", "pier").
  void select_surface(const std::string& name) { surface_ = name; }
  const std::string& surface() const { return surface_; }
  // Database key of the selected defect (empty when none), e.g. for attaching photos.
  const std::string& selected_defect() const { return selected_id_; }
  // Where (s, y) of the shown barrel, or (x, z) of the shown elevation, was
  // drawn in the last frame; empty before one.
  std::optional<ImVec2> screen_point(double a, double b) const;
  const std::string& message() const { return message_; }
  // For the screenshot: shows span `span_label`'s `surface` with the defect `ref` selected.
  void show_for_screenshot(const std::string& span_label, const std::string& surface, const std::string& ref);

 private:
  enum class Mode { point, line, area };
  // The drawn rectangle in the surface's own metres: a to the right (or the
  // left, for a face seen from downstream), b down the screen (barrel y) or up it (z).
  struct Plane {
    double a_min = 0, a_max = 1, b_min = 0, b_max = 1;
    bool a_leftward = false, b_up = false;
    const char* a_name = "s";
    const char* b_name = "y";
    float bottom_rows = 4.0f;  // room under the plane for labels, scale and frame, in font sizes
    std::string left_label, right_label;  // beside the left and right edges, with room kept for them
  };
  // A drawn defect waiting for its type and severity.
  struct Pending {
    app::DefectPlace place;
    storage::DefectGeometry geometry = storage::DefectGeometry::point;
    app::PlanePath points;
    std::string where;  // "S1 barrel"
    const char* a_name = "s";
    const char* b_name = "y";
  };
  using Marks = std::vector<const app::DefectOnRecord*>;
  using Decorate = std::function<void(ImDrawList*, ImVec2 top_left, ImVec2 near, ImVec2 far)>;

  void draw_toolbar(const std::vector<app::ElevationFrame>& elevations);
  void draw_modes();
  void draw_surface(const Plane& plane, const Marks& marks, const app::DefectPlace& place, const std::string& where,
                    float height, const Decorate& decorate);
  void decorate_barrel(const app::BarrelFrame& barrel, ImDrawList* draw, ImVec2 top_left, ImVec2 near, ImVec2 far);
  void decorate_elevation(const app::ElevationFrame& e, ImDrawList* draw, ImVec2 top_left, ImVec2 near, ImVec2 far);
  void draw_marks(ImDrawList* draw, const Marks& marks);
  void handle_pointer(bool tapped, const Marks& marks, const app::DefectPlace& place, const std::string& where);
  void tap_at(ImVec2 pointer, const Marks& marks, const app::DefectPlace& place, const std::string& where);
  void finish_stroke(const app::DefectPlace& place, const std::string& where);
  void start_pending(const app::DefectPlace& place, const std::string& where, storage::DefectGeometry geometry,
                     app::PlanePath points);
  void draw_selection();
  void send_photos_request();
  void draw_placement_notes(const std::vector<app::PlacementNote>& notes);
  void draw_defect_form(storage::DefectGeometry geometry);
  void draw_new_defect_popup();
  void draw_edit_popup();
  void draw_delete_popup();
  void run(const char* what, const std::function<void()>& change);
  int hit_test(const Marks& marks, ImVec2 pointer) const;
  ImVec2 to_screen(double a, double b) const;
  app::PlanePoint to_plane(ImVec2 p) const;  // clamped to the plane
  bool on_plane(ImVec2 p) const;

  app::InspectionData data_;
  PhotosRequest photos_request_;
  std::optional<std::optional<std::string>> photos_wanted_;  // set by a Photos button, sent at the end of draw()
  size_t span_ = 0;
  std::string surface_ = "Barrel";
  std::string selected_id_;
  Mode mode_ = Mode::point;
  // A drag in progress, in screen pixels; and tapped area corners in metres.
  app::StrokeSampler stroke_;
  bool dragging_ = false;
  app::PlanePath corners_;
  std::string corners_surface_;  // the surface the corners are on
  std::optional<Pending> pending_;
  app::DefectDraft draft_;
  char notes_[512] = {};
  std::string form_error_;  // a refused width, shown in the dialog
  NumericKeypad keypad_;
  bool open_new_ = false, open_edit_ = false, open_delete_ = false, open_legend_ = false;
  bool close_area_ = false;  // Close area pressed (or the first corner tapped again)
  std::string message_;  // last refusal or error, for the person
  std::string hint_;     // how to use the current mode, after a tap it did not expect
  std::string saved_;    // where the last change went
  // Mapping of the last frame: screen = origin + (a, b) * scale, per Plane.
  Plane plane_;
  ImVec2 origin_{0, 0};
  float scale_ = 0;
};

}  // namespace soffit::gui
