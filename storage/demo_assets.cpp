#include "storage/demo_assets.hpp"

#include <filesystem>
#include <vector>

namespace soffit::storage {

std::string find_demo_sheets() {
  namespace fs = std::filesystem;
  std::error_code ec;
  std::vector<fs::path> candidates;
  const fs::path exe = fs::read_symlink("/proc/self/exe", ec);
  if (!ec) {
    const fs::path bin = exe.parent_path();
    candidates = {bin / "../share/soffit/sheets", bin / "assets/sheets", bin / "../assets/sheets",
                  bin / "../../assets/sheets"};
  }
#ifdef SOFFIT_SOURCE_ASSETS
  candidates.push_back(fs::path(SOFFIT_SOURCE_ASSETS) / "sheets");
#endif
  for (const auto& c : candidates)
    if (fs::exists(c / "sallow-ford_S1-MW_2019.csv", ec)) return fs::weakly_canonical(c, ec).string();
  return {};
}

}  // namespace soffit::storage
