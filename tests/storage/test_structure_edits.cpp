// Adding and editing a structure's details (issue 4, the register screen):
// every field written and read back from a reopened file, stamps, one undo
// step per edit, and bad fields refused before any SQL with a message that
// names the field, leaving the file as it was.
#include <doctest/doctest.h>

#include <cmath>
#include <limits>

#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/register_queries.hpp"
#include "storage/register_search.hpp"
#include "storage/storage_error.hpp"
#include "tests/app/demo_project_fixture.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

namespace {

// Invented structures in the manner of FIELD.md §10; nothing here is real.
StructureFields sallow_ford() {
  StructureFields f;
  f.ref = "BVDC-ST-0417";
  f.name = "Sallow Ford Bridge";
  f.latitude_deg = 0.0;
  f.longitude_deg = 0.0;
  f.location_fictitious = true;
  f.carries = "Ferny Lane";
  f.crosses = "Sallow Beck";
  f.span_count = 2;
  f.notes = "two brick segmental spans";
  return f;
}

StructureFields mill_culvert() {
  StructureFields f;
  f.ref = "BVDC-ST-0418";
  f.name = "Brackwood Mill Culvert";
  f.latitude_deg = 51.25;
  f.longitude_deg = -2.5;
  f.location_fictitious = false;
  f.carries = "Mill Lane";
  f.crosses = "Brackwood Leat";
  f.span_count = 1;
  f.notes = "single stone arch; ivy on the upstream face";
  return f;
}

std::string add(Project& p, const StructureFields& f) {
  std::string id;
  p.edit("add " + f.ref, [&](Connection& db) { id = insert_structure(db, p.author(), f); });
  return id;
}

void edit(Project& p, const std::string& id, const StructureFields& f) {
  p.edit("edit " + f.ref, [&](Connection& db) { update_structure(db, p.author(), id, f); });
}

void check_fields(const StructureFields& got, const StructureFields& want) {
  CHECK(got.ref == want.ref);
  CHECK(got.name == want.name);
  REQUIRE(got.latitude_deg.has_value() == want.latitude_deg.has_value());
  if (want.latitude_deg) CHECK(std::abs(*got.latitude_deg - *want.latitude_deg) < 1e-12);
  REQUIRE(got.longitude_deg.has_value() == want.longitude_deg.has_value());
  if (want.longitude_deg) CHECK(std::abs(*got.longitude_deg - *want.longitude_deg) < 1e-12);
  CHECK(got.location_fictitious == want.location_fictitious);
  CHECK(got.carries == want.carries);
  CHECK(got.crosses == want.crosses);
  CHECK(got.span_count == want.span_count);
  CHECK(got.notes == want.notes);
}

// The edit is refused as invalid with a message that starts with the field,
// after the "path: " StorageError puts in front.
std::string refused_message(Project& p, const std::function<void(Connection&)>& change) {
  try {
    p.edit("bad edit", change);
  } catch (const StorageError& e) {
    CHECK_MESSAGE(e.kind() == ErrorKind::invalid, e.what());
    const std::string what = e.what();
    const std::string prefix = p.path() + ": ";
    REQUIRE(what.rfind(prefix, 0) == 0);
    return what.substr(prefix.size());
  }
  FAIL("the bad edit was accepted");
  return "";
}

}  // namespace

TEST_CASE("update_structure rewrites every field, stamps it, and the file keeps it after reopening") {
  TempDir dir;
  const std::string path = dir.file("edit.soffit");
  std::string id, created_at, first_modified;
  {
    Project p = Project::create(path, "J. Okafor");
    id = add(p, sallow_ford());
    const auto before = find_structure(p.db(), "BVDC-ST-0417");
    REQUIRE(before.has_value());
    created_at = before->created_at;
    first_modified = before->modified_at;
  }
  {
    Project p = Project::open(path, "M. Lindqvist");
    edit(p, id, mill_culvert());
  }
  Project p = Project::open(path, "A. Reader", Access::view);
  CHECK_FALSE(find_structure(p.db(), "BVDC-ST-0417").has_value());  // the reference itself changed
  const auto after = find_structure(p.db(), "BVDC-ST-0418");
  REQUIRE(after.has_value());
  CHECK(after->id == id);  // the same row, not a new one
  check_fields(after->fields, mill_culvert());
  CHECK(after->author == "M. Lindqvist");
  CHECK(after->created_at == created_at);
  // ISO 8601 UTC stamps of one format order as text (ISO 8601 §5.3.3 / RFC 3339 §5.1).
  CHECK(after->modified_at >= first_modified);
}

TEST_CASE("an empty text field clears the column and an absent number stays absent") {
  TempDir dir;
  Project p = Project::create(dir.file("clear.soffit"), "J. Okafor");
  const std::string id = add(p, sallow_ford());
  StructureFields bare;
  bare.ref = "BVDC-ST-0417";
  edit(p, id, bare);
  check_fields(find_structure(p.db(), "BVDC-ST-0417")->fields, bare);
  CHECK(p.db().query_int("SELECT count(*) FROM structure WHERE name IS NULL AND notes IS NULL AND carries IS NULL "
                         "AND crosses IS NULL AND latitude_deg IS NULL AND span_count IS NULL") == 1);
}

TEST_CASE("the edit is one undo step, redo puts it back, and the undo holds after reopening") {
  TempDir dir;
  const std::string path = dir.file("undo.soffit");
  std::string id;
  {
    Project p = Project::create(path, "J. Okafor");
    id = add(p, sallow_ford());
    edit(p, id, mill_culvert());
    CHECK(p.undo_label() == "edit BVDC-ST-0418");
    REQUIRE(p.undo());
    check_fields(find_structure(p.db(), "BVDC-ST-0417")->fields, sallow_ford());
    CHECK_FALSE(find_structure(p.db(), "BVDC-ST-0418").has_value());
    CHECK(p.undo_label() == "add BVDC-ST-0417");  // the edit was exactly one step
    REQUIRE(p.redo());
    check_fields(find_structure(p.db(), "BVDC-ST-0418")->fields, mill_culvert());
    REQUIRE(p.undo());
  }
  Project p = Project::open(path, "J. Okafor");
  const auto s = find_structure(p.db(), "BVDC-ST-0417");
  REQUIRE(s.has_value());
  CHECK(s->id == id);
  check_fields(s->fields, sallow_ford());
  CHECK(p.redo_label() == "edit BVDC-ST-0418");  // the journal is in the file
}

TEST_CASE("search follows an edited reference and name") {
  TempDir dir;
  Project p = Project::create(dir.file("search.soffit"), "J. Okafor");
  const std::string id = add(p, sallow_ford());
  edit(p, id, mill_culvert());
  const auto hits = search_register(p.db(), "Brackwood Mill");
  REQUIRE(hits.size() == 1);
  CHECK(hits[0].structure_ref == "BVDC-ST-0418");
  CHECK(search_register(p.db(), "Sallow Ford").empty());
}

TEST_CASE("editing the demo structure's details keeps its spans and visits") {
  soffit::test::DemoProject demo;
  Project& p = *demo.project;
  const auto before = structure_detail(p.db(), soffit::test::kDemoRef);
  REQUIRE(before.has_value());
  StructureFields f = before->structure.fields;
  f.ref = "BVDC-ST-0417A";
  f.notes = "renumbered by the owner";
  edit(p, before->structure.id, f);
  const auto after = structure_detail(p.db(), "BVDC-ST-0417A");
  REQUIRE(after.has_value());
  CHECK(after->spans.size() == before->spans.size());
  CHECK(after->inspections.size() == before->inspections.size());
  CHECK(after->structure.fields.notes == "renumbered by the owner");
}

TEST_CASE("bad fields are refused with the field named, and nothing changes") {
  TempDir dir;
  Project p = Project::create(dir.file("refuse.soffit"), "J. Okafor");
  const std::string id = add(p, sallow_ford());
  add(p, mill_culvert());
  const std::string journal = p.undo_label();
  const auto try_edit = [&](const StructureFields& f) {
    return refused_message(p, [&](Connection& db) { update_structure(db, p.author(), id, f); });
  };

  StructureFields f = sallow_ford();
  f.ref = "   ";
  CHECK(try_edit(f) == "reference: must not be empty");
  f.ref = "";
  CHECK(try_edit(f) == "reference: must not be empty");
  f.ref = "BVDC-ST-0418";
  CHECK(try_edit(f) == "reference: BVDC-ST-0418 is already used by another structure in this project");

  // WGS84 geographic coordinates (EPSG:4326): latitude -90..90, longitude -180..180 degrees.
  f = sallow_ford();
  f.latitude_deg = 90.5;
  CHECK(try_edit(f) == "latitude: 90.5 is outside -90 to 90 degrees");
  f.latitude_deg = -91;
  CHECK(try_edit(f) == "latitude: -91 is outside -90 to 90 degrees");
  f.latitude_deg = std::numeric_limits<double>::quiet_NaN();
  CHECK(try_edit(f).rfind("latitude: ", 0) == 0);
  f = sallow_ford();
  f.longitude_deg = 180.25;
  CHECK(try_edit(f) == "longitude: 180.25 is outside -180 to 180 degrees");
  f.longitude_deg = -200;
  CHECK(try_edit(f) == "longitude: -200 is outside -180 to 180 degrees");
  f = sallow_ford();
  f.span_count = 0;
  CHECK(try_edit(f) == "number of spans: 0 is fewer than one");

  // Nothing was written and no undo step was recorded.
  check_fields(find_structure(p.db(), "BVDC-ST-0417")->fields, sallow_ford());
  CHECK(p.undo_label() == journal);
}

TEST_CASE("the limits themselves are accepted: the poles, the antimeridian, one span") {
  TempDir dir;
  Project p = Project::create(dir.file("limits.soffit"), "J. Okafor");
  const std::string id = add(p, sallow_ford());
  StructureFields f = sallow_ford();
  f.latitude_deg = -90;
  f.longitude_deg = 180;
  f.span_count = 1;
  edit(p, id, f);
  check_fields(find_structure(p.db(), "BVDC-ST-0417")->fields, f);
  f.latitude_deg = 90;
  f.longitude_deg = -180;
  edit(p, id, f);
  check_fields(find_structure(p.db(), "BVDC-ST-0417")->fields, f);
}

TEST_CASE("a new structure is refused on the same rules") {
  TempDir dir;
  Project p = Project::create(dir.file("insert.soffit"), "J. Okafor");
  add(p, sallow_ford());
  StructureFields f = mill_culvert();
  f.ref = "BVDC-ST-0417";
  CHECK(refused_message(p, [&](Connection& db) { insert_structure(db, p.author(), f); }) ==
        "reference: BVDC-ST-0417 is already used by another structure in this project");
  f = mill_culvert();
  f.ref = "";
  CHECK(refused_message(p, [&](Connection& db) { insert_structure(db, p.author(), f); }) ==
        "reference: must not be empty");
  f = mill_culvert();
  f.span_count = -1;
  CHECK(refused_message(p, [&](Connection& db) { insert_structure(db, p.author(), f); }) ==
        "number of spans: -1 is fewer than one");
  CHECK(p.db().query_int("SELECT count(*) FROM structure") == 1);
}

TEST_CASE("editing a structure that is not there is not_found") {
  TempDir dir;
  Project p = Project::create(dir.file("missing.soffit"), "J. Okafor");
  try {
    edit(p, "00000000-0000-4000-8000-000000000000", sallow_ford());
    FAIL("an edit of no structure was accepted");
  } catch (const StorageError& e) {
    CHECK(e.kind() == ErrorKind::not_found);
  }
  CHECK(p.undo_label() == "");
}
