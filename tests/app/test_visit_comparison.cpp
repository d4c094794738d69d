// Change between visits on the demo sections (FIELD.md §10.2: the S1 rise
// changed −4.5 mm at mid-width, −4.7 mm on the downstream face and 0 on the
// upstream face between 2019 and 2025; oracle values of the unweighted circle
// fit, agreeing to about ±0.5 mm).
#include <doctest/doctest.h>

#include <cmath>

#include "app/model/visit_comparison.hpp"
#include "geometry/sheet/sheet_reader.hpp"

using namespace soffit;

namespace {
app::SectionPair pair_of(const std::string& span, const std::string& section) {
  const std::string base = std::string(SOFFIT_ASSETS) + "/sheets/sallow-ford_" + span + "-" + section + "_";
  return {span, section, read_sheet_file(base + "2019.csv", {}), read_sheet_file(base + "2025.csv", {})};
}
}  // namespace

TEST_CASE("rise changes between the demo visits match the FIELD.md oracle, with their uncertainty") {
  const auto changes = app::compare_sections({pair_of("S1", "MW"), pair_of("S1", "DS"), pair_of("S1", "US")});
  REQUIRE(changes.size() == 3);
  CHECK(std::abs(changes[0].rise_change_m * 1000 - (-4.5)) < 0.6);
  CHECK(std::abs(changes[1].rise_change_m * 1000 - (-4.7)) < 0.6);
  CHECK(std::abs(changes[2].rise_change_m * 1000 - 0.0) < 0.6);
  for (const auto& c : changes) {
    CHECK(c.rise_change_u_m > 0.001);  // at least the two datums' 1 mm each
    CHECK(c.rise_change_u_m < 0.006);
  }
  // US: no change at all; MW and DS: a few mm against a few mm of uncertainty, not beyond twice it.
  CHECK(changes[2].verdict == "within its uncertainty");
  CHECK(changes[0].verdict != "beyond twice its uncertainty");
}
