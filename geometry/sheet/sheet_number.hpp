#pragma once
// Locale-independent number reading and writing for sheets.
//
// Inspectors run comma-decimal locales; strtod/atof/printf would read "9.800"
// as 9 there. std::from_chars and std::to_chars ignore the locale.
#include <optional>
#include <string>
#include <string_view>

namespace soffit {

// The finite number the whole cell spells, or nullopt ("", "abc", "nan", "inf", "1,5").
std::optional<double> try_parse_number(std::string_view cell);

// As try_parse_number, but throws InputError(file, line, field, ...) saying
// what is wrong with the cell in words an inspector can act on.
double parse_number(std::string_view cell, const std::string& file, int line,
                    const std::string& field);

// Fixed-point text with `decimals` digits, always with a decimal point.
std::string format_fixed(double value, int decimals);

// True when the cell's text has a fractional part that is not zero ("0.35", not "35" or "35.0").
bool has_nonzero_fraction(double value);

}  // namespace soffit
