#include "geometry/sheet/sheet_units.hpp"

#include "geometry/sheet/angles.hpp"

namespace soffit {

NameWithUnit split_unit_suffix(std::string_view name) {
  const size_t us = name.rfind('_');
  if (us == std::string_view::npos) return {std::string(name), ""};
  return {std::string(name.substr(0, us)), std::string(name.substr(us + 1))};
}

bool unit_is_of_kind(std::string_view unit, UnitKind kind) {
  switch (kind) {
    case UnitKind::length: return unit == "m" || unit == "cm" || unit == "mm";
    case UnitKind::angle:
      return unit == "deg" || unit == "gon" || unit == "mgon" || unit == "arcsec";
    case UnitKind::ratio: return unit == "ppm";
    case UnitKind::text: return unit.empty();
  }
  return false;
}

std::string units_of_kind(UnitKind kind) {
  switch (kind) {
    case UnitKind::length: return "m, cm or mm";
    case UnitKind::angle: return "deg, gon, mgon or arcsec";
    case UnitKind::ratio: return "ppm";
    case UnitKind::text: return "no unit";
  }
  return "";
}

double to_si(double value, std::string_view unit) {
  if (unit == "mm") return value / 1000.0;
  if (unit == "cm") return value / 100.0;
  if (unit == "deg") return degrees_to_radians(value);
  if (unit == "gon") return gon_to_radians(value);
  if (unit == "mgon") return gon_to_radians(value / 1000.0);
  if (unit == "arcsec") return degrees_to_radians(value / 3600.0);
  if (unit == "ppm") return value / 1e6;
  return value;  // m
}

}  // namespace soffit
