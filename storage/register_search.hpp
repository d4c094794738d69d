#pragma once
// Full-text search over the register (issue 3 "Full-text search"): structures
// (reference, name, notes), inspection notes and defects (label, type,
// element, notes), through the FTS5 tables of layout 2 (schema_v2.cpp).
#include <string>
#include <vector>

#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

enum class SearchKind { structure, inspection, defect };

struct SearchHit {
  SearchKind kind = SearchKind::structure;
  std::string id;             // the row's key in its own table
  std::string structure_ref;  // the structure it belongs to
  std::string title;          // name; inspection date; defect label and type
  std::string snippet;        // the matching text, matches in [brackets]
  double score = 0;           // FTS5 bm25: lower is better
};

// What the user typed becomes an FTS5 query of quoted terms, all required,
// the last one also matching as a prefix (so "Sallow Fo" finds "Sallow
// Ford"). Quotes, brackets, operators and other punctuation are never FTS5
// or SQL syntax. Empty if nothing searchable is left.
std::string fts_query_from_user_text(const std::string& text);

// Best hits first, at most `limit` of them across the three kinds.
std::vector<SearchHit> search_register(Connection& db, const std::string& text, int limit = 50);

// Rebuilds every search index from the register's rows (after a VACUUM by
// another tool, which may renumber the rowids the indexes point at).
void rebuild_search_index(Connection& db);

const char* search_kind_name(SearchKind kind);

}  // namespace soffit::storage
