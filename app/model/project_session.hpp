#pragma once
// The project the app has open, seen from the screens: the register, one
// structure's spans and visits, a section's sheet. No UI here, so the screens'
// data can be tested headless; every call goes through the storage library.
#include <optional>
#include <string>
#include <vector>

#include "geometry/sheet/survey_sheet.hpp"
#include "storage/project_file.hpp"
#include "storage/register_records.hpp"
#include "storage/register_search.hpp"

namespace soffit::app {

class ProjectSession {
 public:
  // Opens an existing project; throws storage::StorageError with a message
  // for the person (not a SQLite file, newer version, damaged, locked…).
  void open(const std::string& path, const std::string& author);
  // Opens the demo project at `path`, writing it first if nothing is there.
  void open_demo(const std::string& path, const std::string& sheets_dir, const std::string& author);
  void close();

  bool is_open() const { return project_.has_value(); }
  std::string path() const { return project_ ? project_->path() : std::string(); }

  std::vector<storage::StructureSummary> structures();
  std::vector<storage::SearchHit> search(const std::string& text);
  std::optional<storage::StructureDetail> structure(const std::string& ref);
  SurveySheet section_sheet(const std::string& section_id);
  // Writes a reading's exclusion (an empty reason includes it again) as one
  // undoable edit; `reading` indexes the section's sheet as section_sheet gives it.
  void set_reading_exclusion(const std::string& section_id, size_t reading, const std::string& reason);

  // Sign-off: draft → checked → issued, each one undoable edit; an issued visit
  // is read-only and a correction is a new revision, with its reason.
  void set_visit_status(const std::string& inspection_id, const std::string& status);
  void revise_visit(const std::string& inspection_id, const std::string& reason);

  // The register's own details, each one undoable edit. Bad fields are refused
  // (storage::StorageError, kind invalid) with a message that starts with the
  // field's name, and the project is left as it was. add_structure returns the new id.
  std::string add_structure(const storage::StructureFields& fields);
  void update_structure(const std::string& structure_id, const storage::StructureFields& fields);

  // The project's journal: undo the latest edit made anywhere in the app (it
  // survives reopening), redo the latest undone one; false when there is none.
  bool undo();
  bool redo();
  std::string undo_label();  // "" when nothing to undo
  std::string redo_label();
  // The open project for views that edit observations (nullptr when none is open).
  storage::Project* project() { return project_ ? &*project_ : nullptr; }

 private:
  std::optional<storage::Project> project_;
};

// Where the app keeps its own files (the demo project, the recent list):
// $XDG_DATA_HOME/soffit, else ~/.local/share/soffit, else the temp folder.
std::string app_data_dir();

}  // namespace soffit::app
