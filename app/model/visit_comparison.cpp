#include "app/model/visit_comparison.hpp"

#include <cmath>

#include "app/model/seeded_profile.hpp"

namespace soffit::app {

namespace {

struct Fitted {
  std::optional<Estimate> rise, span;
};

Fitted fit_of(const SurveySheet& sheet) {
  const ProfileAnalysis a = seeded_profile(sheet.readings, 1000);
  if (!a.ok()) return {};
  return {a.uncertainty.geometry[1], a.uncertainty.geometry[0]};  // rise_m, span_m (derived.hpp order)
}

}  // namespace

std::vector<SectionChange> compare_sections(const std::vector<SectionPair>& pairs, double datum_sd_m) {
  std::vector<SectionChange> out;
  for (const SectionPair& p : pairs) {
    SectionChange c;
    c.span = p.span;
    c.section = p.section;
    const Fitted a = fit_of(p.earlier), b = fit_of(p.later);
    c.rise_earlier = a.rise;
    c.rise_later = b.rise;
    c.span_earlier = a.span;
    c.span_later = b.span;
    if (!a.rise || !b.rise) {
      c.verdict = "no fit";
      out.push_back(std::move(c));
      continue;
    }
    c.rise_change_m = b.rise->value - a.rise->value;
    c.rise_change_u_m = std::sqrt(a.rise->sd * a.rise->sd + b.rise->sd * b.rise->sd + 2 * datum_sd_m * datum_sd_m);
    c.span_change_m = b.span->value - a.span->value;
    c.span_change_u_m = std::sqrt(a.span->sd * a.span->sd + b.span->sd * b.span->sd);
    // Two standard uncertainties as the line for a change worth reporting (common practice).
    const double ratio = std::abs(c.rise_change_m) / c.rise_change_u_m;
    c.verdict = ratio >= 2.0 ? "beyond twice its uncertainty" : ratio >= 1.0 ? "borderline" : "within its uncertainty";
    out.push_back(std::move(c));
  }
  return out;
}

}  // namespace soffit::app
