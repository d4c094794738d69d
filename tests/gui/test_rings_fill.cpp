// Drives the rings and fill view through ImGui's input on the demo project
// (FIELD.md §10, invented): record a ring count and a fill depth with keypad
// taps, edit a count, delete a depth after confirming and undo it, and see
// that the issued 2019 visit offers no way to change it. What was stored is
// read back by queries of the tests' own, from the project file reopened.
#include <doctest/doctest.h>

#include <cmath>
#include <string>

#include "app/gui/rings_fill_view.hpp"
#include "headless_ui.hpp"
#include "storage/inspection_observations.hpp"
#include "storage/sqlite_statement.hpp"
#include "tests/app/demo_project_fixture.hpp"

using namespace soffit;

namespace {

using test::DemoProject;
using test::kDemoRef;

// Closes the project and opens the file again: what follows is what reached the disk.
void reopen(DemoProject& demo) {
  const std::string path = demo.project->path();
  demo.project.reset();
  demo.project.emplace(storage::Project::open(path, "test"));
}

std::string visit_id(DemoProject& demo, const std::string& date) {
  storage::Statement q(demo.project->db(), "SELECT id FROM inspection WHERE inspection_date = ?1");
  q.bind(1, date);
  REQUIRE(q.step());
  return q.column_text(0);
}

long long rows(DemoProject& demo, const char* table, const std::string& inspection_id) {
  storage::Statement q(demo.project->db(), std::string("SELECT count(*) FROM ") + table + " WHERE inspection_id = ?1");
  q.bind(1, inspection_id);
  REQUIRE(q.step());
  return q.column_int64(0);
}

// Opens the keypad of `field`, deletes what it holds, types `digits` and presses OK.
void key_in(test::HeadlessUi& ui, const std::string& field, const std::string& digits) {
  REQUIRE(ui.tap(field));
  for (int i = 0; i < 8; ++i) REQUIRE(ui.tap("key:<"));
  for (char k : digits) REQUIRE(ui.tap(std::string("key:") + k));
  REQUIRE(ui.tap("key:ok"));
}

// Turns the mouse wheel over the screen until `control` is inside the 800 px window, clear of its edges.
void scroll_into_view(test::HeadlessUi& ui, const std::string& control) {
  ImGuiIO& io = ImGui::GetIO();
  const auto y = [&] { return gui::UiProbe::instance().centres.at(control).y; };
  const float top = ImGui::GetFrameHeight(), bottom = io.DisplaySize.y - ImGui::GetFrameHeight();
  for (int i = 0; i < 40 && (y() > bottom || y() < top); ++i) {
    io.MousePos = ImVec2(io.DisplaySize.x * 0.5f, io.DisplaySize.y * 0.5f);
    io.MouseWheel = y() > bottom ? -1.0f : 1.0f;
    ui.frame();
    io.MouseWheel = 0.0f;
    ui.frame();
  }
  REQUIRE(y() < bottom);
  REQUIRE(y() > top);
}

}  // namespace

TEST_CASE("a ring count keyed in on the 2025 draft visit is stored as brick plus the span's joint") {
  DemoProject demo;
  const std::string v2025 = visit_id(demo, "2025-05-21");  // PI-2025, FIELD.md §10.1
  const long long before = rows(demo, "ring_count", v2025);
  gui::RingsFillView view;
  view.open(*demo.project, kDemoRef);
  test::HeadlessUi ui([&] { view.draw(); });
  ui.frame();
  REQUIRE(view.data().data().inspection.date == "2025-05-21");
  CHECK_FALSE(view.read_only());
  REQUIRE(ui.tap("rings:add-count"));
  REQUIRE(ui.tap("rc:span:S2"));
  REQUIRE(ui.tap("rc:face:DS"));
  REQUIRE(ui.tap("rc:pos:crown"));
  key_in(ui, "rc:rings", "4");          // FIELD.md §10: 4 rings at every face
  key_in(ui, "rc:unit", "120");         // one ring: 110 mm header + 10 mm joint (FIELD.md §10 bricks and joints)
  key_in(ui, "rc:taped", "457");        // S2 DS crown face depth, FIELD.md §10
  REQUIRE(ui.tap("rc:conf:medium"));
  REQUIRE(ui.tap("rc:basis:face count only"));  // FIELD.md §4: "face count only" as the basis
  REQUIRE(ui.tap("rc:save"));
  CHECK(view.saved_note().find("Saved to the project file demo.soffit") != std::string::npos);
  CHECK(view.saved_note().find("S2 DS crown") != std::string::npos);

  reopen(demo);
  CHECK(rows(demo, "ring_count", v2025) == before + 1);
  storage::Statement q(demo.project->db(),
                       "SELECT r.rings, r.unit_depth_mm, r.thickness_mm, r.face, r.position, r.confidence, r.basis, "
                       "r.thickness_lower_mm IS NULL FROM ring_count r JOIN span s ON s.id = r.span_id "
                       "WHERE r.inspection_id = ?1 AND s.label = 'S2' ORDER BY r.rowid DESC LIMIT 1");
  q.bind(1, v2025);
  REQUIRE(q.step());
  CHECK(q.column_int64(0) == 4);
  // The span's joint (10 mm, demo span details after FIELD.md §10 "joints 8–12 mm") is taken off: 110 mm brick.
  CHECK(std::abs(q.column_double(1) - 110.0) < 1e-9);
  CHECK(std::abs(q.column_double(2) - 457.0) < 1e-9);
  CHECK(q.column_text(3) == "DS");
  CHECK(q.column_text(4) == "crown");
  CHECK(q.column_text(5) == "medium");
  CHECK(q.column_text(6) == "face count only");
  CHECK(q.column_int64(7) == 1);  // no range typed: none stored
}

TEST_CASE("the 2019 trial pit keyed in as a fill depth is stored in metres, and mm typed as m is refused") {
  DemoProject demo;
  const std::string v2025 = visit_id(demo, "2025-05-21");
  const long long before = rows(demo, "fill_depth", v2025);
  gui::RingsFillView view;
  view.open(*demo.project, kDemoRef);
  test::HeadlessUi ui([&] { view.draw(); });
  ui.frame();
  // FIELD.md §10 (trial pit row) and §10.3: the 2019 pit over the S1 crown (x = 3.2), DS verge y 4.45–4.75,
  // extrados 0.455 m below the verge, 110 mm of bituminous surfacing; recorded again as evidence for 2025.
  REQUIRE(ui.tap("rings:add-fill"));
  REQUIRE(ui.tap("fd:span:S1"));
  key_in(ui, "fd:chainage", "3.2");
  key_in(ui, "fd:offset", "4.6");
  REQUIRE(ui.tap("fd:method:trial_pit"));
  key_in(ui, "fd:depth", "455");  // millimetres typed into the metre field
  key_in(ui, "fd:surfacing", "0.11");
  const ImVec2 save = gui::UiProbe::instance().centres.at("fd:save");
  ui.forget_controls();  // from here on, "drawn" means drawn after Save
  ui.tap_at(save);
  CHECK(ui.drawn("fd:error"));   // refused with the field named, the form still open
  CHECK(ui.drawn("fd:save"));
  CHECK(rows(demo, "fill_depth", v2025) == before);
  key_in(ui, "fd:depth", "0.455");
  REQUIRE(ui.tap("fd:save"));
  CHECK(view.saved_note().find("Added fill depth S1 at 3.20 m (trial pit)") != std::string::npos);

  reopen(demo);
  CHECK(rows(demo, "fill_depth", v2025) == before + 1);
  storage::Statement q(demo.project->db(),
                       "SELECT chainage_m, offset_y_m, method, depth_m, surfacing_m, uncertainty_m IS NULL "
                       "FROM fill_depth WHERE inspection_id = ?1 AND method = 'trial_pit'");
  q.bind(1, v2025);
  REQUIRE(q.step());
  CHECK(std::abs(q.column_double(0) - 3.2) < 1e-9);
  CHECK(std::abs(q.column_double(1) - 4.6) < 1e-9);
  CHECK(q.column_text(2) == "trial_pit");
  CHECK(std::abs(q.column_double(3) - 0.455) < 1e-9);
  CHECK(std::abs(q.column_double(4) - 0.110) < 1e-9);
  CHECK(q.column_int64(5) == 1);  // FIELD.md gives no uncertainty for the pit: none stored
}

TEST_CASE("a selected ring count is edited in the same form and keeps its recorded range") {
  DemoProject demo;
  gui::RingsFillView view;
  view.open(*demo.project, kDemoRef);
  test::HeadlessUi ui([&] { view.draw(); });
  ui.frame();
  REQUIRE(!view.count_ids().empty());
  const std::string id = view.count_ids()[0];
  REQUIRE(!id.empty());
  REQUIRE(ui.tap("rings:count:0"));
  scroll_into_view(ui, "rings:edit-count");  // under the table
  REQUIRE(ui.tap("rings:edit-count"));
  REQUIRE(ui.tap("rc:rings+"));  // a fifth ring found behind the face
  REQUIRE(ui.tap("rc:conf:high"));
  REQUIRE(ui.tap("rc:save"));

  reopen(demo);
  storage::Statement q(demo.project->db(),
                       "SELECT rings, confidence, unit_depth_mm, thickness_lower_mm, thickness_upper_mm "
                       "FROM ring_count WHERE id = ?1");
  q.bind(1, id);
  REQUIRE(q.step());
  CHECK(q.column_int64(0) == 5);  // the demo's 4 (FIELD.md §10) plus one
  CHECK(q.column_text(1) == "high");
  CHECK(std::abs(q.column_double(2) - 110.0) < 1e-9);  // the brick, unchanged by the round trip through brick + joint
  CHECK(std::abs(q.column_double(3) - 350.0) < 1e-9);  // d range 0.35–0.58 m, FIELD.md §10.3, kept
  CHECK(std::abs(q.column_double(4) - 580.0) < 1e-9);
}

TEST_CASE("a fill depth is deleted only after confirming, and Undo brings it back") {
  DemoProject demo;
  const std::string v2025 = visit_id(demo, "2025-05-21");
  const long long before = rows(demo, "fill_depth", v2025);
  REQUIRE(before >= 1);  // FIELD.md §10.3: the 2025 estimate over the S1 crown
  gui::RingsFillView view;
  view.open(*demo.project, kDemoRef);
  test::HeadlessUi ui([&] { view.draw(); });
  ui.frame();
  const std::string id = view.fill_ids()[0];
  scroll_into_view(ui, "rings:fill:0");  // the fill table is below the counts
  REQUIRE(ui.tap("rings:fill:0"));
  scroll_into_view(ui, "rings:delete-fill");
  REQUIRE(ui.tap("rings:delete-fill"));
  REQUIRE(ui.tap("rings:keep"));  // the first answer keeps it
  CHECK(rows(demo, "fill_depth", v2025) == before);
  REQUIRE(ui.tap("rings:delete-fill"));
  REQUIRE(ui.tap("rings:confirm-delete"));
  CHECK(rows(demo, "fill_depth", v2025) == before - 1);
  CHECK(view.saved_note().find("Deleted fill depth") != std::string::npos);
  scroll_into_view(ui, "rings:undo");
  REQUIRE(ui.tap("rings:undo"));
  CHECK(rows(demo, "fill_depth", v2025) == before);
  REQUIRE(!view.fill_ids().empty());
  CHECK(view.fill_ids()[0] == id);  // the same row, not a copy
  CHECK(view.saved_note().find("Undone: delete fill depth") != std::string::npos);
}

TEST_CASE("the issued 2019 visit is shown read-only with no Add, Edit or Delete") {
  DemoProject demo;
  gui::RingsFillView view;
  view.open(*demo.project, kDemoRef, std::string("2019-05-14"));  // PI-2019, issued in the demo
  test::HeadlessUi ui([&] { view.draw(); });
  ui.frame();
  REQUIRE(view.data().data().inspection.status == "issued");
  CHECK(view.read_only());
  CHECK(ui.drawn("rings:read-only"));
  CHECK_FALSE(ui.drawn("rings:add-count"));
  CHECK_FALSE(ui.drawn("rings:add-fill"));
  CHECK_FALSE(ui.drawn("rings:undo"));
  CHECK_FALSE(ui.drawn("rings:count:0"));  // rows are not selectable either
  CHECK_FALSE(ui.drawn("rings:fill:0"));
  CHECK(!view.lines().empty());  // the counts are shown all the same (FIELD.md §10: 2019 face counts)
}
