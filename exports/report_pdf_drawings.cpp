#include "exports/report_pdf_drawings.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "exports/report_pdf_layout.hpp"
#include "exports/section_ring_fill.hpp"
#include "geometry/shapes/outline.hpp"

namespace soffit {

namespace {

struct Extent {
  double min_x = std::numeric_limits<double>::infinity(), max_x = -min_x;
  double min_y = min_x, max_y = -min_x;
  void add(double x, double y) {
    min_x = std::min(min_x, x), max_x = std::max(max_x, x);
    min_y = std::min(min_y, y), max_y = std::max(max_y, y);
  }
  bool empty() const { return !(max_x >= min_x); }
};

// Maps model metres into a box with one scale for both axes (z up on paper).
struct ModelToPaper {
  double scale = 1.0, x0 = 0.0, z0 = 0.0, left = 0.0, bottom = 0.0;
  double px(double x) const { return left + (x - x0) * scale; }
  double py(double z) const { return bottom - (z - z0) * scale; }
};

ModelToPaper fit_into(const Extent& e, const ReportBox& box, double pad) {
  ModelToPaper m;
  const double w = std::max(e.max_x - e.min_x, 1e-3), h = std::max(e.max_y - e.min_y, 1e-3);
  m.scale = std::min((box.width - 2 * pad) / w, (box.height - 2 * pad) / h);
  m.x0 = e.min_x;
  m.z0 = e.min_y;
  m.left = box.x + pad + (box.width - 2 * pad - w * m.scale) / 2;
  m.bottom = box.y + box.height - pad - (box.height - 2 * pad - h * m.scale) / 2;
  return m;
}

void frame(cairo_t* cr, const ReportBox& box) {
  cairo_rectangle(cr, box.x, box.y, box.width, box.height);
  cairo_set_source_rgb(cr, 0.98, 0.98, 0.99);
  cairo_fill_preserve(cr);
  cairo_set_source_rgb(cr, 0.6, 0.6, 0.6);
  cairo_set_line_width(cr, 0.5);
  cairo_stroke(cr);
}

void polyline(cairo_t* cr, const ModelToPaper& m, const std::vector<Point2>& pts) {
  for (size_t i = 0; i < pts.size(); ++i) {
    if (i == 0) cairo_move_to(cr, m.px(pts[i].x), m.py(pts[i].z));
    else cairo_line_to(cr, m.px(pts[i].x), m.py(pts[i].z));
  }
}

// A bar of a round length in metres, at the lower left of the box.
void scale_bar(cairo_t* cr, const ReportBox& box, double scale_pt_per_m) {
  double metres = 1.0;
  for (double candidate : {0.1, 0.2, 0.5, 1.0, 2.0, 5.0, 10.0})
    if (candidate * scale_pt_per_m <= box.width * 0.2) metres = candidate;
  const double x = box.x + 8, y = box.y + box.height - 8, len = metres * scale_pt_per_m;
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_set_line_width(cr, 1.2);
  cairo_move_to(cr, x, y);
  cairo_line_to(cr, x + len, y);
  cairo_stroke(cr);
  report_font(cr, 6.5);
  char label[32];
  std::snprintf(label, sizeof label, "%g m", metres);
  report_text(cr, x + len + 4, y + 2, label);
}

void legend_entry(cairo_t* cr, double x, double y, double r, double g, double b, const char* text, bool dashed) {
  cairo_set_source_rgb(cr, r, g, b);
  cairo_set_line_width(cr, 1.2);
  if (dashed) {
    const double dash[] = {3.0, 2.0};
    cairo_set_dash(cr, dash, 2, 0);
  }
  cairo_move_to(cr, x, y - 2.5);
  cairo_line_to(cr, x + 14, y - 2.5);
  cairo_stroke(cr);
  cairo_set_dash(cr, nullptr, 0, 0);
  cairo_set_source_rgb(cr, 0, 0, 0);
  report_font(cr, 6.5);
  report_text(cr, x + 18, y, text);
}

}  // namespace

void draw_section_elevation(cairo_t* cr, const ReportBox& box, const SurveySheet& sheet,
                            const ProfileAnalysis& analysis, const std::optional<double>& ring_thickness_m) {
  cairo_save(cr);
  frame(cr, box);
  Extent e;
  for (const Reading& r : sheet.readings) e.add(r.x, r.z);
  std::vector<Point2> intrados, extrados;
  if (analysis.ok()) {
    RingFillOptions options;
    options.ring_thickness_m = ring_thickness_m;
    if (!ring_fill_problem(*analysis.fit, options).empty()) options.ring_thickness_m.reset();
    const RingFill model = ring_fill(*analysis.fit, analysis.uncertainty, options);
    for (const IntradosStation& s : model.band.stations) intrados.push_back(s.at);
    extrados = model.extrados;
  }
  for (const Point2& p : intrados) e.add(p.x, p.z);
  for (const Point2& p : extrados) e.add(p.x, p.z);
  if (e.empty()) {
    cairo_restore(cr);
    return;
  }
  const ModelToPaper m = fit_into(e, box, 16);

  // Springing line, for the eye: the level the rise is measured from.
  if (analysis.ok()) {
    cairo_set_source_rgb(cr, 0.7, 0.7, 0.7);
    cairo_set_line_width(cr, 0.5);
    const double dash[] = {2.0, 2.0};
    cairo_set_dash(cr, dash, 2, 0);
    cairo_move_to(cr, m.px(e.min_x), m.py(analysis.fit->outline.z_springing));
    cairo_line_to(cr, m.px(e.max_x), m.py(analysis.fit->outline.z_springing));
    cairo_stroke(cr);
    cairo_set_dash(cr, nullptr, 0, 0);
  }
  if (!extrados.empty()) {
    cairo_set_source_rgb(cr, 0.55, 0.33, 0.15);
    cairo_set_line_width(cr, 1.0);
    const double dash[] = {4.0, 2.0};
    cairo_set_dash(cr, dash, 2, 0);
    polyline(cr, m, extrados);
    cairo_stroke(cr);
    cairo_set_dash(cr, nullptr, 0, 0);
  }
  if (!intrados.empty()) {
    cairo_set_source_rgb(cr, 0.80, 0.10, 0.10);
    cairo_set_line_width(cr, 1.2);
    polyline(cr, m, intrados);
    cairo_stroke(cr);
  }
  cairo_set_line_width(cr, 0.6);
  for (size_t i = 0; i < sheet.readings.size(); ++i) {
    const Reading& r = sheet.readings[i];
    const bool used = analysis.ok() && i < analysis.fit->used.size() && analysis.fit->used[i];
    cairo_new_sub_path(cr);
    cairo_arc(cr, m.px(r.x), m.py(r.z), 1.6, 0, 2 * M_PI);
    cairo_set_source_rgb(cr, 0.10, 0.25, 0.60);
    if (used) cairo_fill(cr);
    else cairo_stroke(cr);
  }
  scale_bar(cr, box, m.scale);
  const double lx = box.x + box.width - 150, ly = box.y + 12;
  legend_entry(cr, lx, ly, 0.80, 0.10, 0.10, "fitted intrados", false);
  if (!extrados.empty()) legend_entry(cr, lx, ly + 9, 0.55, 0.33, 0.15, "extrados (ring from counts)", true);
  cairo_set_source_rgb(cr, 0.10, 0.25, 0.60);
  cairo_arc(cr, lx + 7, ly + 18 - 2.5, 1.6, 0, 2 * M_PI);
  cairo_fill(cr);
  cairo_set_source_rgb(cr, 0, 0, 0);
  report_text(cr, lx + 18, ly + 18, "reading used (hollow: not used)");
  cairo_restore(cr);
}

void draw_unrolled_soffit(cairo_t* cr, const ReportBox& box, const std::optional<double>& arc_length_m,
                          const std::optional<double>& barrel_width_m,
                          const std::vector<const storage::ExportDefect*>& defects) {
  cairo_save(cr);
  frame(cr, box);
  Extent e;
  const bool outline = arc_length_m && barrel_width_m && *arc_length_m > 0 && *barrel_width_m > 0;
  if (outline) {
    e.add(0, 0);
    e.add(*arc_length_m, *barrel_width_m);
  }
  for (const storage::ExportDefect* d : defects)
    if (d->fields.frame == storage::DefectFrame::soffit)
      for (const auto& [s, y] : d->fields.points) e.add(s, y);
  if (e.empty()) {
    cairo_set_source_rgb(cr, 0.3, 0.3, 0.3);
    report_font(cr, 7.5);
    report_text(cr, box.x + box.width / 2, box.y + box.height / 2, "no defect located on the soffit", 0.5);
    cairo_restore(cr);
    return;
  }
  const ModelToPaper m = fit_into(e, box, 18);
  if (outline) {
    cairo_rectangle(cr, m.px(0), m.py(*barrel_width_m), *arc_length_m * m.scale, *barrel_width_m * m.scale);
    cairo_set_source_rgb(cr, 0.93, 0.90, 0.84);
    cairo_fill_preserve(cr);
    cairo_set_source_rgb(cr, 0.4, 0.4, 0.4);
    cairo_set_line_width(cr, 0.8);
    cairo_stroke(cr);
    // The crown: half the arc length along the intrados from either springing.
    cairo_set_source_rgb(cr, 0.6, 0.6, 0.6);
    const double dash[] = {2.0, 2.0};
    cairo_set_dash(cr, dash, 2, 0);
    cairo_move_to(cr, m.px(*arc_length_m / 2), m.py(0));
    cairo_line_to(cr, m.px(*arc_length_m / 2), m.py(*barrel_width_m));
    cairo_stroke(cr);
    cairo_set_dash(cr, nullptr, 0, 0);
    report_font(cr, 6.0);
    report_text(cr, m.px(*arc_length_m / 2), m.py(*barrel_width_m) - 3, "crown", 0.5);
    report_text(cr, m.px(0), m.py(0) + 8, "s = 0", 0.0);
    char label[64];
    std::snprintf(label, sizeof label, "s = %.2f m", *arc_length_m);
    report_text(cr, m.px(*arc_length_m), m.py(0) + 8, label, 1.0);
    std::snprintf(label, sizeof label, "y = %.2f m", *barrel_width_m);
    report_text(cr, m.px(0) - 3, m.py(*barrel_width_m) + 6, label, 1.0);
  } else {
    cairo_set_source_rgb(cr, 0.3, 0.3, 0.3);
    report_font(cr, 6.5);
    report_text(cr, box.x + 4, box.y + 9, "arc length or barrel width unknown: frame sized to the defects");
  }
  for (const storage::ExportDefect* d : defects) {
    const storage::DefectFields& f = d->fields;
    if (f.frame != storage::DefectFrame::soffit || f.points.empty()) continue;
    const bool severe = f.severity && *f.severity >= 4;
    cairo_set_source_rgb(cr, severe ? 0.85 : 0.90, severe ? 0.10 : 0.45, severe ? 0.10 : 0.05);
    cairo_set_line_width(cr, 1.4);
    if (f.geometry == storage::DefectGeometry::point || f.points.size() == 1) {
      const auto [s, y] = f.points.front();
      cairo_arc(cr, m.px(s), m.py(y), 2.5, 0, 2 * M_PI);
      cairo_fill(cr);
    } else {
      for (size_t i = 0; i < f.points.size(); ++i) {
        const auto [s, y] = f.points[i];
        if (i == 0) cairo_move_to(cr, m.px(s), m.py(y));
        else cairo_line_to(cr, m.px(s), m.py(y));
      }
      if (f.geometry == storage::DefectGeometry::area) {
        cairo_close_path(cr);
        cairo_stroke_preserve(cr);
        cairo_set_source_rgba(cr, 0.90, 0.45, 0.05, 0.25);
        cairo_fill(cr);
      } else {
        cairo_stroke(cr);
      }
    }
    cairo_set_source_rgb(cr, 0, 0, 0);
    report_font(cr, 6.5, true);
    const auto [s, y] = f.points.front();
    report_text(cr, m.px(s) + 3, m.py(y) - 3, f.ref);
  }
  cairo_restore(cr);
}

bool draw_png_thumbnail(cairo_t* cr, double x, double y, double side_pt, const std::string& png_bytes) {
  struct Reader {
    const std::string* bytes;
    size_t at = 0;
  } reader{&png_bytes};
  auto read = [](void* closure, unsigned char* data, unsigned int length) -> cairo_status_t {
    auto* r = static_cast<Reader*>(closure);
    if (r->at + length > r->bytes->size()) return CAIRO_STATUS_READ_ERROR;
    std::copy_n(r->bytes->data() + r->at, length, data);
    r->at += length;
    return CAIRO_STATUS_SUCCESS;
  };
  cairo_save(cr);
  cairo_surface_t* image = png_bytes.empty() ? nullptr : cairo_image_surface_create_from_png_stream(read, &reader);
  const bool ok = image && cairo_surface_status(image) == CAIRO_STATUS_SUCCESS &&
                  cairo_image_surface_get_width(image) > 0 && cairo_image_surface_get_height(image) > 0;
  if (ok) {
    const double w = cairo_image_surface_get_width(image), h = cairo_image_surface_get_height(image);
    const double s = side_pt / std::max(w, h);
    cairo_translate(cr, x + (side_pt - w * s) / 2, y + (side_pt - h * s) / 2);
    cairo_scale(cr, s, s);
    cairo_set_source_surface(cr, image, 0, 0);
    cairo_paint(cr);
  }
  if (image) cairo_surface_destroy(image);
  cairo_restore(cr);
  cairo_set_source_rgb(cr, 0.6, 0.6, 0.6);
  cairo_set_line_width(cr, 0.5);
  cairo_rectangle(cr, x, y, side_pt, side_pt);
  cairo_stroke(cr);
  return ok;
}

}  // namespace soffit
