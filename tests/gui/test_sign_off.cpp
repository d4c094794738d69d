// Sign-off from the structure screen (issue: draft → checked → issued,
// read-only once issued), driven through ImGui input on the demo project.
#include <doctest/doctest.h>

#include <cstdlib>
#include <filesystem>

#include <unistd.h>

#include "app/gui/project_screens.hpp"
#include "app/model/project_session.hpp"
#include "storage/register_queries.hpp"
#include "tests/gui/headless_ui.hpp"

using namespace soffit;

namespace {
std::string status_of(const std::string& project, const std::string& date) {
  storage::Project p = storage::Project::open(project, "test", storage::Access::view);
  const auto detail = storage::structure_detail(p.db(), "BVDC-ST-0417");
  for (const auto& v : detail->inspections)
    if (v.date == date) return v.status;
  return "";
}
}  // namespace

TEST_CASE("Mark checked, then Issue with confirmation, turns the draft visit into an issued one") {
  namespace fs = std::filesystem;
  const fs::path home = fs::temp_directory_path() / ("soffit_sign_off_" + std::to_string(::getpid()));
  fs::remove_all(home);
  fs::create_directories(home);
  ::setenv("XDG_DATA_HOME", home.c_str(), 1);
  const std::string project = (home / "soffit" / "sallow-ford-demo.soffit").string();
  {
    gui::ProjectScreens screens(SOFFIT_ASSETS, "test");
    test::HeadlessUi ui([&] { screens.draw_current(); });
    screens.open_demo();
    screens.open_first_sections();
    screens.screen = gui::Screen::structure;
    ui.frame();
    REQUIRE(ui.tap("checked:2025-05-21"));
    ui.frame();
    REQUIRE(ui.tap("issue:2025-05-21"));
    REQUIRE(ui.tap("issue:confirm"));
    ui.frame();
    CHECK(ui.drawn("revise:2025-05-21"));  // an issued visit offers a revision, not edits
    screens.defects.close();
    screens.rings_fill.close();
  }
  CHECK(status_of(project, "2025-05-21") == "issued");
  CHECK(status_of(project, "2019-05-14") == "issued");  // the earlier visit was issued already (demo)
  fs::remove_all(home);
}
