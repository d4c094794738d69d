#pragma once
// The JSON that `soffit fit` prints: a contract other tools rely on.
// Every quantity with an uncertainty is {"value": v, "sd": s, "ci95": [lo, hi]}.
// Keys carry their units (_m, _mm); numbers are SI unless the key says mm.
#include <nlohmann/json.hpp>
#include <string>

#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit {

inline constexpr const char* kSurveyDataCaution =
    "Survey data, not a structural assessment. What this geometry means for the capacity of "
    "the bridge is for a qualified engineer to decide under the local codes.";

nlohmann::ordered_json fit_report_json(const SurveySheet& sheet, const ProfileAnalysis& analysis,
                               const ProfileRequest& request);

}  // namespace soffit
