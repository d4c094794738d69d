#pragma once
// BEGIN IMMEDIATE … COMMIT, rolled back unless commit() ran: an exception
// anywhere in an edit leaves the file exactly as it was before the edit.
#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

class Transaction {
 public:
  // IMMEDIATE takes the write lock at the start, so a busy file fails before
  // any work is done rather than at COMMIT.
  explicit Transaction(Connection& db) : db_(db) { db_.exec("BEGIN IMMEDIATE"); }
  ~Transaction() {
    if (!done_) {
      try {
        db_.exec("ROLLBACK");
      } catch (...) {
        // SQLite may already have rolled back (SQLITE_FULL does); nothing to undo then.
      }
    }
  }
  Transaction(const Transaction&) = delete;
  Transaction& operator=(const Transaction&) = delete;

  void commit() {
    db_.exec("COMMIT");
    done_ = true;
  }
  void rollback() {
    done_ = true;
    db_.exec("ROLLBACK");
  }

 private:
  Connection& db_;
  bool done_ = false;
};

}  // namespace soffit::storage
