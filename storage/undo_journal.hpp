#pragma once
// Undo and redo through SQLite's session extension (sqlite.org/sessionintro.html).
//
// Each edit runs in its own transaction with a session attached to the user's
// tables (schema.hpp journaled_tables); the changeset it yields is stored in
// edit_journal in that same transaction. Undo applies the inverted changeset,
// redo the original; both are transactions too. Because the journal lives in
// the file, undo and redo survive closing and reopening the project. A new
// edit discards the undone entries (no branching history).
#include <functional>
#include <string>
#include <string_view>

#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

// Entries kept; older ones are dropped so the journal cannot grow without bound.
inline constexpr int kJournalDepth = 500;

void record_edit(Connection& db, std::string_view label, const std::string& author,
                 const std::function<void(Connection&)>& change);

// False when there is nothing to undo / redo. Throws invalid when the rows
// have changed in a way the journal cannot reverse (for example the inspection
// was issued since); the file is then left as it was.
bool undo_last_edit(Connection& db);
bool redo_next_edit(Connection& db);

std::string next_undo_label(Connection& db);

// Changes whenever an edit is made, undone or redone: views that show
// something derived (a fit of the latest visit) compare it to know when to redo it.
std::string journal_state(Connection& db);

// Drops every entry: what the file holds now is where undo stops (a project
// written by the app itself, such as the demo, starts with nothing to undo).
void forget_edit_history(Connection& db);
std::string next_redo_label(Connection& db);

}  // namespace soffit::storage
