// The data behind the defects and rings views: one visit read through
// storage, defects added and deleted as undoable edits of the project file.
// Values checked against the invented demo of FIELD.md §10.
#include <doctest/doctest.h>

#include <chrono>
#include <cmath>
#include <filesystem>
#include <optional>

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

TEST_CASE("adding a point defect is one undoable edit; a bad severity or type is refused and changes nothing") {
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
