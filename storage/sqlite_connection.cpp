#include "storage/sqlite_connection.hpp"

#include <sqlite3.h>

#include "storage/sqlite_statement.hpp"

namespace soffit::storage {

ErrorKind kind_for_sqlite_code(int rc) {
  switch (rc & 0xff) {
    case SQLITE_FULL: return ErrorKind::disk_full;
    case SQLITE_BUSY:
    case SQLITE_LOCKED: return ErrorKind::locked;
    case SQLITE_READONLY:
    case SQLITE_PERM: return ErrorKind::read_only;
    case SQLITE_CORRUPT: return ErrorKind::damaged;
    case SQLITE_NOTADB: return ErrorKind::not_sqlite;
    case SQLITE_CONSTRAINT: return ErrorKind::invalid;
    case SQLITE_CANTOPEN: return ErrorKind::not_found;
    default: return ErrorKind::io;
  }
}

Connection::Connection(const std::string& path, int flags, const std::string& name)
    : path_(name.empty() ? path : name) {
  const int rc = sqlite3_open_v2(path.c_str(), &db_, flags, nullptr);
  if (rc != SQLITE_OK) {
    const std::string msg = db_ ? sqlite3_errmsg(db_) : sqlite3_errstr(rc);
    close();
    throw StorageError(kind_for_sqlite_code(rc), path_, "cannot open: " + msg);
  }
  // Extended codes tell SQLITE_READONLY_DBMOVED and the like apart in messages.
  sqlite3_extended_result_codes(db_, 1);
}

Connection::~Connection() { close(); }

Connection::Connection(Connection&& other) noexcept : db_(other.db_), path_(std::move(other.path_)) {
  other.db_ = nullptr;
}

Connection& Connection::operator=(Connection&& other) noexcept {
  if (this != &other) {
    close();
    db_ = other.db_;
    path_ = std::move(other.path_);
    other.db_ = nullptr;
  }
  return *this;
}

void Connection::close() noexcept {
  if (db_) {
    // sqlite3_close_v2 defers the close until the last statement is finalised,
    // so a statement leaked by an exception cannot keep the file half-open.
    sqlite3_close_v2(db_);
    db_ = nullptr;
  }
}

void Connection::exec(std::string_view sql) {
  const char* tail = sql.data();
  const char* end = sql.data() + sql.size();
  while (tail < end) {
    sqlite3_stmt* raw = nullptr;
    const char* next = nullptr;
    const int rc = sqlite3_prepare_v2(db_, tail, static_cast<int>(end - tail), &raw, &next);
    if (rc != SQLITE_OK) fail(rc, "preparing SQL");
    if (raw == nullptr) break;  // only comments or white space were left
    Statement stmt(*this, raw);
    while (stmt.step()) {
    }
    tail = next;
  }
}

std::string Connection::query_text(std::string_view sql) {
  Statement stmt(*this, sql);
  return stmt.step() ? stmt.column_text(0) : std::string();
}

long long Connection::query_int(std::string_view sql) {
  Statement stmt(*this, sql);
  return stmt.step() ? stmt.column_int64(0) : 0;
}

int Connection::changes() const { return sqlite3_changes(db_); }

void Connection::fail(int rc, std::string_view context) const {
  std::string msg(context);
  msg += ": ";
  msg += db_ ? sqlite3_errmsg(db_) : sqlite3_errstr(rc);
  throw StorageError(kind_for_sqlite_code(rc), path_, msg);
}

}  // namespace soffit::storage
