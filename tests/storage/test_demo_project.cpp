// The demo project (issue 3 "Demo project"): the invented scenario of
// FIELD.md §10 opens cleanly and holds what §10 lists; every picture is in
// the media folder under its SHA-256 name and decodes.
#include <doctest/doctest.h>
#include <stb_image.h>

#include <filesystem>

#include "storage/demo_assets.hpp"
#include "storage/demo_project.hpp"
#include "storage/photo_store.hpp"
#include "storage/project_file.hpp"
#include "storage/register_search.hpp"
#include "storage/sha256.hpp"
#include "storage/sqlite_statement.hpp"
#include "tests/cli/run_command.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

namespace {
long long count(Project& p, const std::string& sql) { return p.db().query_int(sql); }
}  // namespace

TEST_CASE("the demo project holds the Sallow Ford scenario of FIELD.md §10 and opens cleanly") {
  TempDir dir;
  const std::string path = dir.file("sallow-ford.soffit");
  const std::string sheets = find_demo_sheets();
  REQUIRE_FALSE(sheets.empty());
  const DemoSummary s = write_demo_project(path, sheets, "test");
  CHECK(s.defects == 18);

  Project p = Project::open(path, "J. Okafor", Access::view);
  CHECK_FALSE(p.report().unclean_close);
  CHECK(p.db().query_text("PRAGMA integrity_check") == "ok");
  CHECK(p.db().query_text("PRAGMA foreign_key_check") == "");
  // A new inspector's first Undo must not take the demo apart: its making is not in the journal.
  CHECK(count(p, "SELECT count(*) FROM edit_journal") == 0);
  CHECK(p.undo_label().empty());
  CHECK(p.db().query_text("SELECT ref || '|' || name || '|' || location_fictitious FROM structure") ==
        "BVDC-ST-0417|Sallow Ford Bridge|1");
  CHECK(count(p, "SELECT count(*) FROM span") == 2);
  CHECK(count(p, "SELECT count(*) FROM span WHERE barrel_width_m = 5.20 AND ring_material = 'brick'") == 2);
  // Two visits six years apart; the 2019 one issued, the 2025 one a draft (FIELD.md §10.1).
  CHECK(p.db().query_text("SELECT group_concat(inspection_date || ' ' || status, ', ') FROM "
                          "(SELECT * FROM inspection ORDER BY inspection_date)") ==
        "2019-05-14 issued, 2025-05-21 draft");
  // Both faces and mid-width of S1, mid-width of S2, each visit; 11 stations each (FIELD.md §10.2).
  CHECK(count(p, "SELECT count(*) FROM section_survey") == 8);
  CHECK(count(p, "SELECT count(*) FROM reading WHERE is_check = 0") == 88);
  // …plus the two closing checks booked on the S1 MW 2025 sheet (assets/sheets).
  CHECK(count(p, "SELECT count(*) FROM reading WHERE is_check = 1") == 2);
  CHECK(count(p, "SELECT count(DISTINCT c.label) FROM section_survey c JOIN span s ON s.id = c.span_id "
                 "WHERE s.span_index = 1") == 3);
  // The S1 MW 2019 crown: offset 1302 mm above the datum line at RL 9.800, z = offset + 0.300 m (FIELD.md §10.2).
  CHECK(count(p, "SELECT count(*) FROM reading r JOIN section_survey c ON c.id = r.section_id JOIN inspection i "
                 "ON i.id = c.inspection_id JOIN span s ON s.id = c.span_id WHERE c.label = 'MW' AND "
                 "s.span_index = 1 AND i.inspection_date = '2019-05-14' AND abs(r.x_m - 3.2) < 1e-9 AND "
                 "abs(r.z_m - 1.602) < 1e-9") == 1);
  // 4 rings at every face, at both springings and the crown, both visits; S1 US W springing 470 mm.
  CHECK(count(p, "SELECT count(*) FROM ring_count WHERE rings = 4") == 24);
  CHECK(count(p, "SELECT count(*) FROM ring_count WHERE face = 'US' AND position = 'W springing' AND "
                 "thickness_mm = 470") == 2);
  CHECK(count(p, "SELECT count(*) FROM fill_depth WHERE method = 'trial_pit' AND depth_m = 0.455") == 1);
  CHECK(count(p, "SELECT count(*) FROM fill_depth") == 3);
  // D01–D10: 8 existed in 2019 (D05 and D09 are new in 2025), all 10 in 2025 (FIELD.md §10.4).
  CHECK(count(p, "SELECT count(*) FROM defect") == 18);
  CHECK(count(p, "SELECT count(DISTINCT ref) FROM defect") == 10);
  CHECK(count(p, "SELECT count(*) FROM defect d JOIN inspection i ON i.id = d.inspection_id WHERE "
                 "i.inspection_date = '2019-05-14'") == 8);
  CHECK(count(p, "SELECT count(*) FROM defect WHERE ref = 'D01' AND width_mm = 1.2 AND length_m = 3.40") == 1);
  CHECK(count(p, "SELECT count(*) FROM photo") == 18);
  CHECK(count(p, "SELECT count(*) FROM photo_defect WHERE marker_json IS NOT NULL") == 18);
  CHECK(count(p, "SELECT count(*) FROM defect d WHERE NOT EXISTS "
                 "(SELECT 1 FROM photo_defect l WHERE l.defect_id = d.id)") == 0);

  // Every picture: in the media folder under the SHA-256 of its bytes, a decodable 640 × 480 JPEG.
  Statement q(p.db(), "SELECT file_name, content_hash, width_px, height_px FROM photo");
  int decoded = 0;
  while (q.step()) {
    const std::string file = photo_file_path(path, q.column_text(0));
    const std::string bytes = soffit::test::read_bytes(file);
    REQUIRE_FALSE(bytes.empty());
    CHECK(sha256_hex(bytes.data(), bytes.size()) == q.column_text(1));
    int w = 0, h = 0, comp = 0;
    unsigned char* px = stbi_load_from_memory(reinterpret_cast<const unsigned char*>(bytes.data()),
                                              static_cast<int>(bytes.size()), &w, &h, &comp, 3);
    REQUIRE(px != nullptr);
    stbi_image_free(px);
    CHECK(w == 640);
    CHECK(h == 480);
    CHECK(q.column_int64(2) == 640);
    decoded += 1;
  }
  CHECK(decoded == 18);
  // Search reaches the scenario's words.
  const auto calcite = search_register(p.db(), "calcite");
  REQUIRE(calcite.size() == 1);
  CHECK(calcite[0].title == "D06 seepage 2025-05-21");
  CHECK(search_register(p.db(), "flood debris").size() == 1);
}

TEST_CASE("soffit demo writes the project, refuses an existing file, and list reads it back") {
  TempDir dir;
  const std::string path = dir.file("demo.soffit");
  auto r = soffit::test::run_soffit("demo " + path);
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  CHECK(r.out.find("18 defects") != std::string::npos);
  CHECK(r.out.find("Nothing in it is real") != std::string::npos);
  r = soffit::test::run_soffit("list " + path);
  CHECK(r.exit_code == 0);
  CHECK(r.out.find("Sallow Ford Bridge") != std::string::npos);
  const std::string before = soffit::test::read_bytes(path);
  r = soffit::test::run_soffit("demo " + path);
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("never replaces a file") != std::string::npos);
  CHECK(soffit::test::read_bytes(path) == before);
  r = soffit::test::run_soffit("demo");
  CHECK(r.exit_code == 2);
}
