#include "storage/fit_cache.hpp"

#include <array>
#include <charconv>

#include "storage/row_stamp.hpp"
#include "storage/sha256.hpp"
#include "storage/sqlite_statement.hpp"
#include "storage/sqlite_transaction.hpp"
#include "storage/storage_error.hpp"

namespace soffit::storage {
namespace {

// Exact and locale-independent: 0.1 is written 1.999999999999ap-4, so two
// values hash alike only if they are the same double.
std::string exact(double v) {
  std::array<char, 64> buf{};
  const auto r = std::to_chars(buf.data(), buf.data() + buf.size(), v, std::chars_format::hex);
  return std::string(buf.data(), r.ptr);
}

bool section_exists(Connection& db, const std::string& section_id) {
  Statement q(db, "SELECT 1 FROM section_survey WHERE id = ?1");
  q.bind(1, section_id);
  return q.step();
}

}  // namespace

std::string fit_input_text(Connection& db, const std::string& section_id, const FitCacheKey& key) {
  if (!section_exists(db, section_id)) throw StorageError(ErrorKind::not_found, db.path(), "no section " + section_id);
  const ProfileRequest& r = key.request;
  std::string t = "soffit-fit-input 1\n";
  t += "program " + key.program_version + "\n";
  t += "shape " + r.shape + "\n";
  t += "fallback_sigma_m " + exact(r.fit.fallback_sigma_m) + "\n";
  t += "springing_z " + (r.fit.springing_z ? exact(*r.fit.springing_z) : std::string("ends")) + "\n";
  t += std::string("robust ") + (r.fit.robust ? "1" : "0") + "\n";
  t += "seed " + std::to_string(r.uncertainty.seed) + "\n";
  t += "draws " + std::to_string(r.uncertainty.monte_carlo_draws) + "\n";
  Statement q(db, "SELECT seq, x_m, z_m, sigma_m, excluded, is_check FROM reading WHERE section_id = ?1 ORDER BY seq");
  q.bind(1, section_id);
  while (q.step()) {
    t += "reading " + std::to_string(q.column_int64(0)) + " " + exact(q.column_double(1)) + " " +
         exact(q.column_double(2)) + " " + exact(q.column_double(3)) + " " + std::to_string(q.column_int64(4)) +
         " " + std::to_string(q.column_int64(5)) + "\n";
  }
  return t;
}

std::string fit_input_hash(Connection& db, const std::string& section_id, const FitCacheKey& key) {
  const std::string text = fit_input_text(db, section_id, key);
  return sha256_hex(text.data(), text.size());
}

void store_fit_result(Connection& db, const std::string& author, const std::string& section_id,
                      const FitCacheKey& key, std::string_view result_json) {
  Transaction t(db);
  // Hashed inside the transaction, so the readings cannot change in between.
  const std::string hash = fit_input_hash(db, section_id, key);
  {
    Statement valid(db, "SELECT json_valid(?1)");
    valid.bind(1, result_json);
    if (!valid.step() || valid.column_int64(0) != 1)
      throw StorageError(ErrorKind::invalid, db.path(), "the fit result to cache is not valid JSON");
  }
  const std::string now = utc_now();
  Statement(db,
            "INSERT INTO fit_cache (id, section_id, shape, input_hash, result_json, created_at, modified_at, author) "
            "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?6, ?7) "
            "ON CONFLICT (section_id, shape) DO UPDATE SET input_hash = excluded.input_hash, "
            "result_json = excluded.result_json, modified_at = excluded.modified_at, author = excluded.author")
      .bind_all(new_uuid(), section_id, key.request.shape, hash, result_json, now, author)
      .run();
  t.commit();
}

std::optional<std::string> find_fit_result(Connection& db, const std::string& section_id, const FitCacheKey& key) {
  const std::string hash = fit_input_hash(db, section_id, key);
  Statement q(db, "SELECT result_json FROM fit_cache WHERE section_id = ?1 AND shape = ?2 AND input_hash = ?3");
  q.bind_all(section_id, key.request.shape, hash);
  if (!q.step()) return std::nullopt;
  return q.column_text(0);
}

}  // namespace soffit::storage
