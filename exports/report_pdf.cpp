#include "exports/report_pdf.hpp"

#include <cstdio>

#include "exports/report_pdf_drawings.hpp"
#include "exports/report_pdf_layout.hpp"
#include "exports/ring_thickness_estimate.hpp"
#include "geometry/analysis/derived.hpp"

namespace soffit {

namespace {

using storage::ExportDefect;
using storage::InspectionExportData;

std::string fixed(double v, int decimals) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, v);
  return buf;
}

std::string optional_fixed(const std::optional<double>& v, int decimals, const char* unit = "") {
  return v ? fixed(*v, decimals) + unit : "—";
}

size_t key_index(const char* key) {
  const auto& keys = geometry_quantity_keys();
  for (size_t k = 0; k < keys.size(); ++k)
    if (keys[k] == key) return k;
  return keys.size();
}

std::string location_text(const storage::StructureFields& s) {
  if (!s.latitude_deg || !s.longitude_deg) return "not recorded";
  std::string t = fixed(*s.latitude_deg, 5) + "°, " + fixed(*s.longitude_deg, 5) + "° (WGS84)";
  if (s.location_fictitious) t += " — fictitious location (demonstration data)";
  return t;
}

void title_block(ReportPages& pages, const InspectionExportData& d) {
  pages.heading("Masonry arch bridge — inspection survey report", 15);
  pages.heading(d.structure.fields.ref + "  " + d.structure.fields.name, 11);
  std::string status = d.inspection.status + ", revision " + std::to_string(d.inspection.revision);
  if (!d.inspection.revision_reason.empty()) status += " (" + d.inspection.revision_reason + ")";
  std::string instruments;
  for (const storage::Instrument& i : d.inspection.details.instruments)
    instruments += (instruments.empty() ? "" : "; ") + i.name +
                   (i.precision_mm ? " (±" + fixed(*i.precision_mm, 1) + " mm)" : std::string());
  pages.facts({{"Structure reference", d.structure.fields.ref},
               {"Name", d.structure.fields.name},
               {"Location", location_text(d.structure.fields)},
               {"Carries / crosses", d.structure.fields.carries + " / " + d.structure.fields.crosses},
               {"Inspection date", d.inspection.date},
               {"Kind of inspection", d.inspection.details.kind},
               {"Inspector", d.inspection.details.inspector},
               {"Status", status},
               {"Weather", d.inspection.details.weather +
                               (d.inspection.details.air_temperature_c
                                    ? ", air " + fixed(*d.inspection.details.air_temperature_c, 1) + " °C"
                                    : std::string())},
               {"Instruments", instruments},
               {"Parts not inspected", d.inspection.details.parts_not_inspected},
               {"Project file", d.project_file_name}});
  pages.caution_box(kReportCautionTitle, kReportCaution);
}

void fit_table(ReportPages& pages, const AnalysedSection& s) {
  const ShapeFit& fit = *s.analysis.fit;
  const Uncertainty& u = s.analysis.uncertainty;
  pages.paragraph("Fitted shape: " + std::string(fit.family->name()) + "; rms residual " +
                      fixed(fit.rms_m * 1000.0, 1) + " mm over " + std::to_string(fit.n_used) +
                      " readings; ranges by " + u.method +
                      (u.widened ? " (widened: scatter exceeds the stated σ)" : "") + ".",
                  8);
  struct Row {
    const char* label;
    const char* key;
    const char* unit;
    double factor;
    int decimals;
  };
  const Row rows[] = {{"span L", "span_m", "m", 1.0, 3},          {"rise r_c", "rise_m", "m", 1.0, 3},
                      {"quarter rise r_q", "rise_quarter_m", "m", 1.0, 3},
                      {"r_q / r_c", "rq_rc_ratio", "", 1.0, 4},   {"radius at crown", "radius_crown_m", "m", 1.0, 3},
                      {"radius at quarter", "radius_quarter_m", "m", 1.0, 3},
                      {"arc length", "arc_length_m", "m", 1.0, 3}};
  std::vector<std::vector<std::string>> body;
  for (const Row& r : rows) {
    const size_t k = key_index(r.key);
    if (k >= u.geometry.size()) continue;
    const Estimate& e = u.geometry[k];
    body.push_back({r.label, r.unit, fixed(e.value, r.decimals), fixed(e.sd, r.decimals),
                    fixed(e.lo, r.decimals) + " … " + fixed(e.hi, r.decimals)});
  }
  pages.table({{"quantity", 150}, {"unit", 40}, {"value", 80, true}, {"sd", 70, true}, {"95% range", 150, true}},
              body);
}

void ring_table(ReportPages& pages, const SpanGeometry& span) {
  pages.heading("Ring counts", 9.5);
  if (span.ring_counts.empty()) {
    pages.paragraph("No ring count recorded for this span: the ring thickness is unknown.", 8);
    return;
  }
  std::vector<std::vector<std::string>> body;
  auto range = [](const std::optional<ThicknessRange>& r) {
    if (!r) return std::string("—");
    std::string t = fixed(r->value_mm, 0);
    if (r->lower_mm && r->upper_mm) t += " (" + fixed(*r->lower_mm, 0) + " … " + fixed(*r->upper_mm, 0) + ")";
    return t;
  };
  for (const storage::RingCountFields* c : span.ring_counts) {
    const RingThicknessEstimate est = ring_thickness_estimate(*c, span.source->details);
    body.push_back({c->face, c->position, std::to_string(c->rings), optional_fixed(est.unit_depth_mm, 0),
                    range(est.from_counts), range(est.measured), c->confidence.empty() ? "—" : c->confidence});
  }
  pages.table({{"face", 45},
               {"position", 85},
               {"rings", 40, true},
               {"unit mm", 50, true},
               {"d from count mm (range)", 115, true},
               {"d measured mm (range)", 110, true},
               {"confidence", 65}},
              body);
}

void fill_table(ReportPages& pages, const SpanGeometry& span) {
  pages.heading("Fill depth (road surface to extrados)", 9.5);
  if (span.fill_depths.empty()) {
    pages.paragraph("No fill depth recorded for this span.", 8);
    return;
  }
  std::vector<std::vector<std::string>> body;
  for (const storage::FillDepthFields* f : span.fill_depths)
    body.push_back({fixed(f->chainage_m, 2), optional_fixed(f->offset_y_m, 2), f->method, fixed(f->depth_m, 3),
                    optional_fixed(f->uncertainty_m, 3), optional_fixed(f->surfacing_m, 3), f->notes});
  pages.table({{"x m", 45, true},
               {"y m", 45, true},
               {"method", 60},
               {"depth m", 55, true},
               {"± m", 45, true},
               {"surfacing m", 60, true},
               {"notes", 160}},
              body);
}

std::string defect_location(const storage::DefectFields& f) {
  if (f.points.empty()) return "—";
  const auto [a, b] = f.points.front();
  const char* names = f.frame == storage::DefectFrame::soffit ? "s %.2f, y %.2f" : "x %.2f, z %.2f (elev.)";
  char buf[96];
  std::snprintf(buf, sizeof buf, names, a, b);
  return buf;
}

void defects_section(ReportPages& pages, const ReportPdfInput& in, const SpanGeometry* span,
                     const std::string& span_label) {
  const InspectionExportData& d = *in.data;
  std::vector<const ExportDefect*> here;
  std::vector<size_t> indices;
  for (size_t k = 0; k < d.defects.size(); ++k)
    if (d.defects[k].span_label == span_label) {
      here.push_back(&d.defects[k]);
      indices.push_back(k);
    }
  pages.heading(span_label.empty() ? "Defects not on a span" : "Defects", 9.5);
  if (here.empty()) {
    pages.paragraph("No defect recorded.", 8);
    return;
  }
  std::vector<std::vector<std::string>> body;
  for (const ExportDefect* e : here) {
    const storage::DefectFields& f = e->fields;
    body.push_back({f.ref, f.defect_type, f.element, defect_location(f), optional_fixed(f.length_m, 2),
                    optional_fixed(f.width_mm, 1),
                    f.severity ? std::to_string(*f.severity) + " (" + f.severity_scale + ")" : "—"});
  }
  pages.table({{"ref", 35},
               {"type", 95},
               {"element", 80},
               {"location m", 95},
               {"length m", 50, true},
               {"width mm", 50, true},
               {"severity", 106}},
              body);

  if (span) {
    pages.paragraph("Unrolled soffit: s along the intrados from the springing, y across the barrel from the "
                    "reference face (" + (here.front()->fields.frame_origin.empty() ? std::string("as recorded")
                                                                                    : here.front()->fields.frame_origin) +
                        ").",
                    7.5);
    std::optional<double> arc;
    if (span->reference_section) {
      const AnalysedSection& ref = in.geometry->sections[*span->reference_section];
      const size_t k = key_index("arc_length_m");
      if (ref.analysis.ok() && k < ref.analysis.uncertainty.geometry.size())
        arc = ref.analysis.uncertainty.geometry[k].value;
    }
    pages.need(150);
    draw_unrolled_soffit(pages.cr(), {pages.left(), pages.y(), pages.width(), 140}, arc,
                         span->source->details.barrel_width_m, here);
    pages.advance(148);
  }

  constexpr double side = 96, gap = 10, caption_h = 22;
  const int per_row = static_cast<int>((pages.width() + gap) / (side + gap));
  int column = 0;
  for (size_t i = 0; i < here.size(); ++i) {
    if (indices[i] >= in.thumbnails.size()) continue;
    for (const storage::DefectThumbnail& t : in.thumbnails[indices[i]]) {
      if (column == 0) pages.need(side + caption_h);
      const double x = pages.left() + column * (side + gap);
      draw_png_thumbnail(pages.cr(), x, pages.y(), side, t.png_bytes);
      cairo_set_source_rgb(pages.cr(), 0, 0, 0);
      report_font(pages.cr(), 6.5, true);
      report_text(pages.cr(), x, pages.y() + side + 8, here[i]->fields.ref);
      report_font(pages.cr(), 5.5);
      std::string caption = t.caption.substr(0, 30) + (t.caption.size() > 30 ? "…" : "");
      report_text(pages.cr(), x, pages.y() + side + 16, caption);
      if (++column == per_row) {
        column = 0;
        pages.advance(side + caption_h);
      }
    }
  }
  if (column != 0) pages.advance(side + caption_h);
}

void span_pages(ReportPages& pages, const ReportPdfInput& in, const SpanGeometry& span) {
  const storage::ExportSpan& sp = *span.source;
  pages.new_page();
  pages.heading("Span " + sp.record.label, 13);
  pages.facts({{"Nominal shape", sp.details.nominal_shape},
               {"Barrel width", optional_fixed(sp.details.barrel_width_m, 2, " m")},
               {"Skew", optional_fixed(sp.details.skew_deg, 1, "°")},
               {"Ring material", sp.details.ring_material},
               {"Unit depth / joint", optional_fixed(sp.details.unit_depth_mm, 0, " mm") + " / " +
                                          optional_fixed(sp.details.joint_thickness_mm, 0, " mm")},
               {"Ring d (counts, crown)", optional_fixed(span.ring_from_counts_mm, 0, " mm")},
               {"Fill material", sp.details.fill_material}});
  for (const AnalysedSection& s : in.geometry->sections) {
    if (s.source->record.span_label != sp.record.label) continue;
    const storage::SectionRecord& r = s.source->record;
    pages.need(330);  // the plot and its fit table on one page
    pages.heading("Section " + r.label + (r.position_m ? " at " + fixed(*r.position_m, 2) + " m" : std::string()) +
                      (r.method.empty() ? std::string() : ", " + r.method),
                  10);
    if (!s.analysis.ok()) {
      pages.paragraph("No arch could be fitted: " + s.analysis.error, 8);
      continue;
    }
    std::optional<double> ring;
    if (span.ring_from_counts_mm) ring = *span.ring_from_counts_mm / 1000.0;
    draw_section_elevation(pages.cr(), {pages.left(), pages.y() + 2, pages.width(), 150}, s.sheet, s.analysis, ring);
    pages.advance(158);
    fit_table(pages, s);
  }
  ring_table(pages, span);
  fill_table(pages, span);
  defects_section(pages, in, &span, sp.record.label);
}

std::string render(const ReportPdfInput& in, int total_pages, int& pages_used) {
  const InspectionExportData& d = *in.data;
  ReportPages pages(in.program + "  ·  " + d.structure.fields.ref + " " + d.inspection.date + " rev " +
                        std::to_string(d.inspection.revision) + "  ·  inputs SHA-256 " + d.inputs_sha256,
                    total_pages, d.inspection.date, in.program);
  title_block(pages, d);
  pages.heading("Contents of this report", 10);
  pages.paragraph(std::to_string(d.spans.size()) + " span(s), " + std::to_string(d.sections.size()) +
                      " surveyed section(s), " + std::to_string(d.ring_counts.size()) + " ring count(s), " +
                      std::to_string(d.fill_depths.size()) + " fill observation(s), " +
                      std::to_string(d.defects.size()) + " defect(s).",
                  8.5);
  if (!in.geometry->warnings.empty()) {
    pages.heading("Left out, and why", 10);
    for (const std::string& w : in.geometry->warnings) pages.paragraph("• " + w, 7.5, 6);
  }
  pages.heading("Provenance", 10);
  pages.facts({{"Program", in.program},
               {"Inputs SHA-256", d.inputs_sha256},
               {"Ranges", "95% intervals by Monte Carlo propagation of the reading σ (JCGM 101:2008)"}});
  for (const SpanGeometry& span : in.geometry->spans) span_pages(pages, in, span);
  bool off_span = false;
  for (const ExportDefect& e : d.defects) off_span = off_span || e.span_label.empty();
  if (off_span) defects_section(pages, in, nullptr, "");
  pages_used = pages.page_count();
  return pages.finish();
}

}  // namespace

std::string report_pdf(const ReportPdfInput& input) {
  // Two passes: the first only counts pages, so that every footer can say "of N".
  int pages = 0;
  render(input, 0, pages);
  int again = 0;
  return render(input, pages, again);
}

}  // namespace soffit
