#pragma once
// A short plain-text account of a fit, for people reading a terminal.
#include <iosfwd>

#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit::cli {
void print_fit_summary(std::ostream& out, const SurveySheet& sheet, const ProfileAnalysis& analysis);
}  // namespace soffit::cli
