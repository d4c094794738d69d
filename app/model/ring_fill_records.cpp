#include "app/model/ring_fill_records.hpp"

#include <cstdio>

#include "storage/observation_edits.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::app {

// Both queries repeat the ORDER BY of storage/export_queries.cpp (ring_counts_of,
// fill_depths_of) and check each row against the export's, so a change of
// order there leaves rows uneditable rather than edits landing on the wrong row.
std::vector<std::string> ring_count_ids(storage::Connection& db, const std::string& inspection_id,
                                        const std::vector<storage::RingCountFields>& counts) {
  storage::Statement q(db,
                       "SELECT r.id, r.span_id, r.face, r.position, r.rings FROM ring_count r JOIN span s "
                       "ON s.id = r.span_id WHERE r.inspection_id = ?1 ORDER BY s.span_index, r.face, r.rowid");
  q.bind(1, inspection_id);
  std::vector<std::string> ids;
  while (q.step() && ids.size() < counts.size()) {
    const storage::RingCountFields& c = counts[ids.size()];
    const bool same = q.column_text(1) == c.span_id && q.column_text(2) == c.face &&
                      q.column_text(3) == c.position && q.column_int64(4) == c.rings;
    ids.push_back(same ? q.column_text(0) : std::string());
  }
  ids.resize(counts.size());
  return ids;
}

std::vector<std::string> fill_depth_ids(storage::Connection& db, const std::string& inspection_id,
                                        const std::vector<storage::FillDepthFields>& fills) {
  storage::Statement q(db,
                       "SELECT f.id, f.span_id, f.chainage_m, f.method, f.depth_m FROM fill_depth f JOIN span s "
                       "ON s.id = f.span_id WHERE f.inspection_id = ?1 "
                       "ORDER BY s.span_index, f.chainage_m, f.offset_y_m, f.rowid");
  q.bind(1, inspection_id);
  std::vector<std::string> ids;
  while (q.step() && ids.size() < fills.size()) {
    const storage::FillDepthFields& f = fills[ids.size()];
    const bool same = q.column_text(1) == f.span_id && q.column_double(2) == f.chainage_m &&
                      q.column_text(3) == f.method && q.column_double(4) == f.depth_m;
    ids.push_back(same ? q.column_text(0) : std::string());
  }
  ids.resize(fills.size());
  return ids;
}

std::optional<double> span_joint_mm(const storage::SpanDetails& span) { return span.joint_thickness_mm; }

std::optional<double> default_ring_depth_mm(const storage::SpanDetails& span) {
  if (!span.unit_depth_mm) return std::nullopt;
  return *span.unit_depth_mm + span.joint_thickness_mm.value_or(0.0);
}

std::optional<double> ring_depth_mm(const storage::RingCountFields& count, const storage::SpanDetails& span) {
  if (!count.unit_depth_mm) return std::nullopt;
  return *count.unit_depth_mm + span.joint_thickness_mm.value_or(0.0);
}

std::optional<double> unit_depth_from_ring_depth(double ring_depth_mm, const storage::SpanDetails& span,
                                                 std::string& problem) {
  const double joint = span.joint_thickness_mm.value_or(0.0);
  // The project file takes unit depths of at least 1 mm (storage/observation_edits.cpp).
  if (ring_depth_mm - joint < 1.0) {
    char buf[160];
    std::snprintf(buf, sizeof buf, "Brick + joint: %g mm leaves no brick once the span's %g mm joint is taken off.",
                  ring_depth_mm, joint);
    problem = buf;
    return std::nullopt;
  }
  problem.clear();
  return ring_depth_mm - joint;
}

std::string ring_count_name(const std::string& span_label, const storage::RingCountFields& c) {
  return span_label + " " + c.face + " " + c.position;
}

std::string fill_method_words(const std::string& method) {
  if (method == "trial_pit") return "trial pit";
  if (method == "gpr") return "GPR";
  return method;
}

std::string fill_depth_name(const std::string& span_label, const storage::FillDepthFields& f) {
  char buf[48];
  std::snprintf(buf, sizeof buf, " at %.2f m (", f.chainage_m);
  return span_label + buf + fill_method_words(f.method) + ")";
}

std::string add_ring_count(storage::Project& project, const std::string& name, const storage::RingCountFields& f) {
  std::string id;
  project.edit("add ring count " + name,
               [&](storage::Connection& db) { id = storage::add_ring_count(db, project.author(), f); });
  return id;
}

void update_ring_count(storage::Project& project, const std::string& name, const std::string& id,
                       const storage::RingCountFields& f) {
  project.edit("edit ring count " + name,
               [&](storage::Connection& db) { storage::update_ring_count(db, project.author(), id, f); });
}

void delete_ring_count(storage::Project& project, const std::string& name, const std::string& id) {
  project.edit("delete ring count " + name, [&](storage::Connection& db) { storage::delete_ring_count(db, id); });
}

std::string add_fill_depth(storage::Project& project, const std::string& name, const storage::FillDepthFields& f) {
  std::string id;
  project.edit("add fill depth " + name,
               [&](storage::Connection& db) { id = storage::add_fill_depth(db, project.author(), f); });
  return id;
}

void update_fill_depth(storage::Project& project, const std::string& name, const std::string& id,
                       const storage::FillDepthFields& f) {
  project.edit("edit fill depth " + name,
               [&](storage::Connection& db) { storage::update_fill_depth(db, project.author(), id, f); });
}

void delete_fill_depth(storage::Project& project, const std::string& name, const std::string& id) {
  project.edit("delete fill depth " + name, [&](storage::Connection& db) { storage::delete_fill_depth(db, id); });
}

}  // namespace soffit::app
