#pragma once
// Ring thickness d of one ring count, two ways, each with a range
// (GEOMETRY_JSON.md "Ring thickness" states the rule for users):
//  - from the count: n rings × (unit depth + joint), the unit depth from the
//    count itself or else from the span record, the joint from the span record;
//  - as measured: the face depth taped intrados arris to extrados arris.
// The range is the representativeness of a face observation: ±1 ring unless
// the count is verified through the barrel (FIELD.md §4: "≈±1 ring
// representativeness unless verified", common practice), and then only the
// ±10 mm of taping a face depth (FIELD.md §4, from memory of the trade).
// A range the surveyor recorded (thickness_lower_mm / _upper_mm) is theirs and
// is kept as recorded for the measured thickness. Nothing missing is assumed:
// a missing unit depth or joint gives no count-based value, and says so.
#include <optional>
#include <string>
#include <vector>

#include "storage/survey_records.hpp"

namespace soffit {

// FIELD.md §4: "Tape the face depth … (±5–10 mm)"; the wider end is used.
inline constexpr double kFaceDepthToleranceMm = 10.0;

struct ThicknessRange {
  double value_mm = 0.0;
  std::optional<double> lower_mm, upper_mm;  // null when nothing sets the range
  std::string rule;                          // how the range was set, in words
};

struct RingThicknessEstimate {
  std::optional<double> unit_depth_mm;    // used for the count
  std::string unit_depth_from;            // "ring count", "span record" or empty when unknown
  std::optional<double> joint_mm;         // from the span record
  bool verified = false;                  // confidence "high": the count is proven through the barrel
  std::optional<ThicknessRange> from_counts;
  std::optional<ThicknessRange> measured;
  std::vector<std::string> warnings;      // why a value is missing, without a "file:line" prefix
};

RingThicknessEstimate ring_thickness_estimate(const storage::RingCountFields& count,
                                              const storage::SpanDetails& span);

}  // namespace soffit
