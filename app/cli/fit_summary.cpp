#include "app/cli/fit_summary.hpp"

#include <cstdio>
#include <ostream>
#include <string>

#include "exports/fit_report_json.hpp"
#include "geometry/analysis/derived.hpp"

namespace soffit::cli {

namespace {

std::string line(const char* label, const Estimate& e, double factor, const char* unit, int digits) {
  char buf[160];
  std::snprintf(buf, sizeof buf, "  %-22s %.*f %s  (sd %.*f; 95%%: %.*f to %.*f)\n", label, digits,
                e.value * factor, unit, digits, e.sd * factor, digits, e.lo * factor, digits, e.hi * factor);
  return buf;
}

}  // namespace

void print_fit_summary(std::ostream& out, const SurveySheet& sheet, const ProfileAnalysis& analysis) {
  const ShapeFit& fit = *analysis.fit;
  const Uncertainty& u = analysis.uncertainty;
  out << sheet.source << ": " << fit.family->name() << " (" << fit.n_used << " readings used, "
      << u.method << ")\n";
  if (analysis.selection) out << "  chosen because " << analysis.selection->reason << "\n";
  const auto& g = u.geometry;
  out << line("span", g[0], 1.0, "m", 4) << line("rise", g[1], 1000.0, "mm", 1)
      << line("span/rise", g[2], 1.0, "", 3) << line("rise at quarter points", g[8], 1000.0, "mm", 1)
      << line("radius at crown", g[10], 1.0, "m", 3) << line("intrados length", g[12], 1.0, "m", 3);
  char buf[160];
  std::snprintf(buf, sizeof buf, "  rms residual %.1f mm, largest %.1f mm, reduced chi-square %.2f\n",
                fit.rms_m * 1000, fit.max_abs_m * 1000, fit.reduced_chi2);
  out << buf;
  for (const DeformationZone& z : analysis.zones) out << "  departure: " << z.description << "\n";
  for (const std::string& w : sheet.warnings) out << "  note: " << w << "\n";
  for (const std::string& w : analysis.warnings) out << "  note: " << w << "\n";
  out << "  " << kSurveyDataCaution << "\n";
}

}  // namespace soffit::cli
