#include "geometry/sheet/sheet_number.hpp"

#include <charconv>
#include <cmath>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/csv_rows.hpp"

namespace soffit {

std::optional<double> try_parse_number(std::string_view cell) {
  while (!cell.empty() && (cell.front() == ' ' || cell.front() == '\t')) cell.remove_prefix(1);
  while (!cell.empty() && (cell.back() == ' ' || cell.back() == '\t')) cell.remove_suffix(1);
  if (!cell.empty() && cell.front() == '+') cell.remove_prefix(1);  // from_chars refuses '+'
  if (cell.empty() || cell.front() == '+') return std::nullopt;
  double value = 0.0;
  const char* first = cell.data();
  const char* last = cell.data() + cell.size();
  auto [ptr, ec] = std::from_chars(first, last, value, std::chars_format::general);
  if (ec != std::errc() || ptr != last) return std::nullopt;
  if (!std::isfinite(value)) return std::nullopt;  // from_chars accepts "nan" and "inf"
  return value;
}

double parse_number(std::string_view cell, const std::string& file, int line,
                    const std::string& field) {
  if (auto v = try_parse_number(cell)) return *v;
  std::string text(cell);
  if (text.empty()) {
    throw InputError(file, line, field, "the cell is empty; a number is needed here");
  }
  const std::string low = ascii_lower(text);
  if (low.find("nan") != std::string::npos || low.find("inf") != std::string::npos) {
    throw InputError(file, line, field,
                     "'" + text + "' is not a measured value (NaN and infinity are not accepted); "
                     "enter the reading, or leave the row out or mark it excluded");
  }
  if (text.find(',') != std::string::npos) {
    throw InputError(file, line, field,
                     "'" + text + "' is not a number: use a point as the decimal separator "
                     "(for example 1.5, not 1,5)");
  }
  throw InputError(file, line, field, "'" + text + "' is not a number");
}

std::string format_fixed(double value, int decimals) {
  char buf[64];
  auto [ptr, ec] = std::to_chars(buf, buf + sizeof buf, value, std::chars_format::fixed, decimals);
  if (ec != std::errc()) return "?";
  std::string s(buf, ptr);
  if (s == "-0" || s.rfind("-0.", 0) == 0) {  // "-0.000" reads as a sign error on site
    bool all_zero = s.find_first_not_of("-0.") == std::string::npos;
    if (all_zero) s.erase(0, 1);
  }
  return s;
}

bool has_nonzero_fraction(double value) { return value != std::trunc(value); }

}  // namespace soffit
