// Ring counts, fill depths, defects, span and visit details (issue 3 "What it
// holds"): each edit is one transaction and one undo step, bad values are
// refused with the field named, and nothing half-written is left behind.
// Values are the invented Sallow Ford Bridge of FIELD.md §10.
#include <doctest/doctest.h>

#include <cmath>
#include <functional>
#include <nlohmann/json.hpp>

#include "storage/observation_edits.hpp"
#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/sqlite_statement.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;

namespace {

struct Visit {
  std::string structure_id, span_id, inspection_id;
};

Visit sallow_ford_2019(Project& p) {
  Visit v;
  p.edit("set up", [&](Connection& db) {
    StructureFields f;
    f.ref = "BVDC-ST-0417";
    f.name = "Sallow Ford Bridge";
    v.structure_id = insert_structure(db, p.author(), f);
    v.span_id = ensure_span(db, p.author(), v.structure_id, 1);
    v.inspection_id = ensure_inspection(db, p.author(), v.structure_id, "2019-05-14");
  });
  return v;
}

long long count(Project& p, const char* table) {
  return p.db().query_int(std::string("SELECT count(*) FROM ") + table);
}

std::string message_of(const std::function<void()>& f) {
  try {
    f();
  } catch (const StorageError& e) {
    CHECK(e.kind() == ErrorKind::invalid);
    return e.what();
  }
  return "<no error>";
}

}  // namespace

TEST_CASE("a ring count is stored with its range and basis, and undo removes it") {
  TempDir dir;
  Project p = Project::create(dir.file("rings.soffit"), "J. Okafor");
  const Visit v = sallow_ford_2019(p);
  RingCountFields r;
  r.inspection_id = v.inspection_id;
  r.span_id = v.span_id;
  r.face = "US";
  r.position = "W springing";
  r.rings = 4;                // FIELD.md §10: 4 rings at every face
  r.thickness_mm = 470;       // S1 US W springing, FIELD.md §10
  r.thickness_lower_mm = 350;  // d range 0.35–0.58 m, FIELD.md §10.3
  r.thickness_upper_mm = 580;
  r.unit_depth_mm = 110;      // brick 230 × 110 × 68 mm, FIELD.md §10
  r.confidence = "medium";
  r.basis = "face count only";
  std::string id;
  p.edit("ring count", [&](Connection& db) { id = add_ring_count(db, p.author(), r); });
  Statement q(p.db(), "SELECT rings, thickness_mm, thickness_lower_mm, thickness_upper_mm, basis, author "
                      "FROM ring_count WHERE id = ?1");
  q.bind(1, id);
  REQUIRE(q.step());
  CHECK(q.column_int64(0) == 4);
  CHECK(q.column_double(1) == 470.0);
  CHECK(q.column_double(2) == 350.0);
  CHECK(q.column_double(3) == 580.0);
  CHECK(q.column_text(4) == "face count only");
  CHECK(q.column_text(5) == "J. Okafor");
  REQUIRE(p.undo());
  CHECK(count(p, "ring_count") == 0);
  REQUIRE(p.redo());
  CHECK(p.db().query_text("SELECT id FROM ring_count") == id);

  r.rings = 0;
  CHECK(message_of([&] { p.edit("bad", [&](Connection& db) { add_ring_count(db, p.author(), r); }); })
            .find("field 'rings'") != std::string::npos);
  r.rings = 4;
  r.confidence = "certain";
  CHECK(message_of([&] { p.edit("bad", [&](Connection& db) { add_ring_count(db, p.author(), r); }); })
            .find("field 'confidence'") != std::string::npos);
  CHECK(count(p, "ring_count") == 1);
  CHECK(p.undo_label() == "ring count");  // refused edits leave no undo step
}

TEST_CASE("a fill depth observation keeps its method and uncertainty - undo removes it") {
  TempDir dir;
  Project p = Project::create(dir.file("fill.soffit"), "J. Okafor");
  const Visit v = sallow_ford_2019(p);
  FillDepthFields f;
  f.inspection_id = v.inspection_id;
  f.span_id = v.span_id;
  f.chainage_m = 3.2;      // S1 crown, FIELD.md §10.3
  f.offset_y_m = 4.60;     // trial pit on the DS verge, y 4.45–4.75 (FIELD.md §10)
  f.method = "trial_pit";
  f.depth_m = 0.455;       // verge to brick extrados, FIELD.md §10
  f.uncertainty_m = 0.005; // (d + h) to ±5 mm, FIELD.md §5
  f.surfacing_m = 0.110;
  p.edit("fill depth", [&](Connection& db) { add_fill_depth(db, p.author(), f); });
  CHECK(std::abs(p.db().query_int("SELECT round(depth_m * 1000) FROM fill_depth") - 455) == 0);
  CHECK(p.db().query_text("SELECT method FROM fill_depth") == "trial_pit");
  REQUIRE(p.undo());
  CHECK(count(p, "fill_depth") == 0);

  f.method = "guess";
  CHECK(message_of([&] { p.edit("bad", [&](Connection& db) { add_fill_depth(db, p.author(), f); }); })
            .find("field 'method'") != std::string::npos);
  f.method = "estimate";
  f.depth_m = 455;  // millimetres typed into a metre field
  CHECK(message_of([&] { p.edit("bad", [&](Connection& db) { add_fill_depth(db, p.author(), f); }); })
            .find("field 'depth_m'") != std::string::npos);
  CHECK(count(p, "fill_depth") == 0);
}

TEST_CASE("defects: line on the soffit, area on an elevation, update and delete are each one undo step") {
  TempDir dir;
  Project p = Project::create(dir.file("defects.soffit"), "J. Okafor");
  const Visit v = sallow_ford_2019(p);
  DefectFields d01;  // FIELD.md §10.4, 2019: s 1.80–3.90 at y 4.55, max 0.5 mm
  d01.inspection_id = v.inspection_id;
  d01.span_id = v.span_id;
  d01.ref = "D01";
  d01.defect_type = "longitudinal_crack";
  d01.element = "barrel";
  d01.frame_origin = "W springing; US face";
  d01.geometry = DefectGeometry::line;
  d01.points = {{1.80, 4.55}, {3.90, 4.55}};
  d01.length_m = 2.10;
  d01.width_mm = 0.5;
  d01.severity = 3;
  d01.notes = "max width at s 3.0 (card); studs M1 fitted";
  DefectFields d03;  // FIELD.md §10.4: DS spandrel bulge at x 3.2, 1.0 m above springing
  d03.inspection_id = v.inspection_id;
  d03.span_id = v.span_id;
  d03.ref = "D03";
  d03.defect_type = "spandrel_bulge";
  d03.element = "DS spandrel wall";
  d03.frame = DefectFrame::elevation;
  d03.frame_origin = "DS spandrel elevation, x from the W abutment face, z from the springing";
  d03.geometry = DefectGeometry::area;
  d03.points = {{2.7, 0.6}, {3.7, 0.6}, {3.7, 1.4}, {2.7, 1.4}};
  d03.area_m2 = 0.8;
  d03.notes = "18 mm outward (line offset, u 2 mm)";

  std::string id01, id03;
  p.edit("D01", [&](Connection& db) { id01 = add_defect(db, p.author(), d01); });
  p.edit("D03", [&](Connection& db) { id03 = add_defect(db, p.author(), d03); });
  CHECK(count(p, "defect") == 2);
  const auto geometry = nlohmann::json::parse(
      p.db().query_text("SELECT geometry_json FROM defect WHERE ref = 'D01'"));
  REQUIRE(geometry["points"].size() == 2);
  CHECK(geometry["points"][1][0].get<double>() == 3.90);
  CHECK(p.db().query_text("SELECT location_frame || '/' || geometry_kind FROM defect WHERE ref = 'D03'") ==
        "elevation/area");

  // 2019 → 2025 growth of D01 recorded as an edit (FIELD.md §10.4: 1.2 mm, s 1.30–4.70).
  d01.points = {{1.30, 4.55}, {4.70, 4.55}};
  d01.width_mm = 1.2;
  d01.length_m = 3.40;
  p.edit("D01 grown", [&](Connection& db) { update_defect(db, p.author(), id01, d01); });
  CHECK(p.db().query_text("SELECT width_mm FROM defect WHERE id = '" + id01 + "'") == "1.2");
  REQUIRE(p.undo());
  CHECK(p.db().query_text("SELECT width_mm FROM defect WHERE id = '" + id01 + "'") == "0.5");

  p.edit("delete D03", [&](Connection& db) { delete_defect(db, id03); });
  CHECK(count(p, "defect") == 1);
  REQUIRE(p.undo());
  CHECK(p.db().query_text("SELECT ref FROM defect WHERE id = '" + id03 + "'") == "D03");
}

TEST_CASE("a defect outside the vocabulary, with the wrong number of points or a bad grade is refused") {
  TempDir dir;
  Project p = Project::create(dir.file("bad_defects.soffit"), "J. Okafor");
  const Visit v = sallow_ford_2019(p);
  DefectFields d;
  d.inspection_id = v.inspection_id;
  d.ref = "D99";
  d.defect_type = "crack";  // not a key: the vocabulary says which crack
  d.element = "barrel";
  d.frame_origin = "W springing; US face";
  d.points = {{1.0, 1.0}};
  const auto add = [&] { p.edit("bad", [&](Connection& db) { add_defect(db, p.author(), d); }); };
  CHECK(message_of(add).find("field 'defect_type'") != std::string::npos);
  d.defect_type = "transverse_crack";
  d.geometry = DefectGeometry::line;
  CHECK(message_of(add).find("at least 2 points") != std::string::npos);
  d.geometry = DefectGeometry::area;
  d.points = {{0, 0}, {1, 0}};
  CHECK(message_of(add).find("at least 3 points") != std::string::npos);
  d.points.push_back({1, 1});
  d.severity = 6;  // the default scale is 1–5 (defect_vocabulary.md)
  CHECK(message_of(add).find("field 'severity'") != std::string::npos);
  d.severity = 2;
  d.width_mm = -0.1;
  CHECK(message_of(add).find("field 'width_mm'") != std::string::npos);
  CHECK(count(p, "defect") == 0);
  CHECK(is_defect_type("scour"));
  CHECK_FALSE(is_defect_type("Scour"));
}

TEST_CASE("span details and visit details are stored, read back and undone as one step each") {
  TempDir dir;
  Project p = Project::create(dir.file("span.soffit"), "J. Okafor");
  const Visit v = sallow_ford_2019(p);
  SpanDetails s;  // FIELD.md §10 table
  s.nominal_shape = "segmental";
  s.barrel_width_m = 5.20;
  s.skew_deg = 5;
  s.ring_material = "brick";
  s.unit_depth_mm = 110;
  s.joint_thickness_mm = 10;
  s.fill_material = "clayey sandy gravel with brick fragments";
  s.surfacing_depth_m = 0.110;
  s.spandrel_walls = {{"US", false, 0.45, std::nullopt, 0.0}, {"DS", false, 0.45, std::nullopt, 5.20}};
  s.supports = {{"pier", "pier", 1.20, std::nullopt, std::nullopt, "footing top RL 8.35"}};
  p.edit("span details", [&](Connection& db) { update_span_details(db, p.author(), v.span_id, s); });
  Statement q(p.db(), "SELECT barrel_width_m, skew_deg, ring_material, spandrel_walls_json, supports_json FROM span");
  REQUIRE(q.step());
  CHECK(q.column_double(0) == 5.20);
  CHECK(q.column_double(1) == 5.0);
  CHECK(q.column_text(2) == "brick");
  const auto walls = nlohmann::json::parse(q.column_text(3));
  REQUIRE(walls.size() == 2);
  CHECK(walls[1]["side"] == "DS");
  CHECK(walls[1]["thickness_m"].get<double>() == 0.45);
  CHECK(nlohmann::json::parse(q.column_text(4))[0]["thickness_m"].get<double>() == 1.20);

  s.ring_material = "concrete";
  CHECK(message_of([&] { p.edit("bad", [&](Connection& db) { update_span_details(db, p.author(), v.span_id, s); }); })
            .find("field 'ring_material'") != std::string::npos);

  InspectionDetails d;  // FIELD.md §10.1, PI-2019
  d.kind = "principal";
  d.inspector = "J. Okafor";
  d.weather = "overcast, dry; soffit 11 C";
  d.air_temperature_c = 13;
  d.instruments = {{"laser level", 1.0}, {"crack width card", 0.1}};
  p.edit("visit", [&](Connection& db) { update_inspection_details(db, p.author(), v.inspection_id, d); });
  CHECK(p.db().query_text("SELECT inspector FROM inspection") == "J. Okafor");
  CHECK(nlohmann::json::parse(p.db().query_text("SELECT instruments_json FROM inspection"))[1]["precision_mm"]
            .get<double>() == 0.1);
  REQUIRE(p.undo());
  CHECK(p.db().query_text("SELECT coalesce(inspector, '-') FROM inspection") == "-");
  REQUIRE(p.undo());
  CHECK(p.db().query_text("SELECT coalesce(barrel_width_m, '-') FROM span") == "-");
}

namespace {

RingCountFields s1_us_crown(const Visit& v) {
  RingCountFields r;
  r.inspection_id = v.inspection_id;
  r.span_id = v.span_id;
  r.face = "US";
  r.position = "crown";
  r.rings = 4;           // FIELD.md §10: 4 rings at every face
  r.unit_depth_mm = 110;  // brick 230 × 110 × 68 mm, FIELD.md §10
  r.thickness_mm = 462;   // S1 US crown, FIELD.md §10
  r.confidence = "medium";
  r.basis = "face count only";
  return r;
}

FillDepthFields s1_trial_pit(const Visit& v) {
  FillDepthFields f;  // the 2019 trial pit over the S1 crown, FIELD.md §10 and §10.3
  f.inspection_id = v.inspection_id;
  f.span_id = v.span_id;
  f.chainage_m = 3.2;
  f.offset_y_m = 4.60;
  f.method = "trial_pit";
  f.depth_m = 0.455;
  f.surfacing_m = 0.110;
  return f;
}

ErrorKind kind_of(const std::function<void()>& f) {
  try {
    f();
  } catch (const StorageError& e) {
    return e.kind();
  }
  FAIL("no StorageError");
  return ErrorKind::invalid;
}

}  // namespace

TEST_CASE("a ring count is changed and deleted as one undo step each, with the same rules as adding it") {
  TempDir dir;
  Project p = Project::create(dir.file("ring_edit.soffit"), "J. Okafor");
  const Visit v = sallow_ford_2019(p);
  RingCountFields r = s1_us_crown(v);
  std::string id;
  p.edit("add ring count", [&](Connection& db) { id = add_ring_count(db, p.author(), r); });

  r.rings = 5;  // a fifth ring found at the crown on a second look
  r.thickness_mm = 590;
  r.confidence = "high";
  r.basis = "core";
  p.edit("edit ring count", [&](Connection& db) { update_ring_count(db, "M. Lindqvist", id, r); });
  Statement q(p.db(), "SELECT rings, thickness_mm, confidence, basis, author, inspection_id FROM ring_count WHERE id = ?1");
  q.bind(1, id);
  REQUIRE(q.step());
  CHECK(q.column_int64(0) == 5);
  CHECK(q.column_double(1) == 590.0);
  CHECK(q.column_text(2) == "high");
  CHECK(q.column_text(3) == "core");
  CHECK(q.column_text(4) == "M. Lindqvist");
  CHECK(q.column_text(5) == v.inspection_id);
  REQUIRE(p.undo());
  CHECK(p.db().query_int("SELECT rings FROM ring_count") == 4);

  r.rings = 21;  // storage takes 1 to 20 rings (observation_edits.cpp)
  CHECK(message_of([&] { p.edit("bad", [&](Connection& db) { update_ring_count(db, p.author(), id, r); }); })
            .find("field 'rings'") != std::string::npos);
  r.rings = 4;
  r.thickness_lower_mm = 600;
  r.thickness_upper_mm = 350;
  CHECK(message_of([&] { p.edit("bad", [&](Connection& db) { update_ring_count(db, p.author(), id, r); }); })
            .find("field 'thickness_lower_mm'") != std::string::npos);
  CHECK(p.db().query_int("SELECT rings FROM ring_count") == 4);  // the refused edit changed nothing
  CHECK(kind_of([&] { p.edit("bad", [&](Connection& db) { update_ring_count(db, p.author(), "nope", s1_us_crown(v)); }); }) ==
        ErrorKind::not_found);

  p.edit("delete ring count", [&](Connection& db) { delete_ring_count(db, id); });
  CHECK(count(p, "ring_count") == 0);
  CHECK(kind_of([&] { p.edit("bad", [&](Connection& db) { delete_ring_count(db, id); }); }) == ErrorKind::not_found);
  REQUIRE(p.undo());
  CHECK(p.db().query_text("SELECT id FROM ring_count") == id);
}

TEST_CASE("a fill depth is changed and deleted as one undo step each, and mm typed as m is refused") {
  TempDir dir;
  Project p = Project::create(dir.file("fill_edit.soffit"), "J. Okafor");
  const Visit v = sallow_ford_2019(p);
  FillDepthFields f = s1_trial_pit(v);
  std::string id;
  p.edit("add fill depth", [&](Connection& db) { id = add_fill_depth(db, p.author(), f); });
  f.uncertainty_m = 0.005;  // (d + h) to ±5 mm, FIELD.md §5
  f.method = "core";
  p.edit("edit fill depth", [&](Connection& db) { update_fill_depth(db, p.author(), id, f); });
  CHECK(p.db().query_text("SELECT method FROM fill_depth") == "core");
  CHECK(std::abs(p.db().query_int("SELECT round(uncertainty_m * 1000) FROM fill_depth") - 5) == 0);
  REQUIRE(p.undo());
  CHECK(p.db().query_text("SELECT method FROM fill_depth") == "trial_pit");

  f.surfacing_m = 110;  // millimetres typed into a metre field
  CHECK(message_of([&] { p.edit("bad", [&](Connection& db) { update_fill_depth(db, p.author(), id, f); }); })
            .find("field 'surfacing_m'") != std::string::npos);
  f.surfacing_m = 0.6;  // more surfacing than the whole depth it is part of (FIELD.md §5)
  CHECK(message_of([&] { p.edit("bad", [&](Connection& db) { update_fill_depth(db, p.author(), id, f); }); })
            .find("field 'surfacing_m'") != std::string::npos);
  f.surfacing_m = 0.110;
  f.offset_y_m = std::nan("");
  CHECK(message_of([&] { p.edit("bad", [&](Connection& db) { add_fill_depth(db, p.author(), f); }); })
            .find("field 'offset_y_m'") != std::string::npos);
  CHECK(count(p, "fill_depth") == 1);

  p.edit("delete fill depth", [&](Connection& db) { delete_fill_depth(db, id); });
  CHECK(count(p, "fill_depth") == 0);
  REQUIRE(p.undo());
  CHECK(count(p, "fill_depth") == 1);
}

TEST_CASE("ring counts and fill depths of an issued visit can be neither changed nor deleted") {
  TempDir dir;
  Project p = Project::create(dir.file("issued.soffit"), "J. Okafor");
  const Visit v = sallow_ford_2019(p);
  RingCountFields r = s1_us_crown(v);
  const FillDepthFields f = s1_trial_pit(v);
  std::string ring_id, fill_id;
  p.edit("observations", [&](Connection& db) {
    ring_id = add_ring_count(db, p.author(), r);
    fill_id = add_fill_depth(db, p.author(), f);
  });
  p.edit("check", [&](Connection& db) { set_inspection_status(db, p.author(), v.inspection_id, "checked"); });
  p.edit("issue", [&](Connection& db) { set_inspection_status(db, p.author(), v.inspection_id, "issued"); });
  r.rings = 5;
  const auto refused = [&](const std::function<void(Connection&)>& change) {
    const std::string m = message_of([&] { p.edit("refused", change); });
    CHECK(m.find("issued") != std::string::npos);
  };
  refused([&](Connection& db) { update_ring_count(db, p.author(), ring_id, r); });
  refused([&](Connection& db) { delete_ring_count(db, ring_id); });
  refused([&](Connection& db) { update_fill_depth(db, p.author(), fill_id, f); });
  refused([&](Connection& db) { delete_fill_depth(db, fill_id); });
  CHECK(p.db().query_int("SELECT rings FROM ring_count") == 4);
  CHECK(count(p, "fill_depth") == 1);
  CHECK(p.undo_label() == "issue");
}
