#include "storage/migrations.hpp"

#include <array>
#include <functional>

#include "storage/row_stamp.hpp"
#include "storage/schema.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

using Step = std::function<void(Connection&, const std::string& author)>;

// 0 → 1: the v0 structures keep their keys; they get stamps naming the
// migration as author, because nobody remembers who typed them.
void v0_to_v1(Connection& db, const std::string& author) {
  db.exec("ALTER TABLE structure RENAME TO structure_v0");
  db.exec(schema_v1_sql());
  Statement copy(db,
                 "INSERT INTO structure (id, ref, name, notes, created_at, modified_at, author) "
                 "SELECT id, ref, name, notes, ?1, ?1, ?2 FROM structure_v0");
  copy.bind_all(utc_now(), author + " (migrated from layout 0)").run();
  db.exec("DROP TABLE structure_v0");
}

// 1 → 2: photo image facts and full-text search; adds columns and tables
// only, so every layout 1 row stays as it was (and is indexed for search).
void v1_to_v2(Connection& db, const std::string& /*author*/) { db.exec(schema_v1_to_v2_sql()); }

// 2 → 3: guards only (triggers); no row changes. A layout 2 file whose
// issued inspection already had its links changed keeps them as they are.
void v2_to_v3(Connection& db, const std::string& /*author*/) { db.exec(schema_v2_to_v3_sql()); }

// Index k holds the step from version k.
const std::array<Step, kSchemaVersion> kSteps = {v0_to_v1, v1_to_v2, v2_to_v3};

}  // namespace

const std::string& schema_v0_sql() {
  static const std::string sql =
      "CREATE TABLE structure (id TEXT PRIMARY KEY, ref TEXT NOT NULL UNIQUE, name TEXT, notes TEXT);";
  return sql;
}

void migrate(Connection& db, int from_version, const std::string& author) {
  for (int v = from_version; v < kSchemaVersion; ++v) {
    kSteps[static_cast<size_t>(v)](db, author);
    // user_version is written in the same transaction as the step itself.
    db.exec("PRAGMA user_version = " + std::to_string(v + 1));
  }
}

}  // namespace soffit::storage
