#pragma once
// A stored section back as survey-sheet text, in the form it was imported
// from: reading the text again gives the same raw cells and the same reduced
// readings (the round trip the issue asks for).
#include <string>

#include "geometry/sheet/survey_sheet.hpp"
#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

// The section as stored: layout, raw rows (cells only) and reduced readings.
SurveySheet load_section_sheet(Connection& db, const std::string& section_id);

std::string export_section_sheet(Connection& db, const std::string& section_id);

// The sheet's text from its layout and raw rows (cells quoted where needed).
// With `keep_line_numbers`, blank lines (which the reader skips) pad the gaps
// so that every row and metadata line is read back at its own line number:
// a message about an edited sheet then names the line the person knows.
std::string write_sheet_text(const SurveySheet& sheet, bool keep_line_numbers = false);

}  // namespace soffit::storage
