#include "geometry/sheet/reading_checks.hpp"

#include <cmath>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_defaults.hpp"
#include "geometry/sheet/sheet_number.hpp"

namespace soffit {
namespace {

std::string signed_mm(double metres) {
  const double mm = metres * 1000.0;
  const std::string s = format_fixed(mm, 1);
  return (mm >= 0.05 ? "+" : "") + s + " mm";
}

int find_earlier(const std::vector<StationKey>& keys, const Readings& readings, size_t i,
                 bool match_nearest) {
  int best = -1;
  if (keys[i].key) {
    for (size_t j = 0; j < i; ++j) {
      if (readings[j].check || keys[j].key != keys[i].key) continue;
      if (best < 0 || (readings[best].excluded && !readings[j].excluded)) best = static_cast<int>(j);
    }
  }
  if (best >= 0 || !match_nearest) return best;
  double nearest = sheet_limits().check_match_m;
  for (size_t j = 0; j < i; ++j) {
    if (readings[j].check || readings[j].excluded) continue;
    const double d = std::abs(readings[j].x - readings[i].x);
    if (d <= nearest) {
      nearest = d;
      best = static_cast<int>(j);
    }
  }
  return best;
}

}  // namespace

void require_usable_readings(const Readings& readings, const std::string& file) {
  size_t usable = 0;
  for (const Reading& r : readings) usable += (!r.excluded && !r.check) ? 1 : 0;
  if (usable >= 3) return;
  throw InputError(file, 0, "",
                   "only " + std::to_string(usable) + " usable reading" +
                       (usable == 1 ? "" : "s") + " (of " + std::to_string(readings.size()) +
                       " rows, after excluded and check readings); at least 3 are needed to "
                       "fit a profile, and FIELD practice is about 9 per section");
}

void check_repeats_and_closures(const std::vector<StationKey>& keys, const Readings& readings,
                                bool match_nearest, const std::string& file,
                                std::vector<std::string>& warnings) {
  for (size_t i = 0; i < readings.size(); ++i) {
    const Reading& r = readings[i];
    if (!r.check) {
      if (!keys[i].key || r.excluded) continue;
      for (size_t j = 0; j < i; ++j) {
        if (readings[j].check || readings[j].excluded || keys[j].key != keys[i].key) continue;
        throw InputError(file, r.source_line, keys[i].field,
                         keys[i].label + " appears twice (lines " +
                             std::to_string(readings[j].source_line) + " and " +
                             std::to_string(r.source_line) +
                             "); if the later one is a closing check write yes in its check "
                             "column, if one is a blunder mark it excluded with a reason");
      }
      continue;
    }
    const std::string where = file + ":" + std::to_string(r.source_line) + ": ";
    const int j = find_earlier(keys, readings, i, match_nearest);
    if (j < 0) {
      warnings.push_back(where + "check reading at " + keys[i].label +
                         " has no earlier reading to compare with");
      continue;
    }
    const Reading& e = readings[j];
    std::string diff = "dz " + signed_mm(r.z - e.z);
    if (std::abs(r.x - e.x) >= 0.0005) diff = "dx " + signed_mm(r.x - e.x) + ", " + diff;
    warnings.push_back(where + "closing check at " + keys[i].label + ": " + diff +
                       " against line " + std::to_string(e.source_line));
  }
}

}  // namespace soffit
