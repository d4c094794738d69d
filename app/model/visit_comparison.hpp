#pragma once
// Change between two visits, section by section: the fitted rise and span of
// each section surveyed both times, their difference and its uncertainty.
// The entry point for the fuller change analysis that will follow; what it
// says is a measured difference, not a judgement of the structure.
#include <optional>
#include <string>
#include <vector>

#include "geometry/analysis/uncertainty.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit::app {

struct SectionPair {
  std::string span, section;      // labels, e.g. S1 and MW
  SurveySheet earlier, later;     // the section's sheet at each visit
};

struct SectionChange {
  std::string span, section;
  std::optional<Estimate> rise_earlier, rise_later, span_earlier, span_later;  // empty where no fit
  double rise_change_m = 0.0, rise_change_u_m = 0.0;  // later − earlier, and its standard uncertainty
  double span_change_m = 0.0, span_change_u_m = 0.0;
  std::string verdict;  // "no fit", "within its uncertainty", "borderline", "beyond twice its uncertainty"
};

// Fits both sheets of every pair (shape auto, seeded) and compares. Each
// visit's datum is taken as uncertain by `datum_sd_m` (FIELD.md §10.2 uses
// 1 mm, re-established from the benchmark), added to the rise uncertainty.
std::vector<SectionChange> compare_sections(const std::vector<SectionPair>& pairs, double datum_sd_m = 0.001);

}  // namespace soffit::app
