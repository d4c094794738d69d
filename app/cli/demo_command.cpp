// `soffit demo PATH`: writes the invented Sallow Ford Bridge project of
// FIELD.md §10 (storage/demo_project.hpp). Exit codes as dispatch.hpp.
#include <cstdio>
#include <string>

#include "app/cli/option_parsing.hpp"
#include "geometry/core/input_error.hpp"
#include "storage/demo_assets.hpp"
#include "storage/demo_project.hpp"
#include "storage/photo_store.hpp"
#include "storage/storage_error.hpp"

namespace soffit::cli {

int run_demo(int argc, char** argv) {
  constexpr const char* kSynopsis = "demo PATH";
  std::string path;
  try {
    OptionCursor args(argc, argv, "demo");
    while (args.more()) {
      const std::string_view arg = args.next();
      if (!arg.empty() && arg[0] == '-') throw UsageError("unknown option '" + std::string(arg) + "'");
      if (!path.empty()) throw UsageError("one PATH only");
      path = arg;
    }
    if (path.empty()) throw UsageError("no PATH given (the new project file, e.g. sallow-ford.soffit)");
  } catch (const UsageError& e) {
    std::fprintf(stderr, "soffit demo: %s\nusage: soffit %s\n", e.what(), kSynopsis);
    return 2;
  }
  const std::string sheets = storage::find_demo_sheets();
  if (sheets.empty()) {
    std::fprintf(stderr, "soffit demo: the demo survey sheets (sallow-ford_*.csv) are not installed beside soffit\n");
    return 1;
  }
  try {
    const auto s = storage::write_demo_project(path, sheets, "soffit demo (invented data)");
    std::printf("wrote %s: invented demo structure BVDC-ST-0417 Sallow Ford Bridge, 2 visits, %d sections "
                "(%d readings), %d ring counts, %d fill depths, %d defects with %d drawn pictures in %s\n"
                "Nothing in it is real.\n",
                path.c_str(), s.sections, s.readings, s.ring_counts, s.fill_depths, s.defects, s.photos,
                storage::media_folder(path).c_str());
    return 0;
  } catch (const storage::StorageError& e) {
    std::fprintf(stderr, "soffit demo: %s\n", e.what());
    return e.kind() == storage::ErrorKind::io ? 1 : 2;
  } catch (const InputError& e) {
    std::fprintf(stderr, "soffit demo: a demo sheet is damaged: %s\n", e.what());
    return 1;
  }
}

}  // namespace soffit::cli
