#include "exports/structure_geometry.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <limits>

#include "exports/fixed_decimal.hpp"
#include "exports/ring_thickness_estimate.hpp"
#include "geometry/analysis/derived.hpp"

namespace soffit {

namespace {

double geometry_value(const ProfileAnalysis& a, const std::string& key) {
  const auto& keys = geometry_quantity_keys();
  const size_t k = static_cast<size_t>(std::find(keys.begin(), keys.end(), key) - keys.begin());
  return a.uncertainty.geometry.at(k).value;
}

SurveySheet titled_sheet(const storage::InspectionExportData& data, const storage::ExportSection& s) {
  SurveySheet sheet = s.sheet;
  SheetMetadata& m = sheet.metadata;
  m.structure = data.structure.fields.ref;
  if (!data.structure.fields.name.empty()) m.structure_name = data.structure.fields.name;
  m.span = s.record.span_label;
  m.section = s.record.label;
  m.position_m = s.record.position_m;
  if (!s.record.reference_face.empty()) m.reference_face = s.record.reference_face;
  m.date = data.inspection.date;
  if (!s.record.datum.empty()) m.datum = s.record.datum;
  return sheet;
}

bool is_crown(const std::string& position) {
  std::string lower = position;
  for (char& c : lower) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return lower.find("crown") != std::string::npos;
}

std::optional<double> mean_count_thickness(const std::vector<const storage::RingCountFields*>& counts,
                                           const storage::SpanDetails& span) {
  for (const bool crown_only : {true, false}) {
    double sum = 0.0;
    int n = 0;
    for (const auto* c : counts) {
      if (crown_only && !is_crown(c->position)) continue;
      const RingThicknessEstimate e = ring_thickness_estimate(*c, span);
      if (!e.from_counts) continue;
      sum += e.from_counts->value_mm;
      ++n;
    }
    if (n > 0) return sum / n;
  }
  return std::nullopt;
}

StationFill fill_at(double x, double span, const std::vector<const storage::FillDepthFields*>& fills) {
  StationFill out;
  out.x_m = x;
  const double tolerance = kFillStationTolerance * span;
  for (const auto* f : fills)
    if (std::abs(f->chainage_m - x) <= tolerance) out.observations.push_back(f);
  // Nearest the station first; then the better known.
  std::stable_sort(out.observations.begin(), out.observations.end(), [x](const auto* a, const auto* b) {
    const double da = std::abs(a->chainage_m - x), db = std::abs(b->chainage_m - x);
    if (da != db) return da < db;
    return a->uncertainty_m.value_or(HUGE_VAL) < b->uncertainty_m.value_or(HUGE_VAL);
  });
  return out;
}

}  // namespace

ProfileRequest export_profile_request(int draws, std::uint64_t seed) {
  ProfileRequest r;
  r.shape = "auto";
  r.uncertainty.monte_carlo_draws = draws;
  r.uncertainty.seed = seed;
  return r;
}

StructureGeometry analyse_structure(const storage::InspectionExportData& data, const ProfileRequest& request) {
  StructureGeometry g;
  g.request = request;
  for (const storage::ExportSection& s : data.sections) {
    AnalysedSection a;
    a.source = &s;
    a.sheet = titled_sheet(data, s);
    a.analysis = analyse_profile(a.sheet.readings, request);
    if (!a.analysis.ok())
      g.warnings.push_back("span " + s.record.span_label + " section " + s.record.label +
                           ": no arch could be fitted (" + a.analysis.error + "): its shape, parameters and "
                           "derived quantities are null");
    g.sections.push_back(std::move(a));
  }
  for (const storage::ExportSpan& span : data.spans) {
    SpanGeometry sg;
    sg.source = &span;
    const std::string name = "span " + span.record.label;
    for (const auto& c : data.ring_counts)
      if (c.span_id == span.record.id) sg.ring_counts.push_back(&c);
    for (const auto& f : data.fill_depths)
      if (f.span_id == span.record.id) sg.fill_depths.push_back(&f);

    // The reference section: fitted, and nearest mid-width where positions are known.
    double best = std::numeric_limits<double>::infinity();
    for (size_t i = 0; i < g.sections.size(); ++i) {
      const AnalysedSection& a = g.sections[i];
      if (a.source->record.span_label != span.record.label || !a.analysis.ok()) continue;
      const auto& pos = a.source->record.position_m;
      const auto& width = span.details.barrel_width_m;
      const double score = pos && width ? std::abs(*pos - *width / 2.0) : std::numeric_limits<double>::max();
      if (!sg.reference_section || score < best) {
        sg.reference_section = i;
        best = score;
      }
    }
    if (sg.reference_section) {
      const ProfileAnalysis& a = g.sections[*sg.reference_section].analysis;
      const double L = geometry_value(a, "span_m"), left = geometry_value(a, "springing_left_x_m");
      sg.span_m = L;
      sg.crown_x_m = geometry_value(a, "crown_x_m");
      sg.quarter_left_x_m = left + L / 4.0;
      sg.quarter_right_x_m = left + 3.0 * L / 4.0;
      sg.crown_fill = fill_at(*sg.crown_x_m, L, sg.fill_depths);
      sg.quarter_left_fill = fill_at(*sg.quarter_left_x_m, L, sg.fill_depths);
      sg.quarter_right_fill = fill_at(*sg.quarter_right_x_m, L, sg.fill_depths);
      if (sg.crown_fill->observations.empty())
        g.warnings.push_back(name + ": no fill depth observed at the crown (x " + fixed_decimal(*sg.crown_x_m, 3) +
                             " m): fill at the crown is null");
      if (sg.quarter_left_fill->observations.empty() || sg.quarter_right_fill->observations.empty())
        g.warnings.push_back(name + ": no fill depth observed at " +
                             (sg.quarter_left_fill->observations.empty() && sg.quarter_right_fill->observations.empty()
                                  ? std::string("either quarter point")
                                  : std::string("one quarter point")) +
                             " of the span: that fill is null");
    } else {
      g.warnings.push_back(name + ": no fitted section in this inspection: span, crown and quarter points are "
                                  "unknown, and so is the fill at them (null)");
    }

    if (sg.ring_counts.empty())
      g.warnings.push_back(name + ": no ring count in this inspection: ring thickness is null");
    for (const auto* c : sg.ring_counts)
      for (const std::string& w : ring_thickness_estimate(*c, span.details).warnings)
        g.warnings.push_back(name + " ring count at the " + w);
    sg.ring_from_counts_mm = mean_count_thickness(sg.ring_counts, span.details);
    g.spans.push_back(std::move(sg));
  }
  return g;
}

const SpanGeometry* span_of_section(const StructureGeometry& g, const AnalysedSection& s) {
  for (const SpanGeometry& sg : g.spans)
    if (sg.source->record.label == s.source->record.span_label) return &sg;
  return nullptr;
}

std::optional<double> road_z_over_crown(const StructureGeometry& g, const AnalysedSection& s, std::string& why) {
  const SpanGeometry* sg = span_of_section(g, s);
  if (!s.analysis.ok()) {
    why = "the section has no fit";
    return std::nullopt;
  }
  if (!sg || !sg->ring_from_counts_mm) {
    why = "no ring thickness from the ring counts of this span";
    return std::nullopt;
  }
  if (!sg->crown_fill || sg->crown_fill->observations.empty()) {
    why = "no fill depth observed at the crown of this span";
    return std::nullopt;
  }
  // Across the width, the observation nearest this section; the list is
  // already ordered nearest the station, then better known.
  const auto& obs = sg->crown_fill->observations;
  const storage::FillDepthFields* chosen = obs.front();
  if (const auto& pos = s.source->record.position_m) {
    double best = HUGE_VAL;
    for (const auto* f : obs) {
      const double d = f->offset_y_m ? std::abs(*f->offset_y_m - *pos) : HUGE_VAL;
      if (d < best) {
        best = d;
        chosen = f;
      }
    }
  }
  return geometry_value(s.analysis, "crown_z_m") + *sg->ring_from_counts_mm / 1000.0 + chosen->depth_m;
}

}  // namespace soffit
