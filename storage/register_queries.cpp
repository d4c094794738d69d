#include "storage/register_queries.hpp"

#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

constexpr const char* kStructureColumns =
    "s.id, s.ref, s.name, s.latitude_deg, s.longitude_deg, s.location_fictitious, s.carries, s.crosses, "
    "s.span_count, s.notes, s.created_at, s.modified_at, s.author";

StructureRecord read_structure(const Statement& q) {
  StructureRecord r;
  r.id = q.column_text(0);
  r.fields.ref = q.column_text(1);
  r.fields.name = q.column_text(2);
  r.fields.latitude_deg = q.column_double_or_null(3);
  r.fields.longitude_deg = q.column_double_or_null(4);
  r.fields.location_fictitious = q.column_int64(5) != 0;
  r.fields.carries = q.column_text(6);
  r.fields.crosses = q.column_text(7);
  if (auto n = q.column_int_or_null(8)) r.fields.span_count = static_cast<int>(*n);
  r.fields.notes = q.column_text(9);
  r.created_at = q.column_text(10);
  r.modified_at = q.column_text(11);
  r.author = q.column_text(12);
  return r;
}

std::vector<SectionRecord> sections_of(Connection& db, const std::string& inspection_id) {
  Statement q(db,
              "SELECT c.id, p.label, p.span_index, c.label, c.position_m, c.reference_face, c.direction, c.method, "
              "c.datum, (SELECT count(*) FROM reading r WHERE r.section_id = c.id), "
              "(SELECT count(*) FROM reading r WHERE r.section_id = c.id AND r.excluded = 1) "
              "FROM section_survey c JOIN span p ON p.id = c.span_id WHERE c.inspection_id = ?1 "
              "ORDER BY p.span_index, c.position_m, c.label");
  q.bind(1, inspection_id);
  std::vector<SectionRecord> out;
  while (q.step()) {
    SectionRecord s;
    s.id = q.column_text(0);
    s.span_label = q.column_text(1);
    s.span_index = static_cast<int>(q.column_int64(2));
    s.label = q.column_text(3);
    s.position_m = q.column_double_or_null(4);
    s.reference_face = q.column_text(5);
    s.direction = q.column_text(6);
    s.method = q.column_text(7);
    s.datum = q.column_text(8);
    s.reading_count = static_cast<int>(q.column_int64(9));
    s.excluded_count = static_cast<int>(q.column_int64(10));
    out.push_back(std::move(s));
  }
  return out;
}

}  // namespace

std::optional<StructureRecord> find_structure(Connection& db, const std::string& ref) {
  Statement q(db, std::string("SELECT ") + kStructureColumns + " FROM structure s WHERE s.ref = ?1");
  q.bind(1, ref);
  if (!q.step()) return std::nullopt;
  return read_structure(q);
}

std::vector<StructureSummary> list_structures(Connection& db, int limit, int offset) {
  Statement q(db, std::string("SELECT ") + kStructureColumns +
                      ", (SELECT count(*) FROM span p WHERE p.structure_id = s.id)"
                      ", (SELECT count(*) FROM inspection i WHERE i.structure_id = s.id)"
                      ", (SELECT count(*) FROM section_survey c JOIN inspection i ON i.id = c.inspection_id"
                      "   WHERE i.structure_id = s.id)"
                      ", (SELECT max(inspection_date) FROM inspection i WHERE i.structure_id = s.id)"
                      // The latest visit's worst defect, for the register's 'severe defects' filter.
                      ", (SELECT max(d.severity) FROM defect d WHERE d.inspection_id ="
                      "   (SELECT i.id FROM inspection i WHERE i.structure_id = s.id"
                      "    ORDER BY i.inspection_date DESC, i.revision DESC LIMIT 1))"
                      " FROM structure s ORDER BY s.ref LIMIT ?1 OFFSET ?2");
  q.bind_all(limit, offset);
  std::vector<StructureSummary> out;
  while (q.step()) {
    StructureSummary s;
    s.structure = read_structure(q);
    s.span_count = static_cast<int>(q.column_int64(13));
    s.inspection_count = static_cast<int>(q.column_int64(14));
    s.section_count = static_cast<int>(q.column_int64(15));
    s.latest_visit = q.column_text(16);
    if (const auto worst = q.column_int_or_null(17)) s.worst_severity = static_cast<int>(*worst);
    out.push_back(std::move(s));
  }
  return out;
}

std::optional<StructureDetail> structure_detail(Connection& db, const std::string& ref) {
  auto structure = find_structure(db, ref);
  if (!structure) return std::nullopt;
  StructureDetail d;
  d.structure = std::move(*structure);
  {
    Statement q(db, "SELECT id, span_index, label FROM span WHERE structure_id = ?1 ORDER BY span_index");
    q.bind(1, d.structure.id);
    while (q.step()) d.spans.push_back({q.column_text(0), static_cast<int>(q.column_int64(1)), q.column_text(2)});
  }
  Statement q(db,
              "SELECT id, inspection_date, kind, inspector, status, revision FROM inspection "
              "WHERE structure_id = ?1 ORDER BY inspection_date, revision");
  q.bind(1, d.structure.id);
  while (q.step()) {
    InspectionRecord i;
    i.id = q.column_text(0);
    i.date = q.column_text(1);
    i.kind = q.column_text(2);
    i.inspector = q.column_text(3);
    i.status = q.column_text(4);
    i.revision = static_cast<int>(q.column_int64(5));
    d.inspections.push_back(std::move(i));
  }
  for (auto& i : d.inspections) i.sections = sections_of(db, i.id);
  return d;
}

}  // namespace soffit::storage
