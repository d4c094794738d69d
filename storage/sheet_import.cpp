#include "storage/sheet_import.hpp"

#include "storage/register_edits.hpp"
#include "storage/register_queries.hpp"
#include "storage/row_stamp.hpp"
#include "storage/sheet_json.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

std::string direction_key(const std::optional<SectionDirection>& d) {
  if (!d) return {};
  return *d == SectionDirection::skew ? "skew" : "square";
}

template <typename T>
std::optional<T> non_empty(const std::optional<T>& v) {
  return v;
}
std::optional<std::string> non_empty(const std::string& s) {
  if (s.empty()) return std::nullopt;
  return s;
}

void require_new_section(Connection& db, const std::string& inspection_id, const std::string& span_id,
                         const SheetTarget& target) {
  Statement q(db, "SELECT 1 FROM section_survey WHERE inspection_id = ?1 AND span_id = ?2 AND label = ?3");
  q.bind_all(inspection_id, span_id, target.section);
  if (q.step())
    throw StorageError(ErrorKind::invalid, db.path(),
                       "section " + target.section + " of span " + std::to_string(target.span_index) + " of " +
                           target.structure_ref + " on " + target.date +
                           " is already in the project; nothing was overwritten (choose another --section)");
}

}  // namespace

ImportResult import_sheet(Project& project, const SurveySheet& sheet, const SheetTarget& target) {
  ImportResult result;
  const std::string& author = project.author();
  project.edit("import " + target.structure_ref + " S" + std::to_string(target.span_index) + " " + target.section +
                   " " + target.date,
               [&](Connection& db) {
                 if (auto s = find_structure(db, target.structure_ref)) {
                   result.structure_id = s->id;
                 } else {
                   StructureFields f;
                   f.ref = target.structure_ref;
                   f.name = sheet.metadata.structure_name.value_or("");
                   result.structure_id = insert_structure(db, author, f);
                   result.structure_created = true;
                 }
                 const std::string span_id = ensure_span(db, author, result.structure_id, target.span_index);
                 result.inspection_id = ensure_inspection(db, author, result.structure_id, target.date);
                 require_new_section(db, result.inspection_id, span_id, target);

                 const std::string now = utc_now();
                 result.section_id = new_uuid();
                 Statement(db,
                           "INSERT INTO section_survey (id, inspection_id, span_id, label, position_m, reference_face, "
                           "direction, method, datum, sheet_json, notes, created_at, modified_at, author) "
                           "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?12, ?13)")
                     .bind_all(result.section_id, result.inspection_id, span_id, target.section,
                               sheet.metadata.position_m, sheet.metadata.reference_face,
                               non_empty(direction_key(sheet.metadata.direction)), method_key(sheet.method),
                               sheet.metadata.datum, sheet_layout_to_json(sheet), sheet.metadata.note, now, author)
                     .run();

                 Statement ins(db,
                               "INSERT INTO reading (id, section_id, seq, x_m, z_m, sigma_m, excluded, exclusion_reason, "
                               "is_check, source_line, raw_cells_json, note, created_at, modified_at, author) "
                               "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?13, ?14)");
                 for (size_t i = 0; i < sheet.readings.size(); ++i) {
                   const Reading& r = sheet.readings[i];
                   std::optional<std::string> raw;
                   if (i < sheet.raw_rows.size()) raw = cells_to_json(sheet.raw_rows[i].cells);
                   ins.reset();
                   ins.bind_all(new_uuid(), result.section_id, static_cast<long long>(i), r.x, r.z, r.sigma,
                                r.excluded, non_empty(r.exclusion_reason), r.check, r.source_line, raw,
                                non_empty(r.note), now, author);
                   ins.run();
                 }
                 result.reading_count = static_cast<int>(sheet.readings.size());
               });
  return result;
}

}  // namespace soffit::storage
