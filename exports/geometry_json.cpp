#include "exports/geometry_json.hpp"

#include <charconv>
#include <cmath>
#include <set>

#include "exports/fit_report_json.hpp"
#include "exports/fixed_decimal.hpp"
#include "exports/ring_thickness_estimate.hpp"
#include "geometry/analysis/derived.hpp"

namespace soffit {

namespace {

using json = nlohmann::ordered_json;

// Resolution of stored numbers, by unit: 0.01 mm for lengths, 1e-5 for ratios.
constexpr int kMetreDecimals = 5;
constexpr int kMillimetreDecimals = 2;
constexpr int kRatioDecimals = 5;
constexpr int kDegreeDecimals = 4;
constexpr int kSquareMetreDecimals = 4;

// The value rounded as fixed_decimal prints it, read back with from_chars:
// JSON then stores the shortest text of that double, which reads back to it.
json rounded(double v, int decimals) {
  if (!std::isfinite(v)) return nullptr;
  const std::string text = fixed_decimal(v, decimals);
  double r = 0.0;
  std::from_chars(text.data(), text.data() + text.size(), r);
  return r == 0.0 ? 0.0 : r;  // no "-0.0"
}

json rounded(const std::optional<double>& v, int decimals) { return v ? rounded(*v, decimals) : json(nullptr); }

json text_or_null(const std::string& s) { return s.empty() ? json(nullptr) : json(s); }

// Unit of a quantity from its key's suffix, and the resolution it is stored to.
std::pair<std::string, int> unit_of(const std::string& key) {
  const auto ends = [&](const char* suffix) {
    const std::string s(suffix);
    return key.size() > s.size() && key.compare(key.size() - s.size(), s.size(), s) == 0;
  };
  if (ends("_mm")) return {"mm", kMillimetreDecimals};
  if (ends("_per_m")) return {"1/m", 8};
  if (ends("_m")) return {"m", kMetreDecimals};
  if (ends("_deg")) return {"deg", kDegreeDecimals};
  return {"1", kRatioDecimals};  // _ratio and any other dimensionless key
}

json quantity(const Estimate& e, const std::string& key) {
  const auto [unit, decimals] = unit_of(key);
  return json{{"value", rounded(e.value, decimals)},
              {"sd", rounded(e.sd, decimals)},
              {"ci95", json::array({rounded(e.lo, decimals), rounded(e.hi, decimals)})},
              {"unit", unit}};
}

json provenance_json(const storage::InspectionExportData& d, const StructureGeometry& g,
                     const GeometryJsonOptions& o) {
  const storage::ExportInspection& i = d.inspection;
  return json{{"program", o.program},
              {"project_file", d.project_file_name},
              {"structure_ref", d.structure.fields.ref},
              {"inspection",
               {{"id", i.id},
                {"date", i.date},
                {"revision", i.revision},
                {"status", i.status},
                {"supersedes_id", text_or_null(i.supersedes_id)},
                {"revision_reason", text_or_null(i.revision_reason)},
                {"revision_author", text_or_null(i.revision_author)},
                {"revision_at", text_or_null(i.revision_at)}}},
              {"inputs_sha256", d.inputs_sha256},
              {"inputs_hashed",
               "the structure, span, inspection, section reading, ring count, fill depth and defect records of "
               "this inspection as read from the project (storage/export_queries.hpp)"},
              {"analysis",
               {{"shape", g.request.shape},
                {"uncertainty_method", g.request.uncertainty.monte_carlo_draws > 0 ? "monte-carlo" : "linearised"},
                {"monte_carlo_draws", g.request.uncertainty.monte_carlo_draws},
                {"seed", g.request.uncertainty.seed}}}};
}

json structure_json(const storage::StructureRecord& s) {
  const storage::StructureFields& f = s.fields;
  return json{{"ref", f.ref},
              {"name", text_or_null(f.name)},
              {"carries", text_or_null(f.carries)},
              {"crosses", text_or_null(f.crosses)},
              {"span_count", f.span_count ? json(*f.span_count) : json(nullptr)},
              {"location",
               {{"latitude_deg", rounded(f.latitude_deg, 7)},
                {"longitude_deg", rounded(f.longitude_deg, 7)},
                {"crs", "EPSG:4326"},
                {"fictitious", f.location_fictitious}}},
              {"notes", text_or_null(f.notes)}};
}

json measurement_json(const storage::InspectionExportData& d, std::vector<std::string>& warnings) {
  const storage::InspectionDetails& v = d.inspection.details;
  json instruments = json::array();
  for (const storage::Instrument& in : v.instruments)
    instruments.push_back({{"name", in.name}, {"precision_mm", rounded(in.precision_mm, kMillimetreDecimals)}});
  std::set<std::string> seen;
  json datums = json::array();
  for (const storage::ExportSection& s : d.sections)
    if (!s.record.datum.empty() && seen.insert(s.record.datum).second) datums.push_back(s.record.datum);
  if (!v.air_temperature_c) warnings.push_back("inspection: no air temperature recorded: air_temperature_degc is null");
  if (v.instruments.empty()) warnings.push_back("inspection: no instruments recorded: instruments is empty");
  if (datums.empty()) warnings.push_back("inspection: no section names its datum: datums is empty");
  return json{{"air_temperature_degc", rounded(v.air_temperature_c, 1)},
              {"weather", text_or_null(v.weather)},
              {"instruments", std::move(instruments)},
              {"datums", std::move(datums)}};
}

json inspection_json(const storage::ExportInspection& i) {
  const storage::InspectionDetails& v = i.details;
  return json{{"date", i.date},
              {"kind", text_or_null(v.kind)},
              {"inspector", text_or_null(v.inspector)},
              {"status", i.status},
              {"revision", i.revision},
              {"parts_not_inspected", text_or_null(v.parts_not_inspected)},
              {"notes", text_or_null(v.notes)}};
}

json thickness_json(const std::optional<ThicknessRange>& r) {
  if (!r) return nullptr;
  return json{{"value_mm", rounded(r->value_mm, kMillimetreDecimals)},
              {"lower_mm", rounded(r->lower_mm, kMillimetreDecimals)},
              {"upper_mm", rounded(r->upper_mm, kMillimetreDecimals)},
              {"rule", r->rule}};
}

json ring_thickness_json(const SpanGeometry& sg) {
  json counts = json::array();
  std::optional<double> lo, hi;
  for (const auto* c : sg.ring_counts) {
    const RingThicknessEstimate e = ring_thickness_estimate(*c, sg.source->details);
    if (e.from_counts && e.from_counts->lower_mm) {
      lo = std::min(lo.value_or(HUGE_VAL), *e.from_counts->lower_mm);
      hi = std::max(hi.value_or(-HUGE_VAL), *e.from_counts->upper_mm);
    }
    counts.push_back({{"face", c->face},
                      {"position", c->position},
                      {"rings", c->rings},
                      {"unit_depth_mm", rounded(e.unit_depth_mm, kMillimetreDecimals)},
                      {"unit_depth_from", text_or_null(e.unit_depth_from)},
                      {"joint_thickness_mm", rounded(e.joint_mm, kMillimetreDecimals)},
                      {"confidence", text_or_null(c->confidence)},
                      {"verified", e.verified},
                      {"basis", text_or_null(c->basis)},
                      {"notes", text_or_null(c->notes)},
                      {"from_counts", thickness_json(e.from_counts)},
                      {"measured", thickness_json(e.measured)}});
  }
  json summary = nullptr;
  if (sg.ring_from_counts_mm)
    summary = {{"value_mm", rounded(*sg.ring_from_counts_mm, kMillimetreDecimals)},
               {"lower_mm", rounded(lo, kMillimetreDecimals)},
               {"upper_mm", rounded(hi, kMillimetreDecimals)},
               {"rule", "mean of the count-based values at the crown (every count when none is at the crown); "
                        "range from the lowest lower to the highest upper bound of the counts"}};
  return json{{"counts", std::move(counts)}, {"from_counts_summary", std::move(summary)}};
}

json fill_observation_json(const storage::FillDepthFields& f) {
  json range = nullptr;
  if (f.uncertainty_m)
    range = json::array({rounded(f.depth_m - *f.uncertainty_m, kMetreDecimals),
                         rounded(f.depth_m + *f.uncertainty_m, kMetreDecimals)});
  // FIELD.md §5: an estimate is (d + h) − d, so it shares the ring's uncertainty.
  const bool correlated = f.method == "estimate";
  return json{{"chainage_m", rounded(f.chainage_m, kMetreDecimals)},
              {"offset_y_m", rounded(f.offset_y_m, kMetreDecimals)},
              {"method", f.method},
              {"depth_m", rounded(f.depth_m, kMetreDecimals)},
              {"uncertainty_m", rounded(f.uncertainty_m, kMetreDecimals)},
              {"range_m", std::move(range)},
              {"surfacing_m", rounded(f.surfacing_m, kMetreDecimals)},
              {"correlated_with_ring_thickness", correlated},
              {"notes", text_or_null(f.notes)}};
}

json station_json(const std::optional<StationFill>& s) {
  if (!s || s->observations.empty()) return nullptr;
  json obs = json::array();
  for (const auto* f : s->observations) obs.push_back(fill_observation_json(*f));
  return json{{"x_m", rounded(s->x_m, kMetreDecimals)}, {"observations", std::move(obs)}};
}

json fill_json(const SpanGeometry& sg) {
  json all = json::array();
  for (const auto* f : sg.fill_depths) all.push_back(fill_observation_json(*f));
  return json{{"observations", std::move(all)},
              {"station_tolerance_m", sg.span_m ? rounded(kFillStationTolerance * *sg.span_m, kMetreDecimals)
                                                : json(nullptr)},
              {"at_crown", station_json(sg.crown_fill)},
              {"at_quarter_points",
               {{"left", station_json(sg.quarter_left_fill)}, {"right", station_json(sg.quarter_right_fill)}}}};
}

json surfacing_json(const SpanGeometry& sg) {
  json observed = json::array();
  for (const auto* f : sg.fill_depths)
    if (f->surfacing_m)
      observed.push_back({{"chainage_m", rounded(f->chainage_m, kMetreDecimals)},
                          {"offset_y_m", rounded(f->offset_y_m, kMetreDecimals)},
                          {"method", f->method},
                          {"depth_m", rounded(*f->surfacing_m, kMetreDecimals)}});
  return json{{"recorded_depth_m", rounded(sg.source->details.surfacing_depth_m, kMetreDecimals)},
              {"observed", std::move(observed)}};
}

json walls_json(const storage::SpanDetails& d) {
  json walls = json::array();
  for (const storage::SpandrelWall& w : d.spandrel_walls)
    walls.push_back({{"side", w.side},
                     {"internal", w.internal},
                     {"thickness_m", rounded(w.thickness_m, kMetreDecimals)},
                     {"height_m", rounded(w.height_m, kMetreDecimals)},
                     {"position_m", rounded(w.position_m, kMetreDecimals)}});
  return walls;
}

json supports_json(const storage::SpanDetails& d) {
  json supports = json::array();
  for (const storage::SupportDimensions& s : d.supports)
    supports.push_back({{"name", s.name},
                        {"kind", text_or_null(s.kind)},
                        {"thickness_m", rounded(s.thickness_m, kMetreDecimals)},
                        {"height_m", rounded(s.height_m, kMetreDecimals)},
                        {"length_m", rounded(s.length_m, kMetreDecimals)},
                        {"notes", text_or_null(s.notes)}});
  return supports;
}

std::string raw_metadata(const SurveySheet& sheet, const char* key) {
  for (const MetadataLine& m : sheet.raw_metadata)
    if (m.key == key && !m.values.empty()) return m.values.front();
  return {};
}

json section_json(const AnalysedSection& a) {
  const storage::SectionRecord& r = a.source->record;
  const ProfileAnalysis& an = a.analysis;
  std::optional<double> sigma_min, sigma_max;
  for (const Reading& x : a.sheet.readings) {
    if (!(x.sigma > 0.0)) continue;
    sigma_min = std::min(sigma_min.value_or(HUGE_VAL), x.sigma);
    sigma_max = std::max(sigma_max.value_or(-HUGE_VAL), x.sigma);
  }
  json out{{"label", r.label},
           {"position_m", rounded(r.position_m, kMetreDecimals)},
           {"reference_face", text_or_null(r.reference_face)},
           {"direction", text_or_null(r.direction)},
           {"method", r.method},
           {"instrument", text_or_null(raw_metadata(a.sheet, "instrument"))},
           {"datum", text_or_null(r.datum)},
           {"reading_sigma_mm",
            {{"min", sigma_min ? rounded(*sigma_min * 1000.0, kMillimetreDecimals) : json(nullptr)},
             {"max", sigma_max ? rounded(*sigma_max * 1000.0, kMillimetreDecimals) : json(nullptr)}}},
           {"reading_count", r.reading_count},
           {"excluded_count", r.excluded_count}};
  if (!an.ok()) {
    out["fit_error"] = an.error;
    for (const char* k : {"shape", "shape_chosen_because", "springing_level_from", "parameters", "derived",
                          "fit_quality", "uncertainty"})
      out[k] = nullptr;
    out["deformation_zones"] = json::array();
  } else {
    const ShapeFit& fit = *an.fit;
    const Uncertainty& u = an.uncertainty;
    out["fit_error"] = nullptr;
    out["shape"] = std::string(fit.family->name());
    out["shape_chosen_because"] = an.selection ? json(an.selection->reason) : json(nullptr);
    out["springing_level_from"] = fit.family->springing_from_shape() ? "shape"
                                  : fit.springing_from_ends         ? "end readings"
                                                                    : "given";
    json params = json::object();
    for (const auto& [name, e] : u.parameters) params[name] = quantity(e, name);
    out["parameters"] = std::move(params);
    json derived = json::object();
    const auto& keys = geometry_quantity_keys();
    for (size_t k = 0; k < keys.size(); ++k) derived[keys[k]] = quantity(u.geometry[k], keys[k]);
    out["derived"] = std::move(derived);
    out["fit_quality"] = {{"readings_used", fit.n_used},
                          {"rms_residual_mm", rounded(fit.rms_m * 1000.0, kMillimetreDecimals)},
                          {"max_residual_mm", rounded(fit.max_abs_m * 1000.0, kMillimetreDecimals)},
                          {"reduced_chi2", rounded(fit.reduced_chi2, kRatioDecimals)}};
    out["uncertainty"] = {{"method", u.method},
                          {"monte_carlo_draws_used", u.draws_used},
                          {"seed", u.seed},
                          {"widened", u.widened},
                          {"sigma_scale", rounded(u.scale, kRatioDecimals)}};
    json zones = json::array();
    for (const DeformationZone& z : an.zones)
      zones.push_back({{"x_from_m", rounded(z.x_from, kMetreDecimals)},
                       {"x_to_m", rounded(z.x_to, kMetreDecimals)},
                       {"mean_departure_mm", rounded(z.mean_departure_m * 1000.0, kMillimetreDecimals)},
                       {"peak_departure_mm", rounded(z.peak_departure_m * 1000.0, kMillimetreDecimals)},
                       {"significance_sigma", rounded(z.significance, 3)},
                       {"description", z.description}});
    out["deformation_zones"] = std::move(zones);
  }
  json readings = json::array();
  for (size_t i = 0; i < a.sheet.readings.size(); ++i) {
    const Reading& x = a.sheet.readings[i];
    const bool fitted = an.ok();
    readings.push_back({{"x_m", rounded(x.x, kMetreDecimals)},
                        {"z_m", rounded(x.z, kMetreDecimals)},
                        {"sigma_mm", rounded((fitted ? an.fit->sigmas[i] : x.sigma) * 1000.0, kMillimetreDecimals)},
                        {"used", fitted && static_cast<bool>(an.fit->used[i])},
                        {"check", x.check},
                        {"excluded_because", x.excluded ? json(x.exclusion_reason) : json(nullptr)},
                        {"residual_mm", fitted ? rounded(an.fit->residuals[i] * 1000.0, kMillimetreDecimals)
                                               : json(nullptr)}});
  }
  out["readings"] = std::move(readings);
  return out;
}

json span_json(const StructureGeometry& g, const SpanGeometry& sg) {
  const storage::SpanDetails& d = sg.source->details;
  json sections = json::array();
  for (const AnalysedSection& a : g.sections)
    if (a.source->record.span_label == sg.source->record.label) sections.push_back(section_json(a));
  json arc = nullptr, reference = nullptr;
  if (sg.reference_section) {
    const AnalysedSection& a = g.sections[*sg.reference_section];
    reference = a.source->record.label;
    const auto& keys = geometry_quantity_keys();
    for (size_t k = 0; k < keys.size(); ++k)
      if (keys[k] == "arc_length_m") arc = quantity(a.analysis.uncertainty.geometry[k], keys[k]);
  }
  return json{{"index", sg.source->record.index},
              {"label", sg.source->record.label},
              {"nominal_shape", text_or_null(d.nominal_shape)},
              {"barrel_width_m", rounded(d.barrel_width_m, kMetreDecimals)},
              {"skew_deg", rounded(d.skew_deg, kDegreeDecimals)},
              {"ring_material", text_or_null(d.ring_material)},
              {"unit_depth_mm", rounded(d.unit_depth_mm, kMillimetreDecimals)},
              {"joint_thickness_mm", rounded(d.joint_thickness_mm, kMillimetreDecimals)},
              {"fill_material", text_or_null(d.fill_material)},
              {"haunch_backing_height_m", rounded(d.haunch_backing_height_m, kMetreDecimals)},
              {"spandrel_walls", walls_json(d)},
              {"supports", supports_json(d)},
              {"notes", text_or_null(d.notes)},
              {"reference_section", std::move(reference)},
              {"stations",
               {{"crown_x_m", rounded(sg.crown_x_m, kMetreDecimals)},
                {"quarter_left_x_m", rounded(sg.quarter_left_x_m, kMetreDecimals)},
                {"quarter_right_x_m", rounded(sg.quarter_right_x_m, kMetreDecimals)}}},
              {"soffit_arc_length_m", std::move(arc)},
              {"ring_thickness", ring_thickness_json(sg)},
              {"fill", fill_json(sg)},
              {"surfacing", surfacing_json(sg)},
              {"sections", std::move(sections)}};
}

json defect_json(const storage::ExportDefect& e) {
  const storage::DefectFields& f = e.fields;
  const bool soffit = f.frame == storage::DefectFrame::soffit;
  json points = json::array();
  for (const auto& [a, b] : f.points)
    points.push_back(soffit ? json{{"s_m", rounded(a, kMetreDecimals)}, {"y_m", rounded(b, kMetreDecimals)}}
                            : json{{"x_m", rounded(a, kMetreDecimals)}, {"z_m", rounded(b, kMetreDecimals)}});
  const char* kind = f.geometry == storage::DefectGeometry::point  ? "point"
                     : f.geometry == storage::DefectGeometry::line ? "line"
                                                                   : "area";
  return json{{"ref", text_or_null(f.ref)},
              {"span", text_or_null(e.span_label)},
              {"defect_type", f.defect_type},
              {"element", f.element},
              {"frame", soffit ? "soffit" : "elevation"},
              {"frame_origin", f.frame_origin},
              {"geometry", kind},
              {"points", std::move(points)},
              {"length_m", rounded(f.length_m, kMetreDecimals)},
              {"width_mm", rounded(f.width_mm, kMillimetreDecimals)},
              {"area_m2", rounded(f.area_m2, kSquareMetreDecimals)},
              {"severity_scale", f.severity_scale},
              {"severity", f.severity ? json(*f.severity) : json(nullptr)},
              {"photo_count", e.photo_count},
              {"notes", text_or_null(f.notes)}};
}

// A soffit defect beyond the intrados (s past the arc length of the span's
// reference section) is kept as recorded, and flagged.
void check_defect_extent(const storage::ExportDefect& e, const StructureGeometry& g, std::vector<std::string>& w) {
  if (e.fields.frame != storage::DefectFrame::soffit || e.span_label.empty()) return;
  for (const SpanGeometry& sg : g.spans) {
    if (sg.source->record.label != e.span_label || !sg.reference_section) continue;
    const auto& keys = geometry_quantity_keys();
    const ProfileAnalysis& a = g.sections[*sg.reference_section].analysis;
    for (size_t k = 0; k < keys.size(); ++k) {
      if (keys[k] != "arc_length_m") continue;
      const double arc = a.uncertainty.geometry[k].value;
      for (const auto& [s, y] : e.fields.points)
        if (s < -0.05 || s > arc + 0.05) {
          w.push_back("defect " + e.fields.ref + ": s " + fixed_decimal(s, 3) + " m is beyond the intrados of span " +
                      e.span_label + " (0 to " + fixed_decimal(arc, 3) + " m): kept as recorded");
          return;
        }
    }
  }
}

}  // namespace

json geometry_json(const storage::InspectionExportData& data, const StructureGeometry& g,
                   const GeometryJsonOptions& options) {
  std::vector<std::string> warnings = g.warnings;
  json out;
  out["format"] = kGeometryFormat;
  out["format_version"] = kGeometryFormatVersion;
  out["caution"] = kSurveyDataCaution;
  out["frame"] = {
      {"sections",
       "x along the span from the named springing and z up, in metres, in each section's own frame as "
       "reduced from its sheet; fill chainages are in the frame of the span's reference section"},
      {"soffit", "s along the intrados from the springing named in frame_origin, y square from the named face, metres"},
      {"elevation", "x along and z up on the elevation named in frame_origin, metres"},
      {"handedness", "right-handed: x along the span, y across from the reference face, z up"}};
  out["provenance"] = provenance_json(data, g, options);
  out["structure"] = structure_json(data.structure);
  out["inspection"] = inspection_json(data.inspection);
  out["measurement"] = measurement_json(data, warnings);
  json spans = json::array();
  for (const SpanGeometry& sg : g.spans) spans.push_back(span_json(g, sg));
  if (g.spans.empty()) warnings.push_back("structure: no span recorded");
  out["spans"] = std::move(spans);
  json defects = json::array();
  for (const storage::ExportDefect& e : data.defects) {
    defects.push_back(defect_json(e));
    check_defect_extent(e, g, warnings);
  }
  out["defects"] = std::move(defects);
  for (const AnalysedSection& a : g.sections) {
    const std::string where = "span " + a.source->record.span_label + " section " + a.source->record.label + ": ";
    for (const std::string& w : a.sheet.warnings) warnings.push_back(where + w);
    for (const std::string& w : a.analysis.warnings) warnings.push_back(where + w);
  }
  out["warnings"] = warnings;
  return out;
}

json geometry_json(const storage::InspectionExportData& data, const GeometryJsonOptions& options) {
  const StructureGeometry g =
      analyse_structure(data, export_profile_request(options.monte_carlo_draws, options.seed));
  return geometry_json(data, g, options);
}

// User text that is not valid UTF-8 is written with U+FFFD rather than refused.
std::string geometry_json_text(const json& document) {
  return document.dump(2, ' ', false, json::error_handler_t::replace) + "\n";
}

}  // namespace soffit
