// Offsets sheets: the datum, sag and direction keys, then reduce_offset per row.
#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_columns.hpp"
#include "geometry/sheet/sheet_forms.hpp"
#include "geometry/sheet/sheet_number.hpp"

namespace soffit {
namespace {

void read_datum(OffsetSetup& s, const SheetMetadataLines& meta, const std::string& file,
                std::vector<std::string>& warnings) {
  const char* keys[] = {"datum_start_station", "datum_start_rl", "datum_end_station",
                        "datum_end_rl"};
  const MetadataEntry* any = nullptr;
  std::string missing;
  for (const char* k : keys) {
    if (const MetadataEntry* e = meta.find(k)) {
      any = e;
    } else {
      missing += (missing.empty() ? "" : ", ") + std::string(k) + "_m";
    }
  }
  const MetadataEntry* level = meta.find("datum_rl");
  if (any && !missing.empty()) {
    throw InputError(file, any->line, any->key,
                     "a sloping datum needs the station and height of both ends; missing: " +
                         missing);
  }
  if (any && level) {
    throw InputError(file, level->line, level->key,
                     "both a level datum (datum_rl) and a sloping datum (datum_start/end) are "
                     "given; keep one");
  }
  if (any) {
    s.datum_start = DatumMark{*meta.number("datum_start_station"), *meta.number("datum_start_rl")};
    s.datum_end = DatumMark{*meta.number("datum_end_station"), *meta.number("datum_end_rl")};
    if (s.datum_start->station_m == s.datum_end->station_m) {
      const MetadataEntry* e = meta.find("datum_end_station");
      throw InputError(file, e->line, e->key,
                       "the two datum ends are at the same station; a sloping datum needs two "
                       "different stations");
    }
  } else if (level) {
    s.datum_rl_m = *level->si;
  } else {
    warnings.push_back(file + ": no datum height given (datum_rl_m): z is measured from the "
                              "datum line itself");
  }
}

void read_sag(OffsetSetup& s, const SheetMetadataLines& meta,
              const std::vector<std::optional<double>>& stations, const std::string& file,
              std::vector<std::string>& warnings) {
  const MetadataEntry* sag = meta.find("line_sag");
  if (!sag) return;
  if (*sag->si < 0.0) {
    throw InputError(file, sag->line, sag->key,
                     "the sag of a taut line is how far its middle hangs below the straight "
                     "line between its ends: write it as a positive number");
  }
  s.sag_m = *sag->si;
  const MetadataEntry* a = meta.find("line_start_station");
  const MetadataEntry* b = meta.find("line_end_station");
  if ((a == nullptr) != (b == nullptr)) {
    const MetadataEntry* given = a ? a : b;
    throw InputError(file, given->line, given->key,
                     "give both line_start_station_m and line_end_station_m, or neither "
                     "(then the line runs between the first and last stations)");
  }
  if (a) {
    s.line_start_station_m = *a->si;
    s.line_end_station_m = *b->si;
  } else if (s.datum_start) {
    s.line_start_station_m = s.datum_start->station_m;
    s.line_end_station_m = s.datum_end->station_m;
  } else {
    bool first = true;
    for (const auto& st : stations) {
      if (!st) continue;
      if (first || *st < s.line_start_station_m) s.line_start_station_m = *st;
      if (first || *st > s.line_end_station_m) s.line_end_station_m = *st;
      first = false;
    }
  }
  if (s.line_start_station_m == s.line_end_station_m) {
    throw InputError(file, sag->line, sag->key, "the taut line has no length (its ends coincide)");
  }
  int outside = 0;
  const double lo = std::min(s.line_start_station_m, s.line_end_station_m);
  const double hi = std::max(s.line_start_station_m, s.line_end_station_m);
  for (const auto& st : stations) outside += (*st < lo || *st > hi) ? 1 : 0;
  if (outside > 0) {
    warnings.push_back(file + ":" + std::to_string(sag->line) + ": " + std::to_string(outside) +
                       " station(s) lie beyond the ends of the taut line; no sag correction "
                       "is applied to them");
  }
}

}  // namespace

MethodReduction reduce_offsets_sheet(SurveySheet& sheet, const SheetMetadataLines& meta) {
  const std::string& file = sheet.source;
  OffsetSetup s;
  s.x_origin_m = meta.number("x_origin").value_or(0.0);
  s.z_origin_rl_m = meta.number("z_origin_rl").value_or(0.0);
  read_datum(s, meta, file, sheet.warnings);
  if (const MetadataEntry* d = meta.find("offset_direction")) {
    const std::string v = ascii_lower(d->text);
    if (v == "down") {
      s.offsets_down = true;
    } else if (v != "up") {
      throw InputError(file, d->line, d->key,
                       "'" + d->text + "' is not understood; write up (offsets measured up from "
                       "the line, the usual case) or down");
    }
  }
  const auto stations = column_si(sheet, "station");
  const auto offsets = column_si(sheet, "offset");
  read_sag(s, meta, stations, file, sheet.warnings);

  MethodReduction red;
  const int sc = column_index(sheet.columns, "station");
  for (size_t i = 0; i < sheet.readings.size(); ++i) {
    const Point2 p = reduce_offset(s, *stations[i], *offsets[i]);
    sheet.readings[i].x = p.x;
    sheet.readings[i].z = p.z;
    red.keys.push_back({format_fixed(*stations[i], 6),
                        "station " + sheet.raw_rows[i].cells[sc] + " " + sheet.columns[sc].unit,
                        sheet.columns[sc].name});
  }
  sheet.offsets = s;
  return red;
}

}  // namespace soffit
