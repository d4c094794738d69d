#define SQLITE_ENABLE_SESSION 1
#define SQLITE_ENABLE_PREUPDATE_HOOK 1
#include "storage/undo_journal.hpp"

#include <sqlite3.h>

#include <memory>
#include <vector>

#include "storage/row_stamp.hpp"
#include "storage/schema.hpp"
#include "storage/sqlite_statement.hpp"
#include "storage/sqlite_transaction.hpp"

namespace soffit::storage {
namespace {

struct SessionDeleter {
  void operator()(sqlite3_session* s) const { sqlite3session_delete(s); }
};
using SessionPtr = std::unique_ptr<sqlite3_session, SessionDeleter>;

struct Changeset {
  int size = 0;
  void* data = nullptr;
  ~Changeset() { sqlite3_free(data); }
};

// A row the changeset deletes may already be gone through ON DELETE CASCADE of
// its parent in the same changeset: skipping it is exact. Anything else means
// the rows are not as the journal left them, so the whole undo is refused.
int on_conflict(void* /*ctx*/, int conflict, sqlite3_changeset_iter* it) {
  const char* table = nullptr;
  int columns = 0, op = 0, indirect = 0;
  sqlite3changeset_op(it, &table, &columns, &op, &indirect);
  if (conflict == SQLITE_CHANGESET_NOTFOUND && op == SQLITE_DELETE) return SQLITE_CHANGESET_OMIT;
  return SQLITE_CHANGESET_ABORT;
}

void apply(Connection& db, int size, void* data, const char* what) {
  const int rc = sqlite3changeset_apply(db.handle(), size, data, nullptr, on_conflict, nullptr);
  if (rc == SQLITE_ABORT || (rc & 0xff) == SQLITE_CONSTRAINT) {
    throw StorageError(ErrorKind::invalid, db.path(),
                       std::string("cannot ") + what +
                           ": the records have changed since (or are now read-only); nothing was changed");
  }
  if (rc != SQLITE_OK) db.fail(rc, std::string("cannot ") + what);
}

struct JournalEntry {
  long long seq = 0;
  std::vector<unsigned char> changeset;
};

bool load_entry(Connection& db, const char* sql, JournalEntry& out) {
  Statement s(db, sql);
  if (!s.step()) return false;
  out.seq = s.column_int64(0);
  out.changeset = s.column_blob(1);
  return true;
}

std::string label_of(Connection& db, const char* sql) {
  Statement s(db, sql);
  return s.step() ? s.column_text(0) : std::string();
}

}  // namespace

void record_edit(Connection& db, std::string_view label, const std::string& author,
                 const std::function<void(Connection&)>& change) {
  Transaction t(db);
  sqlite3_session* raw = nullptr;
  if (const int rc = sqlite3session_create(db.handle(), "main", &raw); rc != SQLITE_OK)
    db.fail(rc, "starting the undo record");
  SessionPtr session(raw);
  for (const char* const* table = journaled_tables(); *table; ++table) {
    if (const int rc = sqlite3session_attach(session.get(), *table); rc != SQLITE_OK)
      db.fail(rc, "starting the undo record");
  }

  change(db);

  Changeset cs;
  if (const int rc = sqlite3session_changeset(session.get(), &cs.size, &cs.data); rc != SQLITE_OK)
    db.fail(rc, "recording the edit for undo");
  session.reset();
  if (cs.size > 0) {
    db.exec("DELETE FROM edit_journal WHERE undone = 1");
    Statement ins(db, "INSERT INTO edit_journal (label, author, at, changeset) VALUES (?1, ?2, ?3, ?4)");
    ins.bind_all(label, author, utc_now());
    ins.bind_blob(4, cs.data, cs.size);
    ins.run();
    Statement trim(db, "DELETE FROM edit_journal WHERE seq <= (SELECT max(seq) FROM edit_journal) - ?1");
    trim.bind(1, kJournalDepth).run();
  }
  t.commit();
}

bool undo_last_edit(Connection& db) {
  Transaction t(db);
  JournalEntry e;
  if (!load_entry(db, "SELECT seq, changeset FROM edit_journal WHERE undone = 0 ORDER BY seq DESC LIMIT 1", e))
    return false;
  int inv_size = 0;
  void* inv = nullptr;
  if (const int rc = sqlite3changeset_invert(static_cast<int>(e.changeset.size()), e.changeset.data(), &inv_size, &inv);
      rc != SQLITE_OK)
    db.fail(rc, "cannot undo");
  std::unique_ptr<void, decltype(&sqlite3_free)> guard(inv, sqlite3_free);
  apply(db, inv_size, inv, "undo");
  Statement(db, "UPDATE edit_journal SET undone = 1 WHERE seq = ?1").bind(1, e.seq).run();
  t.commit();
  return true;
}

bool redo_next_edit(Connection& db) {
  Transaction t(db);
  JournalEntry e;
  if (!load_entry(db, "SELECT seq, changeset FROM edit_journal WHERE undone = 1 ORDER BY seq ASC LIMIT 1", e))
    return false;
  apply(db, static_cast<int>(e.changeset.size()), e.changeset.data(), "redo");
  Statement(db, "UPDATE edit_journal SET undone = 0 WHERE seq = ?1").bind(1, e.seq).run();
  t.commit();
  return true;
}

std::string next_undo_label(Connection& db) {
  return label_of(db, "SELECT label FROM edit_journal WHERE undone = 0 ORDER BY seq DESC LIMIT 1");
}

std::string next_redo_label(Connection& db) {
  return label_of(db, "SELECT label FROM edit_journal WHERE undone = 1 ORDER BY seq ASC LIMIT 1");
}

std::string journal_state(Connection& db) {
  Statement q(db, "SELECT coalesce(max(seq), 0) || ':' || coalesce(sum(undone), 0) FROM edit_journal");
  return q.step() ? q.column_text(0) : std::string();
}

void forget_edit_history(Connection& db) { Statement(db, "DELETE FROM edit_journal").run(); }

}  // namespace soffit::storage
