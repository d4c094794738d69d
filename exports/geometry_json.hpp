#pragma once
// The project-level geometry file: one inspection of one structure, as JSON an
// analyst builds a 2D or 3D model from without retyping anything, with how
// sure each number is. Format "soffit-geometry", version 1; every field is
// described in exports/GEOMETRY_JSON.md and checked by exports/geometry_schema.json.
//
// Units are explicit: every number's key ends in its unit (_m, _mm, _m2,
// _deg, _degc) or the number sits in a quantity object {value, sd, ci95, unit}.
// Numbers are rounded to a stated resolution (0.01 mm for lengths) before they
// are stored, so the file reads back to the same doubles and two exports of
// the same data are byte-identical. Missing information is null, with a
// sentence in "warnings"; nothing is invented.
#include <cstdint>
#include <nlohmann/json.hpp>
#include <string>

#include "exports/structure_geometry.hpp"
#include "storage/export_queries.hpp"

namespace soffit {

inline constexpr const char* kGeometryFormat = "soffit-geometry";
inline constexpr int kGeometryFormatVersion = 1;

struct GeometryJsonOptions {
  std::string program;          // the writer and its version, e.g. "soffit 0.1.0"
  int monte_carlo_draws = 2000; // ranges of the fitted quantities (JCGM 101:2008)
  std::uint64_t seed = 1;       // fixed: the same data always gives the same ranges
};

// From data already read and analysed (the command writes the section files
// from the same `geometry`).
nlohmann::ordered_json geometry_json(const storage::InspectionExportData& data, const StructureGeometry& geometry,
                                     const GeometryJsonOptions& options);

// Reads, analyses and writes in one call.
nlohmann::ordered_json geometry_json(const storage::InspectionExportData& data, const GeometryJsonOptions& options);

// The text written to the file: two-space indentation and a final newline.
std::string geometry_json_text(const nlohmann::ordered_json& document);

}  // namespace soffit
