#include "storage/sqlite_statement.hpp"

#include <sqlite3.h>

#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

Statement::Statement(Connection& db, std::string_view sql) : db_(db) {
  const int rc = sqlite3_prepare_v2(db.handle(), sql.data(), static_cast<int>(sql.size()), &stmt_, nullptr);
  if (rc != SQLITE_OK) db_.fail(rc, "preparing SQL");
}

Statement::Statement(Connection& db, sqlite3_stmt* prepared) : db_(db), stmt_(prepared) {}

Statement::~Statement() { sqlite3_finalize(stmt_); }

namespace {
void check_bind(Connection& db, int rc) {
  if (rc != SQLITE_OK) db.fail(rc, "binding a parameter");
}
}  // namespace

Statement& Statement::bind(int index, std::nullptr_t) {
  check_bind(db_, sqlite3_bind_null(stmt_, index));
  return *this;
}
Statement& Statement::bind(int index, long long value) {
  check_bind(db_, sqlite3_bind_int64(stmt_, index, value));
  return *this;
}
Statement& Statement::bind(int index, double value) {
  check_bind(db_, sqlite3_bind_double(stmt_, index, value));
  return *this;
}
Statement& Statement::bind(int index, std::string_view value) {
  check_bind(db_, sqlite3_bind_text64(stmt_, index, value.data(), value.size(), SQLITE_TRANSIENT, SQLITE_UTF8));
  return *this;
}
Statement& Statement::bind_blob(int index, const void* data, int size) {
  check_bind(db_, sqlite3_bind_blob(stmt_, index, data, size, SQLITE_TRANSIENT));
  return *this;
}

bool Statement::step() {
  const int rc = sqlite3_step(stmt_);
  if (rc == SQLITE_ROW) return true;
  if (rc == SQLITE_DONE) return false;
  db_.fail(rc, "running SQL");
}

void Statement::run() {
  while (step()) {
  }
}

void Statement::reset() {
  sqlite3_reset(stmt_);
  sqlite3_clear_bindings(stmt_);
}

bool Statement::is_null(int col) const { return sqlite3_column_type(stmt_, col) == SQLITE_NULL; }
long long Statement::column_int64(int col) const { return sqlite3_column_int64(stmt_, col); }
double Statement::column_double(int col) const { return sqlite3_column_double(stmt_, col); }

std::string Statement::column_text(int col) const {
  const auto* p = sqlite3_column_text(stmt_, col);
  if (!p) return {};
  return std::string(reinterpret_cast<const char*>(p), static_cast<size_t>(sqlite3_column_bytes(stmt_, col)));
}

std::optional<std::string> Statement::column_text_or_null(int col) const {
  if (is_null(col)) return std::nullopt;
  return column_text(col);
}
std::optional<double> Statement::column_double_or_null(int col) const {
  if (is_null(col)) return std::nullopt;
  return column_double(col);
}
std::optional<long long> Statement::column_int_or_null(int col) const {
  if (is_null(col)) return std::nullopt;
  return column_int64(col);
}

std::vector<unsigned char> Statement::column_blob(int col) const {
  const auto* p = static_cast<const unsigned char*>(sqlite3_column_blob(stmt_, col));
  const int n = sqlite3_column_bytes(stmt_, col);
  return p ? std::vector<unsigned char>(p, p + n) : std::vector<unsigned char>();
}

}  // namespace soffit::storage
