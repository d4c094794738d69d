#pragma once
// A fresh copy of the invented demo project (FIELD.md §10) in its own temp
// folder, open for editing, removed afterwards: tests that edit it get their own.
#include <doctest/doctest.h>

#include <chrono>
#include <filesystem>
#include <optional>
#include <string>

#include "storage/demo_assets.hpp"
#include "storage/demo_project.hpp"
#include "storage/inspection_observations.hpp"
#include "storage/project_file.hpp"

namespace soffit::test {

inline constexpr const char* kDemoRef = "BVDC-ST-0417";

struct DemoProject {
  std::filesystem::path dir;
  std::optional<storage::Project> project;

  DemoProject() {
    dir = std::filesystem::temp_directory_path() /
          ("soffit-demo-" + std::to_string(std::chrono::steady_clock::now().time_since_epoch().count()));
    std::filesystem::create_directories(dir);
    const std::string path = (dir / "demo.soffit").string();
    const std::string sheets = storage::find_demo_sheets();
    REQUIRE_FALSE(sheets.empty());
    storage::write_demo_project(path, sheets, "test");
    project.emplace(storage::Project::open(path, "test"));
  }
  ~DemoProject() {
    project.reset();
    std::error_code ec;
    std::filesystem::remove_all(dir, ec);
  }
  DemoProject(const DemoProject&) = delete;
  DemoProject& operator=(const DemoProject&) = delete;

  // Counted by a query of its own, not read back from the view under test.
  size_t defects_in_db(const std::string& inspection_id) {
    return storage::inspection_observations(project->db(), inspection_id).defects.size();
  }
};

}  // namespace soffit::test
