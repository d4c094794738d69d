#pragma once
// The section drawn to scale: readings, the fitted intrados, and each
// reading's departure as a bar normal to the curve, exaggerated and labelled.
#include "exports/intrados_band.hpp"
#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/core/reading.hpp"

namespace soffit::gui {

// Draws into the current window, filling `height` pixels of the available width.
// `band`, when given, is drawn about the curve with the residual bars' exaggeration.
void draw_profile_plot(const Readings& readings, const ProfileAnalysis& analysis, const IntradosBand* band,
                       float height);

}  // namespace soffit::gui
