// Undo and redo through the session-extension journal (undo_journal.hpp):
// each edit one step, redo after undo, a new edit clears redo, the journal
// survives closing the project, and an issued inspection stays read-only.
#include <doctest/doctest.h>

#include "geometry/sheet/sheet_reader.hpp"
#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/register_queries.hpp"
#include "storage/sheet_import.hpp"
#include "storage/sqlite_statement.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

namespace {

std::string notes_of(Project& p, const std::string& ref) {
  const auto s = find_structure(p.db(), ref);
  return s ? s->fields.notes : "<absent>";
}

std::string add_structure(Project& p, const std::string& ref) {
  std::string id;
  StructureFields f;
  f.ref = ref;
  p.edit("add " + ref, [&](Connection& db) { id = insert_structure(db, p.author(), f); });
  return id;
}

soffit::SurveySheet demo_sheet() {
  return soffit::read_sheet_file(std::string(SOFFIT_ASSETS) + "/sheets/sallow-ford_S1-MW_2019.csv", {});
}

}  // namespace

TEST_CASE("undo and redo step through edits in order") {
  TempDir dir;
  Project p = Project::create(dir.file("undo.soffit"), "J. Okafor");
  CHECK_FALSE(p.undo());
  const std::string id = add_structure(p, "BVDC-ST-0417");
  p.edit("note", [&](Connection& db) { update_structure_notes(db, p.author(), id, "ivy on S2 US spandrel"); });
  CHECK(p.undo_label() == "note");

  REQUIRE(p.undo());
  CHECK(notes_of(p, "BVDC-ST-0417") == "");
  CHECK(p.redo_label() == "note");
  REQUIRE(p.undo());
  CHECK(notes_of(p, "BVDC-ST-0417") == "<absent>");
  CHECK_FALSE(p.undo());

  REQUIRE(p.redo());
  CHECK(notes_of(p, "BVDC-ST-0417") == "");
  CHECK(find_structure(p.db(), "BVDC-ST-0417")->id == id);  // the same key comes back
  REQUIRE(p.redo());
  CHECK(notes_of(p, "BVDC-ST-0417") == "ivy on S2 US spandrel");
  CHECK_FALSE(p.redo());
}

TEST_CASE("a new edit after undo discards the undone edits") {
  TempDir dir;
  Project p = Project::create(dir.file("branch.soffit"), "J. Okafor");
  add_structure(p, "A");
  add_structure(p, "B");
  REQUIRE(p.undo());
  add_structure(p, "C");
  CHECK_FALSE(p.redo());
  CHECK(p.redo_label() == "");
  CHECK(list_structures(p.db()).size() == 2);
  CHECK_FALSE(find_structure(p.db(), "B").has_value());
}

TEST_CASE("undo and redo survive closing and reopening the project") {
  TempDir dir;
  const std::string path = dir.file("persist.soffit");
  {
    Project p = Project::create(path, "J. Okafor");
    add_structure(p, "BVDC-ST-0417");
    add_structure(p, "BVDC-ST-0418");
  }
  {
    Project p = Project::open(path, "J. Okafor");
    CHECK(p.undo_label() == "add BVDC-ST-0418");
    REQUIRE(p.undo());
  }
  {
    Project p = Project::open(path, "J. Okafor");
    CHECK_FALSE(find_structure(p.db(), "BVDC-ST-0418").has_value());
    CHECK(p.redo_label() == "add BVDC-ST-0418");
    REQUIRE(p.redo());
  }
  Project p = Project::open(path, "J. Okafor");
  CHECK(find_structure(p.db(), "BVDC-ST-0418").has_value());
}

TEST_CASE("undoing an import removes the section and its readings - redo restores them exactly") {
  TempDir dir;
  Project p = Project::create(dir.file("import_undo.soffit"), "J. Okafor");
  const auto sheet = demo_sheet();
  const auto r = import_sheet(p, sheet, {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
  const auto stored = [&] {
    std::vector<std::pair<double, double>> xz;
    Statement q(p.db(), "SELECT x_m, z_m FROM reading ORDER BY seq");
    while (q.step()) xz.emplace_back(q.column_double(0), q.column_double(1));
    return xz;
  };
  const auto before = stored();
  REQUIRE(before.size() == 11);
  REQUIRE(p.undo());
  CHECK(p.db().query_int("SELECT count(*) FROM reading") == 0);
  CHECK(p.db().query_int("SELECT count(*) FROM section_survey") == 0);
  CHECK(p.db().query_int("SELECT count(*) FROM structure") == 0);
  REQUIRE(p.redo());
  CHECK(stored() == before);  // the stored values, bit for bit
  CHECK(p.db().query_text("SELECT id FROM section_survey") == r.section_id);
}

TEST_CASE("excluding a reading is one undo step and needs a reason") {
  TempDir dir;
  Project p = Project::create(dir.file("exclude.soffit"), "J. Okafor");
  const auto r = import_sheet(p, demo_sheet(), {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
  const std::string reading_id = p.db().query_text("SELECT id FROM reading WHERE seq = 7");  // x = 4.8
  p.edit("exclude", [&](Connection& db) { set_reading_exclusion(db, p.author(), reading_id, "protruding voussoir"); });
  CHECK(p.db().query_int("SELECT excluded FROM reading WHERE seq = 7") == 1);
  REQUIRE(p.undo());
  CHECK(p.db().query_int("SELECT excluded FROM reading WHERE seq = 7") == 0);
  // The schema refuses an exclusion without a reason (readings are facts; STYLE.md item 5).
  CHECK_THROWS_AS(p.edit("bad", [&](Connection& db) {
    Statement(db, "UPDATE reading SET excluded = 1, exclusion_reason = NULL WHERE id = ?1").bind(1, reading_id).run();
  }), StorageError);
  CHECK(p.db().query_int("SELECT excluded FROM reading WHERE seq = 7") == 0);
  CHECK(r.reading_count == 11);
}

TEST_CASE("deleting a section cascades to its readings and undo brings all of them back") {
  TempDir dir;
  Project p = Project::create(dir.file("cascade.soffit"), "J. Okafor");
  const auto r = import_sheet(p, demo_sheet(), {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
  p.edit("delete section", [&](Connection& db) {
    Statement(db, "DELETE FROM section_survey WHERE id = ?1").bind(1, r.section_id).run();
  });
  CHECK(p.db().query_int("SELECT count(*) FROM reading") == 0);
  REQUIRE(p.undo());
  CHECK(p.db().query_int("SELECT count(*) FROM reading") == 11);
  REQUIRE(p.redo());
  CHECK(p.db().query_int("SELECT count(*) FROM reading") == 0);
  CHECK(p.db().query_text("PRAGMA foreign_key_check") == "");
}

TEST_CASE("an issued inspection refuses edits and undo, and the file is unchanged") {
  TempDir dir;
  Project p = Project::create(dir.file("issued.soffit"), "J. Okafor");
  const auto r = import_sheet(p, demo_sheet(), {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
  p.edit("check", [&](Connection& db) { set_inspection_status(db, p.author(), r.inspection_id, "checked"); });
  p.edit("issue", [&](Connection& db) { set_inspection_status(db, p.author(), r.inspection_id, "issued"); });
  const std::string reading_id = p.db().query_text("SELECT id FROM reading WHERE seq = 2");
  try {
    p.edit("exclude", [&](Connection& db) { set_reading_exclusion(db, p.author(), reading_id, "joint"); });
    FAIL("edited a reading of an issued inspection");
  } catch (const StorageError& e) {
    CHECK(e.kind() == ErrorKind::invalid);
    CHECK(std::string(e.what()).find("issued and read-only") != std::string::npos);
  }
  try {
    p.undo();
    FAIL("undid the issue of an inspection");
  } catch (const StorageError& e) {
    CHECK(e.kind() == ErrorKind::invalid);
  }
  CHECK(p.db().query_text("SELECT status FROM inspection") == "issued");
  CHECK(p.undo_label() == "issue");
  CHECK(p.db().query_int("SELECT excluded FROM reading WHERE seq = 2") == 0);
}
