#include "exports/section_points_csv.hpp"

#include "exports/fixed_decimal.hpp"
#include "exports/section_provenance.hpp"

namespace soffit {

namespace {

// RFC 4180 §2: a field with a comma, quote or line break is quoted, and its quotes doubled.
std::string csv_field(const std::string& text) {
  if (text.find_first_of(",\"\r\n") == std::string::npos) return text;
  std::string quoted = "\"";
  for (char c : text) {
    if (c == '"') quoted += '"';
    quoted += c;
  }
  return quoted + "\"";
}

}  // namespace

std::string section_points_csv(const SurveySheet& sheet, const ProfileAnalysis& analysis,
                               const std::string& program) {
  const ShapeFit& fit = *analysis.fit;
  const SectionProvenance provenance = section_provenance(sheet, analysis, program);
  std::string out = "# Soffit section points\n";
  for (const std::string& line : provenance.lines) out += "# " + line + "\n";
  out +=
      "# columns: x_m, z_m reduced coordinates; sigma_mm standard uncertainty used (k = 1, isotropic);\n"
      "#   used 1 when the reading took part in the fit; excluded_because the surveyor's reason;\n"
      "#   check 1 for a closing-check repeat (never fitted); residual_mm signed orthogonal distance\n"
      "#   from the fitted intrados, + above it (into the masonry); weight the robust weight (1 when\n"
      "#   not robust, 0 when not used); source_line the line in the source file.\n";
  out += "# caution: " + provenance.caution + "\n";
  out += kSectionPointsHeader;
  out += "\n";
  for (size_t i = 0; i < sheet.readings.size(); ++i) {
    const Reading& r = sheet.readings[i];
    out += fixed_decimal(r.x, 4) + "," + fixed_decimal(r.z, 4) + "," +
           fixed_decimal(fit.sigmas[i] * 1000.0, 2) + "," + (fit.used[i] ? "1" : "0") + "," +
           csv_field(!r.excluded ? std::string() : r.exclusion_reason.empty() ? "no reason given" : r.exclusion_reason) + "," + (r.check ? "1" : "0") +
           "," + fixed_decimal(fit.residuals[i] * 1000.0, 2) + "," + fixed_decimal(fit.weights[i], 4) +
           "," + std::to_string(r.source_line) + "," + csv_field(r.note) + "\n";
  }
  return out;
}

}  // namespace soffit
