#include "app/model/visit_geometry.hpp"

#include "app/model/seeded_profile.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit::app {

std::vector<SectionGeometry> summarise_geometry(const std::vector<LabelledSheet>& sheets, int monte_carlo_draws) {
  std::vector<SectionGeometry> out;
  for (const LabelledSheet& s : sheets) {
    SectionGeometry g;
    g.span = s.span;
    g.section = s.section;
    // Seeded: the same summary every time the screen opens.
    const ProfileAnalysis a = seeded_profile(s.sheet.readings, monte_carlo_draws);
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
