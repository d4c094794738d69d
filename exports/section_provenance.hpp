#pragma once
// Where a section export came from, as short "key: value" lines that every
// section file (CSV comment, SVG caption, .geo comment) repeats, so a file
// separated from its folder still says what it is and what it is not.
#include <string>
#include <vector>

#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit {

// `program` names the writer and its version, e.g. "soffit 0.1.0"; the
// exports library does not know it, the executable does.
struct SectionProvenance {
  std::vector<std::string> lines;  // "source: …", "section: …", "shape: …", "uncertainty: …", "program: …"
  std::string caution;             // survey data, not an assessment
};

SectionProvenance section_provenance(const SurveySheet& sheet, const ProfileAnalysis& analysis,
                                     const std::string& program);

// A one-line title: structure, span, section and date where the sheet gives them.
std::string section_title(const SurveySheet& sheet);

}  // namespace soffit
