// Ring thickness from a count and from a taped face depth, each with its
// range (exports/ring_thickness_estimate.hpp). FIELD.md §4: one brick ring
// ≈110–125 mm with its joint; ±10 mm taping; ≈±1 ring representativeness
// unless verified (common practice).
#include <doctest/doctest.h>

#include <cmath>

#include "exports/ring_thickness_estimate.hpp"

using soffit::ring_thickness_estimate;
namespace st = soffit::storage;

namespace {

st::SpanDetails brick_span() {
  st::SpanDetails s;
  s.unit_depth_mm = 102.5;  // modern UK brick 215 × 102.5 × 65 mm with 10 mm joints (FIELD.md §4)
  s.joint_thickness_mm = 10;
  return s;
}

st::RingCountFields count(int rings) {
  st::RingCountFields c;
  c.face = "US";
  c.position = "crown";
  c.rings = rings;
  return c;
}

}  // namespace

TEST_CASE("ring thickness from an unverified face count: n x (unit + joint), +-1 ring") {
  const auto e = ring_thickness_estimate(count(3), brick_span());
  REQUIRE(e.from_counts);
  CHECK(e.unit_depth_from == "span record");
  CHECK(std::abs(e.from_counts->value_mm - 337.5) < 1e-9);  // 3 × 112.5 mm
  CHECK(std::abs(*e.from_counts->lower_mm - 225.0) < 1e-9);
  CHECK(std::abs(*e.from_counts->upper_mm - 450.0) < 1e-9);
  CHECK_FALSE(e.measured);  // no taped depth: null, and said so
  REQUIRE(e.warnings.size() == 1);
  CHECK(e.warnings[0].find("no measured face depth") != std::string::npos);
}

TEST_CASE("ring thickness from a verified count keeps only the +-10 mm of taping") {
  auto c = count(4);
  c.confidence = "high";
  c.unit_depth_mm = 110;  // the count's own unit depth wins over the span record
  c.thickness_mm = 470;
  const auto e = ring_thickness_estimate(c, brick_span());
  REQUIRE(e.from_counts);
  REQUIRE(e.measured);
  CHECK(e.verified);
  CHECK(e.unit_depth_from == "ring count");
  CHECK(std::abs(e.from_counts->value_mm - 480.0) < 1e-9);
  CHECK(std::abs(*e.from_counts->lower_mm - 470.0) < 1e-9);
  CHECK(std::abs(*e.measured->upper_mm - 480.0) < 1e-9);
  CHECK(e.warnings.empty());
}

TEST_CASE("ring thickness: one ring is never fewer - a recorded range is kept - a missing joint gives null") {
  auto c = count(1);
  c.thickness_mm = 115;
  c.thickness_lower_mm = 100;
  c.thickness_upper_mm = 240;
  auto e = ring_thickness_estimate(c, brick_span());
  REQUIRE(e.from_counts);
  CHECK(std::abs(*e.from_counts->lower_mm - 112.5) < 1e-9);
  CHECK(std::abs(*e.from_counts->upper_mm - 225.0) < 1e-9);
  CHECK(std::abs(*e.measured->lower_mm - 100.0) < 1e-9);
  CHECK(e.measured->rule.find("recorded") != std::string::npos);

  auto span = brick_span();
  span.joint_thickness_mm.reset();
  e = ring_thickness_estimate(count(4), span);
  CHECK_FALSE(e.from_counts);
  REQUIRE_FALSE(e.warnings.empty());
  CHECK(e.warnings[0].find("no joint thickness") != std::string::npos);
}
