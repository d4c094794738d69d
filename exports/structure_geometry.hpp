#pragma once
// One inspection of a structure reduced for export: every section fitted the
// same way (one request, one fixed seed, so two exports agree to the byte),
// and per span the stations an analyst models at (crown and quarter points of
// the fitted reference section), the fill observed near them, and the ring
// thickness from the counts that the section drawings use.
// The JSON (geometry_json.hpp) and the per-section files of `soffit export`
// are both views of this one result.
#include <optional>
#include <string>
#include <vector>

#include "geometry/analysis/profile_analysis.hpp"
#include "storage/export_queries.hpp"

namespace soffit {

struct AnalysedSection {
  const storage::ExportSection* source = nullptr;
  SurveySheet sheet;           // the stored sheet, its metadata filled from the register for titles
  ProfileAnalysis analysis;    // analysis.ok() false when no arch could be fitted
};

// A fill observation within kFillStationTolerance of a station.
struct StationFill {
  double x_m = 0.0;  // the station, in the reference section's frame
  std::vector<const storage::FillDepthFields*> observations;  // nearest across the width first
};

// Fill near a station counts as "at" it within this fraction of the span
// (a Soffit choice, stated in GEOMETRY_JSON.md: the trade has no rule).
inline constexpr double kFillStationTolerance = 0.05;

struct SpanGeometry {
  const storage::ExportSpan* source = nullptr;
  std::optional<size_t> reference_section;  // index into sections: fitted, nearest mid-width
  std::optional<double> span_m, crown_x_m, quarter_left_x_m, quarter_right_x_m;
  std::optional<StationFill> crown_fill, quarter_left_fill, quarter_right_fill;  // when the station is known
  // Mean count-based d over the counts at the crown (every count when none is at
  // the crown), for drawing the extrados; null without a count or ring depth.
  std::optional<double> ring_from_counts_mm;
  std::vector<const storage::RingCountFields*> ring_counts;
  std::vector<const storage::FillDepthFields*> fill_depths;
};

struct StructureGeometry {
  ProfileRequest request;
  std::vector<AnalysedSection> sections;  // in the order of data.sections
  std::vector<SpanGeometry> spans;        // in the order of data.spans
  std::vector<std::string> warnings;      // each names the span or section it is about
};

// The request every section is fitted with: the family chosen by the fit
// ("auto"), Monte Carlo ranges with `draws` draws from `seed`.
ProfileRequest export_profile_request(int draws, std::uint64_t seed);

StructureGeometry analyse_structure(const storage::InspectionExportData& data, const ProfileRequest& request);

// The span a section belongs to, by its label; null when none matches.
const SpanGeometry* span_of_section(const StructureGeometry& g, const AnalysedSection& s);

// Road level in the section's own frame (z up, as its readings) over its
// crown: fitted crown + ring from counts + the crown fill nearest the
// section across the width. Null (with `why`) when a term is missing.
std::optional<double> road_z_over_crown(const StructureGeometry& g, const AnalysedSection& s, std::string& why);

}  // namespace soffit
