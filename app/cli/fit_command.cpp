// soffit fit FILE [--shape NAME|auto] [--sigma-mm S] [--springing-z Z] [--seed K] [--mc N]
//                 [--robust] [--summary]
// Reads one section, fits it headless and prints the JSON report (or, with
// --summary, a short text account) on stdout.
#include <charconv>
#include <cstdio>
#include <iostream>
#include <nlohmann/json.hpp>
#include <string>
#include <string_view>

#include "app/cli/fit_summary.hpp"
#include "app/cli/option_parsing.hpp"
#include "exports/fit_report_json.hpp"
#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit::cli {

namespace {

std::string shape_names() {
  std::string names;
  for (const ShapeFamily* f : shape_families()) names += std::string(f->name()) + "|";
  return names + "auto";
}

}  // namespace

int run_fit(int argc, char** argv) {
  std::string file;
  ProfileRequest request;
  SheetOptions sheet_options;
  bool summary = false;
  try {
    OptionCursor args(argc, argv, "fit");
    while (args.more()) {
      const std::string_view arg = args.next();
      if (arg == "--shape") {
        request.shape = std::string(args.value(arg));
        if (request.shape != "auto" && !find_shape_family(request.shape))
          throw UsageError("--shape must be one of " + shape_names() + ", not '" + request.shape + "'");
      } else if (arg == "--sigma-mm") {
        const double s = args.number(arg);
        if (!(s > 0.0)) throw UsageError("--sigma-mm must be a positive number of millimetres");
        sheet_options.default_sigma_m = s / 1000.0;
        request.fit.fallback_sigma_m = s / 1000.0;
      } else if (arg == "--springing-z") {
        request.fit.springing_z = args.number(arg);
      } else if (arg == "--seed") {
        request.uncertainty.seed = static_cast<std::uint64_t>(args.integer(arg, 0));
      } else if (arg == "--mc") {
        request.uncertainty.monte_carlo_draws = static_cast<int>(args.integer(arg, 0, 1000000));
      } else if (arg == "--robust") {
        request.fit.robust = true;
      } else if (arg == "--summary") {
        summary = true;
      } else if (!arg.empty() && arg[0] == '-') {
        throw UsageError("unknown option '" + std::string(arg) + "'");
      } else if (file.empty()) {
        file = std::string(arg);
      } else {
        throw UsageError("only one FILE can be fitted at a time");
      }
    }
    if (file.empty()) throw UsageError("no FILE given");
  } catch (const UsageError& e) {
    std::fprintf(stderr, "soffit fit: %s\nusage: soffit fit FILE [--shape %s] [--sigma-mm S]\n"
                         "       [--springing-z Z] [--seed K] [--mc N] [--robust] [--summary]\n",
                 e.what(), shape_names().c_str());
    return 2;
  }

  SurveySheet sheet;
  try {
    sheet = read_sheet_file(file, sheet_options);
  } catch (const InputError& e) {
    std::fprintf(stderr, "soffit fit: %s\n", e.what());
    return 2;
  }
  const ProfileAnalysis analysis = analyse_profile(sheet.readings, request);
  if (!analysis.ok()) {
    std::fprintf(stderr, "soffit fit: %s: cannot fit: %s\n", file.c_str(), analysis.error.c_str());
    return 2;
  }
  if (summary)
    print_fit_summary(std::cout, sheet, analysis);
  else
    std::cout << fit_report_json(sheet, analysis, request).dump(2) << "\n";
  return 0;
}

}  // namespace soffit::cli
