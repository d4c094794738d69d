// Creating, reopening and the settings every project file must carry
// (issue 3 "Behaviour": WAL, foreign keys on, synchronous FULL, user_version).
#include <doctest/doctest.h>

#include <filesystem>
#include <set>

#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/register_queries.hpp"
#include "storage/row_stamp.hpp"
#include "storage/schema.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

TEST_CASE("a new project carries the Soffit application_id, the schema version and WAL") {
  TempDir dir;
  const std::string path = dir.file("new.soffit");
  {
    Project p = Project::create(path, "J. Okafor");
    // Values as documented for these pragmas at sqlite.org/pragma.html.
    CHECK(p.db().query_int("PRAGMA application_id") == kApplicationId);
    CHECK(p.db().query_int("PRAGMA user_version") == kSchemaVersion);
    CHECK(p.db().query_text("PRAGMA journal_mode") == "wal");
    CHECK(p.db().query_int("PRAGMA foreign_keys") == 1);
    CHECK(p.db().query_int("PRAGMA synchronous") == 2);  // 2 = FULL
  }
  Project p = Project::open(path, "M. Lindqvist");
  CHECK(p.db().query_int("PRAGMA foreign_keys") == 1);
  CHECK(p.db().query_int("PRAGMA synchronous") == 2);
  CHECK_FALSE(p.report().unclean_close);
  CHECK_FALSE(p.report().full_check);
  CHECK(p.report().migrated_from == -1);
}

TEST_CASE("create refuses to replace an existing file and leaves it byte for byte") {
  TempDir dir;
  const std::string path = dir.file("notes.soffit");
  soffit::test::write_bytes(path, "field notes, not a project\n");
  try {
    Project::create(path, "J. Okafor");
    FAIL("create replaced a file");
  } catch (const StorageError& e) {
    CHECK(e.kind() == ErrorKind::already_exists);
  }
  CHECK(soffit::test::read_bytes(path) == "field notes, not a project\n");
}

TEST_CASE("rows written before closing are there after reopening, with UUID keys and stamps") {
  TempDir dir;
  const std::string path = dir.file("reopen.soffit");
  std::string id;
  {
    Project p = Project::create(path, "J. Okafor");
    StructureFields f;
    f.ref = "BVDC-ST-0417";
    f.name = "Sallow Ford Bridge";  // invented demo structure (FIELD.md §10)
    f.latitude_deg = 0.0;
    f.longitude_deg = 0.0;
    f.location_fictitious = true;
    p.edit("add structure", [&](Connection& db) { id = insert_structure(db, p.author(), f); });
  }
  Project p = Project::open(path, "M. Lindqvist");
  const auto s = find_structure(p.db(), "BVDC-ST-0417");
  REQUIRE(s.has_value());
  CHECK(s->id == id);
  CHECK(s->fields.name == "Sallow Ford Bridge");
  CHECK(s->fields.location_fictitious);
  CHECK(s->author == "J. Okafor");
  // RFC 4122 §4.4: version nibble 4, variant bits 10xx.
  REQUIRE(id.size() == 36);
  CHECK(id[14] == '4');
  CHECK(std::string("89ab").find(id[19]) != std::string::npos);
  CHECK(s->created_at.size() == 24);  // 2025-05-21T08:40:12.345Z
  CHECK(s->created_at.back() == 'Z');
}

TEST_CASE("a project left open by a killed process is fully checked at the next open") {
  TempDir dir;
  const std::string path = dir.file("unclean.soffit");
  { Project p = Project::create(path, "J. Okafor"); }
  {
    // Simulate a crash: set the marker as a live session would, and skip close().
    Project p = Project::open(path, "J. Okafor");
    CHECK(p.db().query_text("SELECT value FROM project_meta WHERE key = 'open_state'") == "open");
    p.db().close();  // the Project destructor then finds no connection to mark clean
  }
  Project p = Project::open(path, "J. Okafor");
  CHECK(p.report().unclean_close);
  CHECK(p.report().full_check);
}

TEST_CASE("new UUIDs do not repeat") {
  std::set<std::string> seen;
  for (int i = 0; i < 1000; ++i) seen.insert(new_uuid());
  CHECK(seen.size() == 1000);
}

TEST_CASE("a large project closed cleanly opens without the page-by-page check - after an unclean close it gets it") {
  TempDir dir;
  const std::string path = dir.file("large.soffit");
  {
    Project p = Project::create(path, "J. Okafor");
    p.db().exec("INSERT INTO project_meta (key, value) VALUES ('padding', zeroblob(65 * 1024 * 1024))");
  }
  {
    Project p = Project::open(path, "J. Okafor");
    CHECK(p.report().check_skipped);
    CHECK_FALSE(p.report().full_check);
    // Left marked open, as a killed process leaves it.
    p.db().exec("UPDATE project_meta SET value = 'open' WHERE key = 'open_state'");
    p.db().close();
  }
  Project p = Project::open(path, "J. Okafor");
  CHECK(p.report().unclean_close);
  CHECK(p.report().full_check);
  CHECK_FALSE(p.report().check_skipped);
}
