#include "geometry/sheet/column_mapping.hpp"

#include <fstream>
#include <sstream>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/csv_rows.hpp"

namespace soffit {
namespace {

constexpr int kMapFormatVersion = 1;

std::string trimmed(std::string_view s) {
  const auto b = s.find_first_not_of(" \t");
  if (b == std::string_view::npos) return "";
  const auto e = s.find_last_not_of(" \t");
  return std::string(s.substr(b, e - b + 1));
}

void add_column(ColumnMapping& m, const std::string& target, const std::string& source,
                const std::string& origin, int line) {
  if (target.empty() || source.empty()) {
    throw InputError(origin, line, target.empty() ? "column" : target,
                     "a column mapping needs a Soffit column and the export's column, as "
                     "station_m=Chainage (m)");
  }
  if (const MappedColumn* earlier = m.find_target(target)) {
    throw InputError(origin, line, target,
                     "the column " + target + " is mapped twice (also to '" + earlier->source + "')");
  }
  for (const MappedColumn& c : m.columns) {
    if (ascii_lower(c.source) == ascii_lower(source)) {
      throw InputError(origin, line, target,
                       "the export's column '" + source + "' is already mapped as " + c.target +
                           "; one export column feeds one Soffit column");
    }
  }
  m.columns.push_back({target, source, origin, line});
}

}  // namespace

void ColumnMapping::set(const std::string& key, const std::string& value, const std::string& origin,
                        int origin_line) {
  for (MappedSetting& s : settings) {
    if (ascii_lower(s.key) == ascii_lower(key)) {
      s = {key, value, origin, origin_line};
      return;
    }
  }
  settings.push_back({key, value, origin, origin_line});
}

const MappedSetting* ColumnMapping::find_setting(std::string_view key) const {
  for (const MappedSetting& s : settings)
    if (ascii_lower(s.key) == ascii_lower(key)) return &s;
  return nullptr;
}

const MappedColumn* ColumnMapping::find_target(std::string_view target) const {
  for (const MappedColumn& c : columns)
    if (ascii_lower(c.target) == ascii_lower(target)) return &c;
  return nullptr;
}

void add_column_map_spec(ColumnMapping& mapping, std::string_view spec, const std::string& origin) {
  // The spec is one CSV line, so a quoted pair may hold a comma.
  std::string one_line(spec);
  for (char& c : one_line)
    if (c == '\n' || c == '\r') c = ' ';
  const auto rows = split_csv_rows(one_line, origin);
  if (rows.empty()) throw InputError(origin, 0, "", "the column mapping is empty; write station_m=Chainage (m),…");
  for (const std::string& pair : rows.front().cells) {
    if (pair.empty()) continue;
    const auto eq = pair.find('=');
    if (eq == std::string::npos) {
      throw InputError(origin, 0, pair,
                       "a column mapping is TARGET=SOURCE, e.g. station_m=Chainage (m); '" + pair +
                           "' has no '='");
    }
    add_column(mapping, trimmed(std::string_view(pair).substr(0, eq)),
               trimmed(std::string_view(pair).substr(eq + 1)), origin, 0);
  }
}

void add_setting_spec(ColumnMapping& mapping, std::string_view spec, const std::string& origin) {
  const auto eq = spec.find('=');
  const std::string key = eq == std::string_view::npos ? "" : trimmed(spec.substr(0, eq));
  if (key.empty()) {
    throw InputError(origin, 0, std::string(spec),
                     "a setting is KEY=VALUE with a sheet metadata key, e.g. datum_rl_m=9.800");
  }
  mapping.set(key, trimmed(spec.substr(eq + 1)), origin + " " + key);
}

ColumnMapping parse_column_map(std::string_view text, const std::string& file) {
  std::string_view body = text;
  if (body.substr(0, 3) == "\xEF\xBB\xBF") body.remove_prefix(3);
  ColumnMapping m;
  bool seen_first = false;
  for (const CsvRow& row : split_csv_rows(body, file)) {
    if (row.comment) continue;
    const std::string key = ascii_lower(row.cells[0]);
    if (!seen_first) {
      if (key != "soffit-map" || row.cells.size() < 2 || row.cells[1] != std::to_string(kMapFormatVersion)) {
        throw InputError(file, row.line, row.cells[0],
                         "a mapping file starts with the line soffit-map," + std::to_string(kMapFormatVersion));
      }
      seen_first = true;
      continue;
    }
    if (key == "column") {
      if (row.cells.size() != 3) {
        throw InputError(file, row.line, "column",
                         "write column,TARGET,SOURCE, e.g. column,station_m,Chainage (m)");
      }
      add_column(m, row.cells[1], row.cells[2], file, row.line);
      continue;
    }
    if (row.cells.size() != 2 || row.cells[1].empty()) {
      throw InputError(file, row.line, row.cells[0],
                       "a setting line is KEY,VALUE with one value, e.g. datum_rl_m,9.800");
    }
    if (m.find_setting(row.cells[0])) {
      throw InputError(file, row.line, row.cells[0], "this key is set twice in the mapping file");
    }
    m.set(row.cells[0], row.cells[1], file, row.line);
  }
  if (!seen_first) throw InputError(file, 0, "", "the mapping file is empty; it starts with soffit-map,1");
  return m;
}

ColumnMapping read_column_map_file(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(path, 0, "", "the mapping file cannot be opened (check the name and that it exists)");
  std::ostringstream text;
  text << in.rdbuf();
  return parse_column_map(text.str(), path);
}

}  // namespace soffit
