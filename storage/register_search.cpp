#include "storage/register_search.hpp"

#include <algorithm>

#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

// A term is a run of characters the unicode61 tokenizer keeps: ASCII letters
// and digits, and every non-ASCII byte (letters of other scripts, accents).
bool is_term_char(unsigned char c) { return c >= 0x80 || (c >= '0' && c <= '9') || ((c | 0x20) >= 'a' && (c | 0x20) <= 'z'); }

// Each query: the hit's key, the structure reference, a title, a snippet and
// the bm25 score. Column weights favour the reference and name over notes.
struct KindQuery {
  SearchKind kind;
  const char* sql;
};

const KindQuery kQueries[] = {
    {SearchKind::structure,
     "SELECT s.id, s.ref, coalesce(s.name, ''), "
     "snippet(structure_search, -1, '[', ']', '…', 10), bm25(structure_search, 10.0, 5.0, 1.0) AS score "
     "FROM structure_search JOIN structure s ON s.rowid = structure_search.rowid "
     "WHERE structure_search MATCH ?1 ORDER BY score LIMIT ?2"},
    {SearchKind::inspection,
     "SELECT i.id, s.ref, i.inspection_date || ' revision ' || i.revision, "
     "snippet(inspection_search, -1, '[', ']', '…', 10), bm25(inspection_search) AS score "
     "FROM inspection_search JOIN inspection i ON i.rowid = inspection_search.rowid "
     "JOIN structure s ON s.id = i.structure_id "
     "WHERE inspection_search MATCH ?1 ORDER BY score LIMIT ?2"},
    {SearchKind::defect,
     "SELECT d.id, s.ref, trim(coalesce(d.ref, '') || ' ' || d.defect_type || ' ' || i.inspection_date), "
     "snippet(defect_search, -1, '[', ']', '…', 10), bm25(defect_search, 5.0, 3.0, 2.0, 1.0) AS score "
     "FROM defect_search JOIN defect d ON d.rowid = defect_search.rowid "
     "JOIN inspection i ON i.id = d.inspection_id JOIN structure s ON s.id = i.structure_id "
     "WHERE defect_search MATCH ?1 ORDER BY score LIMIT ?2"},
};

}  // namespace

const char* search_kind_name(SearchKind kind) {
  switch (kind) {
    case SearchKind::structure: return "structure";
    case SearchKind::inspection: return "inspection";
    case SearchKind::defect: return "defect";
  }
  return "structure";
}

std::string fts_query_from_user_text(const std::string& text) {
  std::vector<std::string> terms;
  std::string term;
  for (const char c : text) {
    if (is_term_char(static_cast<unsigned char>(c))) {
      term += c;
    } else if (!term.empty()) {
      terms.push_back(std::move(term));
      term.clear();
    }
  }
  if (!term.empty()) terms.push_back(std::move(term));
  // Terms hold letters and digits only, so wrapping them in double quotes
  // makes each a plain FTS5 string: no operator, column filter or quote left.
  std::string query;
  for (size_t i = 0; i < terms.size(); ++i) {
    if (i) query += ' ';
    query += '"' + terms[i] + '"';
    if (i + 1 == terms.size() && !(text.size() && (text.back() == ' ' || text.back() == '\t'))) query += '*';
  }
  return query;
}

std::vector<SearchHit> search_register(Connection& db, const std::string& text, int limit) {
  std::vector<SearchHit> hits;
  const std::string query = fts_query_from_user_text(text);
  if (query.empty() || limit <= 0) return hits;
  for (const auto& k : kQueries) {
    Statement q(db, k.sql);
    q.bind_all(query, limit);
    while (q.step())
      hits.push_back({k.kind, q.column_text(0), q.column_text(1), q.column_text(2), q.column_text(3),
                      q.column_double(4)});
  }
  std::stable_sort(hits.begin(), hits.end(), [](const SearchHit& a, const SearchHit& b) { return a.score < b.score; });
  if (hits.size() > static_cast<size_t>(limit)) hits.resize(static_cast<size_t>(limit));
  return hits;
}

void rebuild_search_index(Connection& db) {
  db.exec("INSERT INTO structure_search (structure_search) VALUES ('rebuild');"
          "INSERT INTO inspection_search (inspection_search) VALUES ('rebuild');"
          "INSERT INTO defect_search (defect_search) VALUES ('rebuild');");
}

}  // namespace soffit::storage
