#include "app/model/inspection_export.hpp"

#include "exports/report_pdf.hpp"
#include "exports/safe_output_path.hpp"
#include "exports/section_gmsh_geo.hpp"
#include "exports/section_points_csv.hpp"
#include "exports/section_ring_fill.hpp"
#include "exports/section_svg.hpp"
#include "exports/structure_geometry.hpp"

namespace soffit::app {

namespace {

// The drawing and meshing model of one section, each term dropped with a
// warning when it is missing or does not suit the fit.
RingFillOptions section_model(const StructureGeometry& g, const AnalysedSection& s, const std::string& name,
                              std::vector<std::string>& warnings) {
  RingFillOptions model;
  const SpanGeometry* span = span_of_section(g, s);
  if (span && span->ring_from_counts_mm) {
    model.ring_thickness_m = *span->ring_from_counts_mm / 1000.0;
    if (const std::string problem = ring_fill_problem(*s.analysis.fit, model); !problem.empty()) {
      warnings.push_back(name + ": ring thickness from the counts not used: " + problem);
      model.ring_thickness_m.reset();
    }
  } else {
    warnings.push_back(name + ": no ring thickness from the ring counts: the elevation has no extrados and no .geo is written");
  }
  std::string why;
  if (const auto road = road_z_over_crown(g, s, why)) {
    model.road_z_m = road;
    if (const std::string problem = ring_fill_problem(*s.analysis.fit, model); !problem.empty()) {
      warnings.push_back(name + ": road level from the fill observations not used: " + problem);
      model.road_z_m.reset();
    }
  } else {
    warnings.push_back(name + ": road level omitted: " + why);
  }
  return model;
}

}  // namespace

ExportInput load_export_input(storage::Connection& db, const std::string& structure_ref,
                              const std::optional<std::string>& date, bool with_thumbnails) {
  ExportInput input;
  input.data = storage::load_inspection_export(db, structure_ref, date);
  if (with_thumbnails) input.thumbnails = storage::load_defect_thumbnails(db, input.data);
  return input;
}

ExportOutcome write_inspection_export(const ExportInput& input, const std::string& out_dir,
                                      const ExportFormats& formats, const GeometryJsonOptions& options,
                                      const std::function<void(int, int)>& progress) {
  namespace fs = std::filesystem;
  ExportOutcome out;
  const storage::InspectionExportData& data = input.data;
  const int sections = static_cast<int>(data.sections.size());
  // Steps: the analysis, the JSON, each section's files, the report.
  const int total = 1 + (formats.json ? 1 : 0) + ((formats.csv || formats.svg || formats.geo) ? sections : 0) +
                    (formats.pdf ? 1 : 0);
  int done = 0;
  auto step = [&] {
    ++done;
    if (progress) progress(done, total);
  };
  if (progress) progress(0, total);

  const StructureGeometry g = analyse_structure(data, export_profile_request(options.monte_carlo_draws, options.seed));
  step();
  std::error_code ec;
  fs::create_directories(out_dir, ec);
  if (ec || !fs::is_directory(out_dir))
    throw ExportPathError("cannot use '" + out_dir + "' as a folder" + (ec ? ": " + ec.message() : ""));
  const std::string stem = sanitise_file_name(data.structure.fields.ref + "_" + data.inspection.date, 60);
  if (formats.json) {
    const std::string text = geometry_json_text(geometry_json(data, g, options));
    out.written.push_back(write_export_file(out_dir, sanitise_file_name(stem + "_geometry.json"), text));
    step();
  }
  if (formats.csv || formats.svg || formats.geo) {
    for (const AnalysedSection& s : g.sections) {
      const std::string name = "span " + s.source->record.span_label + " section " + s.source->record.label;
      if (!s.analysis.ok()) {
        out.warnings.push_back(name + ": no fit (" + s.analysis.error + "): no section files");
        step();
        continue;
      }
      const std::string base = sanitise_file_name(
          stem + "_" + s.source->record.span_label + "-" + s.source->record.label, kMaxExportNameLength - 20);
      if (formats.csv)
        out.written.push_back(
            write_export_file(out_dir, base + "_points.csv", section_points_csv(s.sheet, s.analysis, options.program)));
      if (formats.svg || formats.geo) {
        const RingFillOptions model = section_model(g, s, name, out.warnings);
        if (formats.svg)
          out.written.push_back(write_export_file(out_dir, base + "_elevation.svg",
                                                  section_svg(s.sheet, s.analysis, model, options.program)));
        if (formats.geo && model.ring_thickness_m)
          out.written.push_back(write_export_file(out_dir, base + "_ring-fill.geo",
                                                  section_gmsh_geo(s.sheet, s.analysis, model, options.program)));
      }
      step();
    }
  }
  if (formats.pdf) {
    const ReportPdfInput report{&data, &g, input.thumbnails, options.program};
    out.written.push_back(write_export_file(out_dir, sanitise_file_name(stem + "_report.pdf"), report_pdf(report)));
    step();
  }
  return out;
}

}  // namespace soffit::app
