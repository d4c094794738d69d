// Full-text search (issue 3 "Full-text search over structures, notes and
// defects"): real rows in a real project, kept in step through edits, undo
// and deletes; user text never becomes FTS5 or SQL syntax.
#include <doctest/doctest.h>

#include "storage/observation_edits.hpp"
#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/register_search.hpp"
#include "storage/sqlite_statement.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

namespace {

struct Register {
  std::string sallow_id, brackwood_id, inspection_id, defect_id;
};

// Three invented structures (FIELD.md §10 names), one visit, one defect.
Register small_register(Project& p) {
  Register r;
  p.edit("set up", [&](Connection& db) {
    StructureFields f;
    f.ref = "BVDC-ST-0417";
    f.name = "Sallow Ford Bridge";
    f.carries = "Ferny Lane";
    f.notes = "two brick segmental spans on sandstone abutments";
    r.sallow_id = insert_structure(db, p.author(), f);
    f = {};
    f.ref = "BVDC-ST-0418";
    f.name = "Brackwood Mill Culvert";
    f.notes = "stone arch; sallow saplings in the wing walls";
    r.brackwood_id = insert_structure(db, p.author(), f);
    f = {};
    f.ref = "BVDC-ST-0419";
    f.name = "Upper Brackwood Footbridge";
    insert_structure(db, p.author(), f);
    r.inspection_id = ensure_inspection(db, p.author(), r.sallow_id, "2025-05-21");
    InspectionDetails d;
    d.notes = "light rain; flood debris against the pier";
    d.parts_not_inspected = "S2 soffit near the E springing, US end";
    update_inspection_details(db, p.author(), r.inspection_id, d);
    DefectFields x;
    x.inspection_id = r.inspection_id;
    x.ref = "D06";
    x.defect_type = "seepage";
    x.element = "S1 soffit";
    x.frame_origin = "W springing; US face";
    x.points = {{3.0, 4.55}};
    x.notes = "active drip after rain, calcite up to 15 mm";  // FIELD.md §10.4
    r.defect_id = add_defect(db, p.author(), x);
  });
  return r;
}

std::vector<std::string> ids_found(Project& p, const std::string& text) {
  std::vector<std::string> ids;
  for (const auto& h : search_register(p.db(), text)) ids.push_back(h.id);
  return ids;
}

bool found(Project& p, const std::string& text, const std::string& id) {
  const auto ids = ids_found(p, text);
  return std::find(ids.begin(), ids.end(), id) != ids.end();
}

}  // namespace

TEST_CASE("search finds structures, inspection notes and defects, best match first") {
  TempDir dir;
  Project p = Project::create(dir.file("search.soffit"), "J. Okafor");
  const Register r = small_register(p);

  auto hits = search_register(p.db(), "sallow");
  REQUIRE(hits.size() == 2);
  // In the name (weight 5) beats in the notes (weight 1).
  CHECK(hits[0].id == r.sallow_id);
  CHECK(hits[0].kind == SearchKind::structure);
  CHECK(hits[0].snippet.find("[Sallow]") != std::string::npos);
  CHECK(hits[1].id == r.brackwood_id);
  CHECK(hits[0].score < hits[1].score);

  hits = search_register(p.db(), "calcite");
  REQUIRE(hits.size() == 1);
  CHECK(hits[0].kind == SearchKind::defect);
  CHECK(hits[0].structure_ref == "BVDC-ST-0417");
  CHECK(hits[0].title == "D06 seepage 2025-05-21");

  CHECK(found(p, "flood debris", r.inspection_id));
  CHECK(found(p, "springing", r.inspection_id));  // parts not inspected
  CHECK(found(p, "BVDC-ST-0418", r.brackwood_id));
  CHECK(ids_found(p, "BVDC-ST-0418").size() == 1);
  CHECK(found(p, "Brack", r.brackwood_id));       // the last term is a prefix
  CHECK(ids_found(p, "Brack ").size() == 0);      // …unless a space ends it
  CHECK(ids_found(p, "brackwood").size() == 2);
  CHECK(ids_found(p, "brackwood mill").size() == 1);  // every term is required
  CHECK(found(p, "seepage", r.defect_id));            // the type key, split at '_' too
  CHECK(found(p, "SÁLLOW", r.sallow_id));             // case and accents folded (unicode61)
  CHECK(ids_found(p, "viaduct").empty());
}

TEST_CASE("search stays in step with edits, deletes, undo and redo") {
  TempDir dir;
  Project p = Project::create(dir.file("search_sync.soffit"), "J. Okafor");
  const Register r = small_register(p);
  p.edit("notes", [&](Connection& db) { update_structure_notes(db, p.author(), r.brackwood_id, "ivy removed"); });
  CHECK_FALSE(found(p, "saplings", r.brackwood_id));
  CHECK(found(p, "ivy", r.brackwood_id));

  p.edit("delete D06", [&](Connection& db) { delete_defect(db, r.defect_id); });
  CHECK(ids_found(p, "calcite").empty());
  REQUIRE(p.undo());
  CHECK(found(p, "calcite", r.defect_id));
  REQUIRE(p.redo());
  CHECK(ids_found(p, "calcite").empty());

  p.edit("delete structure", [&](Connection& db) {
    Statement(db, "DELETE FROM structure WHERE id = ?1").bind(1, r.sallow_id).run();  // cascades to the visit
  });
  CHECK(ids_found(p, "Ferny Sallow").empty());
  CHECK(ids_found(p, "flood").empty());
  REQUIRE(p.undo());
  CHECK(found(p, "flood", r.inspection_id));
  CHECK(found(p, "sallow ford", r.sallow_id));
  // The external-content indexes agree with their tables (sqlite.org/fts5.html "integrity-check").
  CHECK_NOTHROW(p.db().exec("INSERT INTO structure_search (structure_search) VALUES ('integrity-check');"
                            "INSERT INTO inspection_search (inspection_search) VALUES ('integrity-check');"
                            "INSERT INTO defect_search (defect_search) VALUES ('integrity-check');"));
  rebuild_search_index(p.db());
  CHECK(found(p, "sallow", r.sallow_id));
}

TEST_CASE("quotes, operators and SQL in the search text are searched for, never run") {
  TempDir dir;
  Project p = Project::create(dir.file("search_quotes.soffit"), "J. Okafor");
  const Register r = small_register(p);
  const char* nasty[] = {"\"", "'", "\"\"", "sallow\"", "\"sallow", "ford\" OR \"x", "NEAR(sallow ford)",
                         "ref:BVDC", "^sallow", "*", "sal*", "(", ")", "-", "+", "AND", "OR NOT",
                         "'; DROP TABLE structure; --", "{ref name}: x", "D06\"'\\", "", "   ", "%_%"};
  for (const char* text : nasty) {
    CAPTURE(text);
    CHECK_NOTHROW(search_register(p.db(), text));
  }
  CHECK(p.db().query_int("SELECT count(*) FROM structure") == 3);
  CHECK(fts_query_from_user_text("ford\" OR \"x") == "\"ford\" \"OR\" \"x\"*");
  CHECK(fts_query_from_user_text("'; DROP --") == "\"DROP\"*");
  CHECK(fts_query_from_user_text("***").empty());
  // Punctuation only separates terms, as the tokenizer does: these still find their rows.
  CHECK(found(p, "\"sallow", r.sallow_id));
  CHECK(found(p, "sallow\" ford", r.sallow_id));
  CHECK(found(p, "ref:BVDC-ST-0417", r.sallow_id) == false);  // "ref" is a term, not a column filter
  CHECK(found(p, "(calcite)", r.defect_id));
}
