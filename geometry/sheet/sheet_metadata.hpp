#pragma once
// The metadata lines of a survey sheet ("key,value" between the first line and
// the "readings" line): which keys exist, their units, and their values.
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "geometry/sheet/csv_rows.hpp"
#include "geometry/sheet/survey_method.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit {

struct MetadataEntry {
  int line = 0;
  std::string key;               // as written, lower case
  std::string quantity;          // key without its unit suffix
  std::string text;              // the value as written (extra cells joined with ", ")
  std::optional<double> si;      // numeric keys: the value in m, rad or plain ratio
};

class SheetMetadataLines {
 public:
  // Reads one "key,value" row. Unknown keys become warnings; a known numeric
  // key with a wrong unit, a missing value or a repeated key throws.
  void add(const CsvRow& row, const std::string& file, std::vector<std::string>& warnings);

  const MetadataEntry* find(std::string_view quantity) const;
  std::optional<std::string> text(std::string_view quantity) const;
  std::optional<double> number(std::string_view quantity) const;

  // Warns about keys that belong to another method (e.g. line_sag_mm in a polar sheet).
  void warn_keys_not_used_by(SurveyMethod method, const std::string& file,
                             std::vector<std::string>& warnings) const;

  // The method-independent fields; throws on a bad direction or instrument class.
  SheetMetadata summary(const std::string& file, std::vector<std::string>& warnings) const;

 private:
  std::vector<MetadataEntry> entries_;
};

// True for a name that is a readings column of any method ("station_m",
// "offset_mm", "easting_m"...): such a line before "readings" means the
// "readings" line was forgotten.
bool looks_like_column_name(std::string_view name);

}  // namespace soffit
