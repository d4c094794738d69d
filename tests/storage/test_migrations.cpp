// Forward migrations from every earlier layout (issue 3: "Schema versioned
// (PRAGMA user_version) with forward migrations, each tested from every
// earlier version"). Layout 0 is kept verbatim in migrations.cpp.
#include <doctest/doctest.h>
#include <sqlite3.h>

#include "storage/inspection_revision.hpp"
#include "storage/migrations.hpp"
#include "storage/project_file.hpp"
#include "storage/register_queries.hpp"
#include "storage/register_search.hpp"
#include "storage/schema.hpp"
#include "storage/sqlite_statement.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

namespace {

// A file as the first Soffit wrote it: our application_id, user_version 0.
void make_v0_project(const std::string& path, const std::string& rows_sql) {
  sqlite3* db = nullptr;
  REQUIRE(sqlite3_open(path.c_str(), &db) == SQLITE_OK);
  const std::string sql = "PRAGMA application_id = " + std::to_string(kApplicationId) + ";" + schema_v0_sql() + rows_sql;
  CHECK(sqlite3_exec(db, sql.c_str(), nullptr, nullptr, nullptr) == SQLITE_OK);
  sqlite3_close(db);
}


// Writes `sql` into a file of layout `version` built by the statements that
// built that layout (layout 1 from schema.cpp, + the 1 → 2 step for layout 2).
void make_project_at(const std::string& path, int version, const std::string& rows_sql) {
  sqlite3* db = nullptr;
  REQUIRE(sqlite3_open(path.c_str(), &db) == SQLITE_OK);
  std::string sql = "PRAGMA application_id = " + std::to_string(kApplicationId) + ";" + schema_v1_sql();
  if (version >= 2) sql += schema_v1_to_v2_sql();
  sql += "PRAGMA user_version = " + std::to_string(version) + ";" + rows_sql;
  char* error = nullptr;
  const int rc = sqlite3_exec(db, sql.c_str(), nullptr, nullptr, &error);
  CHECK_MESSAGE(rc == SQLITE_OK, (error ? error : ""));
  sqlite3_free(error);
  sqlite3_close(db);
}

// An issued visit of structure 'a' with one defect, a photo of the visit
// linked to it and a photo of no visit linked to it; a draft visit with the
// same; two photos of no visit and no link. Made while the visit was a draft,
// then issued, as the app does.
const char* const kVisitRows =
    "INSERT INTO structure (id, ref, created_at, modified_at, author) VALUES ('a', 'BVDC-ST-0417', 't', 't', 'x');"
    "INSERT INTO inspection (id, structure_id, inspection_date, created_at, modified_at, author) VALUES "
    "('iss', 'a', '2019-05-14', 't', 't', 'x'), ('dra', 'a', '2025-05-21', 't', 't', 'x');"
    "INSERT INTO defect (id, inspection_id, ref, defect_type, element, location_frame, frame_origin, geometry_kind,"
    " geometry_json, created_at, modified_at, author) VALUES "
    "('d-iss', 'iss', 'D04', 'transverse_crack', 'barrel', 'soffit', 'W springing; US face', 'point',"
    " '{\"points\":[[3.55,1.2]]}', 't', 't', 'x'),"
    "('d-dra', 'dra', 'D04', 'transverse_crack', 'barrel', 'soffit', 'W springing; US face', 'point',"
    " '{\"points\":[[3.55,1.2]]}', 't', 't', 'x');"
    "INSERT INTO photo (id, inspection_id, content_hash, caption, created_at, modified_at, author) VALUES "
    "('p-iss', 'iss', 'h1', 'D04 looking up', 't', 't', 'x'), ('p-dra', 'dra', 'h2', 'D04 looking up', 't', 't', 'x'),"
    "('p-cross', NULL, 'h3', NULL, 't', 't', 'x'), ('p-none', NULL, 'h4', NULL, 't', 't', 'x'),"
    "('p-loose', NULL, 'h5', NULL, 't', 't', 'x');"
    "INSERT INTO photo_defect (id, photo_id, defect_id, marker_json, created_at, modified_at, author) VALUES "
    "('l-iss', 'p-iss', 'd-iss', '{\"x\":0.5,\"y\":0.5}', 't', 't', 'x'),"
    "('l-cross', 'p-cross', 'd-iss', NULL, 't', 't', 'x'),"
    "('l-dra', 'p-dra', 'd-dra', '{\"x\":0.5,\"y\":0.5}', 't', 't', 'x');"
    "UPDATE inspection SET status = 'issued' WHERE id = 'iss';";

// What an edit of `sql` gives: "ok", or the refusal's message.
std::string try_edit(Project& p, const std::string& sql) {
  try {
    p.edit("try", [&](Connection& db) { db.exec(sql); });
  } catch (const StorageError& e) {
    return e.what();
  }
  return "ok";
}

bool refused_as_issued(Project& p, const std::string& sql) {
  const std::string outcome = try_edit(p, sql);
  CAPTURE(sql);
  CAPTURE(outcome);
  return outcome.find("the inspection is issued and read-only; make a new revision to correct it") != std::string::npos;
}

// Layout 3's guards, on the rows of kVisitRows: every photo change of the
// issued visit is refused, the same change of the draft visit is kept, and a
// revision of the issued visit (which copies its photo links) still works.
void check_photo_guards(Project& p) {
  CHECK(refused_as_issued(p, "INSERT INTO photo_defect (id, photo_id, defect_id, created_at, modified_at, author) "
                             "VALUES ('l-new', 'p-none', 'd-iss', 't', 't', 'x')"));
  CHECK(refused_as_issued(p, "UPDATE photo_defect SET marker_json = '{\"x\":0.1,\"y\":0.1}' WHERE id = 'l-iss'"));
  CHECK(refused_as_issued(p, "DELETE FROM photo_defect WHERE id = 'l-iss'"));
  CHECK(refused_as_issued(p, "UPDATE photo_defect SET defect_id = 'd-iss' WHERE id = 'l-dra'"));  // moved in
  CHECK(refused_as_issued(p, "UPDATE photo SET caption = 'D04 from the US bank' WHERE id = 'p-iss'"));
  CHECK(refused_as_issued(p, "DELETE FROM photo WHERE id = 'p-iss'"));
  CHECK(refused_as_issued(p, "UPDATE photo SET inspection_id = 'iss' WHERE id = 'p-none'"));  // given to it
  CHECK(refused_as_issued(p, "INSERT INTO photo (id, inspection_id, content_hash, created_at, modified_at, author) "
                             "VALUES ('p-new', 'iss', 'hash-new', 't', 't', 'x')"));  // a new photo of it
  CHECK(refused_as_issued(p, "UPDATE defect SET inspection_id = 'iss' WHERE id = 'd-dra'"));  // a draft row moved in
  // Deleting a photo of no visit takes its links with it (ON DELETE CASCADE):
  // one that places an issued defect is refused, and the photo stays.
  CHECK(refused_as_issued(p, "DELETE FROM photo WHERE id = 'p-cross'"));
  CHECK(p.db().query_text("SELECT marker_json FROM photo_defect WHERE id = 'l-iss'") == "{\"x\":0.5,\"y\":0.5}");
  CHECK(p.db().query_text("SELECT caption FROM photo WHERE id = 'p-iss'") == "D04 looking up");
  CHECK(p.db().query_int("SELECT count(*) FROM photo WHERE inspection_id = 'iss'") == 1);
  CHECK(p.db().query_int("SELECT count(*) FROM photo") == 5);
  CHECK(p.db().query_int("SELECT count(*) FROM photo_defect WHERE defect_id = 'd-iss'") == 2);

  // The same changes on the draft visit and on photos of no visit go through.
  CHECK(try_edit(p, "INSERT INTO photo_defect (id, photo_id, defect_id, created_at, modified_at, author) "
                    "VALUES ('l-new', 'p-none', 'd-dra', 't', 't', 'x')") == "ok");
  CHECK(try_edit(p, "UPDATE photo_defect SET marker_json = '{\"x\":0.1,\"y\":0.1}' WHERE id = 'l-dra'") == "ok");
  CHECK(try_edit(p, "UPDATE photo SET caption = 'D04 from the US bank' WHERE id = 'p-dra'") == "ok");
  CHECK(try_edit(p, "UPDATE photo SET inspection_id = 'dra' WHERE id = 'p-none'") == "ok");
  CHECK(try_edit(p, "DELETE FROM photo WHERE id = 'p-loose'") == "ok");
  CHECK(try_edit(p, "DELETE FROM photo_defect WHERE id = 'l-dra'") == "ok");
  CHECK(p.db().query_int("SELECT count(*) FROM photo") == 4);
  CHECK(p.db().query_text("SELECT group_concat(id, ',') FROM (SELECT id FROM photo_defect ORDER BY id)") ==
        "l-cross,l-iss,l-new");

  // A revision copies the issued visit's links onto its own draft defect;
  // the photos stay where they are.
  std::string rev;
  p.edit("revise", [&](Connection& db) { rev = create_inspection_revision(db, p.author(), "iss", "D04 misplaced"); });
  Statement q(p.db(), "SELECT l.id, l.photo_id, coalesce(l.marker_json, 'whole photo') FROM photo_defect l "
                      "JOIN defect d ON d.id = l.defect_id WHERE d.inspection_id = ?1 ORDER BY l.photo_id");
  q.bind(1, rev);
  REQUIRE(q.step());
  CHECK(q.column_text(1) == "p-cross");
  CHECK(q.column_text(2) == "whole photo");
  REQUIRE(q.step());
  const std::string copied = q.column_text(0);
  CHECK(q.column_text(1) == "p-iss");
  CHECK(q.column_text(2) == "{\"x\":0.5,\"y\":0.5}");
  CHECK_FALSE(q.step());
  // The copies belong to the draft revision, so they can be corrected and removed.
  CHECK(try_edit(p, "UPDATE photo_defect SET marker_json = '{\"x\":0.2,\"y\":0.6}' WHERE id = '" + copied + "'") ==
        "ok");
  CHECK(try_edit(p, "DELETE FROM photo_defect WHERE id = '" + copied + "'") == "ok");
  REQUIRE(p.undo());  // the removal
  REQUIRE(p.undo());  // the correction
  REQUIRE(p.undo());  // the revision, whole, copied links included
  CHECK(p.db().query_int("SELECT count(*) FROM inspection") == 2);
  CHECK(p.db().query_int("SELECT count(*) FROM photo_defect") == 3);
  CHECK(p.db().query_text("PRAGMA integrity_check") == "ok");
}

}  // namespace

TEST_CASE("a layout 0 project is migrated to the current layout and keeps its structures") {
  TempDir dir;
  const std::string path = dir.file("v0.soffit");
  make_v0_project(path,
                  "INSERT INTO structure VALUES ('5d1c9a52-3f0e-4f59-9a41-0c2f4b7e8a10', 'BVDC-ST-0417', "
                  "'Sallow Ford Bridge', 'invented demo structure');"
                  "INSERT INTO structure VALUES ('8b0f7e21-9c4d-4a6b-b2e3-1f5a6d7c8e90', 'BVDC-ST-0418', NULL, NULL);");
  {
    Project p = Project::open(path, "R. Delacroix");
    CHECK(p.report().migrated_from == 0);
    CHECK(p.report().full_check);  // checked before being rewritten
    CHECK(p.db().query_int("PRAGMA user_version") == kSchemaVersion);
    CHECK(p.db().query_text("PRAGMA journal_mode") == "wal");
    const auto s = find_structure(p.db(), "BVDC-ST-0417");
    REQUIRE(s.has_value());
    CHECK(s->id == "5d1c9a52-3f0e-4f59-9a41-0c2f4b7e8a10");
    CHECK(s->fields.name == "Sallow Ford Bridge");
    CHECK(s->fields.notes == "invented demo structure");
    CHECK(s->author.find("migrated from layout 0") != std::string::npos);
    CHECK(list_structures(p.db()).size() == 2);
    CHECK(p.db().query_int("SELECT count(*) FROM sqlite_schema WHERE name = 'structure_v0'") == 0);
  }
  Project again = Project::open(path, "R. Delacroix");
  CHECK(again.report().migrated_from == -1);
  CHECK(again.db().query_text("PRAGMA integrity_check") == "ok");
}

TEST_CASE("a migration that cannot complete leaves the earlier file exactly as it was") {
  TempDir dir;
  const std::string path = dir.file("v0_bad.soffit");
  // Layout 1 requires a non-blank reference; this layout 0 row has none.
  make_v0_project(path, "INSERT INTO structure VALUES ('0b6e1d0e-7a7d-4c35-8d8f-6b7a1e2c3d4f', '  ', 'no ref', NULL);");
  const std::string before = soffit::test::read_bytes(path);
  try {
    Project::open(path, "R. Delacroix");
    FAIL("migrated a file that breaks layout 1 rules");
  } catch (const StorageError& e) {
    CHECK_MESSAGE(e.kind() == ErrorKind::invalid, e.what());
  }
  CHECK(soffit::test::read_bytes(path) == before);
}

TEST_CASE("a layout 1 project is migrated to layout 2: rows kept, photos extended, search indexes built") {
  TempDir dir;
  const std::string path = dir.file("v1.soffit");
  {
    sqlite3* db = nullptr;
    REQUIRE(sqlite3_open(path.c_str(), &db) == SQLITE_OK);
    const std::string sql = "PRAGMA application_id = " + std::to_string(kApplicationId) + ";" + schema_v1_sql() +
                            "PRAGMA user_version = 1;"
                            "INSERT INTO structure (id, ref, name, notes, created_at, modified_at, author) VALUES "
                            "('a', 'BVDC-ST-0417', 'Sallow Ford Bridge', 'ivy on the S2 US spandrel', 't', 't', 'x');"
                            "INSERT INTO inspection (id, structure_id, inspection_date, notes, created_at, modified_at,"
                            " author) VALUES ('i', 'a', '2019-05-14', 'stop/go traffic management', 't', 't', 'x');"
                            "INSERT INTO defect (id, inspection_id, defect_type, element, location_frame, frame_origin,"
                            " geometry_kind, geometry_json, notes, created_at, modified_at, author) VALUES ('d', 'i',"
                            " 'scour', 'pier', 'elevation', 'pier, upstream nose', 'point', '{\"points\":[[0,0]]}',"
                            " 'footing top 0.05 m above the bed', 't', 't', 'x');"
                            "INSERT INTO photo (id, content_hash, created_at, modified_at, author) VALUES "
                            "('p', 'abc', 't', 't', 'x');";
    CHECK(sqlite3_exec(db, sql.c_str(), nullptr, nullptr, nullptr) == SQLITE_OK);
    sqlite3_close(db);
  }
  Project p = Project::open(path, "R. Delacroix");
  CHECK(p.report().migrated_from == 1);
  CHECK(p.db().query_int("PRAGMA user_version") == kSchemaVersion);
  CHECK(p.db().query_text("SELECT ref FROM structure") == "BVDC-ST-0417");
  CHECK(p.db().query_text("SELECT coalesce(width_px, 'none') FROM photo WHERE id = 'p'") == "none");
  // Rows written before search existed are found (the step rebuilds the indexes).
  const auto ivy = search_register(p.db(), "ivy");
  REQUIRE(ivy.size() == 1);
  CHECK(ivy[0].id == "a");
  REQUIRE(search_register(p.db(), "stop go").size() == 1);
  REQUIRE(search_register(p.db(), "footing").size() == 1);
  CHECK(search_register(p.db(), "footing")[0].kind == SearchKind::defect);
  CHECK(p.db().query_text("PRAGMA integrity_check") == "ok");
}

TEST_CASE("a layout 2 project is migrated to layout 3: photos and links of an issued visit become read-only") {
  TempDir dir;
  const std::string path = dir.file("v2.soffit");
  make_project_at(path, 2, kVisitRows);
  Project p = Project::open(path, "R. Delacroix");
  CHECK(p.report().migrated_from == 2);
  CHECK(p.db().query_int("PRAGMA user_version") == 3);
  CHECK(p.db().query_int("SELECT count(*) FROM photo") == 5);  // rows kept as they were
  CHECK(p.db().query_int("SELECT count(*) FROM photo_defect") == 3);
  check_photo_guards(p);
}

TEST_CASE("migration: layouts 0 and 1 reach layout 3 with the issued-visit photo guards, as a new project does") {
  TempDir dir;
  SUBCASE("from layout 0") {
    const std::string path = dir.file("v0_guards.soffit");
    make_v0_project(path, "INSERT INTO structure VALUES ('s0', 'BVDC-ST-0418', NULL, NULL);");
    Project p = Project::open(path, "R. Delacroix");
    CHECK(p.report().migrated_from == 0);
    p.edit("visits", [&](Connection& db) { db.exec(kVisitRows); });
    check_photo_guards(p);
  }
  SUBCASE("from layout 1") {
    const std::string path = dir.file("v1_guards.soffit");
    make_project_at(path, 1, kVisitRows);
    Project p = Project::open(path, "R. Delacroix");
    CHECK(p.report().migrated_from == 1);
    check_photo_guards(p);
  }
  SUBCASE("a new project") {
    Project p = Project::create(dir.file("new_guards.soffit"), "R. Delacroix");
    CHECK(p.db().query_int("PRAGMA user_version") == 3);
    p.edit("visits", [&](Connection& db) { db.exec(kVisitRows); });
    check_photo_guards(p);
  }
}
