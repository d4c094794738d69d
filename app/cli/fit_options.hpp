#pragma once
// What every verb that fits a sheet shares: the fit options, and reading the
// sheet and fitting it with errors reported the same way (exit code 2).
#include <optional>
#include <string>
#include <string_view>
#include <utility>

#include "app/cli/option_parsing.hpp"
#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/sheet/sheet_reader.hpp"

namespace soffit::cli {

// "semicircular|segmental|…|auto", for usage lines.
std::string shape_names();

// Consumes `arg` (and its value) when it is one of --shape, --sigma-mm,
// --springing-z, --seed, --mc, --robust. Throws UsageError on a bad value.
bool parse_fit_option(OptionCursor& args, std::string_view arg, ProfileRequest& request,
                      SheetOptions& sheet_options);

// Reads and fits `file`; on failure prints "soffit VERB: …" naming file, line
// and field, and returns nothing (the verb then exits 2).
std::optional<std::pair<SurveySheet, ProfileAnalysis>> read_and_fit(std::string_view verb, const std::string& file,
                                                                     const SheetOptions& sheet_options,
                                                                     const ProfileRequest& request);

}  // namespace soffit::cli
