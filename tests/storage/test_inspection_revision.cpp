// A correction to an issued inspection becomes a new revision with who, when
// and why (issue 3 "What it holds"); the issued one stays read-only.
#include <doctest/doctest.h>

#include "geometry/sheet/sheet_reader.hpp"
#include "storage/inspection_revision.hpp"
#include "storage/observation_edits.hpp"
#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/sheet_import.hpp"
#include "storage/sqlite_statement.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

namespace {

// The 2019 S1 mid-width section (FIELD.md §10.2), one defect, a photo link, then issued.
std::string issued_2019(Project& p) {
  const auto sheet = soffit::read_sheet_file(std::string(SOFFIT_ASSETS) + "/sheets/sallow-ford_S1-MW_2019.csv", {});
  const auto r = import_sheet(p, sheet, {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
  p.edit("D04", [&](Connection& db) {
    DefectFields d;
    d.inspection_id = r.inspection_id;
    d.ref = "D04";
    d.defect_type = "transverse_crack";
    d.element = "barrel";
    d.frame_origin = "W springing; US face";
    d.geometry = DefectGeometry::line;
    d.points = {{3.55, 1.2}, {3.55, 3.0}};  // FIELD.md §10.4
    d.width_mm = 0.3;
    const std::string defect_id = add_defect(db, p.author(), d);
    Statement(db, "INSERT INTO photo (id, content_hash, created_at, modified_at, author) "
                  "VALUES ('p1', 'abc', 'now', 'now', 'J. Okafor')").run();
    Statement(db, "INSERT INTO photo_defect (id, photo_id, defect_id, created_at, modified_at, author) "
                  "VALUES ('l1', 'p1', ?1, 'now', 'now', 'J. Okafor')").bind(1, defect_id).run();
  });
  p.edit("check", [&](Connection& db) { set_inspection_status(db, p.author(), r.inspection_id, "checked"); });
  p.edit("issue", [&](Connection& db) { set_inspection_status(db, p.author(), r.inspection_id, "issued"); });
  return r.inspection_id;
}

}  // namespace

TEST_CASE("a revision of an issued inspection copies its records and says who, when and why") {
  TempDir dir;
  Project p = Project::create(dir.file("revision.soffit"), "J. Okafor");
  const std::string issued = issued_2019(p);
  Project reviewer = [&] {
    p.close();
    return Project::open(dir.file("revision.soffit"), "R. Delacroix");
  }();
  std::string rev;
  reviewer.edit("revise", [&](Connection& db) {
    rev = create_inspection_revision(db, reviewer.author(), issued, "D04 width misread; card says 0.4 mm");
  });
  Connection& db = reviewer.db();
  Statement q(db, "SELECT status, revision, supersedes_id, revision_author, revision_reason, inspection_date, "
                  "revision_at FROM inspection WHERE id = ?1");
  q.bind(1, rev);
  REQUIRE(q.step());
  CHECK(q.column_text(0) == "draft");
  CHECK(q.column_int64(1) == 2);
  CHECK(q.column_text(2) == issued);
  CHECK(q.column_text(3) == "R. Delacroix");
  CHECK(q.column_text(4) == "D04 width misread; card says 0.4 mm");
  CHECK(q.column_text(5) == "2019-05-14");
  CHECK(q.column_text(6).size() == 24);  // 2025-05-21T08:40:12.345Z (row_stamp.hpp)
  const auto per_inspection = [&](const char* sql, const std::string& id) {
    Statement c(db, sql);
    c.bind(1, id);
    c.step();
    return c.column_int64(0);
  };
  const char* readings = "SELECT count(*) FROM reading r JOIN section_survey s ON s.id = r.section_id WHERE s.inspection_id = ?1";
  const char* links = "SELECT count(*) FROM photo_defect l JOIN defect d ON d.id = l.defect_id WHERE d.inspection_id = ?1";
  CHECK(per_inspection(readings, rev) == 11);  // S1 MW has 11 stations (FIELD.md §10.2)
  CHECK(per_inspection(readings, issued) == 11);
  CHECK(per_inspection("SELECT count(*) FROM defect WHERE inspection_id = ?1", rev) == 1);
  CHECK(per_inspection(links, rev) == 1);
  CHECK(db.query_int("SELECT count(DISTINCT id) FROM reading") == 22);  // new keys, not shared ones

  // The correction goes into the revision; the issued record keeps 0.3 mm.
  reviewer.edit("D04 width", [&](Connection& c) {
    Statement(c, "UPDATE defect SET width_mm = 0.4 WHERE inspection_id = ?1").bind(1, rev).run();
  });
  CHECK(db.query_text("SELECT group_concat(width_mm, ',') FROM (SELECT width_mm FROM defect d JOIN inspection i "
                      "ON i.id = d.inspection_id ORDER BY i.revision)") == "0.3,0.4");
  // ensure_inspection (used by import) now finds the draft revision, never the issued one.
  reviewer.edit("find", [&](Connection& c) {
    CHECK(ensure_inspection(c, reviewer.author(), db.query_text("SELECT id FROM structure"), "2019-05-14") == rev);
  });

  // Undo takes the revision away whole; the issued inspection is as it was.
  REQUIRE(reviewer.undo());  // D04 width
  REQUIRE(reviewer.undo());  // revise
  CHECK(db.query_int("SELECT count(*) FROM inspection") == 1);
  CHECK(db.query_int("SELECT count(*) FROM reading") == 11);
  CHECK(db.query_int("SELECT count(*) FROM photo_defect") == 1);
  CHECK(db.query_text("SELECT status FROM inspection") == "issued");
}

TEST_CASE("a revision needs an issued inspection, a reason, and no newer revision already open") {
  TempDir dir;
  Project p = Project::create(dir.file("revision_refused.soffit"), "J. Okafor");
  const std::string issued = issued_2019(p);
  const auto refused = [&](const std::string& id, const std::string& reason) -> std::string {
    try {
      p.edit("revise", [&](Connection& db) { create_inspection_revision(db, p.author(), id, reason); });
    } catch (const StorageError& e) {
      return e.what();
    }
    return "<accepted>";
  };
  CHECK(refused(issued, "  ").find("needs a reason") != std::string::npos);
  std::string rev;
  p.edit("revise", [&](Connection& db) { rev = create_inspection_revision(db, p.author(), issued, "typo"); });
  CHECK(refused(issued, "again").find("already has revision 2") != std::string::npos);
  CHECK(refused(rev, "draft").find("not issued") != std::string::npos);
  CHECK(refused("no-such-id", "x").find("no inspection") != std::string::npos);
  CHECK(p.db().query_int("SELECT count(*) FROM inspection") == 2);
}
