#pragma once
// Numbers in exported files: a fixed count of decimals, written with
// std::to_chars so that a comma-decimal locale (inspectors abroad) can never
// change a file, and the same value always gives the same bytes.
#include <string>

namespace soffit {

// `value` with exactly `decimals` digits after the point; "-0.00" is written
// "0.00" so that a tiny negative rounding never makes two runs differ in sign.
// Non-finite values are written "nan", "inf" or "-inf" (callers avoid them).
std::string fixed_decimal(double value, int decimals);

}  // namespace soffit
