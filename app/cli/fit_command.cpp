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
#include "app/cli/fit_options.hpp"
#include "app/cli/option_parsing.hpp"
#include "exports/fit_report_json.hpp"
#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit::cli {

int run_fit(int argc, char** argv) {
  std::string file;
  ProfileRequest request;
  SheetOptions sheet_options;
  bool summary = false;
  try {
    OptionCursor args(argc, argv, "fit");
    while (args.more()) {
      const std::string_view arg = args.next();
      if (parse_fit_option(args, arg, request, sheet_options)) {
        continue;
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

  const auto fitted = read_and_fit("fit", file, sheet_options, request);
  if (!fitted) return 2;
  const auto& [sheet, analysis] = *fitted;
  if (summary)
    print_fit_summary(std::cout, sheet, analysis);
  else
    std::cout << fit_report_json(sheet, analysis, request).dump(2) << "\n";
  return 0;
}

}  // namespace soffit::cli
