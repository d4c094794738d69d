// soffit export-section SHEET --out DIR [--shape NAME|auto] [--ring-mm T] [--road-z Z]
//                       [--format csv,svg,geo] [--seed K] [--mc N] [--sigma-mm S]
//                       [--springing-z Z] [--robust]
// Fits one section as `soffit fit` does and writes its analysis-ready files
// into DIR (created if missing): the points CSV, the SVG elevation and the Gmsh
// meshing script. Prints each written path on its own line.
#include <cstdio>
#include <filesystem>
#include <iostream>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include "app/cli/fit_options.hpp"
#include "app/cli/option_parsing.hpp"
#include "exports/safe_output_path.hpp"
#include "exports/section_gmsh_geo.hpp"
#include "exports/section_points_csv.hpp"
#include "exports/section_ring_fill.hpp"
#include "exports/section_svg.hpp"
#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit::cli {

namespace {

constexpr const char* kUsage =
    "usage: soffit export-section SHEET --out DIR [--shape NAME|auto] [--ring-mm T] [--road-z Z]\n"
    "                             [--format csv,svg,geo] [--seed K] [--mc N] [--sigma-mm S]\n"
    "                             [--springing-z Z] [--robust]\n"
    "  --ring-mm T   ring thickness d in mm, normal to the intrados (needed for geo)\n"
    "  --road-z Z    road level in m, in the section frame (z as the readings)\n"
    "  --format      default csv,svg, plus geo when --ring-mm is given\n";

struct Formats {
  bool csv = false, svg = false, geo = false;
};

Formats parse_formats(std::string_view list) {
  Formats f;
  size_t start = 0;
  while (start <= list.size()) {
    const size_t end = std::min(list.find(',', start), list.size());
    const std::string_view item = list.substr(start, end - start);
    if (item == "csv") f.csv = true;
    else if (item == "svg") f.svg = true;
    else if (item == "geo") f.geo = true;
    else
      throw UsageError("--format: '" + std::string(item) +
                       "' is not a section format (csv, svg, geo; json and pdf cover a whole structure)");
    start = end + 1;
  }
  return f;
}

}  // namespace

int run_export_section(int argc, char** argv) {
  std::string file, out_dir;
  ProfileRequest request;
  SheetOptions sheet_options;
  RingFillOptions model;
  std::optional<Formats> formats;
  try {
    OptionCursor args(argc, argv, "export-section");
    while (args.more()) {
      const std::string_view arg = args.next();
      if (arg == "--out") {
        out_dir = std::string(args.value(arg));
        if (out_dir.empty()) throw UsageError("--out needs a folder");
      } else if (parse_fit_option(args, arg, request, sheet_options)) {
        continue;
      } else if (arg == "--ring-mm") {
        const double t = args.number(arg);
        if (!(t > 0.0)) throw UsageError("--ring-mm must be a positive number of millimetres");
        model.ring_thickness_m = t / 1000.0;
      } else if (arg == "--road-z") {
        model.road_z_m = args.number(arg);
      } else if (arg == "--format") {
        formats = parse_formats(args.value(arg));
      } else if (!arg.empty() && arg[0] == '-') {
        throw UsageError("unknown option '" + std::string(arg) + "'");
      } else if (file.empty()) {
        file = std::string(arg);
      } else {
        throw UsageError("only one SHEET can be exported at a time");
      }
    }
    if (file.empty()) throw UsageError("no SHEET given");
    if (out_dir.empty()) throw UsageError("--out DIR is required");
    if (!formats) formats = Formats{true, true, model.ring_thickness_m.has_value()};
    if (formats->geo && !model.ring_thickness_m)
      throw UsageError("--format geo needs the ring thickness: give --ring-mm");
  } catch (const UsageError& e) {
    std::fprintf(stderr, "soffit export-section: %s\n%s", e.what(), kUsage);
    return 2;
  }

  const auto fitted = read_and_fit("export-section", file, sheet_options, request);
  if (!fitted) return 2;  // data that cannot be read or fitted is bad input, as for soffit fit
  const auto& [sheet, analysis] = *fitted;
  // Each option is judged on its own first, so the message names the one to fix.
  RingFillOptions ring_only = model;
  ring_only.road_z_m.reset();
  if (const std::string problem = ring_fill_problem(*analysis.fit, ring_only); !problem.empty()) {
    std::fprintf(stderr, "soffit export-section: --ring-mm: %s\n", problem.c_str());
    return 2;
  }
  if (const std::string problem = ring_fill_problem(*analysis.fit, model); !problem.empty()) {
    std::fprintf(stderr, "soffit export-section: --road-z: %s\n", problem.c_str());
    return 2;
  }

  namespace fs = std::filesystem;
  std::error_code ec;
  fs::create_directories(out_dir, ec);
  if (ec || !fs::is_directory(out_dir)) {
    std::fprintf(stderr, "soffit export-section: --out: cannot use '%s' as a folder%s%s\n", out_dir.c_str(),
                 ec ? ": " : "", ec ? ec.message().c_str() : "");
    return 2;
  }
  const std::string program = std::string("soffit ") + SOFFIT_VERSION;
  const std::string stem = sanitise_file_name(fs::path(file).stem().string(), kMaxExportNameLength - 20);
  try {
    std::vector<fs::path> written;
    if (formats->csv)
      written.push_back(write_export_file(out_dir, stem + "_points.csv", section_points_csv(sheet, analysis, program)));
    if (formats->svg)
      written.push_back(write_export_file(out_dir, stem + "_elevation.svg", section_svg(sheet, analysis, model, program)));
    if (formats->geo)
      written.push_back(write_export_file(out_dir, stem + "_ring-fill.geo", section_gmsh_geo(sheet, analysis, model, program)));
    for (const fs::path& p : written) std::cout << p.string() << "\n";
  } catch (const ExportPathError& e) {
    std::fprintf(stderr, "soffit export-section: %s\n", e.what());
    return 2;
  } catch (const std::exception& e) {
    std::fprintf(stderr, "soffit export-section: %s\n", e.what());
    return 1;
  }
  return 0;
}

}  // namespace soffit::cli
