#include "storage/project_file.hpp"

#include <sqlite3.h>

#include <cstdio>

#include "storage/file_probe.hpp"
#include "storage/migrations.hpp"
#include "storage/row_stamp.hpp"
#include "storage/schema.hpp"
#include "storage/sqlite_statement.hpp"
#include "storage/sqlite_transaction.hpp"
#include "storage/undo_journal.hpp"

namespace soffit::storage {
namespace {

// How long to wait for a lock another process holds before calling the file
// locked: long enough for a checkpoint, short enough not to hang the app.
constexpr int kBusyTimeoutMs = 250;

void set_meta(Connection& db, std::string_view key, std::string_view value) {
  Statement(db, "INSERT INTO project_meta (key, value) VALUES (?1, ?2) "
                "ON CONFLICT (key) DO UPDATE SET value = excluded.value")
      .bind_all(key, value)
      .run();
}

std::string get_meta(Connection& db, std::string_view key) {
  Statement s(db, "SELECT value FROM project_meta WHERE key = ?1");
  s.bind(1, key);
  return s.step() ? s.column_text(0) : std::string();
}

// Connection settings every session needs (they are per connection, not stored).
void configure(Connection& db) {
  sqlite3_busy_timeout(db.handle(), kBusyTimeoutMs);
  db.exec("PRAGMA foreign_keys = ON");
  db.exec("PRAGMA synchronous = FULL");  // a commit is on disk before we report it
  // One editor at a time: the exclusive lock is held from the first write to
  // close, and WAL then keeps its index in process memory (no -shm file).
  if (!sqlite3_db_readonly(db.handle(), "main")) db.exec("PRAGMA locking_mode = EXCLUSIVE");
}

// Runs quick_check or integrity_check; throws damaged with SQLite's first complaint.
void check_integrity(Connection& db, bool full) {
  Statement s(db, full ? "PRAGMA integrity_check(20)" : "PRAGMA quick_check(20)");
  std::string problems;
  while (s.step()) {
    const std::string line = s.column_text(0);
    if (line == "ok") return;
    if (!problems.empty()) problems += "; ";
    problems += line;
  }
  throw StorageError(ErrorKind::damaged, db.path(),
                     "the project file is damaged (" + problems +
                         "); it was not changed. Restore a backup or send the file for recovery");
}

// Any SQLite error while we first read the file means its content is not what
// the header promised.
template <typename F>
auto reading_header(const std::string& path, F&& f) {
  try {
    return f();
  } catch (const StorageError& e) {
    if (e.kind() == ErrorKind::not_sqlite || e.kind() == ErrorKind::io)
      throw StorageError(ErrorKind::damaged, path, std::string("the project file is damaged: ") + e.what());
    throw;
  }
}

// A read-only connection to a WAL database creates -wal and -shm files beside
// it and cannot remove them, so the next editor would take them for a crash.
// Instead: a writable file is viewed through an exclusive read-write
// connection that never writes a row (SQLite removes its -wal at close); a
// file nobody may write, with no -wal pending, cannot change under us and is
// opened "immutable", which creates nothing at all.
Connection open_for_viewing(const std::string& path, const FileProbe& probe) {
  if (probe.writable && probe.folder_writable)
    return Connection(path, SQLITE_OPEN_READWRITE | SQLITE_OPEN_EXRESCODE);
  if (probe.wal_present) return Connection(path, SQLITE_OPEN_READONLY | SQLITE_OPEN_EXRESCODE);
  std::string uri = "file:";
  for (char c : path) {
    if (c == '?' || c == '#' || c == '%') {
      char buf[4];
      std::snprintf(buf, sizeof buf, "%%%02X", static_cast<unsigned char>(c));
      uri += buf;
    } else {
      uri += c;
    }
  }
  uri += "?immutable=1";
  return Connection(uri, SQLITE_OPEN_READONLY | SQLITE_OPEN_URI | SQLITE_OPEN_EXRESCODE, path);
}

}  // namespace

Project::Project(Connection db, std::string author, Access access)
    : db_(std::move(db)), author_(std::move(author)), access_(access) {}

Project& Project::operator=(Project&& other) noexcept {
  if (this != &other) {
    close();
    db_ = std::move(other.db_);
    author_ = std::move(other.author_);
    access_ = other.access_;
    report_ = other.report_;
  }
  return *this;
}

Project::~Project() { close(); }

void Project::close() {
  if (!db_.is_open()) return;
  if (access_ == Access::edit) {
    try {
      Transaction t(db_);
      set_meta(db_, "open_state", "closed");
      t.commit();
    } catch (...) {
      // A full disk can refuse even this; the file then reads as uncleanly
      // closed and gets the full check next time, which is the safe side.
    }
  }
  db_.close();
}

Project Project::create(const std::string& path, const std::string& author) {
  const FileProbe probe = probe_file(path);
  if (probe.exists)
    throw StorageError(ErrorKind::already_exists, path, "a file is already there; Soffit never replaces a file");
  Connection db(path, SQLITE_OPEN_READWRITE | SQLITE_OPEN_CREATE | SQLITE_OPEN_EXRESCODE);
  configure(db);
  db.exec("PRAGMA journal_mode = WAL");
  {
    Transaction t(db);
    db.exec("PRAGMA application_id = " + std::to_string(kApplicationId));
    db.exec(schema_v1_sql());
    db.exec("PRAGMA user_version = 1");
    migrate(db, 1, author);  // sets user_version to kSchemaVersion
    set_meta(db, "project_id", new_uuid());
    set_meta(db, "created_at", utc_now());
    set_meta(db, "created_by", author);
    set_meta(db, "open_state", "open");
    t.commit();
  }
  return Project(std::move(db), author, Access::edit);
}

Project Project::open(const std::string& path, const std::string& author, Access access) {
  const FileProbe probe = probe_file(path);
  if (!probe.exists) throw StorageError(ErrorKind::not_found, path, "no such project file");
  if (probe.empty) throw StorageError(ErrorKind::not_sqlite, path, "the file is empty; it is not a Soffit project");
  if (!probe.sqlite_header)
    throw StorageError(ErrorKind::not_sqlite, path, "this is not a Soffit project file (not a SQLite database)");
  if (access == Access::edit && (!probe.writable || !probe.folder_writable))
    throw StorageError(ErrorKind::read_only, path,
                       probe.writable ? "the folder holding the project may not be written; copy the project "
                                        "to a writable folder to edit it"
                                      : "the file is read-only; open it for viewing, or copy it to edit it");
  if (probe.truncated)
    throw StorageError(ErrorKind::damaged, path,
                       "the project file is damaged (shorter than its header says: truncated); it was not "
                       "changed. Restore a backup");

  Connection db = access == Access::edit
                      ? Connection(path, SQLITE_OPEN_READWRITE | SQLITE_OPEN_EXRESCODE)
                      : open_for_viewing(path, probe);
  configure(db);

  const long long app_id = reading_header(path, [&] { return db.query_int("PRAGMA application_id"); });
  const long long version = db.query_int("PRAGMA user_version");
  if (app_id != kApplicationId)
    throw StorageError(ErrorKind::foreign, path,
                       "this SQLite database belongs to another program (application_id " + std::to_string(app_id) +
                           "); Soffit leaves it untouched");
  if (version > kSchemaVersion)
    throw StorageError(ErrorKind::newer_version, path,
                       "made by a newer Soffit (project format " + std::to_string(version) + ", this program reads up to " +
                           std::to_string(kSchemaVersion) + "); update Soffit to open it");

  OpenReport report;
  const bool has_meta = db.query_int("SELECT count(*) FROM sqlite_schema WHERE name = 'project_meta'") > 0;
  report.unclean_close = probe.wal_present || (has_meta && get_meta(db, "open_state") == "open");
  // Before migrating a file we are about to rewrite, make sure it is whole.
  report.full_check = report.unclean_close || version < kSchemaVersion;
  report.check_skipped = !report.full_check && probe.size > kQuickCheckMaxBytes;
  if (!report.check_skipped)
    reading_header(path, [&] {
      check_integrity(db, report.full_check);
      return 0;
    });

  if (access == Access::view) {
    if (version < kSchemaVersion)
      throw StorageError(ErrorKind::read_only, path,
                         "made by an older Soffit (project format " + std::to_string(version) +
                             "); open it for editing once to bring it up to date");
    Project p(std::move(db), author, access);
    p.report_ = report;
    return p;
  }

  {
    // A migration that fails rolls back to the file exactly as it was.
    Transaction t(db);
    if (version < kSchemaVersion) {
      migrate(db, static_cast<int>(version), author);
      report.migrated_from = static_cast<int>(version);
    }
    if (!has_meta || get_meta(db, "project_id").empty()) set_meta(db, "project_id", new_uuid());
    set_meta(db, "open_state", "open");
    set_meta(db, "last_opened_at", utc_now());
    set_meta(db, "last_opened_by", author);
    t.commit();
  }
  // WAL lets a killed process lose at most the edit in flight, never earlier
  // ones. Set after migrating so a refused migration leaves the header as it was.
  db.exec("PRAGMA journal_mode = WAL");
  Project p(std::move(db), author, access);
  p.report_ = report;
  return p;
}

void Project::require_edit_access() const {
  if (access_ != Access::edit)
    throw StorageError(ErrorKind::read_only, path(), "the project is open for viewing only");
}

void Project::edit(std::string_view label, const std::function<void(Connection&)>& change) {
  require_edit_access();
  record_edit(db_, label, author_, change);
}

bool Project::undo() {
  require_edit_access();
  return undo_last_edit(db_);
}

bool Project::redo() {
  require_edit_access();
  return redo_next_edit(db_);
}

std::string Project::undo_label() { return next_undo_label(db_); }
std::string Project::redo_label() { return next_redo_label(db_); }

}  // namespace soffit::storage
