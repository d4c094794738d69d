#include "app/model/visit_geometry.hpp"

#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit::app {

std::vector<SectionGeometry> summarise_geometry(const std::vector<LabelledSheet>& sheets, int monte_carlo_draws) {
  std::vector<SectionGeometry> out;
  for (const LabelledSheet& s : sheets) {
    SectionGeometry g;
    g.span = s.span;
    g.section = s.section;
    ProfileRequest request;
    request.uncertainty.monte_carlo_draws = monte_carlo_draws;
    request.uncertainty.seed = 1;  // the same summary every time the screen opens
    const ProfileAnalysis a = analyse_profile(s.sheet.readings, request);
    if (a.ok()) {
      g.shape = std::string(a.fit->family->name());
      g.span_m = a.uncertainty.geometry[0];  // derived.hpp order: span, rise, …
      g.rise_m = a.uncertainty.geometry[1];
      g.rms_mm = a.fit->rms_m * 1000;
      g.readings_used = a.fit->n_used;
    } else {
      g.error = a.error;
    }
    out.push_back(std::move(g));
  }
  return out;
}

}  // namespace soffit::app
