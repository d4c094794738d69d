#pragma once
// A new visit (inspection) of a structure, started on site: its date and who,
// what kind and in what weather (FIELD.md §1.3). Sections, rings, fill and
// defects are then recorded into it; it stays a draft until signed off.
#include <string>

#include "app/model/register_filter.hpp"  // today_iso(): the form's default date
#include "storage/project_file.hpp"
#include "storage/survey_records.hpp"

namespace soffit::app {

struct NewVisit {
  std::string date;  // YYYY-MM-DD
  storage::InspectionDetails details;
};

// Writes the visit as one undoable edit and returns its key. Throws
// InputError naming the field ("date") for a date that is not a real
// calendar date in YYYY-MM-DD, or when the structure already has a visit on
// that date (a second visit the same day would split its records).
std::string add_visit(storage::Project& project, const std::string& structure_ref, const NewVisit& visit);

}  // namespace soffit::app
