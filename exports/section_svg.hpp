#pragma once
// An elevation of one section drawn to scale (a standard drawing scale 1:N,
// true when printed at 100%), as plain SVG 1.1 with no external resources:
//  - measured points (filled: used by the fit; hollow: excluded or check);
//  - the fitted intrados and its 95% band (intrados_band.hpp: linearised from
//    the fit covariance, offset normal to the curve), drawn to scale and again,
//    exaggerated, in a strip of departures below the elevation, where the band
//    and each reading's residual can actually be seen;
//  - the extrados (intrados offset by the ring thickness) when one is given,
//    and the fill up to road level when that is given;
//  - a span dimension and a chain of dimensions up the crown (rise, ring,
//    fill) with their 95% ranges; a scale bar; a legend; provenance and the
//    caution that this is survey data, not an assessment.
// Deterministic: the same inputs give the same bytes.
#include <string>

#include "exports/section_ring_fill.hpp"
#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit {

// Throws std::invalid_argument when ring_fill_problem(options) is not empty.
std::string section_svg(const SurveySheet& sheet, const ProfileAnalysis& analysis,
                        const RingFillOptions& options, const std::string& program);

// The drawing scale denominator N (1:N) chosen for a model `width_m` wide:
// the smallest of the usual drawing scales that fits it in 250 mm of paper.
int drawing_scale_for(double width_m);

}  // namespace soffit
