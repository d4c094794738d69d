#pragma once
// How a section's readings were taken, which decides how they are reduced.
#include <optional>
#include <string>
#include <string_view>

namespace soffit {

enum class SurveyMethod {
  xz_list,  // plain x,z file: already reduced
  offsets,  // stations along a datum line, offsets up (or down) to the soffit
  polar,    // distances and vertical angles from one instrument set-up
  points,   // easting, northing, height (total station, scan slice)
};

// The word used in a sheet's "method" line ("offsets", "polar", "points").
std::string method_keyword(SurveyMethod method);
std::optional<SurveyMethod> method_from_keyword(std::string_view word);

}  // namespace soffit
