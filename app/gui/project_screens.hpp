#pragma once
// The screens around a project: start (open, create, recent, demo), the
// register of structures with search, and one structure with its spans and
// timeline of visits. Choosing a visit's sections hands them to the section view.
#include <string>
#include <vector>

#include "app/gui/defects_view.hpp"
#include "app/gui/export_dialog.hpp"
#include "app/gui/rings_fill_view.hpp"
#include "app/gui/section_workspace.hpp"
#include "app/model/project_session.hpp"
#include "app/model/register_filter.hpp"
#include "app/model/visit_comparison.hpp"

#include <future>

namespace soffit::gui {

enum class Screen { start, register_list, structure, section, defects, rings_fill, compare };

class ProjectScreens {
 public:
  ProjectScreens(std::string assets_dir, std::string author);

  // Opens (writing it first if needed) the demo project and shows the register.
  void open_demo();
  // Opens the first visit of the first structure in the section view.
  void open_first_sections();
  // Opens the latest visit of the first structure in the defects / rings and fill view.
  void open_first_defects();
  void open_first_rings_fill();

  Screen screen = Screen::start;
  SectionWorkspace sections;
  DefectsView defects;
  ExportDialog export_dialog;
  RingsFillView rings_fill;

  void draw_tabs();
  void draw_current();
  app::ProjectSession& session() { return session_; }
  // Fits the sections the last two visits share, on a worker, and shows the change.
  void start_comparison();
  bool comparing() const { return compare_job_.valid(); }
  const std::optional<std::vector<app::SectionChange>>& changes() const { return changes_; }

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
  void draw_compare();
  void remember(const std::string& path);

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
  std::string compare_title_;
  std::future<std::vector<app::SectionChange>> compare_job_;
  std::optional<std::vector<app::SectionChange>> changes_;
  char revision_reason_[200] = {};
};

}  // namespace soffit::gui
