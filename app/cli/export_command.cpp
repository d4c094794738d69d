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
#include "app/model/inspection_export.hpp"
#include "exports/geometry_json.hpp"
#include "exports/safe_output_path.hpp"
#include "storage/project_file.hpp"

namespace soffit::cli {

namespace {

constexpr const char* kUsage =
    "usage: soffit export PROJECT --structure REF [--inspection YYYY-MM-DD] --out DIR\n"
    "                     [--format json,csv,svg,geo,pdf] [--mc N] [--seed K]\n"
    "  --inspection  the visit to export (default: the latest)\n"
    "  --format      default json,csv,svg,geo; pdf adds the inspection report\n"
    "  --mc, --seed  Monte Carlo draws (default 2000) and seed (default 1) of the ranges\n";

using Formats = app::ExportFormats;

Formats parse_formats(std::string_view list) {
  Formats f{false, false, false, false, false};
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

  try {
    storage::Project project = storage::Project::open(project_path, "soffit export", storage::Access::view);
    const app::ExportInput input = app::load_export_input(project.db(), structure_ref, date, formats.pdf);
    const app::ExportOutcome outcome = app::write_inspection_export(input, out_dir, formats, options);
    for (const std::string& w : outcome.warnings) std::fprintf(stderr, "soffit export: warning: %s\n", w.c_str());
    for (const auto& p : outcome.written) std::cout << p.string() << "\n";
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
