#pragma once
// The sheet-as-written part of a SurveySheet (metadata lines, columns,
// comments) as JSON text, stored in section_survey.sheet_json; and back.
#include <string>
#include <vector>

#include "geometry/sheet/survey_sheet.hpp"

namespace soffit::storage {

std::string sheet_layout_to_json(const SurveySheet& sheet);
// Fills form, format_version, method, source, raw_metadata, columns, comments.
void sheet_layout_from_json(const std::string& json_text, SurveySheet& sheet);

// The method as stored in section_survey.method (geometry's keyword for the
// plain form, "x,z list", is a phrase for messages, not a key).
std::string method_key(SurveyMethod method);
SurveyMethod method_from_key(const std::string& key);

std::string cells_to_json(const std::vector<std::string>& cells);
std::vector<std::string> cells_from_json(const std::string& json_text);

}  // namespace soffit::storage
