#pragma once
// A prepared statement: bind parameters (1-based, as SQLite counts them),
// step through rows, read columns (0-based). Finalised when it goes out of scope.
#include <cstdint>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

struct sqlite3_stmt;

namespace soffit::storage {

class Connection;

class Statement {
 public:
  Statement(Connection& db, std::string_view sql);
  Statement(Connection& db, sqlite3_stmt* prepared);  // takes ownership
  ~Statement();
  Statement(const Statement&) = delete;
  Statement& operator=(const Statement&) = delete;

  Statement& bind(int index, std::nullptr_t);
  Statement& bind(int index, long long value);
  Statement& bind(int index, int value) { return bind(index, static_cast<long long>(value)); }
  Statement& bind(int index, bool value) { return bind(index, value ? 1LL : 0LL); }
  Statement& bind(int index, double value);
  Statement& bind(int index, std::string_view value);
  Statement& bind(int index, const std::string& value) { return bind(index, std::string_view(value)); }
  Statement& bind(int index, const char* value) { return bind(index, std::string_view(value)); }
  Statement& bind_blob(int index, const void* data, int size);
  template <typename T>
  Statement& bind(int index, const std::optional<T>& value) {
    return value ? bind(index, *value) : bind(index, nullptr);
  }

  // Binds ?1, ?2, … in order.
  template <typename... Args>
  Statement& bind_all(const Args&... args) {
    int i = 0;
    (bind(++i, args), ...);
    return *this;
  }

  // True while a row is available; false when done. Throws on error.
  bool step();
  // Steps to completion (INSERT, UPDATE, DELETE).
  void run();
  void reset();

  bool is_null(int col) const;
  long long column_int64(int col) const;
  double column_double(int col) const;
  std::string column_text(int col) const;  // "" for NULL
  std::optional<std::string> column_text_or_null(int col) const;
  std::optional<double> column_double_or_null(int col) const;
  std::optional<long long> column_int_or_null(int col) const;
  std::vector<unsigned char> column_blob(int col) const;

 private:
  Connection& db_;
  sqlite3_stmt* stmt_ = nullptr;
};

}  // namespace soffit::storage
