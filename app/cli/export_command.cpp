// soffit export PROJECT --structure REF [--inspection YYYY-MM-DD] --out DIR
//              [--format json,csv,svg,geo,pdf] [--mc N] [--seed K]
// Writes one inspection of one structure for the analyst: the geometry file
// (exports/GEOMETRY_JSON.md) and, for each section of the inspection, the
// points CSV, the SVG elevation and the Gmsh script, into DIR (created if
// missing). Prints each written path on its own line; what had to be left
// out (no fit, no ring count, no fill at the crown) goes to stderr as a
// warning and into the JSON's "warnings". With pdf in --format, the
// inspection report (exports/report_pdf.hpp) is written as well.
#include <cstdio>
#include <filesystem>
#include <iostream>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "app/cli/option_parsing.hpp"
#include "exports/geometry_json.hpp"
#include "exports/report_pdf.hpp"
#include "exports/safe_output_path.hpp"
#include "exports/section_gmsh_geo.hpp"
#include "exports/section_points_csv.hpp"
#include "exports/section_ring_fill.hpp"
#include "exports/section_svg.hpp"
#include "exports/structure_geometry.hpp"
#include "storage/export_queries.hpp"
#include "storage/project_file.hpp"
#include "storage/report_queries.hpp"

namespace soffit::cli {

namespace {

constexpr const char* kUsage =
    "usage: soffit export PROJECT --structure REF [--inspection YYYY-MM-DD] --out DIR\n"
    "                     [--format json,csv,svg,geo,pdf] [--mc N] [--seed K]\n"
    "  --inspection  the visit to export (default: the latest)\n"
    "  --format      default json,csv,svg,geo; pdf adds the inspection report\n"
    "  --mc, --seed  Monte Carlo draws (default 2000) and seed (default 1) of the ranges\n";

struct Formats {
  bool json = false, csv = false, svg = false, geo = false, pdf = false;
};

Formats parse_formats(std::string_view list) {
  Formats f;
  size_t start = 0;
  while (start <= list.size()) {
    const size_t end = std::min(list.find(',', start), list.size());
    const std::string_view item = list.substr(start, end - start);
    if (item == "json") f.json = true;
    else if (item == "csv") f.csv = true;
    else if (item == "svg") f.svg = true;
    else if (item == "geo") f.geo = true;
    else if (item == "pdf") f.pdf = true;
    else
      throw UsageError("--format: '" + std::string(item) + "' is not a format (json, csv, svg, geo, pdf)");
    start = end + 1;
  }
  return f;
}

void warn(const std::string& message) { std::fprintf(stderr, "soffit export: warning: %s\n", message.c_str()); }

// The drawing and meshing model of one section, each term dropped with a
// warning when it is missing or does not suit the fit.
RingFillOptions section_model(const StructureGeometry& g, const AnalysedSection& s, const std::string& name) {
  RingFillOptions model;
  const SpanGeometry* span = span_of_section(g, s);
  if (span && span->ring_from_counts_mm) {
    model.ring_thickness_m = *span->ring_from_counts_mm / 1000.0;
    if (const std::string problem = ring_fill_problem(*s.analysis.fit, model); !problem.empty()) {
      warn(name + ": ring thickness from the counts not used: " + problem);
      model.ring_thickness_m.reset();
    }
  } else {
    warn(name + ": no ring thickness from the ring counts: the elevation has no extrados and no .geo is written");
  }
  std::string why;
  if (const auto road = road_z_over_crown(g, s, why)) {
    model.road_z_m = road;
    if (const std::string problem = ring_fill_problem(*s.analysis.fit, model); !problem.empty()) {
      warn(name + ": road level from the fill observations not used: " + problem);
      model.road_z_m.reset();
    }
  } else {
    warn(name + ": road level omitted: " + why);
  }
  return model;
}

}  // namespace

int run_export(int argc, char** argv) {
  std::string project_path, structure_ref, out_dir;
  std::optional<std::string> date;
  Formats formats{true, true, true, true, false};
  GeometryJsonOptions options;
  options.program = std::string("soffit ") + SOFFIT_VERSION;
  try {
    OptionCursor args(argc, argv, "export");
    while (args.more()) {
      const std::string_view arg = args.next();
      if (arg == "--structure") {
        structure_ref = std::string(args.value(arg));
        if (structure_ref.empty()) throw UsageError("--structure needs a reference");
      } else if (arg == "--inspection") {
        date = std::string(args.value(arg));
      } else if (arg == "--out") {
        out_dir = std::string(args.value(arg));
        if (out_dir.empty()) throw UsageError("--out needs a folder");
      } else if (arg == "--format") {
        formats = parse_formats(args.value(arg));
      } else if (arg == "--mc") {
        options.monte_carlo_draws = static_cast<int>(args.integer(arg, 0, 1000000));
      } else if (arg == "--seed") {
        options.seed = static_cast<std::uint64_t>(args.integer(arg, 0));
      } else if (!arg.empty() && arg[0] == '-') {
        throw UsageError("unknown option '" + std::string(arg) + "'");
      } else if (project_path.empty()) {
        project_path = std::string(arg);
      } else {
        throw UsageError("only one PROJECT can be exported at a time ('" + std::string(arg) + "' is extra)");
      }
    }
    if (project_path.empty()) throw UsageError("no PROJECT given");
    if (structure_ref.empty()) throw UsageError("--structure REF is required");
    if (out_dir.empty()) throw UsageError("--out DIR is required");
  } catch (const UsageError& e) {
    std::fprintf(stderr, "soffit export: %s\n%s", e.what(), kUsage);
    return 2;
  }

  namespace fs = std::filesystem;
  try {
    storage::Project project = storage::Project::open(project_path, "soffit export", storage::Access::view);
    const storage::InspectionExportData data = storage::load_inspection_export(project.db(), structure_ref, date);
    const StructureGeometry g =
        analyse_structure(data, export_profile_request(options.monte_carlo_draws, options.seed));

    std::error_code ec;
    fs::create_directories(out_dir, ec);
    if (ec || !fs::is_directory(out_dir)) {
      std::fprintf(stderr, "soffit export: --out: cannot use '%s' as a folder%s%s\n", out_dir.c_str(),
                   ec ? ": " : "", ec ? ec.message().c_str() : "");
      return 2;
    }
    const std::string stem = sanitise_file_name(data.structure.fields.ref + "_" + data.inspection.date, 60);
    std::vector<fs::path> written;
    if (formats.json) {
      const std::string text = geometry_json_text(geometry_json(data, g, options));
      written.push_back(write_export_file(out_dir, sanitise_file_name(stem + "_geometry.json"), text));
    }
    if (formats.csv || formats.svg || formats.geo) {
      for (const AnalysedSection& s : g.sections) {
        const std::string name = "span " + s.source->record.span_label + " section " + s.source->record.label;
        if (!s.analysis.ok()) {
          warn(name + ": no fit (" + s.analysis.error + "): no section files");
          continue;
        }
        const std::string base =
            sanitise_file_name(stem + "_" + s.source->record.span_label + "-" + s.source->record.label,
                               kMaxExportNameLength - 20);
        if (formats.csv)
          written.push_back(write_export_file(out_dir, base + "_points.csv",
                                              section_points_csv(s.sheet, s.analysis, options.program)));
        if (!formats.svg && !formats.geo) continue;
        const RingFillOptions model = section_model(g, s, name);
        if (formats.svg)
          written.push_back(write_export_file(out_dir, base + "_elevation.svg",
                                              section_svg(s.sheet, s.analysis, model, options.program)));
        if (formats.geo && model.ring_thickness_m)
          written.push_back(write_export_file(out_dir, base + "_ring-fill.geo",
                                              section_gmsh_geo(s.sheet, s.analysis, model, options.program)));
      }
    }
    if (formats.pdf) {
      const ReportPdfInput report{&data, &g, storage::load_defect_thumbnails(project.db(), data), options.program};
      written.push_back(write_export_file(out_dir, sanitise_file_name(stem + "_report.pdf"), report_pdf(report)));
    }
    for (const fs::path& p : written) std::cout << p.string() << "\n";
  } catch (const storage::StorageError& e) {
    std::fprintf(stderr, "soffit export: %s\n", e.what());
    return e.kind() == storage::ErrorKind::io || e.kind() == storage::ErrorKind::disk_full ? 1 : 2;
  } catch (const ExportPathError& e) {
    std::fprintf(stderr, "soffit export: %s\n", e.what());
    return 2;
  } catch (const std::exception& e) {
    std::fprintf(stderr, "soffit export: %s\n", e.what());
    return 1;
  }
  return 0;
}

}  // namespace soffit::cli
