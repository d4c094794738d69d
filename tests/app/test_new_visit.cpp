// A new visit started on site (issue 4: the field app covers the whole site
// visit; FIELD.md §1.3: who, when, kind, weather are part of every record).
#include <doctest/doctest.h>

#include "app/model/new_visit.hpp"
#include "geometry/core/input_error.hpp"
#include "storage/register_queries.hpp"
#include "tests/app/demo_project_fixture.hpp"

using namespace soffit;

TEST_CASE("a new visit is a draft with its details, one undoable edit") {
  test::DemoProject demo;
  storage::Project& p = *demo.project;
  app::NewVisit v;
  v.date = "2026-12-02";
  v.details.kind = "special";
  v.details.inspector = "A. Inspector";
  v.details.weather = "dry, overcast";
  v.details.air_temperature_c = 6.5;
  const std::string id = app::add_visit(p, test::kDemoRef, v);
  const auto detail = storage::structure_detail(p.db(), test::kDemoRef);
  REQUIRE(detail->inspections.size() == 3);  // FIELD.md §10: the demo has 2019 and 2025
  const auto& latest = detail->inspections.back();
  CHECK(latest.id == id);
  CHECK(latest.date == "2026-12-02");
  CHECK(latest.status == "draft");
  CHECK(latest.kind == "special");
  CHECK(latest.inspector == "A. Inspector");
  REQUIRE(p.undo());
  CHECK(storage::structure_detail(p.db(), test::kDemoRef)->inspections.size() == 2);
}

TEST_CASE("a new visit is refused on a date that is not a date or already has a visit") {
  test::DemoProject demo;
  app::NewVisit v;
  for (const char* bad : {"2026-02-30", "02/12/2026", "2026-13-01", ""}) {
    v.date = bad;
    CAPTURE(bad);
    try {
      app::add_visit(*demo.project, test::kDemoRef, v);
      FAIL("accepted");
    } catch (const InputError& e) {
      CHECK(e.field() == "date");
    }
  }
  v.date = "2025-05-21";  // the demo's draft visit (FIELD.md §10)
  CHECK_THROWS_AS(app::add_visit(*demo.project, test::kDemoRef, v), InputError);
  CHECK(storage::structure_detail(demo.project->db(), test::kDemoRef)->inspections.size() == 2);
  CHECK(app::today_iso().size() == 10);
}
