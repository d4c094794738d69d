#pragma once
// A Gmsh .geo script (built-in kernel, Gmsh 4.x) of one span for 2D
// finite-element meshing: the ring between the fitted intrados and the
// extrados, and the fill block from the extrados up to the road level
// (section_ring_fill.hpp). Run `gmsh -2 file.geo` to mesh it.
//
// Gmsh x is the section's x (m along the span) and Gmsh y its z (m, up).
// Curves are Splines (one per outline piece) through the sampled intrados
// and its normal offset.
// Physical groups: surfaces "ring" and "fill"; curves "supports" (the two
// springing faces of the ring), "intrados", "road" and "fill_ends" (the
// vertical ends of the fill, against the abutment or pier backing).
// The element sizes are variables at the top of the script for the analyst
// to change: ring_size (along the ring; default d/4, four elements through
// the ring) and fill_size (at the road; default d/2).
#include <string>

#include "exports/section_ring_fill.hpp"
#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit {

// Needs options.ring_thickness_m; without options.road_z_m the script holds
// the ring alone and says so. Throws std::invalid_argument when
// ring_fill_problem(options) is not empty or no thickness is given.
std::string section_gmsh_geo(const SurveySheet& sheet, const ProfileAnalysis& analysis,
                             const RingFillOptions& options, const std::string& program);

}  // namespace soffit
