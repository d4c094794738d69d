// `soffit fit`: the command-line contract other checks rely on (issue text:
// JSON keys, uncertainty objects, candidates with auto, exit code 2 on bad input).
// Field values are the demo scenario's oracles (FIELD.md §10.2: unweighted free
// geometric circle fit of the 11 offsets, agree to about ±0.5 mm).
#include <doctest/doctest.h>

#include <cmath>
#include <string>
#include <nlohmann/json.hpp>

#include "tests/cli/run_command.hpp"

using nlohmann::json;
using soffit::test::run_soffit;
using soffit::test::write_temp;

namespace {

const std::string kSheets = std::string(SOFFIT_ASSETS) + "/sheets/";

void check_estimate(const json& e) {
  REQUIRE(e.is_object());
  CHECK(e.at("value").is_number());
  CHECK(e.at("sd").get<double>() >= 0.0);
  REQUIRE(e.at("ci95").size() == 2);
  CHECK(e.at("ci95")[0].get<double>() <= e.at("value").get<double>());
  CHECK(e.at("ci95")[1].get<double>() >= e.at("value").get<double>());
}

}  // namespace

TEST_CASE("soffit fit on the demo sheet reproduces the FIELD.md oracle for S1 mid-width 2019") {
  const auto r = run_soffit("fit " + kSheets + "sallow-ford_S1-MW_2019.csv --shape segmental --seed 3 --mc 500");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const json j = json::parse(r.out);
  CHECK(j.at("shape") == "segmental");
  // R 4.0015 m, rise 1597.3 mm, span at z = 0 6.3975 m, RMS 3.2 mm (FIELD.md §10.2 oracle table)
  CHECK(std::abs(j.at("params").at("radius_m").at("value").get<double>() - 4.0015) < 0.0005);
  CHECK(std::abs(j.at("rise_m").at("value").get<double>() - 1.5973) < 0.0005);
  CHECK(std::abs(j.at("span_m").at("value").get<double>() - 6.3975) < 0.0005);
  CHECK(std::abs(j.at("rms_residual_mm").get<double>() - 3.2) < 0.05);
  check_estimate(j.at("span_m"));
  check_estimate(j.at("rise_m"));
  for (const char* key : {"radius_m", "centre_x_m", "centre_z_m"}) check_estimate(j.at("params").at(key));
  CHECK(j.at("caution").get<std::string>().find("not a structural assessment") != std::string::npos);
  CHECK(j.at("uncertainty").at("seed") == 3);
  CHECK(j.at("uncertainty").at("monte_carlo_draws") == 500);
}

TEST_CASE("soffit fit --shape auto reports every candidate and chooses segmental for S2") {
  const auto r = run_soffit("fit " + kSheets + "sallow-ford_S2-MW_2019.csv --shape auto --mc 200");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const json j = json::parse(r.out);
  CHECK(j.at("shape") == "segmental");
  // R 3.9297 m, rise 1451.7 mm, span 6.0999 m (FIELD.md §10.2)
  CHECK(std::abs(j.at("params").at("radius_m").at("value").get<double>() - 3.9297) < 0.0005);
  CHECK(std::abs(j.at("rise_m").at("value").get<double>() - 1.4517) < 0.0005);
  REQUIRE(j.at("candidates").size() == 6);
  for (const json& c : j.at("candidates")) {
    CHECK(c.contains("shape"));
    CHECK(c.contains("rms_residual_mm"));
    CHECK(c.contains("aic"));
  }
}

TEST_CASE("soffit fit takes a plain x,z file and every family by name") {
  // An invented upright semi-ellipse (a 3.2 m, b 2.6 m), 25 readings from
  // springing to springing: every family can be fitted to it, well or badly.
  std::string text = "# invented semi-ellipse\nx,z,sigma_mm\n";
  for (int k = 0; k <= 24; ++k) {
    const double t = M_PI * (1.0 - k / 24.0);
    text += std::to_string(3.2 + 3.2 * std::cos(t)) + "," + std::to_string(2.6 * std::sin(t)) + ",2\n";
  }
  const auto path = write_temp("ellipse_xz.csv", text);
  for (const std::string shape : {"semicircular", "segmental", "elliptical", "parabolic", "pointed", "three-centred"}) {
    CAPTURE(shape);
    const auto r = run_soffit("fit " + path + " --mc 100 --shape " + shape);
    REQUIRE_MESSAGE(r.exit_code == 0, r.err);
    const json j = json::parse(r.out);
    CHECK(j.at("shape") == shape);
    CHECK(std::isfinite(j.at("rms_residual_mm").get<double>()));
    check_estimate(j.at("span_m"));
    check_estimate(j.at("rise_m"));
  }
  const json elliptical = json::parse(run_soffit("fit " + path + " --mc 50 --shape elliptical").out);
  for (const char* key : {"semi_axis_x_m", "semi_axis_z_m", "centre_x_m", "centre_z_m"})
    check_estimate(elliptical.at("params").at(key));
  CHECK(std::abs(elliptical.at("params").at("semi_axis_x_m").at("value").get<double>() - 3.2) < 0.001);
  CHECK(std::abs(elliptical.at("params").at("semi_axis_z_m").at("value").get<double>() - 2.6) < 0.001);
  const json three = json::parse(run_soffit("fit " + path + " --mc 50 --shape three-centred").out);
  check_estimate(three.at("params").at("radius_crown_m"));
  check_estimate(three.at("params").at("radius_haunch_m"));
  const json pointed = json::parse(run_soffit("fit " + path + " --mc 50 --shape pointed").out);
  check_estimate(pointed.at("params").at("radius_m"));
  const json automatic = json::parse(run_soffit("fit " + path + " --mc 50 --shape auto").out);
  CHECK(automatic.at("shape") == "elliptical");
}

TEST_CASE("soffit fit refuses a family the readings cannot determine, and says why") {
  // Eleven readings of a segmental arch leave a three-centred arch's haunch
  // arcs with no reading of their own: the solver must say so, not guess.
  const auto r = run_soffit("fit " + kSheets + "sallow-ford_S1-MW_2019_xz.csv --shape three-centred");
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("not determined") != std::string::npos);
}

TEST_CASE("soffit fit --springing-z moves the springing line of a segmental fit") {
  const auto path = kSheets + "sallow-ford_S1-MW_2019_xz.csv";
  const json at_zero = json::parse(run_soffit("fit " + path + " --shape segmental --mc 0").out);
  const json raised = json::parse(run_soffit("fit " + path + " --shape segmental --mc 0 --springing-z 0.1").out);
  CHECK(std::abs(raised.at("rise_m").at("value").get<double>() -
                 (at_zero.at("rise_m").at("value").get<double>() - 0.1)) < 1e-9);
  CHECK(raised.at("span_m").at("value").get<double>() < at_zero.at("span_m").at("value").get<double>());
  CHECK(raised.at("springing_level_from") == "given");
}

TEST_CASE("soffit fit: bad input exits 2 with a message naming file, line and field") {
  SUBCASE("a non-number") {
    const auto path = write_temp("nan.csv", "x,z\n0,0\n1,abc\n2,0.5\n3,0\n");
    const auto r = run_soffit("fit " + path);
    CHECK(r.exit_code == 2);
    CHECK(r.err.find(path + ":3") != std::string::npos);
    CHECK(r.err.find("'z'") != std::string::npos);
  }
  SUBCASE("NaN") {
    const auto path = write_temp("nan2.csv", "x,z\n0,0\n1,nan\n2,0.5\n3,0\n");
    const auto r = run_soffit("fit " + path);
    CHECK(r.exit_code == 2);
    CHECK(r.err.find(path + ":3") != std::string::npos);
  }
  SUBCASE("an empty file") {
    const auto path = write_temp("empty.csv", "");
    const auto r = run_soffit("fit " + path);
    CHECK(r.exit_code == 2);
    CHECK(r.err.find(path) != std::string::npos);
  }
  SUBCASE("collinear readings") {
    const auto path = write_temp("line.csv", "x,z\n0,0\n1,0.1\n2,0.2\n3,0.3\n4,0.4\n");
    const auto r = run_soffit("fit " + path + " --shape segmental");
    CHECK(r.exit_code == 2);
    CHECK(r.err.find("straight line") != std::string::npos);
  }
  SUBCASE("fewer readings than the family has parameters") {
    const auto path = write_temp("few.csv", "x,z\n0,0\n1,1\n2,0\n");
    const auto r = run_soffit("fit " + path + " --shape three-centred");
    CHECK(r.exit_code == 2);
    CHECK(r.err.find("too few") != std::string::npos);
  }
  SUBCASE("millimetres in a metres column") {
    const auto path = write_temp("mm.csv", "x,z\n0,0\n1600,968\n3200,1302\n4800,957\n6400,0\n");
    const auto r = run_soffit("fit " + path);
    CHECK(r.exit_code == 2);
    CHECK(r.err.find("millimetres") != std::string::npos);
  }
  SUBCASE("an unknown option and an unknown shape") {
    CHECK(run_soffit("fit x.csv --colour red").exit_code == 2);
    const auto r = run_soffit("fit x.csv --shape oval");
    CHECK(r.exit_code == 2);
    CHECK(r.err.find("oval") != std::string::npos);
  }
  SUBCASE("a missing file") {
    const auto r = run_soffit("fit /nonexistent/section.csv");
    CHECK(r.exit_code == 2);
    CHECK(r.err.find("/nonexistent/section.csv") != std::string::npos);
  }
}
