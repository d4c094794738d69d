// Drives the defects and rings views through ImGui's input on the demo
// project (FIELD.md §10, invented): place a defect by tapping the barrel,
// choosing its type and severity and confirming; undo it; delete one after
// confirming; draw a crack line and an area outline by dragging; edit a
// defect; place one on a spandrel elevation; ask for photos; see a placement
// note. Counts and stored fields are read
// back by separate storage queries, or from the reopened project file, not
// from the view.
#include <doctest/doctest.h>

#include <chrono>
#include <cmath>
#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "app/gui/defects_view.hpp"
#include "app/gui/rings_fill_view.hpp"
#include "app/model/defect_shapes.hpp"
#include "headless_ui.hpp"
#include "pointer_drag.hpp"
#include "tests/app/demo_project_fixture.hpp"
#include "app/gui/ui_probe.hpp"
#include "storage/inspection_observations.hpp"
#include "storage/sqlite_statement.hpp"

using namespace soffit;
namespace fs = std::filesystem;

namespace {

using test::DemoProject;
using test::kDemoRef;

float distance(ImVec2 a, ImVec2 b) { return std::hypot(a.x - b.x, a.y - b.y); }

// Pixels per metre of the surface on show, measured through the view's own mapping.
float pixels_per_metre(const gui::DefectsView& view) {
  const auto a = view.screen_point(0.0, 0.0), b = view.screen_point(1.0, 0.0);
  REQUIRE(a);
  return distance(*a, *b);
}

// The stored defect `ref` of the latest visit, read from the project file reopened from disk.
std::optional<storage::DefectFields> reopened_defect(DemoProject& demo, const std::string& ref) {
  const std::string path = demo.project->path();
  demo.project.reset();
  demo.project.emplace(storage::Project::open(path, "test"));
  app::InspectionData data;
  data.load(*demo.project, kDemoRef);
  for (const auto& d : data.defects())
    if (d.defect.fields.ref == ref) return d.defect.fields;
  return std::nullopt;
}

// Types a number on the width keypad (a width not yet measured starts empty).
void enter_width(test::HeadlessUi& ui, const std::string& digits) {
  REQUIRE(ui.tap("width"));
  for (char k : digits) REQUIRE(ui.tap(std::string("key:") + k));
  REQUIRE(ui.tap("key:ok"));
}

// The defects view open on the demo's latest visit (PI-2025, FIELD.md §10.1), drawn headless once.
struct DefectsOnDemo {
  DemoProject demo;
  gui::DefectsView view;
  test::HeadlessUi ui{[this] { view.draw(); }};
  std::string visit;  // the id of the visit on show

  DefectsOnDemo() {
    view.open(*demo.project, kDemoRef);
    ui.forget_controls();  // "drawn" speaks of this view only
    ui.frame();
    visit = view.data().data().inspection.id;
  }

  // Shows S2 and taps D05, the new missing brick there at s 0.55, y 3.40 (FIELD.md §10.4).
  void tap_d05() {
    REQUIRE(ui.tap("span:S2"));
    ui.tap_at(*view.screen_point(0.55, 3.40));
  }

  // Chooses the type and severity of the mark just made and confirms it; false if a tap found no control.
  bool place(const std::string& type, int severity) {
    return ui.tap("type:" + type) && ui.tap("severity:" + std::to_string(severity)) && ui.tap("confirm defect");
  }

  // The defect `ref` as the view holds it, or null.
  const app::DefectOnRecord* shown(const std::string& ref) const {
    for (const auto& d : view.data().defects())
      if (d.defect.fields.ref == ref) return &d;
    return nullptr;
  }
};

}  // namespace

TEST_CASE_FIXTURE(DefectsOnDemo, "the defects view shows the 2025 visit's defects on the unrolled barrel") {
  REQUIRE(view.data().loaded());
  CHECK(view.data().data().inspection.date == "2025-05-21");  // PI-2025, FIELD.md §10.1
  // FIELD.md §10.4: D01–D10 all exist in 2025 (D05 and D09 new).
  CHECK(view.data().defects().size() == 10);
  const auto barrels = view.data().barrels();
  REQUIRE(barrels.size() == 2);
  CHECK(barrels[0].span_label == "S1");
  CHECK(std::abs(barrels[0].width_m - 5.20) < 1e-9);  // FIELD.md §10: barrel width 5.20 m
  // On S1's soffit: D01, D02 (lines), D06, D10 (areas); D03 is on the DS spandrel elevation.
  std::vector<std::string> refs;
  for (const auto* d : view.data().soffit_defects(barrels[0].span_id)) refs.push_back(d->defect.fields.ref);
  CHECK(refs == std::vector<std::string>{"D01", "D02", "D06", "D10"});
  // D01 runs s 1.30–4.70 at y 4.55 (FIELD.md §10.4): drawn left to right inside the window, to one scale.
  const auto a = view.screen_point(1.30, 4.55), b = view.screen_point(4.70, 4.55), c = view.screen_point(1.30, 0.0);
  REQUIRE(a);
  CHECK(a->x > 0);
  CHECK(b->x < 1280);
  CHECK(b->x > a->x);
  CHECK(std::abs((b->x - a->x) / 3.40f - (a->y - c->y) / 4.55f) < 0.01f);  // px per metre along = across
  CHECK(ui.drawn("barrel"));
  CHECK(ui.drawn("undo"));
}

TEST_CASE_FIXTURE(DefectsOnDemo,
                  "tap the barrel, choose type and severity, confirm: one more defect - Undo removes it - "
                  "Redo restores it") {
  const size_t before = demo.defects_in_db(visit);
  REQUIRE(before == 10);

  // s 2.50, y 1.50 on S1 is clear of every 2025 mark (FIELD.md §10.4: D01/D06 near y 4.55, D10 at s 5–6).
  const auto at = view.screen_point(2.50, 1.50);
  REQUIRE(at);
  ui.tap_at(*at);
  REQUIRE(place("spalling", 3));
  CHECK(view.message().empty());
  CHECK(demo.defects_in_db(visit) == before + 1);
  const app::DefectOnRecord* added = shown("D11");
  REQUIRE(added);
  CHECK(added->defect.fields.defect_type == "spalling");
  CHECK(added->defect.fields.severity == 3);
  CHECK(added->defect.fields.frame_origin == "S1 W springing; US face");  // the frame D01 uses
  REQUIRE(added->defect.fields.points.size() == 1);
  // The tap lands within a pixel: 1 px is under 1 cm at this scale.
  CHECK(std::abs(added->defect.fields.points[0].first - 2.50) < 0.01);
  CHECK(std::abs(added->defect.fields.points[0].second - 1.50) < 0.01);

  REQUIRE(ui.tap("undo"));
  CHECK(demo.defects_in_db(visit) == before);
  CHECK(view.data().defects().size() == before);
  REQUIRE(ui.tap("redo"));
  CHECK(demo.defects_in_db(visit) == before + 1);
}

TEST_CASE_FIXTURE(DefectsOnDemo, "no defect is placed without a type and a severity, nor when cancelled") {
  ui.tap_at(*view.screen_point(2.50, 1.50));
  REQUIRE(ui.tap("type:seepage"));
  REQUIRE(ui.tap("confirm defect"));  // disabled: no severity yet
  CHECK(demo.defects_in_db(visit) == 10);
  REQUIRE(ui.tap("cancel defect"));
  CHECK(demo.defects_in_db(visit) == 10);
}

TEST_CASE_FIXTURE(DefectsOnDemo,
                  "tapping a mark selects it - Delete asks first, then removes it - Undo brings it back") {
  tap_d05();
  REQUIRE(ui.tap("delete"));
  REQUIRE(ui.tap("keep defect"));  // the confirmation is a real choice
  CHECK(demo.defects_in_db(visit) == 10);
  REQUIRE(ui.tap("delete"));
  REQUIRE(ui.tap("confirm delete"));
  CHECK(demo.defects_in_db(visit) == 9);
  for (const auto& d : view.data().defects()) CHECK(d.defect.fields.ref != "D05");
  REQUIRE(ui.tap("undo"));
  CHECK(demo.defects_in_db(visit) == 10);
}

TEST_CASE_FIXTURE(DefectsOnDemo,
                  "drag a crack line on the barrel: type, width and severity saved with its length - it survives "
                  "reopening - Undo removes it") {
  REQUIRE(ui.tap("mode:line"));
  // S1 barrel, s 1.0–3.0 and y 0.8–2.5: clear of every 2025 mark (FIELD.md §10.4: D01, D02, D06 at
  // y 4.15 and beyond, D10 at s 5–6). A bend in the middle, so the line keeps three points.
  const ImVec2 a = *view.screen_point(1.0, 0.8), bend = *view.screen_point(2.0, 1.2), b = *view.screen_point(3.0, 2.5);
  const double drawn_m = (distance(a, bend) + distance(bend, b)) / pixels_per_metre(view);
  test::drag_through(ui, {a, bend, b});
  REQUIRE(ui.tap("type:diagonal_crack"));
  REQUIRE(ui.tap("severity:2"));
  enter_width(ui, "0.8");
  REQUIRE(ui.tap("confirm defect"));
  CHECK(view.message().empty());
  CHECK(demo.defects_in_db(visit) == 11);
  view.close();

  const auto saved = reopened_defect(demo, "D11");
  REQUIRE(saved);
  CHECK(saved->defect_type == "diagonal_crack");
  CHECK(saved->geometry == storage::DefectGeometry::line);
  CHECK(saved->frame == storage::DefectFrame::soffit);
  CHECK(saved->frame_origin == "S1 W springing; US face");  // the frame D01 uses (FIELD.md §10.4)
  REQUIRE(saved->points.size() >= 2);
  CHECK(saved->severity == 2);
  REQUIRE(saved->width_mm);
  CHECK(std::abs(*saved->width_mm - 0.8) < 1e-9);
  REQUIRE(saved->length_m);
  // The stored length is the drawn distance converted through the view's own scale, within 1 cm.
  CHECK(std::abs(*saved->length_m - drawn_m) < 0.01);
  // And it is the length of the stored polyline (plane geometry).
  CHECK(std::abs(*saved->length_m - app::path_length(saved->points)) < 1e-9);
  // Ends where the finger went down and lifted: 1 px is under 1 cm at this scale.
  CHECK(std::abs(saved->points.front().first - 1.0) < 0.01);
  CHECK(std::abs(saved->points.front().second - 0.8) < 0.01);
  CHECK(std::abs(saved->points.back().first - 3.0) < 0.01);
  CHECK(std::abs(saved->points.back().second - 2.5) < 0.01);

  // Undo is kept in the project file: after reopening, Undo in the view still removes the line.
  view.open(*demo.project, kDemoRef);
  ui.frame();
  REQUIRE(ui.tap("undo"));
  CHECK(demo.defects_in_db(visit) == 10);
}

TEST_CASE_FIXTURE(DefectsOnDemo, "a tiny drag in crack-line mode is a tap: it draws nothing and says how to draw") {
  REQUIRE(ui.tap("mode:line"));
  const ImVec2 a = *view.screen_point(2.0, 1.0);
  test::drag_through(ui, {a, ImVec2(a.x + 3, a.y + 2)}, 1.0f);  // 3.6 px: a finger's wobble
  CHECK_FALSE(ui.tap("confirm defect"));  // no dialog was ever drawn
  CHECK(demo.defects_in_db(visit) == 10);
}

TEST_CASE_FIXTURE(DefectsOnDemo,
                  "outline an area by dragging round it: area_m2 is the shoelace of the stored ring and the drawn "
                  "rectangle's area") {
  REQUIRE(ui.tap("mode:area"));
  // A 2.0 m x 1.2 m rectangle on the S1 barrel (s 1.0–3.0, y 0.8–2.0), clear of the 2025 marks.
  const std::vector<ImVec2> corners = {*view.screen_point(1.0, 0.8), *view.screen_point(3.0, 0.8),
                                       *view.screen_point(3.0, 2.0), *view.screen_point(1.0, 2.0),
                                       *view.screen_point(1.0, 0.8)};
  const float px = pixels_per_metre(view);
  test::drag_through(ui, corners);
  REQUIRE(place("spalling", 3));
  CHECK(demo.defects_in_db(visit) == 11);
  view.close();
  const auto saved = reopened_defect(demo, "D11");
  REQUIRE(saved);
  CHECK(saved->geometry == storage::DefectGeometry::area);
  REQUIRE(saved->points.size() >= 3);
  REQUIRE(saved->area_m2);
  // Shoelace of the stored points, worked here independently of the model.
  double twice = 0;
  for (size_t i = 0; i < saved->points.size(); ++i) {
    const auto& [x0, y0] = saved->points[i];
    const auto& [x1, y1] = saved->points[(i + 1) % saved->points.size()];
    twice += x0 * y1 - x1 * y0;
  }
  CHECK(std::abs(*saved->area_m2 - std::abs(twice) / 2) < 1e-9);
  // The drawn rectangle: 2.0 x 1.2 = 2.40 m2, to within a pixel's width all round its 6.4 m perimeter.
  CHECK(std::abs(*saved->area_m2 - 2.40) < 6.4 / px);
  CHECK_FALSE(saved->width_mm);  // spalling has no width
}

TEST_CASE_FIXTURE(DefectsOnDemo, "an area by tapping its corners and Close area") {
  REQUIRE(ui.tap("mode:area"));
  // A right triangle with legs 2.0 m (along s) and 1.5 m (across): 1.5 m2 (plane geometry).
  ui.tap_at(*view.screen_point(1.0, 0.5));
  ui.tap_at(*view.screen_point(3.0, 0.5));
  CHECK_FALSE(ui.tap("confirm defect"));
  ui.tap_at(*view.screen_point(1.0, 2.0));
  REQUIRE(ui.tap("close area"));
  REQUIRE(place("efflorescence", 1));
  CHECK(demo.defects_in_db(visit) == 11);
  const app::DefectOnRecord* added = shown("D11");
  REQUIRE(added);
  CHECK(added->defect.fields.points.size() == 3);
  REQUIRE(added->defect.fields.area_m2);
  CHECK(std::abs(*added->defect.fields.area_m2 - 1.5) < 0.02);  // a pixel is under 1 cm here
}

TEST_CASE_FIXTURE(DefectsOnDemo, "edit a selected defect's severity: one undoable edit") {
  tap_d05();
  REQUIRE_FALSE(view.selected_defect().empty());
  REQUIRE(ui.tap("edit"));
  REQUIRE(ui.tap("severity:5"));
  REQUIRE(ui.tap("save edit"));
  CHECK(view.message().empty());
  auto severity_of_d05 = [&] {
    for (const auto& row : storage::inspection_observations(demo.project->db(), visit).defects)
      if (row.ref == "D05") return row.severity.value_or(0);
    return 0LL;
  };
  CHECK(severity_of_d05() == 5);
  CHECK(demo.defects_in_db(visit) == 10);
  CHECK(view.data().data().defects.size() == 10);
  REQUIRE(ui.tap("undo"));
  CHECK(severity_of_d05() == 3);  // the demo's grade for D05 (demo_project.cpp, invented)
}

TEST_CASE_FIXTURE(DefectsOnDemo, "the DS spandrel elevation shows D03 and takes a new defect in its frame") {
  REQUIRE(ui.tap("surface:DS spandrel"));
  CHECK(view.surface() == "DS spandrel");
  // D03 is on the S1 DS spandrel at x 3.2, z 1.0 (FIELD.md §10.4): tapping it selects it.
  ui.tap_at(*view.screen_point(3.2, 1.0));
  std::string d03_origin;
  for (const auto& d : view.data().defects())
    if (d.id == view.selected_defect()) {
      CHECK(d.defect.fields.ref == "D03");
      d03_origin = d.defect.fields.frame_origin;
    }
  REQUIRE_FALSE(d03_origin.empty());
  // Seen from downstream, x = 0 (the W end) is on the right.
  CHECK(view.screen_point(0.0, 1.0)->x > view.screen_point(6.0, 1.0)->x);
  // z up: higher on the wall is higher on the screen.
  CHECK(view.screen_point(1.0, 2.0)->y < view.screen_point(1.0, 0.5)->y);
  REQUIRE(ui.tap("deselect"));
  // x 1.0, z 2.2: on the wall above the haunch (S1 DS readings, FIELD.md §10.2: the intrados is 0.8 m
  // above the springing at x 0.8, and 1.3 m at x 1.6).
  ui.tap_at(*view.screen_point(1.0, 2.2));
  REQUIRE(place("spandrel_lean", 2));
  CHECK(demo.defects_in_db(visit) == 11);
  view.close();
  const auto saved = reopened_defect(demo, "D11");
  REQUIRE(saved);
  CHECK(saved->frame == storage::DefectFrame::elevation);
  CHECK(saved->frame_origin == d03_origin);  // keeps to the frame the visit already uses there
  CHECK(saved->element == "S1 DS spandrel wall");
  REQUIRE(saved->points.size() == 1);
  CHECK(std::abs(saved->points[0].first - 1.0) < 0.01);
  CHECK(std::abs(saved->points[0].second - 2.2) < 0.01);
}

TEST_CASE("the rings view derives S1's ring thickness from the face counts of FIELD.md §10") {
  DemoProject demo;
  gui::RingsFillView view;
  view.open(*demo.project, kDemoRef);
  test::HeadlessUi ui([&] { view.draw(); });
  ui.frame();
  std::vector<const gui::RingCountLine*> s1;
  for (const auto& l : view.lines())
    if (l.span_label == "S1") s1.push_back(&l);
  REQUIRE(s1.size() == 6);  // US and DS faces at W springing, crown, E springing
  for (const auto* l : s1) {
    CHECK(l->count.rings == 4);  // FIELD.md §10: "4 at every face"
    // 4 x (110 mm brick header + 10 mm lime joint): FIELD.md §10 bricks 230 x 110 x 68, joints 8–12 mm.
    REQUIRE(l->estimate.from_counts);
    CHECK(std::abs(l->estimate.from_counts->value_mm - 480.0) < 1e-9);
    // ±1 ring for an unverified face count (FIELD.md §4, common practice).
    CHECK(std::abs(*l->estimate.from_counts->lower_mm - 360.0) < 1e-9);
    CHECK(std::abs(*l->estimate.from_counts->upper_mm - 600.0) < 1e-9);
  }
  const gui::FaceThickness* us = nullptr;
  const gui::FaceThickness* ds = nullptr;
  for (const auto& f : view.faces())
    if (f.span_label == "S1") (f.face == "US" ? us : ds) = &f;
  REQUIRE(us);
  REQUIRE(ds);
  // FIELD.md §10 taped face depths: S1 US 470/462/468, DS 466/458/465 mm.
  CHECK(std::abs(*us->measured_min_mm - 462.0) < 1e-9);
  CHECK(std::abs(*us->measured_max_mm - 470.0) < 1e-9);
  CHECK(std::abs(*ds->measured_min_mm - 458.0) < 1e-9);
  CHECK(std::abs(*ds->measured_max_mm - 466.0) < 1e-9);
  CHECK(us->rings_min == 4);
  CHECK(us->rings_max == 4);
  CHECK(!view.data().data().fill_depths.empty());  // FIELD.md §10: the 2019 trial pit and the 2025 depths
}

namespace {

struct PhotosAsked {
  std::string inspection_id;
  std::optional<std::string> defect_id;
};

// D05's own row, by a query of its own: D05 is new in 2025 (FIELD.md §10.4), so its reference is unique.
struct StoredDefect {
  std::string id, inspection_id;
  long long photos = 0;
};
StoredDefect stored_defect(DemoProject& demo, const std::string& ref) {
  storage::Statement q(demo.project->db(),
                       "SELECT id, inspection_id, (SELECT count(*) FROM photo_defect l WHERE l.defect_id = d.id) "
                       "FROM defect d WHERE ref = ?1");
  q.bind(1, ref);
  StoredDefect out;
  REQUIRE(q.step());
  out.id = q.column_text(0);
  out.inspection_id = q.column_text(1);
  out.photos = q.column_int64(2);
  CHECK_FALSE(q.step());  // one row only
  return out;
}

}  // namespace

TEST_CASE_FIXTURE(DefectsOnDemo,
                  "Photos of a selected defect and of the visit ask the owner with the visit and defect ids") {
  std::vector<PhotosAsked> asked;
  view.set_photos_request([&](const std::string& inspection, const std::optional<std::string>& defect) {
    asked.push_back({inspection, defect});
  });
  ui.frame();  // drawn again, with the callback
  CHECK(ui.drawn("photos:visit"));
  CHECK_FALSE(ui.drawn("photos:defect"));  // nothing selected yet
  const StoredDefect d05 = stored_defect(demo, "D05");
  // demo_project.cpp links one drawn picture to every defect it writes; the view counts the same links.
  CHECK(d05.photos == 1);
  tap_d05();
  REQUIRE(view.selected_defect() == d05.id);
  for (const auto& d : view.data().defects())
    if (d.id == d05.id) CHECK(d.defect.photo_count == d05.photos);
  REQUIRE(ui.tap("photos:defect"));
  REQUIRE(asked.size() == 1);  // once per tap, not once per frame
  CHECK(asked[0].inspection_id == d05.inspection_id);
  REQUIRE(asked[0].defect_id);
  CHECK(*asked[0].defect_id == d05.id);
  REQUIRE(ui.tap("photos:visit"));
  REQUIRE(asked.size() == 2);
  CHECK(asked[1].inspection_id == d05.inspection_id);
  CHECK_FALSE(asked[1].defect_id);
  // The buttons change nothing in the project: still the ten defects of 2025.
  CHECK(demo.defects_in_db(d05.inspection_id) == 10);
}

TEST_CASE_FIXTURE(DefectsOnDemo, "without a photos callback the Photos buttons are not drawn") {
  tap_d05();
  REQUIRE_FALSE(view.selected_defect().empty());
  CHECK(ui.drawn("edit"));  // the selection row is there
  CHECK_FALSE(ui.drawn("photos:defect"));
  CHECK_FALSE(ui.drawn("photos:visit"));
}

TEST_CASE_FIXTURE(DefectsOnDemo,
                  "the S1 DS spandrel shows a placement note for D03 under the drawing and leaves D03 where it is") {
  CHECK_FALSE(ui.drawn("placement notes"));  // the S1 barrel's defects all lie on it (FIELD.md §10.4)
  REQUIRE(ui.tap("surface:DS spandrel"));
  ui.frame();
  // FIELD.md §10.4 / §10.2: D03 at x 3.2, 1.0 m up, is under the S1 DS crown intrados (1.586 m).
  CHECK(ui.drawn("placement notes"));
  const ImVec2 note = gui::UiProbe::instance().centres.at("placement notes");
  CHECK(note.y > view.screen_point(3.2, 0.0)->y);  // under the drawing
  // Still drawn where recorded, and still selectable there.
  ui.tap_at(*view.screen_point(3.2, 1.0));
  REQUIRE_FALSE(view.selected_defect().empty());
  for (const auto& d : view.data().defects())
    if (d.id == view.selected_defect()) CHECK(d.defect.fields.ref == "D03");
}
