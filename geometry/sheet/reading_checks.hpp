#pragma once
// Checks across readings: enough usable ones, repeated stations, closing checks.
#include <optional>
#include <string>
#include <vector>

#include "geometry/core/reading.hpp"

namespace soffit {

// Throws when fewer than three readings are left for fitting (a circle has
// three parameters: fewer readings cannot even be fitted).
void require_usable_readings(const Readings& readings, const std::string& file);

// What identifies a station: readings with equal keys are at the same place.
struct StationKey {
  std::optional<std::string> key;  // nullopt: this reading cannot be keyed
  std::string label;               // "station 0.400 m", for messages
  std::string field;               // the column to name in messages
};

// A repeat of a key in a reading that is not marked as a check, where neither
// reading is excluded, throws naming both lines. Each check reading is paired
// with the earlier reading of the same key (or, if `match_nearest`, the nearest
// earlier reading along x) and the closure difference becomes a warning.
void check_repeats_and_closures(const std::vector<StationKey>& keys, const Readings& readings,
                                bool match_nearest, const std::string& file,
                                std::vector<std::string>& warnings);

}  // namespace soffit
