#pragma once
// How a spreadsheet export's own columns and settings become a Soffit survey
// sheet (SHEET_FORMAT.md, "Spreadsheet exports: column mapping").
//
// A mapping names, for each Soffit column (with its unit, e.g. station_m), the
// header of the export's column that holds it, and gives the metadata the
// export lacks (method, datum_rl_m, …) as key = value settings. Each entry
// remembers where it was written, so that a problem with it names that place
// (the mapping file and line, or the command-line option).
#include <string>
#include <string_view>
#include <vector>

namespace soffit {

struct MappedColumn {
  std::string target;  // Soffit column name with unit: station_m, offset_mm, id, exclude…
  std::string source;  // the export's header text, e.g. "Chainage (m)"
  std::string origin;  // where the entry was written: a file, or "--map"
  int origin_line = 0;  // line in that file; 0 for the command line
};

struct MappedSetting {
  std::string key;    // a metadata key of the sheet: method, datum_rl_m, sigma_mm…
  std::string value;
  std::string origin;  // a file, or the option that gave it ("--datum-rl-m")
  int origin_line = 0;
};

struct ColumnMapping {
  std::vector<MappedColumn> columns;
  std::vector<MappedSetting> settings;  // a later setting of the same key replaces an earlier one

  bool empty() const { return columns.empty() && settings.empty(); }
  // Adds or replaces the setting of `key` (keys are case-insensitive).
  void set(const std::string& key, const std::string& value, const std::string& origin, int origin_line = 0);
  const MappedSetting* find_setting(std::string_view key) const;
  const MappedColumn* find_target(std::string_view target) const;
};

// "station_m=Chainage (m),offset_mm=Offset mm": comma-separated TARGET=SOURCE
// pairs; a pair whose source holds a comma is quoted as a CSV cell
// ("offset_mm=Offset, mm"). Adds to `mapping`; throws InputError naming
// `origin` and the bad pair.
void add_column_map_spec(ColumnMapping& mapping, std::string_view spec, const std::string& origin);

// "KEY=VALUE" from a command-line option; throws InputError naming `origin`.
void add_setting_spec(ColumnMapping& mapping, std::string_view spec, const std::string& origin);

// A mapping file: first line soffit-map,1; then lines column,TARGET,SOURCE
// and KEY,VALUE (metadata settings); # comments and blank lines allowed.
// Throws InputError naming the file, line and field.
ColumnMapping read_column_map_file(const std::string& path);
ColumnMapping parse_column_map(std::string_view text, const std::string& name_for_messages);

}  // namespace soffit
