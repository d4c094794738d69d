#pragma once
// The latest geometry of a structure, for its screen: each section of a visit
// fitted (shape auto, seeded), with span and rise and their 95% ranges. A
// summary to orient the inspector, not an assessment.
#include <optional>
#include <string>
#include <vector>

#include "geometry/analysis/uncertainty.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit::app {

struct LabelledSheet {
  std::string span, section;  // labels, e.g. S1 and MW
  SurveySheet sheet;
};

struct SectionGeometry {
  std::string span, section;
  std::string shape;                        // the family chosen; empty where no fit
  std::optional<Estimate> span_m, rise_m;   // empty where no fit
  double rms_mm = 0.0;
  int readings_used = 0;
  std::string error;                        // why there is no fit
};

// Fits every sheet; runs for a while (Monte Carlo): call it on a worker.
std::vector<SectionGeometry> summarise_geometry(const std::vector<LabelledSheet>& sheets, int monte_carlo_draws = 500);

}  // namespace soffit::app
