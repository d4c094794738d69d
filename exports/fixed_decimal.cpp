#include "exports/fixed_decimal.hpp"

#include <charconv>
#include <cmath>

namespace soffit {

std::string fixed_decimal(double value, int decimals) {
  if (std::isnan(value)) return "nan";
  if (std::isinf(value)) return value > 0 ? "inf" : "-inf";
  char buffer[64];
  const auto result = std::to_chars(buffer, buffer + sizeof buffer, value, std::chars_format::fixed, decimals);
  // A finite double needs at most 309 integer digits: beyond 64 characters
  // the value is no survey coordinate, and the general format still says it.
  if (result.ec != std::errc()) {
    const auto general = std::to_chars(buffer, buffer + sizeof buffer, value);
    return std::string(buffer, general.ptr);
  }
  std::string text(buffer, result.ptr);
  if (text[0] == '-' && text.find_first_not_of("-0.") == std::string::npos) text.erase(0, 1);
  return text;
}

}  // namespace soffit
