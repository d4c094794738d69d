#pragma once
// A Soffit project: one SQLite file (*.soffit) that is the document itself
// (no Save button; every edit is committed as it is made).
//
// Opening checks, in order, and refuses with a typed StorageError without
// writing a byte: missing file, not a SQLite file, read-only file or folder,
// truncated, locked by another process, foreign application_id, newer
// user_version, failed integrity check. A file last closed uncleanly (the
// open marker still set, or a -wal file left beside it) gets the full
// integrity_check; a clean one the faster quick_check, unless it is larger
// than kQuickCheckMaxBytes: quick_check reads every page (1.7 s for a
// 720 MB register of 60,000 structures), which would make every open of a
// national register slow although nothing suggests damage.
#include <functional>
#include <string>
#include <string_view>

#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

enum class Access {
  edit,  // exclusive: one Soffit process edits a project at a time
  view,  // read-only: never writes, not even the open marker
};

inline constexpr long long kQuickCheckMaxBytes = 64LL * 1024 * 1024;

struct OpenReport {
  bool unclean_close = false;        // marker set or -wal present at open
  bool full_check = false;           // integrity_check ran (else quick_check)
  bool check_skipped = false;        // clean and above kQuickCheckMaxBytes: no check ran
  int migrated_from = -1;            // earlier version migrated from; -1 = none
};

class Project {
 public:
  // Refuses (already_exists) if anything is at `path`.
  static Project create(const std::string& path, const std::string& author);
  static Project open(const std::string& path, const std::string& author, Access access = Access::edit);

  Project(Project&&) noexcept = default;
  Project& operator=(Project&&) noexcept;
  ~Project();

  // Marks the file cleanly closed and closes it. Safe to call twice.
  void close();

  Connection& db() { return db_; }
  const std::string& path() const { return db_.path(); }
  const std::string& author() const { return author_; }
  Access access() const { return access_; }
  const OpenReport& report() const { return report_; }

  // Runs `change` as one edit: its own transaction, recorded in the undo
  // journal under `label`. Throws (and leaves the file as it was) on failure.
  void edit(std::string_view label, const std::function<void(Connection&)>& change);

  // Undo the latest edit / redo the latest undone one; false if there is none.
  bool undo();
  bool redo();
  std::string undo_label();  // "" when nothing to undo
  std::string redo_label();

 private:
  Project(Connection db, std::string author, Access access);
  void require_edit_access() const;

  Connection db_;
  std::string author_;
  Access access_ = Access::edit;
  OpenReport report_;
};

}  // namespace soffit::storage
