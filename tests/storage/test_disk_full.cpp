// A full disk, simulated with PRAGMA max_page_count (sqlite.org pragma.html;
// the approach of sqlite.org testing.html §3: fail the write, then check that
// the database is all or nothing).
#include <doctest/doctest.h>

#include "geometry/sheet/sheet_reader.hpp"
#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/register_queries.hpp"
#include "storage/sheet_import.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

TEST_CASE("an edit that does not fit fails as disk full and loses nothing saved before") {
  TempDir dir;
  const std::string path = dir.file("full.soffit");
  const auto sheet = soffit::read_sheet_file(std::string(SOFFIT_ASSETS) + "/sheets/sallow-ford_S1-MW_2019.csv", {});
  {
    Project p = Project::create(path, "J. Okafor");
    import_sheet(p, sheet, {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
    const long long pages = p.db().query_int("PRAGMA page_count");
    p.db().query_int("PRAGMA max_page_count = " + std::to_string(pages));
    try {
      p.edit("a large edit", [&](Connection& db) {
        for (int i = 0; i < 200; ++i) {
          StructureFields f;
          f.ref = "BIG-" + std::to_string(i);
          f.notes = std::string(4000, 'x');
          insert_structure(db, p.author(), f);
        }
      });
      FAIL("the edit fitted in a full file");
    } catch (const StorageError& e) {
      CHECK_MESSAGE(e.kind() == ErrorKind::disk_full, e.what());
    }
    // Same session: the failed edit left nothing, the import is intact.
    CHECK_FALSE(find_structure(p.db(), "BIG-0").has_value());
    CHECK(p.db().query_int("SELECT count(*) FROM reading") == 11);
    CHECK(p.undo_label().find("import") == 0);
  }
  Project p = Project::open(path, "J. Okafor");
  CHECK(p.db().query_text("PRAGMA integrity_check") == "ok");
  CHECK(p.db().query_int("SELECT count(*) FROM structure") == 1);
  CHECK(p.db().query_int("SELECT count(*) FROM reading") == 11);  // the 11 stations of FIELD.md §10.2
}
