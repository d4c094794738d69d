// Polar sheets: the set-up keys, angle ranges, then reduce_polar per row.
#include <cmath>
#include <numbers>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/angles.hpp"
#include "geometry/sheet/sheet_columns.hpp"
#include "geometry/sheet/sheet_defaults.hpp"
#include "geometry/sheet/sheet_forms.hpp"
#include "geometry/sheet/sheet_number.hpp"

namespace soffit {
namespace {

int read_direction(const std::string& text, const std::string& file, int line,
                   const std::string& field) {
  const std::string v = ascii_lower(text);
  if (v == "+x" || v == "+" || v == "x") return +1;
  if (v == "-x" || v == "-") return -1;
  throw InputError(file, line, field,
                   "'" + text + "' is not a direction; write +x (towards increasing x) or -x");
}

double read_axis_height(const SheetMetadataLines& meta, const std::string& file) {
  const MetadataEntry* axis = meta.find("axis_rl");
  const MetadataEntry* ground = meta.find("ground_rl");
  const MetadataEntry* hi = meta.find("instrument_height");
  if (axis && (ground || hi)) {
    throw InputError(file, axis->line, axis->key,
                     "give either axis_rl_m, or ground_rl_m with instrument_height_m, not both");
  }
  if (axis) return *axis->si;
  if (ground && hi) return *ground->si + *hi->si;
  if (ground || hi) {
    const MetadataEntry* given = ground ? ground : hi;
    throw InputError(file, given->line, given->key,
                     std::string("the instrument axis height needs both ground_rl_m and "
                                 "instrument_height_m; missing: ") +
                         (ground ? "instrument_height_m" : "ground_rl_m"));
  }
  throw InputError(file, 0, "axis_rl_m",
                   "a polar sheet needs the height of the instrument axis: axis_rl_m, or "
                   "ground_rl_m and instrument_height_m");
}

}  // namespace

MethodReduction reduce_polar_sheet(SurveySheet& sheet, const SheetMetadataLines& meta) {
  const std::string& file = sheet.source;
  PolarSetup s;
  const MetadataEntry* ix = meta.find("instrument_x");
  if (!ix) {
    throw InputError(file, 0, "instrument_x_m",
                     "a polar sheet needs the instrument position along the section: add "
                     "instrument_x_m");
  }
  s.instrument_x_m = *ix->si;
  s.axis_rl_m = read_axis_height(meta, file);
  s.x_origin_m = meta.number("x_origin").value_or(0.0);
  s.z_origin_rl_m = meta.number("z_origin_rl").value_or(0.0);
  if (const MetadataEntry* f = meta.find("facing")) {
    s.facing = read_direction(f->text, file, f->line, f->key);
  }
  s.distance_sigma_m = meta.number("distance_sigma");
  s.distance_ppm = meta.number("distance_scale");
  if (s.distance_ppm) *s.distance_ppm *= 1e6;  // stored as a plain ratio by to_si
  s.angle_sigma_rad = meta.number("angle_sigma");

  const InstrumentClass& cls = sheet.metadata.instrument
                                   ? *find_instrument_class(*sheet.metadata.instrument)
                                   : default_instrument_class(SurveyMethod::polar);
  const double sd = s.distance_sigma_m.value_or(cls.distance_sigma_m);
  const double ppm = s.distance_ppm.value_or(cls.distance_ppm);
  const double sa = s.angle_sigma_rad.value_or(cls.angle_sigma_rad);
  const bool can_derive = sa > 0.0 || s.distance_sigma_m || s.distance_ppm;

  const bool slope = column_index(sheet.columns, "sdist") >= 0;
  const int dc = column_index(sheet.columns, slope ? "sdist" : "hdist");
  const bool zenith = column_index(sheet.columns, "zenith") >= 0;
  const int ac = column_index(sheet.columns, zenith ? "zenith" : "elevation");
  const int dirc = column_index(sheet.columns, "direction");
  const int idc = column_index(sheet.columns, "id");
  const auto dist = column_si(sheet, slope ? "sdist" : "hdist");
  const auto angle = column_si(sheet, zenith ? "zenith" : "elevation");
  const std::string aunit = sheet.columns[ac].unit;
  const double right = aunit == "gon" ? 100.0 : aunit == "mgon" ? 100000.0 :
                       aunit == "arcsec" ? 324000.0 : 90.0;  // a right angle in the written unit

  MethodReduction red;
  red.match_nearest = true;
  for (size_t i = 0; i < sheet.readings.size(); ++i) {
    const RawRow& raw = sheet.raw_rows[i];
    const SheetColumn& acol = sheet.columns[ac];
    const double written = *raw.values[ac];
    const bool in_range = zenith ? (written >= 0.0 && written <= 2.0 * right)
                                 : (written >= -right && written <= right);
    if (!in_range) {
      throw InputError(file, raw.line, acol.name,
                       std::string(zenith ? "a zenith angle" : "an elevation angle") + " of " +
                           raw.cells[ac] + " " + aunit + " is out of range (" +
                           (zenith ? "0 to " + format_fixed(2 * right, 0)
                                   : "-" + format_fixed(right, 0) + " to " + format_fixed(right, 0)) +
                           " " + aunit + "); check the angle and its unit");
    }
    if (*dist[i] <= 0.0) {
      throw InputError(file, raw.line, sheet.columns[dc].name, "a distance must be greater than zero");
    }
    PolarShot shot;
    shot.distance_m = *dist[i];
    shot.slope = slope;
    shot.elevation_rad = zenith ? elevation_from_zenith(*angle[i]) : *angle[i];
    shot.direction = s.facing;
    if (dirc >= 0 && !raw.cells[dirc].empty()) {
      shot.direction = read_direction(raw.cells[dirc], file, raw.line, sheet.columns[dirc].name);
    }
    if (!slope && std::abs(std::cos(shot.elevation_rad)) < 1e-6) {
      throw InputError(file, raw.line, acol.name,
                       "a vertical shot has no horizontal distance; record it as sdist (slope "
                       "distance) instead");
    }
    const Point2 p = reduce_polar(s, shot);
    sheet.readings[i].x = p.x;
    sheet.readings[i].z = p.z;
    red.derived_sigma.push_back(can_derive ? std::optional<double>(polar_sigma(shot, sd, ppm, sa))
                                           : std::nullopt);
    StationKey key;
    key.field = idc >= 0 ? sheet.columns[idc].name : sheet.columns[dc].name;
    if (idc >= 0 && !raw.cells[idc].empty()) {
      key.key = "id:" + raw.cells[idc];
      key.label = "point " + raw.cells[idc];
    } else {
      key.key = format_fixed(*dist[i], 6) + "/" + format_fixed(*angle[i], 9) + "/" +
                std::to_string(shot.direction);
      key.label = "the shot " + raw.cells[dc] + " " + sheet.columns[dc].unit + ", " +
                  raw.cells[ac] + " " + aunit;
    }
    red.keys.push_back(key);
  }
  sheet.polar = s;
  return red;
}

}  // namespace soffit
