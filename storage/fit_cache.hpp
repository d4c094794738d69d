#pragma once
// Fit results kept beside a section (table fit_cache, schema.cpp), keyed by a
// SHA-256 of everything the fit depends on: the section's readings (x, z, σ,
// excluded and check flags, in order) and the request (shape, fallback σ,
// springing level, robust, seed, Monte Carlo draws) and the program version.
//
// A stored result is returned only while that hash still matches. On top of
// that, the schema's triggers delete a section's cached results whenever one
// of its readings is inserted, changed or deleted (including by undo and
// redo), so a stale result cannot even be found by section. The cache is
// derived data: it is not in the undo journal, and writing it is not an edit.
#include <optional>
#include <string>
#include <string_view>

#include "geometry/analysis/profile_analysis.hpp"
#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

// What the fit of one section depends on besides its readings.
struct FitCacheKey {
  ProfileRequest request;       // shape, fit options (fallback σ, springing, robust), draws, seed
  std::string program_version;  // a new program may fit differently
};

// The hex SHA-256 of the canonical text of the inputs (fit_input_text).
std::string fit_input_hash(Connection& db, const std::string& section_id, const FitCacheKey& key);

// The canonical text that is hashed: one line per item, numbers as exact
// hexadecimal floating point (locale-independent, no rounding).
std::string fit_input_text(Connection& db, const std::string& section_id, const FitCacheKey& key);

// Stores (or replaces) the result for this section and shape. `result_json`
// must be valid JSON (exports/fit_report_json's text, or any compact JSON).
// Its own transaction; do not call it inside Project::edit. Throws
// StorageError(not_found) for an unknown section, (invalid) for bad JSON.
void store_fit_result(Connection& db, const std::string& author, const std::string& section_id,
                      const FitCacheKey& key, std::string_view result_json);

// The stored result if its inputs are unchanged; nullopt otherwise.
std::optional<std::string> find_fit_result(Connection& db, const std::string& section_id, const FitCacheKey& key);

}  // namespace soffit::storage
