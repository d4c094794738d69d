#pragma once
// The drawings of the inspection report, each into a box of a cairo page:
// a section's elevation (equal scales across and up, so the arch keeps its
// shape), the unrolled soffit of a span with each defect at its place, and a
// photo thumbnail decoded from its stored PNG.
#include <cairo.h>

#include <optional>
#include <string>
#include <vector>

#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/sheet/survey_sheet.hpp"
#include "storage/export_queries.hpp"

namespace soffit {

struct ReportBox {
  double x = 0.0, y = 0.0, width = 0.0, height = 0.0;  // points, y down
};

// Measured points (filled: used by the fit; hollow: excluded or not used),
// the fitted intrados, and the extrados offset by `ring_thickness_m` when
// given; a 1 m scale bar and a legend.
void draw_section_elevation(cairo_t* cr, const ReportBox& box, const SurveySheet& sheet,
                            const ProfileAnalysis& analysis, const std::optional<double>& ring_thickness_m);

// The soffit unrolled: s along the intrados from the springing across, y
// across the barrel from the reference face. The outline is drawn when
// `arc_length_m` and `barrel_width_m` are known; otherwise the frame is sized
// to the defects, and says so. Defects in the elevation frame are not drawn.
void draw_unrolled_soffit(cairo_t* cr, const ReportBox& box, const std::optional<double>& arc_length_m,
                          const std::optional<double>& barrel_width_m,
                          const std::vector<const storage::ExportDefect*>& defects);

// Draws a PNG (as stored in the photo table) scaled into a square of
// `side_pt`, keeping its proportions. False (and nothing drawn but a grey
// frame) when the bytes are not a PNG cairo can read.
bool draw_png_thumbnail(cairo_t* cr, double x, double y, double side_pt, const std::string& png_bytes);

}  // namespace soffit
