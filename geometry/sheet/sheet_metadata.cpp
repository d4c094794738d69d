#include "geometry/sheet/sheet_metadata.hpp"

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_columns.hpp"
#include "geometry/sheet/sheet_defaults.hpp"
#include "geometry/sheet/sheet_number.hpp"
#include "geometry/sheet/sheet_units.hpp"

namespace soffit {
namespace {

struct KeyInfo {
  const char* quantity;
  UnitKind kind;
  const char* method;  // "" = every method
};

// Every metadata key of format version 1 (SHEET_FORMAT.md "Metadata keys").
constexpr KeyInfo kKeys[] = {
    {"structure", UnitKind::text, ""},        {"structure_name", UnitKind::text, ""},
    {"span", UnitKind::text, ""},             {"section", UnitKind::text, ""},
    {"position", UnitKind::length, ""},       {"reference_face", UnitKind::text, ""},
    {"direction", UnitKind::text, ""},        {"date", UnitKind::text, ""},
    {"time", UnitKind::text, ""},             {"method", UnitKind::text, ""},
    {"instrument", UnitKind::text, ""},       {"instrument_model", UnitKind::text, ""},
    {"sigma", UnitKind::length, ""},          {"datum", UnitKind::text, ""},
    {"observer", UnitKind::text, ""},         {"booker", UnitKind::text, ""},
    {"weather", UnitKind::text, ""},          {"note", UnitKind::text, ""},
    {"z_origin_rl", UnitKind::length, ""},
    {"x_origin", UnitKind::length, "offsets polar"},
    {"datum_rl", UnitKind::length, "offsets"},
    {"datum_start_station", UnitKind::length, "offsets"},
    {"datum_start_rl", UnitKind::length, "offsets"},
    {"datum_end_station", UnitKind::length, "offsets"},
    {"datum_end_rl", UnitKind::length, "offsets"},
    {"offset_direction", UnitKind::text, "offsets"},
    {"line_sag", UnitKind::length, "offsets"},
    {"line_start_station", UnitKind::length, "offsets"},
    {"line_end_station", UnitKind::length, "offsets"},
    {"instrument_x", UnitKind::length, "polar"},
    {"ground_rl", UnitKind::length, "polar"},
    {"instrument_height", UnitKind::length, "polar"},
    {"axis_rl", UnitKind::length, "polar"},
    {"facing", UnitKind::text, "polar"},
    {"distance_sigma", UnitKind::length, "polar"},
    {"distance_scale", UnitKind::ratio, "polar"},
    {"angle_sigma", UnitKind::angle, "polar"},
    {"bearing", UnitKind::angle, "points"},
    {"origin_easting", UnitKind::length, "points"},
    {"origin_northing", UnitKind::length, "points"},
};

const KeyInfo* find_key(std::string_view quantity) {
  for (const KeyInfo& k : kKeys) {
    if (quantity == k.quantity) return &k;
  }
  return nullptr;
}

std::string location(const std::string& file, int line) {
  return file + ":" + std::to_string(line) + ": ";
}

bool is_iso_date(const std::string& s) {
  if (s.size() != 10 || s[4] != '-' || s[7] != '-') return false;
  for (size_t i : {0u, 1u, 2u, 3u, 5u, 6u, 8u, 9u}) {
    if (s[i] < '0' || s[i] > '9') return false;
  }
  const int month = (s[5] - '0') * 10 + (s[6] - '0');
  const int day = (s[8] - '0') * 10 + (s[9] - '0');
  return month >= 1 && month <= 12 && day >= 1 && day <= 31;
}

}  // namespace

bool looks_like_column_name(std::string_view name) {
  const std::string low = ascii_lower(name);
  if (find_key(low) || find_key(split_unit_suffix(low).quantity)) return false;
  return is_known_column_quantity(split_unit_suffix(low).quantity) ||
         is_known_column_quantity(low);
}

void SheetMetadataLines::add(const CsvRow& row, const std::string& file,
                             std::vector<std::string>& warnings) {
  MetadataEntry entry;
  entry.line = row.line;
  entry.key = ascii_lower(row.cells[0]);
  for (size_t i = 1; i < row.cells.size(); ++i) {
    if (row.cells[i].empty()) continue;
    if (!entry.text.empty()) entry.text += ", ";
    entry.text += row.cells[i];
  }
  if (entry.key.empty()) {
    throw InputError(file, row.line, "", "a metadata line needs a key in its first cell");
  }

  const KeyInfo* info = find_key(entry.key);
  NameWithUnit split{entry.key, ""};
  if (!info) {
    split = split_unit_suffix(entry.key);
    info = find_key(split.quantity);
    if (info && info->kind == UnitKind::text) info = nullptr;  // "note_mm" is not a key
    if (info && !unit_is_of_kind(split.unit, info->kind)) {
      throw InputError(file, row.line, entry.key,
                       "unit '" + split.unit + "' is not known here; write " + split.quantity +
                           " with " + units_of_kind(info->kind) + " (for example " +
                           split.quantity + "_" +
                           (info->kind == UnitKind::angle ? "deg" :
                            info->kind == UnitKind::ratio ? "ppm" : "m") + ")");
    }
  } else if (info->kind != UnitKind::text) {
    throw InputError(file, row.line, entry.key,
                     "this key needs a unit suffix, for example " + entry.key +
                         (info->kind == UnitKind::angle ? "_deg" :
                          info->kind == UnitKind::ratio ? "_ppm" : "_m"));
  }
  if (!info) {
    if (entry.key == "units") {
      warnings.push_back(location(file, row.line) +
                         "metadata key 'units' is ignored: units are part of each column "
                         "name (e.g. offset_mm)");
    } else {
      warnings.push_back(location(file, row.line) + "unknown metadata key '" + entry.key +
                         "' kept as written but not used (see SHEET_FORMAT.md for the keys)");
    }
    entry.quantity = entry.key;
    entries_.push_back(std::move(entry));
    return;
  }
  entry.quantity = split.quantity;
  if (entry.text.empty()) {
    throw InputError(file, row.line, entry.key, "the value is missing (write it in the next cell)");
  }
  if (const MetadataEntry* earlier = find(entry.quantity)) {
    throw InputError(file, row.line, entry.key,
                     "given twice (also on line " + std::to_string(earlier->line) +
                         " as '" + earlier->key + "'); keep one");
  }
  if (info->kind != UnitKind::text) {
    if (row.cells.size() > 2) {
      warnings.push_back(location(file, row.line) + "extra cells after the value of '" +
                         entry.key + "' are ignored");
    }
    const double raw = parse_number(row.cells[1], file, row.line, entry.key);
    entry.si = to_si(raw, split.unit);
  }
  entries_.push_back(std::move(entry));
}

const MetadataEntry* SheetMetadataLines::find(std::string_view quantity) const {
  for (const MetadataEntry& e : entries_) {
    if (e.quantity == quantity) return &e;
  }
  return nullptr;
}

std::optional<std::string> SheetMetadataLines::text(std::string_view quantity) const {
  if (const MetadataEntry* e = find(quantity)) return e->text;
  return std::nullopt;
}

std::optional<double> SheetMetadataLines::number(std::string_view quantity) const {
  if (const MetadataEntry* e = find(quantity)) return e->si;
  return std::nullopt;
}

void SheetMetadataLines::warn_keys_not_used_by(SurveyMethod method, const std::string& file,
                                               std::vector<std::string>& warnings) const {
  const std::string word = method_keyword(method);
  for (const MetadataEntry& e : entries_) {
    const KeyInfo* info = find_key(e.quantity);
    if (!info || std::string_view(info->method).empty()) continue;
    if (std::string_view(info->method).find(word) != std::string_view::npos) continue;
    warnings.push_back(location(file, e.line) + "'" + e.key + "' is not used by method " +
                       word + "; it is kept but has no effect");
  }
}

SheetMetadata SheetMetadataLines::summary(const std::string& file,
                                          std::vector<std::string>& warnings) const {
  SheetMetadata m;
  m.structure = text("structure");
  m.structure_name = text("structure_name");
  m.span = text("span");
  m.section = text("section");
  m.position_m = number("position");
  m.reference_face = text("reference_face");
  m.date = text("date");
  m.time = text("time");
  m.datum = text("datum");
  m.instrument_model = text("instrument_model");
  m.sigma_m = number("sigma");
  m.observer = text("observer");
  m.booker = text("booker");
  m.weather = text("weather");
  m.note = text("note");
  if (const MetadataEntry* e = find("direction")) {
    const std::string v = ascii_lower(e->text);
    if (v == "skew") {
      m.direction = SectionDirection::skew;
    } else if (v == "square") {
      m.direction = SectionDirection::square;
    } else {
      throw InputError(file, e->line, e->key,
                       "'" + e->text + "' is not a section direction; write skew (parallel to "
                       "the faces) or square (square to the faces)");
    }
  }
  if (const MetadataEntry* e = find("date"); e && !is_iso_date(e->text)) {
    warnings.push_back(location(file, e->line) + "date '" + e->text +
                       "' is not written as YYYY-MM-DD; kept as written");
  }
  if (const MetadataEntry* e = find("instrument")) {
    const std::string v = ascii_lower(e->text);
    if (!find_instrument_class(v)) {
      throw InputError(file, e->line, e->key,
                       "'" + e->text + "' is not an instrument class; write one of " +
                           instrument_class_list() + " (the make and model go in instrument_model)");
    }
    m.instrument = v;
  }
  if (const MetadataEntry* e = find("sigma"); e && e->si) {
    if (*e->si <= 0.0) {
      throw InputError(file, e->line, e->key, "a precision must be greater than zero");
    }
    if (*e->si * 1000.0 < sheet_limits().sigma_mm_smallest) {
      throw InputError(file, e->line, e->key,
                       "a precision of " + e->text + " in " + e->key +
                           " is implausibly small: it looks like metres written as "
                           "millimetres; write it in mm (e.g. sigma_mm,3)");
    }
  }
  return m;
}

}  // namespace soffit
