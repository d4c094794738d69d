#pragma once
// Stores one survey sheet as a section survey of an inspection: the reduced
// readings and, beside them, the cells and metadata exactly as written, so
// that export_section_sheet (sheet_export.hpp) gives the same sheet back.
#include <string>

#include "geometry/sheet/survey_sheet.hpp"
#include "storage/project_file.hpp"

namespace soffit::storage {

struct SheetTarget {
  std::string structure_ref;  // created (named from the sheet) if not in the project
  int span_index = 1;         // 1-based
  std::string date;           // YYYY-MM-DD: the inspection (a draft one is created if needed)
  std::string section;        // section label, e.g. MW; unique within the inspection and span
};

struct ImportResult {
  std::string structure_id, inspection_id, section_id;
  bool structure_created = false;
  int reading_count = 0;
};

// One edit (one transaction, one undo step). Throws StorageError: invalid if
// the section is already in that inspection (nothing is overwritten) or the
// inspection is issued.
ImportResult import_sheet(Project& project, const SurveySheet& sheet, const SheetTarget& target);

}  // namespace soffit::storage
