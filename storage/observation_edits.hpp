#pragma once
// Adding and changing the observations of an inspection: ring counts, fill
// depths, defects, and the details of the visit and of a span. Call them
// inside Project::edit (one transaction, one undo step each); `author`
// stamps the rows. Bad values throw StorageError(invalid) naming the field.
#include <string>

#include "storage/sqlite_connection.hpp"
#include "storage/survey_records.hpp"

namespace soffit::storage {

std::string add_ring_count(Connection& db, const std::string& author, const RingCountFields& f);
// Replace every field but the inspection (a count stays with its visit);
// the same rules as the adds. Rows of an issued visit are refused by the
// schema's triggers; an unknown id throws StorageError(not_found).
void update_ring_count(Connection& db, const std::string& author, const std::string& ring_count_id,
                       const RingCountFields& f);
void delete_ring_count(Connection& db, const std::string& ring_count_id);

std::string add_fill_depth(Connection& db, const std::string& author, const FillDepthFields& f);
void update_fill_depth(Connection& db, const std::string& author, const std::string& fill_depth_id,
                       const FillDepthFields& f);
void delete_fill_depth(Connection& db, const std::string& fill_depth_id);

// The vocabulary of defect_vocabulary.md; true if `type` is one of its keys.
bool is_defect_type(const std::string& type);

std::string add_defect(Connection& db, const std::string& author, const DefectFields& f);
// Replaces every field but the inspection (a defect stays with its visit).
void update_defect(Connection& db, const std::string& author, const std::string& defect_id, const DefectFields& f);
void delete_defect(Connection& db, const std::string& defect_id);

void update_span_details(Connection& db, const std::string& author, const std::string& span_id,
                         const SpanDetails& d);
void update_inspection_details(Connection& db, const std::string& author, const std::string& inspection_id,
                               const InspectionDetails& d);

}  // namespace soffit::storage
