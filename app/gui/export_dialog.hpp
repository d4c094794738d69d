#pragma once
// The app's way out to the analyst: write one visit's geometry file, section
// files and report into a folder, on a worker thread, with a progress bar.
#include <atomic>
#include <future>
#include <memory>
#include <optional>
#include <string>

#include "app/model/inspection_export.hpp"
#include "storage/project_file.hpp"

namespace soffit::gui {

class ExportDialog {
 public:
  // Asks for the dialog to open for one visit; the popup appears on the next draw().
  void request(storage::Project& project, std::string structure_ref, std::string date);
  void draw();
  bool running() const { return job_.valid(); }

 private:
  void start();
  struct Progress {
    std::atomic<int> done{0}, total{1};
  };
  storage::Project* project_ = nullptr;
  std::string ref_, date_;
  bool open_requested_ = false;
  char folder_[512] = {};
  app::ExportFormats formats_{true, true, true, true, true};
  std::shared_ptr<Progress> progress_;
  std::future<app::ExportOutcome> job_;
  std::optional<app::ExportOutcome> outcome_;
  std::string error_;
};

}  // namespace soffit::gui
