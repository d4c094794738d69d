#pragma once
// Unit suffixes of column names and metadata keys ("offset_mm", "zenith_gon").
//
// A reading keeps the unit it was taken in until it is reduced; the suffix is
// the only place a unit is stated, so there is no separate "units" setting to
// get out of step with the numbers.
#include <optional>
#include <string>
#include <string_view>

namespace soffit {

enum class UnitKind { length, angle, ratio, text };

struct NameWithUnit {
  std::string quantity;  // "offset"
  std::string unit;      // "mm"; empty when the name has no '_' suffix
};

// Splits "datum_start_rl_m" into {"datum_start_rl", "m"} at the last '_'.
NameWithUnit split_unit_suffix(std::string_view name);

// Whether `unit` is a unit of `kind`: length m, cm, mm; angle deg, gon, mgon,
// arcsec; ratio ppm.
bool unit_is_of_kind(std::string_view unit, UnitKind kind);

// The units accepted for a kind, for messages: "m, cm or mm".
std::string units_of_kind(UnitKind kind);

// Value in SI (m, rad, plain ratio). Division by exact powers of ten keeps
// "-300" mm as exactly the double nearest -0.3 m.
double to_si(double value, std::string_view unit);

}  // namespace soffit
