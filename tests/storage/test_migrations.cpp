// Forward migrations from every earlier layout (issue 3: "Schema versioned
// (PRAGMA user_version) with forward migrations, each tested from every
// earlier version"). Layout 0 is kept verbatim in migrations.cpp.
#include <doctest/doctest.h>
#include <sqlite3.h>

#include "storage/migrations.hpp"
#include "storage/project_file.hpp"
#include "storage/register_queries.hpp"
#include "storage/register_search.hpp"
#include "storage/schema.hpp"
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
