#include "geometry/sheet/sheet_columns.hpp"

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_number.hpp"
#include "geometry/sheet/sheet_units.hpp"

namespace soffit {
namespace {

struct ColumnSpec {
  const char* quantity;
  UnitKind kind;
  const char* methods;  // "" = every method
  const char* group;    // required: exactly one column of a non-empty group
  const char* example;  // the usual spelling, for messages
};

// Format version 1 columns (SHEET_FORMAT.md "Columns").
constexpr ColumnSpec kColumns[] = {
    {"station", UnitKind::length, "offsets", "station", "station_m"},
    {"offset", UnitKind::length, "offsets", "offset", "offset_mm"},
    {"hdist", UnitKind::length, "polar", "distance", "hdist_m"},
    {"sdist", UnitKind::length, "polar", "distance", "sdist_m"},
    {"elevation", UnitKind::angle, "polar", "vertical angle", "elevation_deg"},
    {"zenith", UnitKind::angle, "polar", "vertical angle", "zenith_gon"},
    {"direction", UnitKind::text, "polar", "", "direction"},
    {"easting", UnitKind::length, "points", "easting", "easting_m"},
    {"northing", UnitKind::length, "points", "northing", "northing_m"},
    {"height", UnitKind::length, "points", "height", "height_m"},
    {"sigma", UnitKind::length, "", "", "sigma_mm"},
    {"id", UnitKind::text, "", "", "id"},
    {"exclude", UnitKind::text, "", "", "exclude"},
    {"check", UnitKind::text, "", "", "check"},
    {"surface", UnitKind::text, "", "", "surface"},
    {"note", UnitKind::text, "", "", "note"},
    {"time", UnitKind::text, "", "", "time"},
};

bool spec_in_method(const ColumnSpec& spec, SurveyMethod method) {
  const std::string_view m = spec.methods;
  return m.empty() || m.find(method_keyword(method)) != std::string_view::npos;
}

const ColumnSpec* find_spec(std::string_view quantity) {
  for (const ColumnSpec& c : kColumns) {
    if (quantity == c.quantity) return &c;
  }
  return nullptr;
}

}  // namespace

bool is_known_column_quantity(std::string_view quantity) { return find_spec(quantity) != nullptr; }

int column_index(const std::vector<SheetColumn>& columns, std::string_view quantity) {
  for (size_t i = 0; i < columns.size(); ++i) {
    if (columns[i].quantity == quantity) return static_cast<int>(i);
  }
  return -1;
}

std::string expected_columns(SurveyMethod method) {
  std::string required, optional;
  std::string last_group;
  for (const ColumnSpec& c : kColumns) {
    if (!spec_in_method(c, method)) continue;
    std::string& list = std::string_view(c.group).empty() ? optional : required;
    const bool same_group = !std::string_view(c.group).empty() && last_group == c.group;
    if (!list.empty()) list += same_group ? " or " : ", ";
    list += c.example;
    last_group = c.group;
  }
  return required + "; optional: " + optional + " (lengths in m, cm or mm; angles in deg or gon)";
}

std::vector<SheetColumn> read_header_row(const CsvRow& header, SurveyMethod method,
                                         const std::string& file,
                                         std::vector<std::string>& warnings) {
  std::vector<SheetColumn> columns;
  for (const std::string& cell : header.cells) {
    SheetColumn col;
    col.name = cell;
    const std::string low = ascii_lower(cell);
    if (low.empty()) {
      throw InputError(file, header.line, "column " + std::to_string(columns.size() + 1),
                       "a column has no name; expected " + expected_columns(method));
    }
    const ColumnSpec* spec = find_spec(low);
    if (spec && spec->kind != UnitKind::text) {
      throw InputError(file, header.line, cell,
                       "this column needs a unit, for example " + std::string(spec->example));
    }
    if (spec) {
      col.quantity = low;
    } else {
      const NameWithUnit split = split_unit_suffix(low);
      spec = find_spec(split.quantity);
      if (spec && spec->kind == UnitKind::text) spec = nullptr;
      if (spec && !unit_is_of_kind(split.unit, spec->kind)) {
        throw InputError(file, header.line, cell,
                         "unit '" + split.unit + "' is not known for " + split.quantity +
                             "; use " + units_of_kind(spec->kind) + " (for example " +
                             spec->example + ")");
      }
      col.quantity = spec ? split.quantity : low;
      col.unit = spec ? split.unit : "";
    }
    if (spec && !spec_in_method(*spec, method)) {
      throw InputError(file, header.line, cell,
                       "this column belongs to method " + std::string(spec->methods) +
                           ", but the sheet's method is " + method_keyword(method) +
                           "; expected " + expected_columns(method));
    }
    if (!spec) {
      warnings.push_back(file + ":" + std::to_string(header.line) + ": column '" + cell +
                         "' is not used; its cells are kept as written");
      col.quantity = "?" + low;  // never matches a known quantity
    }
    if (column_index(columns, col.quantity) >= 0) {
      throw InputError(file, header.line, cell, "this column appears twice; keep one");
    }
    columns.push_back(std::move(col));
  }
  // Exactly one column of each required group.
  for (const ColumnSpec& c : kColumns) {
    if (!spec_in_method(c, method) || std::string_view(c.group).empty()) continue;
    int found = 0;
    for (const ColumnSpec& other : kColumns) {
      if (std::string_view(other.group) == c.group && column_index(columns, other.quantity) >= 0) {
        ++found;
      }
    }
    if (found == 0) {
      throw InputError(file, header.line, "",
                       "the " + std::string(c.group) + " column is missing; expected " +
                           expected_columns(method));
    }
    if (found > 1) {
      throw InputError(file, header.line, "",
                       "two " + std::string(c.group) + " columns are given; keep one (" +
                           expected_columns(method) + ")");
    }
  }
  return columns;
}

RawRow read_data_row(const CsvRow& row, const std::vector<SheetColumn>& columns,
                     SurveyMethod method, const std::string& file) {
  if (row.cells.size() > columns.size()) {
    throw InputError(file, row.line, "",
                     "this row has " + std::to_string(row.cells.size()) + " cells but the header has " +
                         std::to_string(columns.size()) +
                         " columns; a value may be in the wrong place or a cell needs quotes");
  }
  RawRow raw;
  raw.line = row.line;
  raw.cells = row.cells;
  raw.cells.resize(columns.size());
  raw.values.resize(columns.size());
  for (size_t i = 0; i < columns.size(); ++i) {
    const SheetColumn& col = columns[i];
    if (col.unit.empty()) continue;
    const ColumnSpec* spec = find_spec(col.quantity);
    const bool required = spec && spec_in_method(*spec, method) &&
                          !std::string_view(spec->group).empty();
    if (raw.cells[i].empty() && !required) continue;
    if (raw.cells[i].empty()) {
      throw InputError(file, row.line, col.name,
                       "the cell is empty; a number is needed here (leave a reading that was "
                       "not taken out of the table, and say why in a # comment line)");
    }
    raw.values[i] = parse_number(raw.cells[i], file, row.line, col.name);
  }
  return raw;
}

}  // namespace soffit
