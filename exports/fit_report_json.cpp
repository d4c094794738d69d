#include "exports/fit_report_json.hpp"

#include <nlohmann/json.hpp>

#include "geometry/analysis/derived.hpp"

namespace soffit {

namespace {

using json = nlohmann::ordered_json;

json estimate_json(const Estimate& e) {
  return json{{"value", e.value}, {"sd", e.sd}, {"ci95", json::array({e.lo, e.hi})}};
}

json candidates_json(const ShapeSelection& selection) {
  json list = json::array();
  for (size_t i = 0; i < selection.candidates.size(); ++i) {
    const ShapeCandidate& c = selection.candidates[i];
    json entry{{"shape", std::string(c.family->name())},
               {"parameters", c.family->parameter_count()},
               {"chosen", static_cast<int>(i) == selection.chosen}};
    if (c.fit) {
      entry["rms_residual_mm"] = c.fit->rms_m * 1000.0;
      entry["max_residual_mm"] = c.fit->max_abs_m * 1000.0;
      entry["reduced_chi2"] = c.fit->reduced_chi2;
      entry["aic"] = c.fit->aic;
      entry["bic"] = c.fit->bic;
      entry["supported"] = c.supported;
      if (!c.supported) entry["not_supported_because"] = c.error;
    } else {
      entry["rms_residual_mm"] = nullptr;
      entry["aic"] = nullptr;
      entry["error"] = c.error;
    }
    list.push_back(std::move(entry));
  }
  return list;
}

json readings_json(const SurveySheet& sheet, const ShapeFit& fit) {
  json list = json::array();
  for (size_t i = 0; i < sheet.readings.size(); ++i) {
    const Reading& r = sheet.readings[i];
    json entry{{"x_m", r.x},
               {"z_m", r.z},
               {"sigma_mm", fit.sigmas[i] * 1000.0},
               {"used", static_cast<bool>(fit.used[i])},
               {"residual_mm", fit.residuals[i] * 1000.0},
               {"weight", fit.weights[i]},
               {"line", r.source_line}};
    if (r.excluded) entry["excluded_because"] = r.exclusion_reason;
    if (r.check) entry["check"] = true;
    if (!r.note.empty()) entry["note"] = r.note;
    list.push_back(std::move(entry));
  }
  return list;
}

json zones_json(const std::vector<DeformationZone>& zones) {
  json list = json::array();
  for (const DeformationZone& z : zones) {
    list.push_back({{"x_from_m", z.x_from},
                    {"x_to_m", z.x_to},
                    {"readings", z.readings.size()},
                    {"mean_departure_mm", z.mean_departure_m * 1000.0},
                    {"peak_departure_mm", z.peak_departure_m * 1000.0},
                    {"significance_sigma", z.significance},
                    {"kind", z.kind},
                    {"description", z.description}});
  }
  return list;
}

}  // namespace

json fit_report_json(const SurveySheet& sheet, const ProfileAnalysis& analysis,
                     const ProfileRequest& request) {
  const ShapeFit& fit = *analysis.fit;
  const Uncertainty& u = analysis.uncertainty;
  json out;
  out["format"] = "soffit-fit";
  out["format_version"] = 1;
  out["caution"] = kSurveyDataCaution;
  out["source"] = sheet.source;
  out["shape"] = std::string(fit.family->name());
  if (analysis.selection) out["selection"] = analysis.selection->reason;

  const auto& keys = geometry_quantity_keys();
  for (size_t k = 0; k < keys.size(); ++k) out[keys[k]] = estimate_json(u.geometry[k]);
  out["rms_residual_mm"] = fit.rms_m * 1000.0;
  out["max_residual_mm"] = fit.max_abs_m * 1000.0;
  json params = json::object();
  for (const auto& [name, e] : u.parameters) params[name] = estimate_json(e);
  out["params"] = std::move(params);

  out["springing_level_from"] = fit.family->springing_from_shape()
                                    ? "shape"
                                    : (fit.springing_from_ends ? "end readings" : "given");
  out["fit"] = {{"readings_used", fit.n_used},
                {"degrees_of_freedom", fit.dof},
                {"chi2", fit.chi2},
                {"reduced_chi2", fit.reduced_chi2},
                {"aic", fit.aic},
                {"bic", fit.bic},
                {"iterations", fit.iterations},
                {"robust", request.fit.robust}};
  json linearised = json::object();
  for (size_t k = 0; k < keys.size(); ++k) linearised[keys[k]] = estimate_json(u.geometry_linearised[k]);
  out["uncertainty"] = {{"method", u.method},
                        {"monte_carlo_draws", u.draws_requested},
                        {"monte_carlo_draws_used", u.draws_used},
                        {"seed", u.seed},
                        {"reduced_chi2_limit_95", u.reduced_chi2_limit},
                        {"widened", u.widened},
                        {"sigma_scale", u.scale},
                        {"linearised", std::move(linearised)},
                        {"assumes",
                         "independent readings with isotropic normal errors of the stated sigma; "
                         "the family describes the intrados exactly"}};
  if (analysis.selection) out["candidates"] = candidates_json(*analysis.selection);
  out["deformation_zones"] = zones_json(analysis.zones);
  out["readings"] = readings_json(sheet, fit);
  json warnings = json::array();
  for (const std::string& w : sheet.warnings) warnings.push_back(w);
  for (const std::string& w : analysis.warnings) warnings.push_back(w);
  out["warnings"] = std::move(warnings);
  return out;
}

}  // namespace soffit
