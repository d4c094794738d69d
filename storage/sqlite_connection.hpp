#pragma once
// Owns one SQLite connection and turns SQLite result codes into StorageError.
//
// Every statement, scripts included, goes through sqlite3_prepare_v2: no SQL
// text is ever built from user data.
#include <string>
#include <string_view>

#include "storage/storage_error.hpp"

struct sqlite3;

namespace soffit::storage {

class Connection {
 public:
  Connection() = default;
  // flags are sqlite3_open_v2 flags; throws StorageError on failure.
  // `name` is the path messages show when `path` is a URI; default `path`.
  Connection(const std::string& path, int flags, const std::string& name = "");
  ~Connection();
  Connection(Connection&& other) noexcept;
  Connection& operator=(Connection&& other) noexcept;
  Connection(const Connection&) = delete;
  Connection& operator=(const Connection&) = delete;

  sqlite3* handle() const { return db_; }
  const std::string& path() const { return path_; }
  bool is_open() const { return db_ != nullptr; }

  // Runs every statement of `sql` in turn (schema scripts, pragmas).
  void exec(std::string_view sql);
  // Convenience for a pragma or query returning one value; empty if no row.
  std::string query_text(std::string_view sql);
  long long query_int(std::string_view sql);
  // Rows changed by the latest INSERT, UPDATE or DELETE.
  int changes() const;

  // Throws the StorageError that matches rc, with SQLite's own message.
  [[noreturn]] void fail(int rc, std::string_view context) const;

  void close() noexcept;

 private:
  sqlite3* db_ = nullptr;
  std::string path_;
};

// The error kind for a SQLite primary result code.
ErrorKind kind_for_sqlite_code(int rc);

}  // namespace soffit::storage
