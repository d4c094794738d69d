#pragma once
// Writing a section's edited rows to the open project: one edit, one undo
// step in the project's journal, named as the person named the change.
#include <string>

#include "geometry/sheet/survey_sheet.hpp"
#include "storage/project_file.hpp"

namespace soffit::app {

// Throws storage::StorageError when the project refuses (an issued visit, a
// full disk); the stored rows are then as they were.
void save_section(storage::Project& project, const std::string& section_id, const SurveySheet& sheet,
                  const std::string& label);

}  // namespace soffit::app
