#include "exports/ring_thickness_estimate.hpp"

#include "exports/fixed_decimal.hpp"

namespace soffit {

RingThicknessEstimate ring_thickness_estimate(const storage::RingCountFields& count,
                                              const storage::SpanDetails& span) {
  RingThicknessEstimate e;
  const std::string where = count.face + " face, " + count.position;
  e.verified = count.confidence == "high";
  if (count.unit_depth_mm) {
    e.unit_depth_mm = count.unit_depth_mm;
    e.unit_depth_from = "ring count";
  } else if (span.unit_depth_mm) {
    e.unit_depth_mm = span.unit_depth_mm;
    e.unit_depth_from = "span record";
  }
  e.joint_mm = span.joint_thickness_mm;
  const int n = count.rings;

  std::optional<double> per_ring;
  if (e.unit_depth_mm && e.joint_mm) {
    per_ring = *e.unit_depth_mm + *e.joint_mm;
    ThicknessRange r;
    r.value_mm = n * *per_ring;
    if (e.verified) {
      r.lower_mm = r.value_mm - kFaceDepthToleranceMm;
      r.upper_mm = r.value_mm + kFaceDepthToleranceMm;
      r.rule = "verified count: n x (unit + joint) +- " + fixed_decimal(kFaceDepthToleranceMm, 0) + " mm";
    } else {
      // A barrel has at least the one ring that was seen: one ring fewer than one is no arch.
      r.lower_mm = (n > 1 ? n - 1 : n) * *per_ring;
      r.upper_mm = (n + 1) * *per_ring;
      r.rule = "face count: n x (unit + joint), range +-1 ring (representativeness, common practice)";
    }
    e.from_counts = r;
  } else {
    e.warnings.push_back(where + ": no " + std::string(!e.unit_depth_mm ? "unit depth" : "joint thickness") +
                         " recorded (ring count or span record): the thickness from the count of " +
                         std::to_string(n) + " rings is left null");
  }

  if (count.thickness_mm) {
    ThicknessRange r;
    r.value_mm = *count.thickness_mm;
    if (count.thickness_lower_mm && count.thickness_upper_mm) {
      r.lower_mm = *count.thickness_lower_mm;
      r.upper_mm = *count.thickness_upper_mm;
      r.rule = "range as recorded by the surveyor";
      e.measured = r;
    } else if (e.verified) {
      r.lower_mm = r.value_mm - kFaceDepthToleranceMm;
      r.upper_mm = r.value_mm + kFaceDepthToleranceMm;
      r.rule = "verified: taped face depth +- " + fixed_decimal(kFaceDepthToleranceMm, 0) + " mm";
      e.measured = r;
    } else if (per_ring) {
      r.lower_mm = r.value_mm - *per_ring;
      r.upper_mm = r.value_mm + *per_ring;
      r.rule = "taped face depth, range +-1 ring (representativeness, common practice)";
      e.measured = r;
    } else {
      r.rule = "taped face depth; no range: none recorded and no ring depth for +-1 ring";
      e.measured = r;
      e.warnings.push_back(where + ": measured thickness without a recorded range and without the ring depth "
                                   "for +-1 ring: its range is left null");
    }
  } else {
    e.warnings.push_back(where + ": no measured face depth: the measured thickness is null");
  }
  return e;
}

}  // namespace soffit
