// `soffit search`, the observations in `soffit show`, and the usage text
// (issue 3 "Command line", "Full-text search"), on the invented demo project
// of FIELD.md §10 written to a real file. Counts come from FIELD.md §10 (as
// the demo test checks them) and from the project file itself via SQL.
#include <doctest/doctest.h>

#include <nlohmann/json.hpp>

#include "storage/demo_assets.hpp"
#include "storage/demo_project.hpp"
#include "storage/project_file.hpp"
#include "tests/cli/run_command.hpp"
#include "tests/storage/temp_project_dir.hpp"

using nlohmann::json;
using soffit::test::run_soffit;
using soffit::test::TempDir;

namespace {

bool contains(const std::string& s, const std::string& part) { return s.find(part) != std::string::npos; }

std::string demo(TempDir& dir) {
  const std::string path = dir.file("sallow-ford.soffit");
  soffit::storage::write_demo_project(path, soffit::storage::find_demo_sheets(), "test");
  return path;
}

}  // namespace

TEST_CASE("soffit show lists ring counts, fill depths and defects with photo counts per inspection") {
  TempDir dir;
  const std::string project = demo(dir);
  auto r = run_soffit("show " + project + " BVDC-ST-0417 --json");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const json show = json::parse(r.out);
  REQUIRE(show["inspections"].size() == 2);
  const json& v2019 = show["inspections"][0];
  const json& v2025 = show["inspections"][1];
  CHECK(v2019["date"] == "2019-05-14");
  // FIELD.md §10.4: D01–D10, 8 of them seen in 2019 and all 10 in 2025; one photograph each.
  CHECK(v2019["defects"].size() == 8);
  CHECK(v2025["defects"].size() == 10);
  int photos = 0;
  for (const auto* visit : {&v2019, &v2025})
    for (const auto& d : (*visit)["defects"]) {
      CHECK(d["photos"].get<int>() >= 1);
      photos += d["photos"].get<int>();
    }
  soffit::storage::Project p = soffit::storage::Project::open(project, "test", soffit::storage::Access::view);
  CHECK(photos == p.db().query_int("SELECT count(*) FROM photo_defect"));
  // 4 rings at both springings and the crown of both faces of both spans, each visit (FIELD.md §10.3).
  CHECK(v2019["ring_counts"].size() + v2025["ring_counts"].size() == 24);
  for (const auto& rc : v2019["ring_counts"]) CHECK(rc["rings"] == 4);
  CHECK(v2019["fill_depths"].size() + v2025["fill_depths"].size() ==
        static_cast<size_t>(p.db().query_int("SELECT count(*) FROM fill_depth")));
  bool trial_pit = false;  // the 0.455 m trial pit of FIELD.md §10.5
  for (const auto* visit : {&v2019, &v2025})
    for (const auto& fd : (*visit)["fill_depths"])
      trial_pit = trial_pit || (fd["method"] == "trial_pit" && std::abs(fd["depth_m"].get<double>() - 0.455) < 1e-9);
  CHECK(trial_pit);
  bool d01 = false;  // D01: 1.2 mm wide, 3.40 m long (FIELD.md §10.4)
  for (const auto* visit : {&v2019, &v2025})
    for (const auto& d : (*visit)["defects"])
      d01 = d01 || (d["ref"] == "D01" && std::abs(d["width_mm"].get<double>() - 1.2) < 1e-9 &&
                    std::abs(d["length_m"].get<double>() - 3.40) < 1e-9);
  CHECK(d01);

  r = run_soffit("show " + project + " BVDC-ST-0417");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  CHECK(contains(r.out, "ring counts: 12"));
  CHECK(contains(r.out, "defects: 8 ("));
  CHECK(contains(r.out, "defects: 10 ("));
  CHECK(contains(r.out, "longitudinal_crack"));
}

TEST_CASE("soffit search finds defects and structures - bad input exits 2") {
  TempDir dir;
  const std::string project = demo(dir);
  auto r = run_soffit("search " + project + " Sallow Ford --json");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const json found = json::parse(r.out);
  REQUIRE_FALSE(found["hits"].empty());
  CHECK(found["hits"][0]["kind"] == "structure");  // the name matches best (column weights, register_search.cpp)
  CHECK(found["hits"][0]["structure"] == "BVDC-ST-0417");

  r = run_soffit("search " + project + " \"ring separation\" --json");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const json rings = json::parse(r.out);
  int defect_hits = 0;
  for (const auto& h : rings["hits"]) defect_hits += h["kind"] == "defect" && contains(h["title"], "D02");
  CHECK(defect_hits == 2);  // D02 ring separation, seen on both visits (FIELD.md §10.4)

  r = run_soffit("search " + project + " quicksand");
  CHECK(r.exit_code == 0);
  CHECK(contains(r.out, "no matches"));

  r = run_soffit("search " + project + " \"*()\"");
  CHECK(r.exit_code == 2);
  r = run_soffit("search " + project);
  CHECK(r.exit_code == 2);
  const std::string text = dir.file("notes.txt");
  soffit::test::write_bytes(text, "not a project\n");
  r = run_soffit("search " + text + " sallow");
  CHECK(r.exit_code == 2);
  CHECK(contains(r.err, "not a Soffit project file"));
}

TEST_CASE("the usage text lists every verb on one line each") {
  const auto r = run_soffit("--help");
  CHECK(r.exit_code == 0);
  for (const char* verb : {"fit", "export-section", "import", "list", "show", "search", "demo"}) {
    CAPTURE(verb);
    CHECK(contains(r.err, std::string("\n  ") + verb + " "));
    CHECK(run_soffit(verb).exit_code == 2);  // each verb without its arguments is bad input
  }
  CHECK(run_soffit("frobnicate").exit_code == 2);
}
