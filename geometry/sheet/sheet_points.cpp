// Point-list sheets: project easting, northing, height onto the section plane.
#include <numbers>
#include <stdexcept>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_columns.hpp"
#include "geometry/sheet/sheet_defaults.hpp"
#include "geometry/sheet/sheet_forms.hpp"
#include "geometry/sheet/sheet_number.hpp"

namespace soffit {

MethodReduction reduce_points_sheet(SurveySheet& sheet, const SheetMetadataLines& meta) {
  const std::string& file = sheet.source;
  PointsSetup s;
  s.z_origin_rl_m = meta.number("z_origin_rl").value_or(0.0);
  if (const MetadataEntry* b = meta.find("bearing")) {
    if (*b->si < 0.0 || *b->si >= 2.0 * std::numbers::pi) {
      throw InputError(file, b->line, b->key,
                       "a bearing runs from 0 up to a full turn (360 deg, 400 gon); '" + b->text +
                           "' is outside that");
    }
    s.bearing_rad = b->si;
  }
  const MetadataEntry* oe = meta.find("origin_easting");
  const MetadataEntry* on = meta.find("origin_northing");
  if ((oe == nullptr) != (on == nullptr)) {
    const MetadataEntry* given = oe ? oe : on;
    throw InputError(file, given->line, given->key,
                     "give both origin_easting_m and origin_northing_m, or neither (then x "
                     "starts at the leftmost point)");
  }
  if (oe) {
    s.origin_easting = oe->si;
    s.origin_northing = on->si;
  }

  const auto e = column_si(sheet, "easting");
  const auto n = column_si(sheet, "northing");
  const auto h = column_si(sheet, "height");
  std::vector<GridPoint> pts;
  std::vector<bool> use;
  for (size_t i = 0; i < sheet.readings.size(); ++i) {
    pts.push_back({*e[i], *n[i], *h[i]});
    use.push_back(!sheet.readings[i].excluded && !sheet.readings[i].check);
  }
  SectionPlane plane;
  try {
    plane = fit_section_plane(pts, use, s);
  } catch (const std::invalid_argument&) {
    throw InputError(file, 0, "easting",
                     "all usable points are at the same plan position, so no section plane "
                     "can be found; check the easting and northing columns");
  }
  const SheetLimits& lim = sheet_limits();
  if (plane.scatter_rms_m > lim.plane_rms_warn_m || plane.scatter_max_m > lim.plane_max_warn_m) {
    sheet.warnings.push_back(
        file + ": the points scatter about the section plane (bearing " +
        format_fixed(plane.bearing_deg, 2) + " deg) by " +
        format_fixed(plane.scatter_rms_m * 1000.0, 1) + " mm RMS, " +
        format_fixed(plane.scatter_max_m * 1000.0, 1) +
        " mm at most: check that every point belongs to this section");
  }

  MethodReduction red;
  red.match_nearest = true;
  const int idc = column_index(sheet.columns, "id");
  const int ec = column_index(sheet.columns, "easting");
  for (size_t i = 0; i < pts.size(); ++i) {
    const Point2 p = project_to_section(plane, pts[i], s.z_origin_rl_m);
    sheet.readings[i].x = p.x;
    sheet.readings[i].z = p.z;
    const RawRow& raw = sheet.raw_rows[i];
    StationKey key;
    key.field = sheet.columns[idc >= 0 ? idc : ec].name;
    if (idc >= 0 && !raw.cells[idc].empty()) {
      key.key = "id:" + raw.cells[idc];
      key.label = "point " + raw.cells[idc];
    } else {
      key.key = format_fixed(pts[i].easting, 6) + "/" + format_fixed(pts[i].northing, 6) + "/" +
                format_fixed(pts[i].height, 6);
      key.label = "the point E " + raw.cells[ec] + ", N " +
                  raw.cells[column_index(sheet.columns, "northing")] + ", H " +
                  raw.cells[column_index(sheet.columns, "height")];
    }
    red.keys.push_back(key);
  }
  sheet.points = s;
  sheet.plane = plane;
  return red;
}

}  // namespace soffit
