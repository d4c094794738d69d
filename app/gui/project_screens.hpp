#pragma once
// The screens around a project: start (open, create, recent, demo), the
// register of structures with search, and one structure with its spans and
// timeline of visits. Choosing a visit's sections hands them to the section view.
#include <string>
#include <vector>

#include "app/gui/defects_view.hpp"
#include "app/gui/new_section_dialog.hpp"
#include "app/gui/new_visit_dialog.hpp"
#include "app/gui/photo_viewer.hpp"
#include "app/gui/export_dialog.hpp"
#include "app/gui/rings_fill_view.hpp"
#include "app/gui/section_workspace.hpp"
#include "app/gui/structure_form.hpp"
#include "app/model/project_session.hpp"
#include "app/model/register_filter.hpp"
#include "app/model/visit_comparison.hpp"
#include "app/model/visit_geometry.hpp"

#include <functional>
#include <future>

namespace soffit::gui {

enum class Screen { start, register_list, structure, section, defects, rings_fill, photos, compare };

class ProjectScreens {
 public:
  // `textures` uploads photos for the photo viewer (OpenGL in the app; none
  // in headless tests, where photos are drawn as placeholders of their shape).
  ProjectScreens(std::string assets_dir, std::string author, std::unique_ptr<TextureFactory> textures = nullptr);
  ~ProjectScreens();  // the photo viewer frees its textures: close() it while the GL context exists

  // Opens (writing it first if needed) the demo project and shows the register.
  void open_demo();
  // Opens the latest visit with sections of the first structure in the section view.
  void open_first_sections();
  // Opens the latest visit of the first structure in the defects / rings and fill view.
  void open_first_defects();
  void open_first_rings_fill();

  Screen screen = Screen::start;
  SectionWorkspace sections;
  DefectsView defects;
  PhotoViewer photos;
  // The structure screen with "New section" open on the latest visit that is not issued (a screenshot).
  void open_new_section_form();
  // Shows the photos of a visit, with a defect first when one is given.
  void open_photos(const std::string& inspection_id, const std::optional<std::string>& defect_id = std::nullopt);
  ExportDialog export_dialog;
  RingsFillView rings_fill;

  void draw_tabs();
  void draw_current();
  app::ProjectSession& session() { return session_; }
  // Fits the sections the last two visits share, on a worker, and shows the change.
  void start_comparison();
  bool comparing() const { return compare_job_.valid(); }
  // Something runs on a worker (a fit, a comparison, photos): keep frames coming.
  bool busy() const;
  const std::optional<std::vector<app::SectionGeometry>>& latest_geometry() const { return geometry_; }
  const std::optional<std::vector<app::SectionChange>>& changes() const { return changes_; }
  // The register's "Add structure" form, opened as if tapped (for the screenshot view).
  void open_add_structure() { structure_form_.open_new(); }
  const StructureForm& structure_form() const { return structure_form_; }
  // The last change saved or undone, and where it went; empty before one.
  const std::string& saved_note() const { return saved_note_; }

 private:
  void open_path(const std::string& path, bool create);
  void draw_start();
  void draw_register();
  void draw_structure();
  void show_structure(const std::string& ref);
  void open_sections(const storage::InspectionRecord& visit);
  void open_visit_views(const std::string& date);  // defects and rings/fill of one visit
  void draw_sign_off(const storage::InspectionRecord& visit);
  void draw_sign_off_dialogs();
  void sign_off_step(const std::function<void()>& step);  // runs one, says a refusal, re-reads the visits
  void draw_compare();
  void draw_latest_geometry();  // the structure screen's summary of its latest visit
  void show_new_section(const std::string& section_id);  // the section view on a section just made
  void remember(const std::string& path);
  // Add / edit details / undo / redo and where the last change went, on the
  // register and structure screens.
  void draw_edit_bar(bool on_structure);
  void draw_structure_form();
  void undo_or_redo(bool undo);
  // Re-reads what the screens show after the project changed underneath them.
  void reload_after_change(bool sections_too);
  void reload_sections(const storage::InspectionRecord& visit);

  std::string assets_dir_, author_;
  app::ProjectSession session_;
  std::vector<std::string> recent_;
  std::string message_;  // last error for the person, shown on the start screen
  char path_[512] = {};
  char search_[128] = {};
  std::vector<storage::StructureSummary> structures_;
  app::RegisterFilter filter_;
  std::vector<storage::SearchHit> hits_;
  std::optional<storage::StructureDetail> detail_;
  bool visit_views_open_ = false;
  std::vector<std::string> section_ids_;  // of the sections shown, in their order
  std::string signing_visit_;        // inspection id awaiting confirmation
  bool open_issue_ = false, open_revise_ = false;
  bool refresh_structure_ = false;  // re-read the structure after a sign-off step
  NewSectionDialog new_section_;
  NewVisitDialog new_visit_;
  std::future<std::vector<app::SectionGeometry>> geometry_job_;
  std::optional<std::vector<app::SectionGeometry>> geometry_;
  std::string geometry_key_, geometry_visit_;  // what the summary (or its job) is of
  std::string compare_title_;
  std::future<std::vector<app::SectionChange>> compare_job_;
  std::optional<std::vector<app::SectionChange>> changes_;
  char revision_reason_[200] = {};
  StructureForm structure_form_;
  std::string saved_note_;
  std::string highlight_ref_;        // the structure just added or edited, marked in the list
  bool scroll_to_highlight_ = false;  // bring it into view once
  std::string visit_views_date_;     // the visit the defects and rings views show
  std::string sections_visit_id_;    // the visit (inspection id) whose sections the section view shows
  std::string sections_structure_id_;  // and its structure
};

}  // namespace soffit::gui
