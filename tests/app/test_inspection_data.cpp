// The data behind the defects and rings views: one visit read through
// storage, defects added, edited and deleted as undoable edits of the project
// file, the elevations defects are drawn on, and the plane geometry of drawn
// defects (hand-computed values). Values checked against the invented demo of
// FIELD.md §10.
#include <doctest/doctest.h>

#include <chrono>
#include <cmath>
#include <filesystem>
#include <optional>

#include "app/model/defect_shapes.hpp"
#include "app/model/inspection_data.hpp"
#include "tests/app/demo_project_fixture.hpp"
#include "storage/inspection_observations.hpp"
#include "storage/storage_error.hpp"

using namespace soffit;
namespace fs = std::filesystem;

namespace {

using test::DemoProject;
using test::kDemoRef;

app::DefectOnRecord with_ref(const std::string& ref) {
  app::DefectOnRecord d;
  d.defect.fields.ref = ref;
  return d;
}

}  // namespace

TEST_CASE("next_defect_ref follows the highest Dnn and ignores other labels") {
  CHECK(app::next_defect_ref({}) == "D01");
  CHECK(app::next_defect_ref({with_ref("D01"), with_ref("D10"), with_ref("D04")}) == "D11");
  // M1 is a monitoring stud pair (FIELD.md §10.4), not a defect number.
  CHECK(app::next_defect_ref({with_ref("M1"), with_ref("D02"), with_ref("Dx"), with_ref("")}) == "D03");
}

TEST_CASE("polyline_length of stations on a circle approaches the arc from below") {
  // A semicircle of radius 1 sampled at 5 stations: 4 chords of 2 sin(pi/8) (plane geometry).
  Readings r(5);
  for (int i = 0; i < 5; ++i) {
    const double t = M_PI * (1.0 - i / 4.0);
    r[i].x = std::cos(t);
    r[i].z = std::sin(t);
  }
  CHECK(std::abs(app::polyline_length(r) - 8.0 * std::sin(M_PI / 8.0)) < 1e-12);
  r[2].excluded = true;  // an excluded reading is not part of the outline
  // Without the middle station: the two end chords of 2 sin(pi/8) and one of 2 sin(pi/4) across the gap.
  CHECK(std::abs(app::polyline_length(r) - (4.0 * std::sin(M_PI / 8.0) + 2.0 * std::sin(M_PI / 4.0))) < 1e-12);
}

TEST_CASE("the 2019 visit of the demo: its defects and the S1 barrel frame") {
  DemoProject demo;
  app::InspectionData data;
  data.load(*demo.project, kDemoRef, std::string("2019-05-14"));
  // FIELD.md §10.4: in 2019 D01–D04, D06, D07, D08, D10 (D05 and D09 are new in 2025).
  CHECK(data.defects().size() == 8);
  for (const auto& d : data.defects()) {
    CHECK(d.defect.fields.ref != "D05");
    CHECK_FALSE(d.id.empty());
  }
  const auto barrels = data.barrels();
  REQUIRE(barrels.size() == 2);
  const app::BarrelFrame& s1 = barrels[0];
  CHECK(s1.span_label == "S1");
  CHECK(std::abs(s1.width_m - 5.20) < 1e-9);  // FIELD.md §10: barrel width 5.20 m
  CHECK(s1.y_from_upstream);                  // FIELD.md §10.4: y from the US face
  // FIELD.md §10.4: "the S1 arc is 7.418 m long". Chords between stations 0.4–0.8 m apart
  // on R ≈ 4 m fall short of the arc by well under 1 % (chord = 2R sin(θ/2)).
  CHECK(s1.arc_known);
  CHECK(s1.arc_length_m < 7.418 + 0.005);
  CHECK(s1.arc_length_m > 7.418 * 0.99);
}

TEST_CASE("adding a point defect is one undoable edit - a bad severity or type is refused and changes nothing") {
  DemoProject demo;
  app::InspectionData data;
  data.load(*demo.project, kDemoRef);
  const std::string visit = data.data().inspection.id;
  auto in_db = [&] { return storage::inspection_observations(demo.project->db(), visit).defects.size(); };
  REQUIRE(in_db() == 10);  // FIELD.md §10.4: D01–D10 in 2025
  const app::BarrelFrame s2 = data.barrels()[1];

  CHECK(data.add_point_defect(s2, "efflorescence", 2, 1.0, 2.0) == "D11");
  CHECK(in_db() == 11);
  CHECK(data.undo_label() == "add defect D11");
  CHECK(data.undo());
  CHECK(in_db() == 10);
  CHECK(data.redo());
  CHECK(in_db() == 11);

  CHECK_THROWS_WITH_AS(data.add_point_defect(s2, "spalling", 6, 1.0, 2.0), doctest::Contains("severity 6"),
                       storage::StorageError);
  CHECK_THROWS_AS(data.add_point_defect(s2, "crack", 3, 1.0, 2.0), storage::StorageError);
  CHECK(in_db() == 11);
  CHECK(data.undo_label() == "add defect D11");  // refused edits leave no undo step

  std::string d05;
  for (const auto& d : data.defects())
    if (d.defect.fields.ref == "D05") d05 = d.id;
  REQUIRE_FALSE(d05.empty());
  data.delete_defect(d05, "D05");
  CHECK(in_db() == 10);
  CHECK(data.undo());
  CHECK(in_db() == 11);
}

TEST_CASE("path_length and shoelace_area against hand-worked figures") {
  // A 3-4-5 path: 3 + 4 = 7 (plane geometry); a single point or nothing has no length.
  CHECK(std::abs(app::path_length({{0, 0}, {3, 0}, {3, 4}}) - 7.0) < 1e-12);
  CHECK(std::abs(app::path_length({{1, 1}, {4, 5}}) - 5.0) < 1e-12);
  CHECK(app::path_length({{2, 2}}) == 0.0);
  // Rectangle 4 x 3 = 12 either way round; right triangle with legs 4 and 3: 4 x 3 / 2 = 6.
  CHECK(std::abs(app::shoelace_area({{0, 0}, {4, 0}, {4, 3}, {0, 3}}) - 12.0) < 1e-12);
  CHECK(std::abs(app::shoelace_area({{0, 3}, {4, 3}, {4, 0}, {0, 0}}) - 12.0) < 1e-12);
  CHECK(std::abs(app::shoelace_area({{0, 0}, {4, 0}, {0, 3}}) - 6.0) < 1e-12);
  // An L: the 2 x 2 square less its 1 x 1 corner = 3, away from the origin too.
  const app::PlanePath l = {{10, 5}, {12, 5}, {12, 6}, {11, 6}, {11, 7}, {10, 7}};
  CHECK(std::abs(app::shoelace_area(l) - 3.0) < 1e-12);
  CHECK(app::shoelace_area({{0, 0}, {1, 1}}) == 0.0);
  // The demo's D06 ring (FIELD.md §10.4: s 1.30–4.70, band 0.8 m wide): 3.40 x 0.80 = 2.72 m2.
  CHECK(std::abs(app::shoelace_area({{1.30, 4.15}, {4.70, 4.15}, {4.70, 4.95}, {1.30, 4.95}}) - 2.72) < 1e-12);
}

TEST_CASE("inside_ring and distance_to_path pick what a finger touches") {
  const app::PlanePath l = {{0, 0}, {2, 0}, {2, 1}, {1, 1}, {1, 2}, {0, 2}};
  CHECK(app::inside_ring({0.5, 1.5}, l));
  CHECK_FALSE(app::inside_ring({1.5, 1.5}, l));  // the missing corner of the L
  CHECK_FALSE(app::inside_ring({3, 0.5}, l));
  // Distance from (1, 1) to the segment (0,0)–(2,0) is 1; to its far end beyond it, a straight hypotenuse.
  CHECK(std::abs(app::distance_to_path({1, 1}, {{0, 0}, {2, 0}}, false) - 1.0) < 1e-12);
  CHECK(std::abs(app::distance_to_path({5, 4}, {{0, 0}, {2, 0}}, false) - 5.0) < 1e-12);
  // Closed: the edge back from (0,2) to (0,0) counts; open, it does not.
  CHECK(std::abs(app::distance_to_path({-0.5, 1}, {{0, 0}, {2, 0}, {0, 2}}, true) - 0.5) < 1e-12);
  CHECK(app::distance_to_path({-0.5, 1}, {{0, 0}, {2, 0}, {0, 2}}, false) > 0.5);
}

TEST_CASE("simplify_path keeps corners and drops samples along straight runs") {
  const app::PlanePath straight = {{0, 0}, {1, 0.001}, {2, -0.001}, {3, 0}};
  CHECK(app::simplify_path(straight, 0.01) == app::PlanePath{{0, 0}, {3, 0}});
  const app::PlanePath corner = {{0, 0}, {1, 0}, {2, 0}, {2, 1}, {2, 2}};
  CHECK(app::simplify_path(corner, 0.01) == app::PlanePath{{0, 0}, {2, 0}, {2, 2}});
  // A closed drag round a square, back to its start: the four corners and the return survive.
  const app::PlanePath square = {{0, 0}, {1, 0}, {2, 0}, {2, 1}, {2, 2}, {1, 2}, {0, 2}, {0, 1}, {0, 0}};
  CHECK(app::simplify_path(square, 0.01) == app::PlanePath{{0, 0}, {2, 0}, {2, 2}, {0, 2}, {0, 0}});
}

TEST_CASE("StrokeSampler keeps a sample every step and knows how far the drag reached") {
  app::StrokeSampler s(6.0);
  s.start({0, 0});
  CHECK_FALSE(s.move({3, 0}));  // 3 < 6 from the last sample
  CHECK(s.move({6, 0}));
  CHECK_FALSE(s.move({6, 4}));  // 4 from (6, 0)
  CHECK(std::abs(s.reach() - std::hypot(6.0, 4.0)) < 1e-12);
  s.finish({6, 4});  // the lift is kept: 4 is more than a tenth of a step
  CHECK(s.points() == app::PlanePath{{0, 0}, {6, 0}, {6, 4}});
  s.start({0, 0});
  s.move({1, 1});
  s.finish({1, 1});
  CHECK(s.reach() < 2.0);  // a wobble, for the view to treat as a tap
}

TEST_CASE("add_defect stores a line's length and an area's shoelace - bad geometry or width changes nothing") {
  DemoProject demo;
  app::InspectionData data;
  data.load(*demo.project, kDemoRef);
  const std::string visit = data.data().inspection.id;
  auto in_db = [&] { return storage::inspection_observations(demo.project->db(), visit).defects.size(); };
  const app::BarrelFrame s1 = data.barrels()[0];
  const std::string line = data.add_defect(s1.place(), storage::DefectGeometry::line, {{1.0, 1.0}, {4.0, 5.0}},
                                           {"diagonal_crack", 2, 0.3, "fresh edges"});
  const std::string area = data.add_defect(s1.place(), storage::DefectGeometry::area,
                                           {{0.5, 0.5}, {2.5, 0.5}, {2.5, 2.0}}, {"spalling", 3, {}, ""});
  CHECK(line == "D11");
  CHECK(area == "D12");
  CHECK(data.undo_label() == "add defect D12");
  app::InspectionData again;  // read back from the file, not from `data`
  again.load(*demo.project, kDemoRef);
  for (const auto& d : again.defects()) {
    const auto& f = d.defect.fields;
    if (f.ref == "D11") {
      CHECK(f.geometry == storage::DefectGeometry::line);
      REQUIRE(f.length_m);
      CHECK(std::abs(*f.length_m - 5.0) < 1e-12);  // 3-4-5
      CHECK(std::abs(*f.width_mm - 0.3) < 1e-12);
      CHECK_FALSE(f.area_m2);
      CHECK(f.notes == "fresh edges");
    }
    if (f.ref == "D12") {
      REQUIRE(f.area_m2);
      CHECK(std::abs(*f.area_m2 - 1.5) < 1e-12);  // legs 2.0 and 1.5: 1.5 m2
      CHECK_FALSE(f.length_m);
    }
  }
  CHECK(in_db() == 12);
  CHECK_THROWS_WITH_AS(data.add_defect(s1.place(), storage::DefectGeometry::line, {{1.0, 1.0}}, {"other", 2, {}, ""}),
                       doctest::Contains("'points'"), storage::StorageError);
  CHECK_THROWS_WITH_AS(data.add_defect(s1.place(), storage::DefectGeometry::line, {{1, 1}, {2, 2}},
                                       {"transverse_crack", 2, -1.0, ""}),
                       doctest::Contains("width_mm"), storage::StorageError);
  CHECK(in_db() == 12);
  CHECK(data.undo_label() == "add defect D12");
}

TEST_CASE("update_defect changes type, severity, width and notes as one undoable edit") {
  DemoProject demo;
  app::InspectionData data;
  data.load(*demo.project, kDemoRef);
  std::string d04;
  for (const auto& d : data.defects())
    if (d.defect.fields.ref == "D04") d04 = d.id;
  REQUIRE_FALSE(d04.empty());
  data.update_defect(d04, {"transverse_crack", 3, 0.5, "re-read with the microscope"});
  CHECK(data.undo_label() == "edit defect D04");
  auto d04_now = [&] {
    app::InspectionData fresh;
    fresh.load(*demo.project, kDemoRef);
    for (const auto& d : fresh.defects())
      if (d.id == d04) return d.defect.fields;
    return storage::DefectFields{};
  };
  CHECK(d04_now().severity == 3);
  CHECK(std::abs(*d04_now().width_mm - 0.5) < 1e-12);
  CHECK(d04_now().points.size() == 2);  // the position is not touched
  CHECK(data.undo());
  // FIELD.md §10.4: D04 read 0.4 mm in 2025.
  CHECK(std::abs(*d04_now().width_mm - 0.4) < 1e-12);
  CHECK_THROWS_AS(data.update_defect(d04, {"transverse_crack", 0, 0.5, ""}), storage::StorageError);
}

TEST_CASE("the demo's elevations: spandrels, supports and the defects already on them") {
  DemoProject demo;
  app::InspectionData data;
  data.load(*demo.project, kDemoRef);
  const auto barrels = data.barrels();
  REQUIRE(barrels.size() == 2);
  const auto s1 = data.elevations(barrels[0].span_id);
  std::vector<std::string> names;
  for (const auto& e : s1) names.push_back(e.name);
  // The demo's S1 details list the W abutment and the pier (demo_project.cpp, after FIELD.md §10).
  CHECK(names == std::vector<std::string>{"US spandrel", "DS spandrel", "W abutment", "pier"});
  auto refs_on = [&](const app::ElevationFrame& e) {
    std::vector<std::string> refs;
    for (const auto* d : data.elevation_defects(e)) refs.push_back(d->defect.fields.ref);
    return refs;
  };
  const app::ElevationFrame& ds = s1[1];
  CHECK(refs_on(ds) == std::vector<std::string>{"D03"});  // FIELD.md §10.4: bulge on the S1 DS spandrel
  CHECK(ds.seen_from_downstream);
  CHECK(ds.place().frame == storage::DefectFrame::elevation);
  CHECK(ds.origin.find("DS spandrel") != std::string::npos);
  // Width: the S1 DS section's end stations at x 0 and 6.4 (FIELD.md §10.2).
  CHECK(std::abs(ds.x_max - ds.x_min - 6.4) < 1e-9);
  // No wall height in the details: the stand-in is the rise + 1 m; the S1 DS 2025 crown offset is
  // 1286 mm over springing stations at -300 (FIELD.md §10.2): rise 1.586 m.
  CHECK(ds.height_assumed);
  CHECK(std::abs(ds.z_max - (1.586 + 1.0)) < 1e-9);
  CHECK(refs_on(s1[0]).empty());
  // D08 (pier, upstream nose) is on no span: it goes with the pier. FIELD.md §10: pier 1.20 m thick;
  // its scour hole reaches 0.25 m below the footing top.
  const app::ElevationFrame& pier = s1[3];
  CHECK(refs_on(pier) == std::vector<std::string>{"D08"});
  CHECK(std::abs(pier.x_max - pier.x_min - 1.20) < 1e-9);
  CHECK(std::abs(pier.z_min + 0.25) < 1e-9);
  const auto s2 = data.elevations(barrels[1].span_id);
  std::vector<std::string> s2_names;
  for (const auto& e : s2) s2_names.push_back(e.name);
  // D07 on the S2 US spandrel; D09 on the S2 US parapet, an elevation of its own (FIELD.md §10.4).
  CHECK(s2_names == std::vector<std::string>{"US spandrel", "DS spandrel", "E abutment", "US parapet"});
  CHECK(refs_on(s2[0]) == std::vector<std::string>{"D07"});
  CHECK(refs_on(s2[3]) == std::vector<std::string>{"D09"});
  // S2's DS spandrel has no defects yet: a new one gets a frame named for it.
  CHECK(s2[1].origin == "S2 DS spandrel elevation: x from the S2 W springing, z above the springing");
  CHECK(s2[1].element == "S2 DS spandrel wall");
}

namespace {

// A defect of the given reference through `points`, for the placement checks (which read only these).
app::DefectOnRecord placed(const std::string& ref, app::PlanePath points) {
  app::DefectOnRecord d;
  d.id = "id-" + ref;
  d.defect.fields.ref = ref;
  d.defect.fields.geometry = points.size() == 1 ? storage::DefectGeometry::point : storage::DefectGeometry::line;
  d.defect.fields.points = std::move(points);
  return d;
}

std::vector<app::PlacementNote> notes_on(const app::ElevationFrame& e, const app::DefectOnRecord& d) {
  return app::placement_notes(e, {&d});
}

std::vector<app::PlacementNote> notes_on(const app::BarrelFrame& b, const app::DefectOnRecord& d) {
  return app::placement_notes(b, {&d});
}

bool says(const app::PlacementNote& note, const std::string& part) { return note.text.find(part) != std::string::npos; }

}  // namespace

TEST_CASE("placement_notes on the S1 DS spandrel: the demo's D03 lies in the arch opening - marks on the wall get none") {
  DemoProject demo;
  app::InspectionData data;
  data.load(*demo.project, kDemoRef);
  const auto barrels = data.barrels();
  REQUIRE(barrels.size() == 2);
  const auto s1 = data.elevations(barrels[0].span_id);
  REQUIRE(s1.size() == 4);
  const app::ElevationFrame& ds = s1[1];
  REQUIRE(ds.kind == app::ElevationKind::ds_spandrel);
  // FIELD.md §10.4: D03 is at x 3.2, 1.0 m above the springing. FIELD.md §10.2, S1 DS 2025: the crown
  // station at x 3.2 reads 1286 mm over springing stations at −300, so the intrados there is 1.586 m
  // above the springing: D03 as recorded is inside the arch opening, not on the wall.
  const auto notes = app::placement_notes(ds, data.elevation_defects(ds));
  REQUIRE(notes.size() == 1);
  CHECK(notes[0].ref == "D03");
  CHECK_FALSE(notes[0].defect_id.empty());
  CHECK(notes[0].text ==
        "D03: 1.0 m above the springing at x 3.2 is below the intrados (1.59 m), in the arch opening: "
        "check its position or frame");
  // The note changes nothing: D03 is still on the DS spandrel where it was recorded.
  CHECK(data.elevation_defects(ds).size() == 1);

  // Well placed: x 1.0, z 2.2 is on the wall above the haunch (FIELD.md §10.2, S1 DS 2025: the intrados is
  // 0.796 m up at x 0.8 and 1.262 m at x 1.6).
  CHECK(notes_on(ds, placed("D90", {{1.0, 2.2}})).empty());
  // Just above the crown intrados (1.586 m at x 3.2), and 26 mm under it (within the 50 mm a finger or a
  // tape places a mark to, common practice): no note. 86 mm under it: a note.
  CHECK(notes_on(ds, placed("D91", {{3.2, 1.70}})).empty());
  CHECK(notes_on(ds, placed("D92", {{3.2, 1.56}})).empty());
  CHECK(notes_on(ds, placed("D93", {{3.2, 1.50}})).size() == 1);
  // A line along the wall whose second point dips into the opening is named by that point.
  const auto line = notes_on(ds, placed("D94", {{1.0, 2.2}, {2.4, 1.0}, {4.0, 2.2}}));
  REQUIRE(line.size() == 1);
  CHECK(says(line[0], "D94, point 2 of 3: 1.0 m above the springing at x 2.4 is below the intrados"));
  // Beyond the span: the section's end stations are at x 0 and 6.4 (FIELD.md §10.2).
  const auto beyond = notes_on(ds, placed("D95", {{6.9, 2.0}}));
  REQUIRE(beyond.size() == 1);
  CHECK(says(beyond[0], "x 6.9 is outside the span (0 to 6.4 m surveyed)"));
  CHECK(notes_on(ds, placed("D96", {{-0.3, 2.0}})).size() == 1);
  // Below the springing line a spandrel wall is not there: the abutment or pier is.
  const auto under = notes_on(ds, placed("D97", {{0.2, -0.3}}));
  REQUIRE(under.size() == 1);
  CHECK(says(under[0], "0.3 m below the springing at x 0.2 is under the springing line"));
  // The wall height is not recorded for the demo, so nothing is too high; once it is, above it is.
  CHECK_FALSE(ds.recorded_height_m);
  CHECK(notes_on(ds, placed("D98", {{1.0, 2.5}})).empty());
  app::ElevationFrame with_height = ds;
  with_height.recorded_height_m = 2.0;
  const auto high = notes_on(with_height, placed("D98", {{1.0, 2.5}}));
  REQUIRE(high.size() == 1);
  CHECK(says(high[0], "2.5 m above the springing at x 1.0 is above the recorded wall height (2.0 m)"));
  CHECK(notes_on(with_height, placed("D99", {{1.0, 1.9}})).empty());
}

TEST_CASE("placement_notes: D07 lies on the S2 wall above the opening - supports and other elevations are not checked") {
  DemoProject demo;
  app::InspectionData data;
  data.load(*demo.project, kDemoRef);
  const auto barrels = data.barrels();
  REQUIRE(barrels.size() == 2);
  const auto s2 = data.elevations(barrels[1].span_id);
  REQUIRE(s2.size() == 4);
  // The demo's D07 outline (demo_project.cpp) spans x 0.5-3.0 at z 1.6-2.2; FIELD.md §10.2, S2 mid-width
  // 2025: the intrados is 1.153 m up at the crown (offset 1153 mm), so the outline is on the wall.
  REQUIRE(data.elevation_defects(s2[0]).size() == 1);
  CHECK(app::placement_notes(s2[0], data.elevation_defects(s2[0])).empty());
  // The same outline moved down to z 0.3 at x 1.5 dips into the opening (intrados 1.149 m at x 1.525).
  app::DefectOnRecord low = *data.elevation_defects(s2[0])[0];
  for (auto& p : low.defect.fields.points) p.second -= 1.3;
  const auto d07 = app::placement_notes(s2[0], {&low});
  REQUIRE(d07.size() == 1);
  CHECK(d07[0].ref == "D07");
  CHECK(says(d07[0], "D07, point 1 of 4: 0.3 m above the springing at x 0.5 is below the intrados"));
  // D09 is on the US parapet, which has no surveyed outline to check against.
  CHECK(app::placement_notes(s2[3], data.elevation_defects(s2[3])).empty());
  // D08's scour hole reaches 0.25 m below the pier's footing top (FIELD.md §10.4): a real place, not a slip.
  const auto s1 = data.elevations(barrels[0].span_id);
  REQUIRE(s1.size() == 4);
  REQUIRE(data.elevation_defects(s1[3]).size() == 1);
  CHECK(app::placement_notes(s1[3], data.elevation_defects(s1[3])).empty());
}

TEST_CASE("placement_notes on the barrel: s outside the arc or y outside the width gets a note") {
  DemoProject demo;
  app::InspectionData data;
  data.load(*demo.project, kDemoRef);
  const auto barrels = data.barrels();
  REQUIRE(barrels.size() == 2);
  // Every soffit defect of FIELD.md §10.4 lies within its span's arc (S1 7.418 m, S2 6.981 m) and the
  // 5.20 m barrel width; D02 runs along the DS face at y 5.20, on the edge.
  CHECK(app::placement_notes(barrels[0], data.soffit_defects(barrels[0].span_id)).empty());
  CHECK(app::placement_notes(barrels[1], data.soffit_defects(barrels[1].span_id)).empty());
  const app::BarrelFrame& s1 = barrels[0];
  REQUIRE(s1.arc_known);
  REQUIRE(s1.width_known);
  // Past the E springing: 7.9 m along an arc of 7.418 m (FIELD.md §10.4).
  const auto past = notes_on(s1, placed("D90", {{7.9, 2.0}}));
  REQUIRE(past.size() == 1);
  CHECK(says(past[0], "D90: s 7.9 (y 2.0) is outside the arc (0 to 7.4"));
  CHECK(says(past[0], "check its position or frame"));
  CHECK(notes_on(s1, placed("D91", {{-0.2, 2.0}})).size() == 1);
  // A taped s at the far springing (7.418 m) is longer than the chords between stations: no note.
  CHECK(notes_on(s1, placed("D92", {{7.418, 2.0}})).empty());
  // Across the width: 5.5 m on a 5.20 m barrel (FIELD.md §10); 20 mm over is within placing accuracy.
  const auto wide = notes_on(s1, placed("D93", {{3.0, 5.5}}));
  REQUIRE(wide.size() == 1);
  CHECK(says(wide[0], "y 5.5 (s 3.0) is outside the barrel width (0 to 5.2 m)"));
  CHECK(notes_on(s1, placed("D94", {{3.0, 5.22}})).empty());
  CHECK(notes_on(s1, placed("D95", {{3.0, -0.3}})).size() == 1);
  // Unknown width or arc: nothing to check against in that direction.
  app::BarrelFrame unknown = s1;
  unknown.width_known = unknown.arc_known = false;
  CHECK(notes_on(unknown, placed("D96", {{7.9, 5.5}})).empty());
}
