#include "app/model/new_section.hpp"

#include <cmath>
#include <cstdio>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "storage/sheet_import.hpp"

namespace soffit::app {
namespace {

const char* kForm = "new section";  // the "file" named in messages about the form

std::string number(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.4f", v);
  return buf;
}

bool csv_safe(const std::string& s) { return s.find_first_of(",\"\r\n") == std::string::npos; }

}  // namespace

std::string blank_sheet_text(const NewSection& s) {
  if (s.label.empty() || s.label.find_first_not_of(' ') == std::string::npos)
    throw InputError(kForm, 0, "label", "give the section a label, e.g. MW, US or DS");
  if (!csv_safe(s.label) || s.label.size() > 40)
    throw InputError(kForm, 0, "label", "a label is a short name without commas or quotes");
  if (s.span_index < 1) throw InputError(kForm, 0, "span", "choose a span");
  if (s.sigma_mm && !(std::isfinite(*s.sigma_mm) && *s.sigma_mm > 0 && *s.sigma_mm < 1000))
    throw InputError(kForm, 0, "sigma_mm", "the precision is a positive number of millimetres, e.g. 3");

  if (s.booking == NewSectionBooking::xz) {
    // The plain form carries no metadata: the label and visit come from the import target.
    return "# keyed in on site: x along the span, z up, metres\nx,z,sigma_mm\n";
  }
  for (const auto& [value, field] : {std::pair{s.datum_rl_m, "datum_rl_m"}, {s.z_origin_rl_m, "z_origin_rl_m"}}) {
    if (!value) throw InputError(kForm, 0, field, "give the level in metres (a reduced level, e.g. 9.800)");
    if (!std::isfinite(*value) || std::abs(*value) > 10000)
      throw InputError(kForm, 0, field, "a reduced level in metres is expected (e.g. 9.800)");
  }
  std::string t = "soffit-sheet,1\n";
  t += "structure," + s.structure_ref + "\n";
  t += "span,S" + std::to_string(s.span_index) + "\n";
  t += "section," + s.label + "\n";
  t += "date," + s.date + "\n";
  t += "method,offsets\n";
  if (!s.instrument.empty()) t += "instrument," + s.instrument + "\n";
  t += "datum_rl_m," + number(*s.datum_rl_m) + "\n";
  t += "z_origin_rl_m," + number(*s.z_origin_rl_m) + "\n";
  t += std::string("offset_direction,") + (s.offsets_down ? "down" : "up") + "\n";
  if (s.sigma_mm) t += "sigma_mm," + number(*s.sigma_mm) + "\n";
  t += "readings\n";
  t += "id,station_m,offset_mm,surface,check,exclude,note\n";
  return t;
}

std::string add_blank_section(storage::Project& project, const NewSection& s) {
  SheetOptions options;
  options.allow_few_readings = true;
  // Read back through the sheet reader: the empty sheet meets every rule a file would.
  const SurveySheet sheet = parse_sheet(blank_sheet_text(s), s.label + " (keyed in)", options);
  const storage::ImportResult r = storage::import_sheet(project, sheet, {s.structure_ref, s.span_index, s.date, s.label});
  return r.section_id;
}

}  // namespace soffit::app
