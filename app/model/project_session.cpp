#include "app/model/project_session.hpp"

#include <cstdlib>
#include <filesystem>

#include "storage/demo_project.hpp"
#include "storage/inspection_revision.hpp"
#include "storage/register_edits.hpp"
#include "storage/section_readings.hpp"
#include "storage/storage_error.hpp"
#include "storage/register_queries.hpp"
#include "storage/sheet_export.hpp"

namespace soffit::app {

void ProjectSession::open(const std::string& path, const std::string& author) {
  close();
  project_.emplace(storage::Project::open(path, author));
}

void ProjectSession::open_demo(const std::string& path, const std::string& sheets_dir, const std::string& author) {
  close();
  std::error_code ec;
  if (!std::filesystem::exists(path, ec)) {
    std::filesystem::create_directories(std::filesystem::path(path).parent_path(), ec);
    storage::write_demo_project(path, sheets_dir, author);
  }
  project_.emplace(storage::Project::open(path, author));
}

void ProjectSession::close() {
  if (project_) project_->close();
  project_.reset();
}

std::vector<storage::StructureSummary> ProjectSession::structures() {
  return project_ ? storage::list_structures(project_->db()) : std::vector<storage::StructureSummary>{};
}

std::vector<storage::SearchHit> ProjectSession::search(const std::string& text) {
  return project_ ? storage::search_register(project_->db(), text) : std::vector<storage::SearchHit>{};
}

std::optional<storage::StructureDetail> ProjectSession::structure(const std::string& ref) {
  return project_ ? storage::structure_detail(project_->db(), ref) : std::nullopt;
}

SurveySheet ProjectSession::section_sheet(const std::string& section_id) {
  return storage::load_section_sheet(project_->db(), section_id);
}

void ProjectSession::set_visit_status(const std::string& inspection_id, const std::string& status) {
  if (!project_) return;
  project_->edit("mark visit " + status, [&](storage::Connection& db) {
    storage::set_inspection_status(db, project_->author(), inspection_id, status);
  });
}

void ProjectSession::revise_visit(const std::string& inspection_id, const std::string& reason) {
  if (!project_) return;
  project_->edit("new revision of an issued visit", [&](storage::Connection& db) {
    storage::create_inspection_revision(db, project_->author(), inspection_id, reason);
  });
}

std::string ProjectSession::add_structure(const storage::StructureFields& fields) {
  if (!project_) throw storage::StorageError(storage::ErrorKind::not_found, "", "no project is open");
  std::string id;
  project_->edit("add structure " + fields.ref, [&](storage::Connection& db) {
    id = storage::insert_structure(db, project_->author(), fields);
  });
  return id;
}

void ProjectSession::update_structure(const std::string& structure_id, const storage::StructureFields& fields) {
  if (!project_) throw storage::StorageError(storage::ErrorKind::not_found, "", "no project is open");
  project_->edit("edit details of " + fields.ref, [&](storage::Connection& db) {
    storage::update_structure(db, project_->author(), structure_id, fields);
  });
}

bool ProjectSession::undo() { return project_ && project_->undo(); }
bool ProjectSession::redo() { return project_ && project_->redo(); }
std::string ProjectSession::undo_label() { return project_ ? project_->undo_label() : std::string(); }
std::string ProjectSession::redo_label() { return project_ ? project_->redo_label() : std::string(); }

void ProjectSession::set_reading_exclusion(const std::string& section_id, size_t reading, const std::string& reason) {
  if (!project_) return;
  const std::vector<std::string> ids = storage::section_reading_ids(project_->db(), section_id);
  if (reading >= ids.size())
    throw storage::StorageError(storage::ErrorKind::not_found, project_->path(), "no such reading in the section");
  const std::string label = (reason.empty() ? "use reading " : "exclude reading ") + std::to_string(reading + 1);
  project_->edit(label, [&](storage::Connection& db) {
    storage::set_reading_exclusion(db, project_->author(), ids[reading], reason);
  });
}

std::string app_data_dir() {
  namespace fs = std::filesystem;
  if (const char* xdg = std::getenv("XDG_DATA_HOME"); xdg && *xdg) return (fs::path(xdg) / "soffit").string();
  if (const char* home = std::getenv("HOME"); home && *home)
    return (fs::path(home) / ".local" / "share" / "soffit").string();
  return (fs::temp_directory_path() / "soffit").string();
}

}  // namespace soffit::app
