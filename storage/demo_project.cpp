#include "storage/demo_project.hpp"
#include "storage/undo_journal.hpp"

#include <filesystem>

#include "geometry/sheet/sheet_reader.hpp"
#include "storage/demo_photo_painter.hpp"
#include "storage/observation_edits.hpp"
#include "storage/photo_store.hpp"
#include "storage/project_file.hpp"
#include "storage/register_edits.hpp"
#include "storage/row_stamp.hpp"
#include "storage/sheet_import.hpp"

namespace soffit::storage {
namespace {

namespace fs = std::filesystem;

constexpr const char* kRef = "BVDC-ST-0417";
constexpr const char* kVisit2019 = "2019-05-14";
constexpr const char* kVisit2025 = "2025-05-21";

// FIELD.md §10 "Rings (face counts)": thickness in mm at W springing, crown, E springing.
struct FaceRings {
  int span;
  const char* face;
  double mm[3];
  const char* notes;
};
const FaceRings kRings[] = {
    {1, "US", {470, 462, 468}, "independent rowlock rings"},
    {1, "DS", {466, 458, 465}, "independent rowlock rings"},
    {2, "US", {458, 455, 460}, "independent rowlock rings"},
    {2, "DS", {463, 457, 462}, "headers tie rings 2 and 3 at intervals"},
};

// FIELD.md §10.4. Soffit positions: s from the span's W springing along the
// intrados, y from the US face. Pictures: coordinates 0–1 across and down.
struct DemoDefect {
  const char* ref;
  int year;
  int span;  // 0: not on a span
  const char* type;
  const char* element;
  DefectFrame frame;
  const char* origin;
  DefectGeometry geometry;
  std::vector<std::pair<double, double>> points;
  std::optional<double> length_m, width_mm, area_m2;
  int severity;  // soffit-1-5, invented for the demo
  const char* notes;
  DemoMark mark;
  std::vector<std::pair<double, double>> crack;  // picture polyline
  double patch[4];                               // picture patch: cx, cy, rx, ry
};

constexpr const char* kS1 = "S1 W springing; US face";
constexpr const char* kS2 = "S2 W springing; US face";
constexpr const char* kD03 = "S1 DS spandrel elevation: x from the W abutment face, z above the springing";
constexpr const char* kD07 = "S2 US spandrel elevation: x from the S2 W springing, z above the springing";
constexpr const char* kD08 = "pier upstream nose: x across the nose from its point, z from the footing top";
constexpr const char* kD09 = "S2 US parapet elevation: x from the S2 W springing, z above the road";

const std::vector<DemoDefect>& demo_defects() {
  using G = DefectGeometry;
  using F = DefectFrame;
  static const std::vector<DemoDefect> d = {
      {"D01", 2019, 1, "longitudinal_crack", "S1 barrel", F::soffit, kS1, G::line, {{1.80, 4.55}, {3.90, 4.55}},
       2.10, 0.5, {}, 3, "max 0.5 mm at s 3.0 (card); studs M1 fitted across it at s 3.00: 48.62 mm at 11 C",
       DemoMark::crack, {{0.05, 0.48}, {0.45, 0.52}, {0.80, 0.47}}, {}},
      {"D01", 2025, 1, "longitudinal_crack", "S1 barrel", F::soffit, kS1, G::line, {{1.30, 4.55}, {4.70, 4.55}},
       3.40, 1.2, {}, 4,
       "max 1.2 mm at s 3.1; studs M1: 49.31 mm at 8 C (2019 48.62, 2021 48.80, 2023 49.02): +0.69 mm, a steady trend",
       DemoMark::crack, {{0.0, 0.46}, {0.35, 0.53}, {0.70, 0.47}, {1.0, 0.52}}, {}},
      {"D02", 2019, 1, "ring_separation", "S1 DS face, rings 1 and 2", F::soffit, kS1, G::line,
       {{2.20, 5.20}, {3.40, 5.20}}, 1.20, 2, 0.6, 3, "gap up to 2 mm; hollow when tapped over 1.2 x 0.5 m",
       DemoMark::crack, {{0.15, 0.72}, {0.85, 0.70}}, {}},
      {"D02", 2025, 1, "ring_separation", "S1 DS face, rings 1 and 2", F::soffit, kS1, G::line,
       {{1.90, 5.20}, {3.90, 5.20}}, 2.00, 3, 1.6, 4, "gap up to 3 mm; hollow when tapped over 2.0 x 0.8 m",
       DemoMark::crack, {{0.02, 0.71}, {0.98, 0.69}}, {}},
      {"D03", 2019, 1, "spandrel_bulge", "S1 DS spandrel wall", F::elevation, kD03, G::point, {{3.2, 1.0}}, {}, {}, {},
       3, "18 mm outward from a line (u 2 mm)", DemoMark::patch, {}, {0.5, 0.5, 0.30, 0.22}},
      {"D03", 2025, 1, "spandrel_bulge", "S1 DS spandrel wall", F::elevation, kD03, G::point, {{3.2, 1.0}}, {}, {}, {},
       4, "27 mm outward from a line (u 2 mm); 2021: 21, 2023: 24", DemoMark::patch, {}, {0.5, 0.5, 0.36, 0.26}},
      {"D04", 2019, 2, "transverse_crack", "S2 barrel", F::soffit, kS2, G::line, {{3.55, 1.2}, {3.55, 3.0}}, 1.80,
       0.3, {}, 2, "follows the joints; 0.3 mm at 12 C (card)", DemoMark::crack, {{0.50, 0.08}, {0.47, 0.90}}, {}},
      {"D04", 2025, 2, "transverse_crack", "S2 barrel", F::soffit, kS2, G::line, {{3.55, 1.1}, {3.55, 3.0}}, 1.90,
       0.4, {}, 2, "follows the joints; 0.4 mm at 7 C (card, +-0.1 mm): no real change on a cooler day",
       DemoMark::crack, {{0.50, 0.04}, {0.47, 0.92}}, {}},
      {"D05", 2025, 2, "missing_unit", "S2 barrel, ring 1", F::soffit, kS2, G::point, {{0.55, 3.40}}, {}, {}, {}, 3,
       "new: 230 x 68 mm opening, 110 mm deep; adjacent brick loose", DemoMark::missing, {}, {0.5, 0.45, 0, 0}},
      {"D06", 2019, 1, "seepage", "S1 soffit along D01", F::soffit, kS1, G::area,
       {{1.80, 4.30}, {3.90, 4.30}, {3.90, 4.80}, {1.80, 4.80}}, {}, {}, 1.05, 2, "light efflorescence, damp",
       DemoMark::patch, {}, {0.45, 0.50, 0.25, 0.12}},
      {"D06", 2025, 1, "seepage", "S1 soffit along D01", F::soffit, kS1, G::area,
       {{1.30, 4.15}, {4.70, 4.15}, {4.70, 4.95}, {1.30, 4.95}}, {}, {}, 2.72, 3,
       "active drip after rain, calcite up to 15 mm, stained band 0.8 m wide", DemoMark::patch, {},
       {0.5, 0.5, 0.45, 0.22}},
      {"D07", 2019, 2, "vegetation", "S2 US spandrel wall", F::elevation, kD07, G::area,
       {{0.2, 1.6}, {5.9, 1.6}, {5.9, 2.3}, {0.2, 2.3}}, {}, {}, {}, 2, "ivy over 40 % of the wall", DemoMark::patch,
       {}, {0.4, 0.4, 0.4, 0.35}},
      {"D07", 2025, 2, "mortar_loss", "S2 US spandrel wall", F::elevation, kD07, G::area,
       {{0.5, 1.6}, {3.0, 1.6}, {3.0, 2.2}, {0.5, 2.2}}, {}, {}, 1.5, 3,
       "ivy removed 2022; mortar lost up to 40 mm deep over 1.5 m2", DemoMark::patch, {}, {0.5, 0.5, 0.35, 0.3}},
      {"D08", 2019, 0, "scour", "pier, upstream nose", F::elevation, kD08, G::point, {{0.0, 0.05}}, {}, {}, {}, 2,
       "footing top 0.05 m above the bed; beck 0.15 m deep", DemoMark::patch, {}, {0.5, 0.8, 0.2, 0.08}},
      {"D08", 2025, 0, "scour", "pier, upstream nose", F::elevation, kD08, G::area,
       {{-0.45, -0.25}, {0.45, -0.25}, {0.45, 0.0}, {-0.45, 0.0}}, {}, {}, 0.54, 4,
       "hole 0.9 x 0.6 m, 0.25 m below the adjacent bed; footing exposed 0.20 m; no undermining (bar probe 0.3 m)",
       DemoMark::patch, {}, {0.5, 0.75, 0.35, 0.18}},
      {"D09", 2025, 2, "impact_damage", "S2 US parapet", F::elevation, kD09, G::line, {{2.4, 0.6}, {3.6, 0.6}}, 1.2, {},
       {}, 3, "coping displaced 15 mm outward, bed joint cracked, scrape marks at 0.6 m", DemoMark::crack,
       {{0.1, 0.3}, {0.9, 0.32}}, {}},
      {"D10", 2019, 1, "previous_repair", "S1 soffit", F::soffit, kS1, G::area,
       {{5.0, 1.0}, {6.0, 1.0}, {6.0, 2.0}, {5.0, 2.0}}, {}, {}, 1.0, 1,
       "cement repointing (2012) sound; extent invented for the demo", DemoMark::patch, {}, {0.5, 0.5, 0.2, 0.2}},
      {"D10", 2025, 1, "previous_repair", "S1 soffit", F::soffit, kS1, G::area,
       {{5.0, 1.0}, {6.0, 1.0}, {6.0, 2.0}, {5.0, 2.0}}, {}, {}, 1.0, 2, "cement repointing (2012) debonding at edges",
       DemoMark::patch, {}, {0.5, 0.5, 0.24, 0.22}},
  };
  return d;
}

std::string sheet_file(const std::string& dir, int span, const char* section, int year) {
  return dir + "/sallow-ford_S" + std::to_string(span) + "-" + section + "_" + std::to_string(year) + ".csv";
}

SpanDetails span_details(int span) {
  SpanDetails s;  // FIELD.md §10 table
  s.nominal_shape = "segmental";
  s.barrel_width_m = 5.20;
  s.skew_deg = 5;
  s.ring_material = "brick";
  s.unit_depth_mm = 110;     // header face of a 230 x 110 x 68 mm brick, rowlock rings
  s.joint_thickness_mm = 10;  // lime mortar 8–12 mm
  s.fill_material = "clayey sandy gravel with brick fragments";
  s.surfacing_depth_m = 0.110;
  s.spandrel_walls = {{"US", false, 0.45, std::nullopt, 0.0}, {"DS", false, 0.45, std::nullopt, 5.20}};
  if (span == 1)
    s.supports = {{"W abutment", "abutment", std::nullopt, std::nullopt, std::nullopt, "sandstone"},
                  {"pier", "pier", 1.20, std::nullopt, std::nullopt,
                   "sandstone, x 6.40–7.60 at springing level; US cutwater pointed (0.9 m), DS rounded; footing top RL 8.35"}};
  else
    s.supports = {{"E abutment", "abutment", std::nullopt, std::nullopt, std::nullopt, "sandstone"}};
  s.notes = span == 1 ? "span 6.395 m by tape (2019); springing RLs W 9.502, E 9.498"
                      : "span 6.100 m by tape (2019); springing RLs W 9.497, E 9.503";
  return s;
}

InspectionDetails visit_details(int year) {
  InspectionDetails d;  // FIELD.md §10.1
  d.kind = "principal";
  d.inspector = "J. Okafor (assistant M. Lindqvist)";
  d.instruments = {{"laser level and offset staff", 3.0}, {"level and inverted staff", 1.0},
                   {"tape", 5.0}, {"crack width card", 0.1}, {"calliper across studs", 0.05}};
  if (year == 2019) {
    d.weather = "overcast, dry; soffit 11 C";
    d.air_temperature_c = 13;
    d.notes = "PI-2019, 08:50–15:10. Beck 0.15 m deep at the pier. Stop/go 09:30–12:30. "
              "TBM1 - TBM2 = 0.3127 m. Trial pit over the S1 crown, DS verge.";
  } else {
    d.weather = "light rain; soffit 8 C";
    d.air_temperature_c = 9;
    d.parts_not_inspected = "S2 soffit within 0.5 m of the E springing at the US end (flood debris): partly inspected";
    d.notes = "PI-2025, 08:40–14:55. Beck 0.30 m deep at the pier. Stop/go 09:00–11:30. TBM1 - TBM2 = 0.3131 m: "
              "stable. Since 2019: ivy removed from the S2 US spandrel (2022); Ferny Lane resurfaced (2023, 40 mm "
              "inlay plus 10 mm regulating course; road +9 mm).";
  }
  return d;
}

// Draws the defect's picture into `folder` and returns its path.
std::string draw_picture(const DemoDefect& d, const std::string& folder, uint32_t seed) {
  DemoPicture pic;
  pic.seed = seed;
  pic.mark = d.mark;
  pic.path = d.crack;
  pic.crack_width_px = 1.5 + d.width_mm.value_or(0.5) * 3;
  pic.patch_cx = d.patch[0];
  pic.patch_cy = d.patch[1];
  pic.patch_rx = d.patch[2];
  pic.patch_ry = d.patch[3];
  const std::string path = folder + "/P" + std::to_string(d.year % 100) + "-" + d.ref + ".jpg";
  write_demo_jpeg(path, paint_demo_picture(pic));
  return path;
}

PhotoMarker marker_of(const DemoDefect& d) {
  if (d.mark == DemoMark::crack && !d.crack.empty()) {
    const auto& mid = d.crack[d.crack.size() / 2];
    return {mid.first, mid.second};
  }
  return {d.patch[0], d.patch[1]};
}

}  // namespace

DemoSummary write_demo_project(const std::string& path, const std::string& sheets_dir, const std::string& author) {
  DemoSummary sum;
  // Read every sheet first: a missing asset refuses before any file is made.
  struct Section {
    int span, year;
    const char* label;
    SurveySheet sheet;
  };
  std::vector<Section> sections;
  for (const int year : {2019, 2025})
    for (const auto& [span, label] : {std::pair{1, "MW"}, {1, "US"}, {1, "DS"}, {2, "MW"}})
      sections.push_back({span, year, label, read_sheet_file(sheet_file(sheets_dir, span, label, year), {})});

  Project p = Project::create(path, author);
  std::string structure_id, span_ids[3], visit[2];
  p.edit("demo: Sallow Ford Bridge", [&](Connection& db) {
    StructureFields f;
    f.ref = kRef;
    f.name = "Sallow Ford Bridge";
    f.latitude_deg = 0.0;  // the placeholder of FIELD.md §10, flagged fictitious
    f.longitude_deg = 0.0;
    f.location_fictitious = true;
    f.carries = "Ferny Lane (unclassified)";
    f.crosses = "Sallow Beck";
    f.span_count = 2;
    f.notes = "INVENTED DEMONSTRATION DATA: nothing here is real. c. 1840; two brick segmental spans on sandstone "
              "abutments and pier, near Upper Brackwood. Owner: Brackwood Vale District Council, Highways & "
              "Structures. Datum TBM1 (nail in the pier's N cutwater), RL 10.000 assumed.";
    structure_id = insert_structure(db, author, f);
    for (int s = 1; s <= 2; ++s) {
      span_ids[s] = ensure_span(db, author, structure_id, s);
      update_span_details(db, author, span_ids[s], span_details(s));
    }
    visit[0] = ensure_inspection(db, author, structure_id, kVisit2019);
    visit[1] = ensure_inspection(db, author, structure_id, kVisit2025);
    update_inspection_details(db, author, visit[0], visit_details(2019));
    update_inspection_details(db, author, visit[1], visit_details(2025));
  });

  for (const auto& s : sections) {
    const auto r = import_sheet(p, s.sheet, {kRef, s.span, s.year == 2019 ? kVisit2019 : kVisit2025, s.label});
    ++sum.sections;
    sum.readings += r.reading_count;
  }

  p.edit("demo: ring counts and fill depths", [&](Connection& db) {
    for (int v = 0; v < 2; ++v) {
      for (const auto& face : kRings) {
        const char* positions[3] = {"W springing", "crown", "E springing"};
        for (int k = 0; k < 3; ++k) {
          RingCountFields r;
          r.inspection_id = visit[v];
          r.span_id = span_ids[face.span];
          r.face = face.face;
          r.position = positions[k];
          r.rings = 4;
          r.unit_depth_mm = 110;
          r.thickness_mm = face.mm[k];
          r.thickness_lower_mm = 350;  // FIELD.md §10.3: d 0.35–0.58 m
          r.thickness_upper_mm = 580;
          r.confidence = "medium";
          r.basis = v == 0 ? "face count; trial pit over the S1 crown" : "face count; 2019 trial pit";
          r.notes = face.notes;
          add_ring_count(db, author, r);
          ++sum.ring_counts;
        }
      }
      FillDepthFields h;  // FIELD.md §10.3: h = (d + h) − d at the transverse quarter points
      h.inspection_id = visit[v];
      h.span_id = span_ids[1];
      h.chainage_m = 3.2;
      h.offset_y_m = 2.60;
      h.method = "estimate";
      h.depth_m = v == 0 ? 0.466 : 0.480;
      h.uncertainty_m = 0.115;  // the d/h split carries the ring uncertainty (FIELD.md §5)
      h.surfacing_m = v == 0 ? 0.110 : 0.120;
      h.notes = v == 0 ? "(d + h) = 0.931 m (u 5 mm) minus d 0.465 m (0.35–0.58)"
                       : "(d + h) = 0.945 m (u 5 mm) minus d 0.465 m (0.35–0.58); surfacing from the 2023 record";
      add_fill_depth(db, author, h);
      ++sum.fill_depths;
    }
    FillDepthFields pit;  // FIELD.md §10: the 2019 trial pit
    pit.inspection_id = visit[0];
    pit.span_id = span_ids[1];
    pit.chainage_m = 3.2;
    pit.offset_y_m = 4.60;
    pit.method = "trial_pit";
    pit.depth_m = 0.455;
    pit.uncertainty_m = 0.005;
    pit.surfacing_m = 0.110;
    pit.notes = "DS verge, y 4.45–4.75: 110 mm bituminous surfacing over 345 mm clayey sandy gravel with brick "
                "fragments; brick extrados RL 11.555; no waterproofing";
    add_fill_depth(db, author, pit);
    ++sum.fill_depths;
  });

  const fs::path scratch = fs::temp_directory_path() / ("soffit-demo-" + new_uuid());
  fs::create_directories(scratch);
  try {
    uint32_t seed = 417;
    int number = 11;
    for (const auto& d : demo_defects()) {
      const std::string visit_id = visit[d.year == 2019 ? 0 : 1];
      std::string defect_id;
      p.edit(std::string("demo: ") + d.ref + " " + std::to_string(d.year), [&](Connection& db) {
        DefectFields f;
        f.inspection_id = visit_id;
        f.span_id = d.span ? span_ids[d.span] : "";
        f.ref = d.ref;
        f.defect_type = d.type;
        f.element = d.element;
        f.frame = d.frame;
        f.frame_origin = d.origin;
        f.geometry = d.geometry;
        f.points = d.points;
        f.length_m = d.length_m;
        f.width_mm = d.width_mm;
        f.area_m2 = d.area_m2;
        f.severity = d.severity;
        f.notes = d.notes;
        defect_id = add_defect(db, author, f);
      });
      const std::string picture = draw_picture(d, scratch.string(), seed++);
      const std::string caption = "P" + std::to_string(d.year % 100) + "-0" + std::to_string(number++) + " " + d.ref +
                                  (d.frame == DefectFrame::soffit ? ", looking up, top = DS face" : ", looking N") +
                                  " (drawn for the demo, not a photograph)";
      const PhotoRecord photo = add_photo(p, picture, {visit_id, caption});
      p.edit(std::string("demo: mark ") + d.ref, [&](Connection& db) {
        link_photo_to_defect(db, author, photo.id, defect_id, marker_of(d));
      });
      ++sum.defects;
      ++sum.photos;
    }
  } catch (...) {
    fs::remove_all(scratch);
    throw;
  }
  fs::remove_all(scratch);

  p.edit("demo: check 2019", [&](Connection& db) { set_inspection_status(db, author, visit[0], "checked"); });
  p.edit("demo: issue 2019", [&](Connection& db) { set_inspection_status(db, author, visit[0], "issued"); });
  // The demo is where a new inspector starts: Undo must not take it apart.
  forget_edit_history(p.db());
  return sum;
}

}  // namespace soffit::storage
