#pragma once
// The points of one section as CSV: every reading (used, excluded and check
// readings alike, in the order of the sheet) in the section frame, with the σ
// used, the residual from the fitted intrados and the robust weight, so that an
// analyst can refit or model from the measured points, not only the fit.
//
// Format (RFC 4180 fields, LF line ends, UTF-8):
//  - a preamble of lines starting "# ": provenance (section_provenance.hpp),
//    the column meanings and the caution that this is survey data;
//  - the header  x_m,z_m,sigma_mm,used,excluded_because,check,residual_mm,weight,source_line,note
//  - one row per reading. x_m, z_m: 4 decimals (0.1 mm); sigma_mm, residual_mm:
//    2 decimals; weight: 4 decimals; used/check: 1 or 0; text quoted when it
//    holds a comma, quote or line break.
// Numbers are written with std::to_chars: no locale changes a byte.
#include <string>

#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit {

inline constexpr const char* kSectionPointsHeader =
    "x_m,z_m,sigma_mm,used,excluded_because,check,residual_mm,weight,source_line,note";

// `analysis` must hold a fit (analysis.ok()); `program` names the writer.
std::string section_points_csv(const SurveySheet& sheet, const ProfileAnalysis& analysis,
                               const std::string& program);

}  // namespace soffit
