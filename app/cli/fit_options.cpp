#include "app/cli/fit_options.hpp"

#include <cstdio>

#include "geometry/core/input_error.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit::cli {

std::string shape_names() {
  std::string names;
  for (const ShapeFamily* family : shape_families()) names += std::string(family->name()) + "|";
  return names + "auto";
}

bool parse_fit_option(OptionCursor& args, std::string_view arg, ProfileRequest& request,
                      SheetOptions& sheet_options) {
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
  } else {
    return false;
  }
  return true;
}

std::optional<std::pair<SurveySheet, ProfileAnalysis>> read_and_fit(std::string_view verb, const std::string& file,
                                                                     const SheetOptions& sheet_options,
                                                                     const ProfileRequest& request) {
  SurveySheet sheet;
  try {
    sheet = read_sheet_file(file, sheet_options);
  } catch (const InputError& e) {
    std::fprintf(stderr, "soffit %.*s: %s\n", static_cast<int>(verb.size()), verb.data(), e.what());
    return std::nullopt;
  }
  ProfileAnalysis analysis = analyse_profile(sheet.readings, request);
  if (!analysis.ok()) {
    std::fprintf(stderr, "soffit %.*s: %s: cannot fit: %s\n", static_cast<int>(verb.size()), verb.data(),
                 file.c_str(), analysis.error.c_str());
    return std::nullopt;
  }
  return std::make_pair(std::move(sheet), std::move(analysis));
}

}  // namespace soffit::cli
