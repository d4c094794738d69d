// The fit cache (issue 3: "Fit results cached with a hash of their inputs,
// so a changed reading invalidates them"), end to end on a real project
// file: a real fit of the invented S1 mid-width section is stored, found
// again, and no longer found once a reading is changed through the edit API.
#include <doctest/doctest.h>

#include <nlohmann/json.hpp>

#include "exports/fit_report_json.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "storage/fit_cache.hpp"
#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/sha256.hpp"
#include "storage/sheet_export.hpp"
#include "storage/sheet_import.hpp"
#include "storage/sqlite_statement.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

namespace {

const std::string kSheets = std::string(SOFFIT_ASSETS) + "/sheets/";

struct Fixture {
  TempDir dir;
  Project project = Project::create(dir.file("cache.soffit"), "test");
  std::string section_id;
  Fixture() {
    const auto sheet = soffit::read_sheet_file(kSheets + "sallow-ford_S1-MW_2019.csv", {});
    section_id = import_sheet(project, sheet, {"BVDC-ST-0417", 1, "2019-05-14", "MW"}).section_id;
  }
  std::string reading_id(int seq) {
    Statement q(project.db(), "SELECT id FROM reading WHERE section_id = ?1 AND seq = ?2");
    q.bind_all(section_id, seq);
    REQUIRE(q.step());
    return q.column_text(0);
  }
  long long cached_rows() { return project.db().query_int("SELECT count(*) FROM fit_cache"); }
};

FitCacheKey segmental_key() {
  FitCacheKey key;
  key.request.shape = "segmental";
  key.request.uncertainty.monte_carlo_draws = 200;
  key.request.uncertainty.seed = 7;
  key.program_version = "0.1.0";
  return key;
}

// The fit report JSON that `soffit fit` would print for the stored section.
std::string real_fit_json(Connection& db, const std::string& section_id, const FitCacheKey& key) {
  const auto sheet = load_section_sheet(db, section_id);
  const auto analysis = soffit::analyse_profile(sheet.readings, key.request);
  REQUIRE_MESSAGE(analysis.ok(), analysis.error);
  return soffit::fit_report_json(sheet, analysis, key.request).dump();
}

}  // namespace

TEST_CASE("a cached fit is found while its readings are unchanged and lost when one changes") {
  Fixture f;
  const FitCacheKey key = segmental_key();
  const std::string result = real_fit_json(f.project.db(), f.section_id, key);
  CHECK_FALSE(find_fit_result(f.project.db(), f.section_id, key).has_value());

  const std::string last_edit = f.project.undo_label();
  store_fit_result(f.project.db(), "test", f.section_id, key, result);
  const auto hit = find_fit_result(f.project.db(), f.section_id, key);
  REQUIRE(hit.has_value());
  CHECK(*hit == result);
  // The stored hash is the SHA-256 (FIPS 180-4, sha256.hpp) of the canonical input text.
  const std::string text = fit_input_text(f.project.db(), f.section_id, key);
  CHECK(f.project.db().query_text("SELECT input_hash FROM fit_cache") == sha256_hex(text.data(), text.size()));
  CHECK(text.find("reading 10 ") != std::string::npos);  // all 11 readings (seq 0–10) are in it
  // Storing is not an edit: nothing to undo appears.
  CHECK(f.project.undo_label() == last_edit);

  // Exclude the crown reading through the edit API: the cached result is gone.
  const std::string before = fit_input_hash(f.project.db(), f.section_id, key);
  f.project.edit("exclude crown", [&](Connection& db) {
    set_reading_exclusion(db, "test", f.reading_id(5), "deposit on the soffit");
  });
  CHECK_FALSE(find_fit_result(f.project.db(), f.section_id, key).has_value());
  CHECK(f.cached_rows() == 0);  // the schema's trigger cleared it
  CHECK(fit_input_hash(f.project.db(), f.section_id, key) != before);

  // Undo restores the reading and its hash, but the result was derived data: refit and store again.
  REQUIRE(f.project.undo());
  CHECK(fit_input_hash(f.project.db(), f.section_id, key) == before);
  CHECK_FALSE(find_fit_result(f.project.db(), f.section_id, key).has_value());
  store_fit_result(f.project.db(), "test", f.section_id, key, result);
  CHECK(find_fit_result(f.project.db(), f.section_id, key).has_value());
}

TEST_CASE("the cache key covers the fit request and the program version") {
  Fixture f;
  const FitCacheKey key = segmental_key();
  store_fit_result(f.project.db(), "test", f.section_id, key, R"({"shape":"segmental"})");
  REQUIRE(find_fit_result(f.project.db(), f.section_id, key).has_value());

  auto changed = [&](auto mutate) {
    FitCacheKey k = segmental_key();
    mutate(k);
    return find_fit_result(f.project.db(), f.section_id, k).has_value();
  };
  CHECK_FALSE(changed([](FitCacheKey& k) { k.request.uncertainty.seed = 8; }));
  CHECK_FALSE(changed([](FitCacheKey& k) { k.request.uncertainty.monte_carlo_draws = 201; }));
  CHECK_FALSE(changed([](FitCacheKey& k) { k.request.fit.fallback_sigma_m = 0.005; }));
  CHECK_FALSE(changed([](FitCacheKey& k) { k.request.fit.springing_z = 0.0; }));
  CHECK_FALSE(changed([](FitCacheKey& k) { k.request.fit.robust = true; }));
  CHECK_FALSE(changed([](FitCacheKey& k) { k.program_version = "0.2.0"; }));
  CHECK_FALSE(changed([](FitCacheKey& k) { k.request.shape = "parabolic"; }));
  CHECK(changed([](FitCacheKey&) {}));

  // A new result for the same shape replaces the old one (one row per section and shape).
  FitCacheKey other = segmental_key();
  other.request.uncertainty.seed = 8;
  store_fit_result(f.project.db(), "test", f.section_id, other, R"({"seed":8})");
  CHECK(f.cached_rows() == 1);
  CHECK(*find_fit_result(f.project.db(), f.section_id, other) == R"({"seed":8})");
  CHECK_FALSE(find_fit_result(f.project.db(), f.section_id, key).has_value());
}

TEST_CASE("the hash sees a reading changed by one unit in the last place, and bad input is refused") {
  Fixture f;
  const FitCacheKey key = segmental_key();
  const std::string before = fit_input_hash(f.project.db(), f.section_id, key);
  // Outside the edit API (another tool): the hash alone must still notice.
  f.project.db().exec("DROP TRIGGER fit_cache_stale_on_update");
  Statement(f.project.db(), "UPDATE reading SET z_m = z_m + z_m * 2.220446049250313e-16 WHERE section_id = ?1 AND seq = 5")
      .bind(1, f.section_id)
      .run();
  CHECK(fit_input_hash(f.project.db(), f.section_id, key) != before);

  CHECK_THROWS_AS(store_fit_result(f.project.db(), "test", f.section_id, key, "{not json"), StorageError);
  CHECK(f.cached_rows() == 0);
  CHECK_THROWS_AS(find_fit_result(f.project.db(), "no-such-section", key), StorageError);
}
