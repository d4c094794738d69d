#include "exports/section_provenance.hpp"

#include "exports/fit_report_json.hpp"
#include "exports/fixed_decimal.hpp"

namespace soffit {

namespace {

void append(std::string& text, const std::optional<std::string>& part, const char* separator) {
  if (!part || part->empty()) return;
  if (!text.empty()) text += separator;
  text += *part;
}

// Strings from a sheet may hold anything; exported comments stay one line each.
std::string one_line(std::string text) {
  for (char& c : text)
    if (c == '\n' || c == '\r') c = ' ';
  return text;
}

}  // namespace

std::string section_title(const SurveySheet& sheet) {
  const SheetMetadata& m = sheet.metadata;
  std::string title;
  if (m.structure_name && m.structure)
    title = *m.structure_name + " (" + *m.structure + ")";
  else
    append(title, m.structure_name ? m.structure_name : m.structure, "");
  std::string where;
  if (m.span) append(where, "span " + *m.span, ", ");
  if (m.section) append(where, "section " + *m.section, ", ");
  append(where, m.date, ", ");
  if (!where.empty()) title += (title.empty() ? "" : ", ") + where;
  return one_line(title.empty() ? sheet.source : title);
}

SectionProvenance section_provenance(const SurveySheet& sheet, const ProfileAnalysis& analysis,
                                     const std::string& program) {
  const ShapeFit& fit = *analysis.fit;
  const Uncertainty& u = analysis.uncertainty;
  SectionProvenance p;
  p.lines.push_back("source: " + one_line(sheet.source));
  p.lines.push_back("section: " + section_title(sheet));
  const SheetMetadata& m = sheet.metadata;
  if (m.position_m && m.reference_face)
    p.lines.push_back("position: " + fixed_decimal(*m.position_m, 3) + " m from the " +
                      one_line(*m.reference_face) + " face");
  std::string shape = "shape: " + std::string(fit.family->name());
  shape += analysis.selection ? " (chosen by the fit: " + one_line(analysis.selection->reason) + ")"
                              : " (named by the user)";
  p.lines.push_back(shape);
  p.lines.push_back("frame: x along the span, z up, metres; z as reduced from the sheet; springing line at z = " +
                    fixed_decimal(fit.outline.z_springing, 4) + " m (" +
                    (fit.family->springing_from_shape() ? "from the shape"
                     : fit.springing_from_ends        ? "from the end readings"
                                                      : "given") +
                    ")");
  std::string unc = "uncertainty: " + u.method;
  if (u.method == "monte-carlo")
    unc += ", " + std::to_string(u.draws_used) + " of " + std::to_string(u.draws_requested) +
           " draws, seed " + std::to_string(u.seed);
  if (u.widened) unc += "; ranges widened by " + fixed_decimal(u.scale, 3) + " (scatter above the stated sigma)";
  p.lines.push_back(unc);
  p.lines.push_back("program: " + one_line(program));
  p.caution = kSurveyDataCaution;
  return p;
}

}  // namespace soffit
