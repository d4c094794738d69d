// The project-level geometry file (issue 5): on the invented demo of FIELD.md
// §10 it validates against its schema, carries the published oracle values,
// reads back to the same numbers, and states what is missing as null with a
// warning instead of inventing it.
#include <doctest/doctest.h>

#include <cmath>
#include <nlohmann/json.hpp>
#include <string>

#include "exports/geometry_json.hpp"
#include "exports/geometry_json_project.hpp"
#include "storage/export_queries.hpp"
#include "storage/project_file.hpp"
#include "storage/sha256.hpp"
#include "tests/exports/geometry_json_support.hpp"

using soffit::GeometryJsonOptions;
using soffit::test::ExportDir;
using soffit::test::demo_project_path;
using soffit::test::kDemoRef;
using json = nlohmann::ordered_json;
namespace st = soffit::storage;

namespace {

GeometryJsonOptions options(int draws = 200) {
  GeometryJsonOptions o;
  o.program = "soffit test";
  o.monte_carlo_draws = draws;
  o.seed = 7;
  return o;
}

st::InspectionExportData demo_data(const std::string& date) {
  st::Project p = st::Project::open(demo_project_path(), "test", st::Access::view);
  return st::load_inspection_export(p.db(), kDemoRef, date);
}

const json& span(const json& doc, const std::string& label) {
  for (const json& s : doc["spans"])
    if (s["label"] == label) return s;
  FAIL("no span " << label);
  static const json none;
  return none;
}

const json& section(const json& span, const std::string& label) {
  for (const json& s : span["sections"])
    if (s["label"] == label) return s;
  FAIL("no section " << label);
  static const json none;
  return none;
}

bool has_warning(const json& doc, const std::string& part) {
  for (const json& w : doc["warnings"])
    if (w.get<std::string>().find(part) != std::string::npos) return true;
  return false;
}

// Walks two documents together; every number must be the same double.
void check_same(const json& a, const json& b, const std::string& path, int& numbers) {
  CAPTURE(path);
  // Integers read back as unsigned when positive: the kind of integer is not the value.
  if (a.is_number_integer() && b.is_number_integer()) {
    CHECK(a.get<long long>() == b.get<long long>());
    return;
  }
  REQUIRE(a.type() == b.type());
  if (a.is_object()) {
    REQUIRE(a.size() == b.size());
    for (auto it = a.begin(); it != a.end(); ++it) {
      REQUIRE(b.contains(it.key()));
      check_same(it.value(), b[it.key()], path + "/" + it.key(), numbers);
    }
  } else if (a.is_array()) {
    REQUIRE(a.size() == b.size());
    for (size_t i = 0; i < a.size(); ++i) check_same(a[i], b[i], path + "/" + std::to_string(i), numbers);
  } else if (a.is_number_float()) {
    CHECK(a.get<double>() == b.get<double>());
    ++numbers;
  } else {
    CHECK(a == b);
  }
}

int validate(const json& doc, const std::string& name, ExportDir& dir) {
  const std::string path = dir.file(name);
  soffit::test::write_text(path, soffit::geometry_json_text(doc));
  return soffit::test::validate_against_schema(path, dir.file(name + ".log"));
}

}  // namespace

TEST_CASE("geometry JSON of the demo validates against exports/geometry_schema.json, and a broken one does not") {
  if (!soffit::test::jsonschema_available()) {
    MESSAGE("skipped: Debian's python3-jsonschema is not installed (.ci/install-deps installs it)");
    return;
  }
  ExportDir dir;
  const json doc = soffit::geometry_json(demo_data("2019-05-14"), options());
  const bool valid = validate(doc, "demo.json", dir) == 0;
  CHECK_MESSAGE(valid, soffit::test::read_text(dir.file("demo.json.log")));
  // The validator must be able to fail: a quantity without its unit, and a
  // document without its caution, are both refused.
  json no_unit = doc;
  no_unit["spans"][0]["sections"][0]["derived"]["span_m"].erase("unit");
  CHECK(validate(no_unit, "no_unit.json", dir) != 0);
  json no_caution = doc;
  no_caution.erase("caution");
  CHECK(validate(no_caution, "no_caution.json", dir) != 0);
}

TEST_CASE("geometry JSON of the demo carries the FIELD.md §10 values with their ranges") {
  st::Project p = st::Project::open(demo_project_path(), "test", st::Access::view);
  const json doc = soffit::geometry_json(p, kDemoRef, std::string("2019-05-14"), options());
  CHECK(doc["format"] == "soffit-geometry");
  CHECK(doc["format_version"] == 1);
  CHECK(doc["caution"].get<std::string>().find("not a structural assessment") != std::string::npos);
  CHECK(doc["provenance"]["inspection"]["date"] == "2019-05-14");
  CHECK(doc["provenance"]["inspection"]["status"] == "issued");
  CHECK(doc["provenance"]["project_file"] == "sallow-ford.soffit");
  CHECK(doc["provenance"]["inputs_sha256"].get<std::string>().size() == 64);
  CHECK(doc["measurement"]["air_temperature_degc"] == 13.0);  // FIELD.md §10.1: air 13 °C in 2019

  const json& s1 = span(doc, "S1");
  const json& mw = section(s1, "MW");
  // FIELD.md §10.2 oracle, S1 MW 2019: R 4.0015 m, rise 1597.3 mm, span 6.3975 m, r_q/r_c 0.791 (agree to ±0.5 mm).
  CHECK(mw["shape"] == "segmental");
  CHECK(std::abs(mw["parameters"]["radius_m"]["value"].get<double>() - 4.0015) < 0.0005);
  CHECK(std::abs(mw["derived"]["rise_m"]["value"].get<double>() - 1.5973) < 0.0005);
  CHECK(std::abs(mw["derived"]["span_m"]["value"].get<double>() - 6.3975) < 0.0005);
  CHECK(std::abs(mw["derived"]["rq_rc_ratio"]["value"].get<double>() - 0.791) < 0.0006);
  const json& rise = mw["derived"]["rise_m"];
  CHECK(rise["unit"] == "m");
  CHECK(rise["ci95"][0].get<double>() < rise["value"].get<double>());
  CHECK(rise["ci95"][1].get<double>() > rise["value"].get<double>());
  // FIELD.md §10.4: the S1 arc is 7.418 m long (from the scenario's own fit; within 10 mm).
  CHECK(std::abs(s1["soffit_arc_length_m"]["value"].get<double>() - 7.418) < 0.010);

  // FIELD.md §10 / §4: 4 rowlock rings of 110 mm bricks with 10 mm joints; ±1 ring unless verified (common practice).
  const json& count = s1["ring_thickness"]["counts"][0];
  CHECK(count["rings"] == 4);
  CHECK(count["from_counts"]["value_mm"] == 480.0);
  CHECK(count["from_counts"]["lower_mm"] == 360.0);
  CHECK(count["from_counts"]["upper_mm"] == 600.0);
  // The face depths as taped, with the surveyor's range d 0.35–0.58 m (FIELD.md §10.3).
  bool found_470 = false;
  for (const json& c : s1["ring_thickness"]["counts"])
    if (c["face"] == "US" && c["position"] == "W springing") {
      found_470 = true;
      CHECK(c["measured"]["value_mm"] == 470.0);
      CHECK(c["measured"]["lower_mm"] == 350.0);
      CHECK(c["measured"]["upper_mm"] == 580.0);
    }
  CHECK(found_470);

  // FIELD.md §10.3, 2019: h = 0.466 m over the S1 crown (estimate, correlated with d) and the trial pit's 0.455 m.
  const json& crown = s1["fill"]["at_crown"];
  REQUIRE(crown.is_object());
  REQUIRE(crown["observations"].size() == 2);
  bool estimate = false, pit = false;
  for (const json& o : crown["observations"]) {
    if (o["method"] == "estimate") {
      estimate = std::abs(o["depth_m"].get<double>() - 0.466) < 1e-9 && o["correlated_with_ring_thickness"] == true;
    }
    if (o["method"] == "trial_pit") pit = std::abs(o["depth_m"].get<double>() - 0.455) < 1e-9;
  }
  CHECK(estimate);
  CHECK(pit);
  CHECK(s1["fill"]["at_quarter_points"]["left"].is_null());
  CHECK(has_warning(doc, "span S1: no fill depth observed at either quarter point"));
  CHECK(s1["surfacing"]["recorded_depth_m"] == 0.11);
  CHECK(s1["barrel_width_m"] == 5.2);
  CHECK(s1["skew_deg"] == 5.0);
  CHECK(s1["spandrel_walls"].size() == 2);

  // FIELD.md §10.4, 2019: eight defects; D01 from s 1.80 to 3.90 m at y 4.55 m on the unrolled soffit.
  CHECK(doc["defects"].size() == 8);
  const json& d01 = doc["defects"][0];
  CHECK(d01["ref"] == "D01");
  CHECK(d01["frame"] == "soffit");
  CHECK(d01["points"][0]["s_m"] == 1.8);
  CHECK(d01["points"][1]["s_m"] == 3.9);
  CHECK(d01["points"][0]["y_m"] == 4.55);
}

TEST_CASE("geometry JSON: the latest inspection is the default, and an unknown one is refused by name") {
  st::Project p = st::Project::open(demo_project_path(), "test", st::Access::view);
  const auto latest = st::load_inspection_export(p.db(), kDemoRef, std::nullopt);
  CHECK(latest.inspection.date == "2025-05-21");  // FIELD.md §10.1: the later visit
  CHECK_THROWS_WITH_AS(st::load_inspection_export(p.db(), kDemoRef, std::string("2020-01-01")),
                       doctest::Contains("2019-05-14, 2025-05-21"), st::StorageError);
  CHECK_THROWS_WITH_AS(st::load_inspection_export(p.db(), "NO-SUCH", std::nullopt), doctest::Contains("NO-SUCH"),
                       st::StorageError);
  CHECK_THROWS_WITH_AS(st::load_inspection_export(p.db(), kDemoRef, std::string("21/05/2025")),
                       doctest::Contains("YYYY-MM-DD"), st::StorageError);
}

TEST_CASE("geometry JSON round trip: every number reads back equal to its last printed digit") {
  const json doc = soffit::geometry_json(demo_data("2025-05-21"), options());
  const std::string text = soffit::geometry_json_text(doc);
  const json back = json::parse(text);
  int numbers = 0;
  check_same(doc, back, "", numbers);
  CHECK(numbers > 500);
  // Written again, the parsed document gives the same bytes.
  CHECK(soffit::geometry_json_text(back) == text);
  // Lengths in metres are stored to 0.01 mm: never more than five decimals printed.
  const double rise = back["spans"][0]["sections"][0]["derived"]["rise_m"]["value"].get<double>();
  CHECK(std::abs(rise * 1e5 - std::round(rise * 1e5)) < 1e-6);
}

TEST_CASE("geometry JSON: the same survey gives byte-identical files and the same input hash") {
  const std::string one = soffit::geometry_json_text(soffit::geometry_json(demo_data("2025-05-21"), options()));
  const std::string two = soffit::geometry_json_text(soffit::geometry_json(demo_data("2025-05-21"), options()));
  CHECK(one == two);
  // The hash covers the survey, not the keys: a second demo project (new UUIDs) hashes alike…
  ExportDir dir;
  const std::string other = dir.file("again.soffit");
  st::write_demo_project(other, st::find_demo_sheets(), "someone else");
  st::Project p = st::Project::open(other, "test", st::Access::view);
  const auto again = st::load_inspection_export(p.db(), kDemoRef, std::string("2025-05-21"));
  auto data = demo_data("2025-05-21");
  CHECK(again.inputs_sha256 == data.inputs_sha256);
  // …and a reading moved by 0.1 mm does not.
  data.sections[0].sheet.readings[3].z += 0.0001;
  CHECK(st::sha256_hex(st::export_inputs_text(data).data(), st::export_inputs_text(data).size()) !=
        again.inputs_sha256);
}

TEST_CASE("geometry JSON: no fitted section and no ring count give explicit nulls and warnings") {
  auto data = demo_data("2025-05-21");
  std::string s2_id;
  for (const auto& s : data.spans)
    if (s.record.label == "S2") s2_id = s.record.id;
  REQUIRE_FALSE(s2_id.empty());
  // S2: no ring count at all; its only section left with two readings, which no arch fits.
  std::erase_if(data.ring_counts, [&](const st::RingCountFields& c) { return c.span_id == s2_id; });
  for (auto& s : data.sections)
    if (s.record.span_label == "S2") {
      s.sheet.readings.resize(2);
      s.record.reading_count = 2;
    }
  // S1: the unit depth gone from the counts and the span record: the count gives no thickness.
  for (auto& c : data.ring_counts) c.unit_depth_mm.reset();
  for (auto& s : data.spans) s.details.unit_depth_mm.reset();

  const json doc = soffit::geometry_json(data, options(0));
  const json& s2 = span(doc, "S2");
  CHECK(s2["ring_thickness"]["counts"].empty());
  CHECK(s2["ring_thickness"]["from_counts_summary"].is_null());
  CHECK(has_warning(doc, "span S2: no ring count in this inspection"));
  const json& mw = section(s2, "MW");
  CHECK(mw["shape"].is_null());
  CHECK(mw["parameters"].is_null());
  CHECK(mw["derived"].is_null());
  CHECK(mw["fit_error"].is_string());
  CHECK(s2["reference_section"].is_null());
  CHECK(s2["stations"]["crown_x_m"].is_null());
  CHECK(s2["soffit_arc_length_m"].is_null());
  CHECK(has_warning(doc, "span S2 section MW: no arch could be fitted"));
  CHECK(has_warning(doc, "span S2: no fitted section"));

  const json& s1 = span(doc, "S1");
  for (const json& c : s1["ring_thickness"]["counts"]) {
    CHECK(c["from_counts"].is_null());
    CHECK(c["unit_depth_mm"].is_null());
    CHECK(c["measured"].is_object());  // the taped depth is still there, with the surveyor's range
  }
  CHECK(s1["ring_thickness"]["from_counts_summary"].is_null());
  CHECK(has_warning(doc, "no unit depth recorded"));

  if (soffit::test::jsonschema_available()) {
    ExportDir dir;
    const bool valid = validate(doc, "missing.json", dir) == 0;
    CHECK_MESSAGE(valid, soffit::test::read_text(dir.file("missing.json.log")));
  } else {
    MESSAGE("schema check skipped: Debian's python3-jsonschema is not installed");
  }
}
