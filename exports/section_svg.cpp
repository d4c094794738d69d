#include "exports/section_svg.hpp"

#include <algorithm>
#include <cmath>
#include <initializer_list>
#include <stdexcept>

#include "exports/fixed_decimal.hpp"
#include "exports/section_provenance.hpp"
#include "exports/svg_builder.hpp"
#include "geometry/analysis/derived.hpp"

namespace soffit {

namespace {

constexpr double kMargin = 14.0;            // mm of paper
constexpr double kMaxDrawingWidth = 250.0;  // fits A4 landscape with margins
constexpr double kStripHalf = 14.0;         // half-height of the departures strip, mm
constexpr double kTextSize = 2.5;
constexpr double kSmallText = 2.2;
// Average advance of DejaVu Sans, in em: enough to wrap footer lines inside the page.
constexpr double kCharWidthEm = 0.56;

const char* const kInk = R"(stroke="#222222")";
const char* const kCurve = "#1f4e8c";

struct Frame {
  double x_min = 0.0, z_max = 0.0, k = 1.0;  // k: mm of paper per m
  double left = 0.0, top = 0.0;
  PaperPoint at(Point2 p) const { return {left + (p.x - x_min) * k, top + (z_max - p.z) * k}; }
  double paper_x(double x) const { return left + (x - x_min) * k; }
};

const Estimate& geometry_estimate(const Uncertainty& u, std::string_view key) {
  const auto& keys = geometry_quantity_keys();
  const auto it = std::find(keys.begin(), keys.end(), key);
  return u.geometry[static_cast<size_t>(it - keys.begin())];
}

std::string with_range(const Estimate& e, double factor, int decimals, const char* unit) {
  return fixed_decimal(e.value * factor, decimals) + " " + unit + " (95%: " + fixed_decimal(e.lo * factor, decimals) +
         " to " + fixed_decimal(e.hi * factor, decimals) + ")";
}

// A dimension line with architects' slashes at both ends.
void dimension(SvgBuilder& svg, PaperPoint a, PaperPoint b) {
  svg.line(a, b, std::string(kInk) + R"( stroke-width="0.18")");
  for (PaperPoint p : {a, b})
    svg.line({p.x - 0.9, p.y + 0.9}, {p.x + 0.9, p.y - 0.9}, std::string(kInk) + R"( stroke-width="0.35")");
}

double nice_at_least(double value, std::initializer_list<double> steps) {
  for (double s : steps)
    if (s >= value) return s;
  return *(steps.end() - 1);
}

std::vector<PaperPoint> to_paper(const Frame& f, const std::vector<Point2>& points) {
  std::vector<PaperPoint> out;
  out.reserve(points.size());
  for (const Point2& p : points) out.push_back(f.at(p));
  return out;
}

}  // namespace

int drawing_scale_for(double width_m) {
  for (int n : {5, 10, 20, 25, 50, 100, 200, 250, 500, 1000, 2000})
    if (width_m * 1000.0 / n <= kMaxDrawingWidth) return n;
  return 5000;
}

std::string section_svg(const SurveySheet& sheet, const ProfileAnalysis& analysis, const RingFillOptions& options,
                        const std::string& program) {
  const ShapeFit& fit = *analysis.fit;
  const Uncertainty& u = analysis.uncertainty;
  if (const std::string problem = ring_fill_problem(fit, options); !problem.empty())
    throw std::invalid_argument(problem);
  const RingFill model = ring_fill(fit, u, options);
  const Readings& readings = sheet.readings;

  std::vector<Point2> intrados, band_upper, band_lower;
  for (const IntradosStation& s : model.band.stations) {
    intrados.push_back(s.at);
    band_upper.push_back(offset_point(s, s.half_width_95_m));
    band_lower.push_back(offset_point(s, -s.half_width_95_m));
  }

  // --- Extent of the model and the drawing scale ------------------------
  double x_lo = fit.outline.x_left(), x_hi = fit.outline.x_right();
  double z_lo = fit.outline.z_springing, z_hi = model.top_of_ring_z;
  for (const Point2& p : model.extrados) x_lo = std::min(x_lo, p.x), x_hi = std::max(x_hi, p.x);
  for (const Reading& r : readings) {
    x_lo = std::min(x_lo, r.x), x_hi = std::max(x_hi, r.x);
    z_lo = std::min(z_lo, r.z), z_hi = std::max(z_hi, r.z);
  }
  if (model.road_z) z_hi = std::max(z_hi, *model.road_z);
  const double pad = 0.04 * (x_hi - x_lo);
  x_lo -= pad, x_hi += pad;
  const int scale = drawing_scale_for(x_hi - x_lo);
  const double k = 1000.0 / scale;

  const double drawing_width = (x_hi - x_lo) * k;
  const double page_width = std::max(drawing_width + 2 * kMargin + 12.0, 200.0);
  Frame f{x_lo, z_hi, k, kMargin + 12.0 + (page_width - 2 * kMargin - 12.0 - drawing_width) / 2, kMargin + 22.0};
  f.z_max = z_hi + 6.0 / k;  // room for the road label
  const double elevation_bottom = f.at({0.0, z_lo}).y;
  const double span_dim_y = elevation_bottom + 7.0;
  const double strip_mid = span_dim_y + 14.0 + kStripHalf;
  const double legend_top = strip_mid + kStripHalf + 12.0;

  // Footer text, wrapped to the page.
  const SectionProvenance provenance = section_provenance(sheet, analysis, program);
  const size_t chars = static_cast<size_t>((page_width - 2 * kMargin) / (kSmallText * kCharWidthEm));
  std::vector<std::string> footer = wrap_words("Caution: " + provenance.caution, chars);
  const size_t caution_lines = footer.size();
  std::vector<std::string> notes;
  for (const DeformationZone& z : analysis.zones) notes.push_back("Departure: " + z.description);
  for (const std::string& w : u.notes) notes.push_back("Uncertainty: " + w);
  for (const std::string& w : analysis.warnings) notes.push_back("Note: " + w);
  for (const std::string& line : provenance.lines) notes.push_back(line);
  for (const std::string& note : notes)
    for (std::string& line : wrap_words(note, chars)) footer.push_back(std::move(line));
  const double footer_top = legend_top + 30.0;
  const double page_height = footer_top + 3.4 * static_cast<double>(footer.size()) + kMargin;

  const std::string title = section_title(sheet);
  SvgBuilder svg(page_width, page_height, "Elevation: " + title);

  // --- Title -------------------------------------------------------------
  // Bold glyphs are wider: the title wraps at a shorter count than body text.
  const size_t title_chars = static_cast<size_t>((page_width - 2 * kMargin) / (3.6 * kCharWidthEm * 1.15));
  const std::vector<std::string> title_lines = wrap_words("Elevation: " + title, title_chars);
  for (size_t i = 0; i < title_lines.size() && i < 2; ++i)
    svg.text({kMargin, kMargin + 1.0 + 4.4 * static_cast<double>(i)}, title_lines[i], 3.6, "start",
             R"(font-weight="bold")");
  std::string subtitle = "Section frame: x along the span (right), z up; scale 1:" + std::to_string(scale) +
                         " when printed at 100%. Fitted intrados: " + std::string(fit.family->name()) + ".";
  if (sheet.metadata.position_m && sheet.metadata.reference_face)
    subtitle += " Section " + fixed_decimal(*sheet.metadata.position_m, 3) + " m from the " +
                *sheet.metadata.reference_face + " face.";
  svg.text({kMargin, kMargin + 11.0}, subtitle, kSmallText, "start");

  // --- Fill, ring, band, intrados ----------------------------------------
  svg.open_group("elevation");
  const double z_s = fit.outline.z_springing;
  svg.line(f.at({x_lo, z_s}), f.at({x_hi, z_s}),
           R"(stroke="#777777" stroke-width="0.18" stroke-dasharray="2,1")");
  svg.text({f.at({x_lo, z_s}).x, f.at({x_lo, z_s}).y + 2.8}, "springing line", kSmallText, "start",
           R"(fill="#555555")");
  if (model.road_z) {
    const double road_from = model.extrados.empty() ? fit.outline.x_left() : model.extrados.front().x;
    const double road_to = model.extrados.empty() ? fit.outline.x_right() : model.extrados.back().x;
    if (!model.extrados.empty()) {
      std::vector<Point2> fill = model.extrados;
      fill.push_back({road_to, *model.road_z});
      fill.push_back({road_from, *model.road_z});
      svg.polygon(to_paper(f, fill), R"(fill="#eadfc4" stroke="#b8a77f" stroke-width="0.15")");
    }
    svg.line(f.at({road_from, *model.road_z}), f.at({road_to, *model.road_z}),
             R"(stroke="#333333" stroke-width="0.7")");
    svg.text({f.paper_x(road_from), f.at({0.0, *model.road_z}).y - 1.4},
             "road level z = " + fixed_decimal(*model.road_z, 3) + " m (given)", kSmallText, "start");
  }
  if (!model.extrados.empty()) {
    std::vector<Point2> ring = intrados;
    ring.insert(ring.end(), model.extrados.rbegin(), model.extrados.rend());
    svg.polygon(to_paper(f, ring), R"(fill="#d8a58c" stroke="#8a4b32" stroke-width="0.25")");
  }
  {
    std::vector<Point2> band = band_upper;
    band.insert(band.end(), band_lower.rbegin(), band_lower.rend());
    svg.polygon(to_paper(f, band), R"(fill="#3d7cc9" fill-opacity="0.45" stroke="none")");
  }
  svg.polyline(to_paper(f, intrados), std::string(R"(fill="none" stroke=")") + kCurve + R"(" stroke-width="0.35")");

  // Readings: filled when the fit used them, hollow when excluded or a check.
  for (size_t i = 0; i < readings.size(); ++i) {
    const PaperPoint p = f.at({readings[i].x, readings[i].z});
    svg.circle(p, 0.75, fit.used[i] ? R"(fill="#b03a2e" stroke="#5e1d17" stroke-width="0.15")"
                                    : R"(fill="#ffffff" stroke="#b03a2e" stroke-width="0.3")");
  }
  svg.close_group();

  // --- Dimensions ----------------------------------------------------------
  svg.open_group("dimensions");
  const Estimate& span = geometry_estimate(u, "span_m");
  const Estimate& rise = geometry_estimate(u, "rise_m");
  const Estimate& crown_z = geometry_estimate(u, "crown_z_m");
  const double crown_x = geometry_estimate(u, "crown_x_m").value;
  const PaperPoint left = f.at({fit.outline.x_left(), z_s}), right = f.at({fit.outline.x_right(), z_s});
  const std::string thin = std::string(kInk) + R"( stroke-width="0.12")";
  svg.line({left.x, left.y + 1.0}, {left.x, span_dim_y + 1.5}, thin);
  svg.line({right.x, right.y + 1.0}, {right.x, span_dim_y + 1.5}, thin);
  dimension(svg, {left.x, span_dim_y}, {right.x, span_dim_y});
  svg.text({(left.x + right.x) / 2, span_dim_y - 1.0}, "span " + with_range(span, 1.0, 3, "m"), kTextSize, "middle");

  // A chain up the crown: rise, then ring, then fill.
  const double cx = f.paper_x(crown_x);
  const double y_spring = f.at({crown_x, z_s}).y, y_crown = f.at({crown_x, crown_z.value}).y;
  dimension(svg, {cx, y_spring}, {cx, y_crown});
  // Low down, where the opening is widest and no reading stands in the way.
  svg.text({cx + 1.5, y_spring - 0.3 * (y_spring - y_crown)}, "rise " + with_range(rise, 1000.0, 1, "mm"), kTextSize, "start");
  double chain_z = crown_z.value;
  if (options.ring_thickness_m) {
    const double d = *options.ring_thickness_m;
    // At a pointed crown the extrados apex stands higher than d above the intrados.
    const double top = std::max(model.top_of_ring_z, chain_z + d);
    const double y_top = f.at({crown_x, top}).y;
    dimension(svg, {cx, y_crown}, {cx, y_top});
    svg.text({cx + 1.5, (y_crown + y_top) / 2 + 0.9}, "ring d " + fixed_decimal(d * 1000.0, 0) + " mm (given)",
             kTextSize, "start");
    chain_z = top;
  }
  if (model.road_z) {
    const double y_top = f.at({crown_x, *model.road_z}).y, y_from = f.at({crown_x, chain_z}).y;
    const double depth = *model.road_z - chain_z;
    // The road is given exactly: the range comes from the fitted crown level alone.
    const double lo = *model.road_z - (chain_z - crown_z.value) - crown_z.hi;
    const double hi = *model.road_z - (chain_z - crown_z.value) - crown_z.lo;
    dimension(svg, {cx, y_from}, {cx, y_top});
    const std::string label = options.ring_thickness_m ? "fill h " : "d + h ";
    svg.text({cx + 1.5, (y_from + y_top) / 2 + 0.9},
             label + fixed_decimal(depth * 1000.0, 0) + " mm at the crown (95%: " + fixed_decimal(lo * 1000.0, 0) +
                 " to " + fixed_decimal(hi * 1000.0, 0) + ", crown level only)",
             kTextSize, "start");
  }
  svg.close_group();

  // --- Departures strip: residuals and the band, exaggerated ---------------
  svg.open_group("departures");
  double biggest_mm = 0.0;
  for (size_t i = 0; i < readings.size(); ++i)
    if (fit.used[i]) biggest_mm = std::max(biggest_mm, std::abs(fit.residuals[i]) + 2 * fit.sigmas[i]);
  for (const IntradosStation& s : model.band.stations) biggest_mm = std::max(biggest_mm, s.half_width_95_m);
  biggest_mm *= 1000.0 * 1.1;
  const double full_mm = nice_at_least(biggest_mm, {1, 2, 5, 10, 20, 50, 100, 200, 500, 1000});
  const double per_mm = kStripHalf / full_mm;  // paper mm per mm of departure
  const double strip_left = f.paper_x(x_lo), strip_right = f.paper_x(x_hi);
  svg.text({strip_left, strip_mid - kStripHalf - 3.0},
           "Departures from the fitted intrados, normal to it (mm; vertical scale " +
               fixed_decimal(per_mm * scale, 0) + " times the elevation's). Shaded: 95% band of the fitted curve.",
           kSmallText, "start");
  for (double level : {-1.0, -0.5, 0.5, 1.0}) {
    const double y = strip_mid - level * kStripHalf;
    svg.line({strip_left, y}, {strip_right, y}, R"(stroke="#bbbbbb" stroke-width="0.12" stroke-dasharray="1,1")");
    if (std::abs(level) == 1.0)
    {
      std::string label(1, level > 0 ? '+' : '-');
      label += fixed_decimal(full_mm, 0);
      svg.text({strip_left - 1.0, y + 0.8}, label, kSmallText, "end");
    }
  }
  {
    std::vector<PaperPoint> band;
    for (const IntradosStation& s : model.band.stations)
      band.push_back({f.paper_x(s.at.x), strip_mid - std::min(s.half_width_95_m * 1000.0 * per_mm, kStripHalf)});
    for (auto it = model.band.stations.rbegin(); it != model.band.stations.rend(); ++it)
      band.push_back({f.paper_x(it->at.x), strip_mid + std::min(it->half_width_95_m * 1000.0 * per_mm, kStripHalf)});
    svg.polygon(band, R"(fill="#3d7cc9" fill-opacity="0.35" stroke="none")");
  }
  svg.line({strip_left, strip_mid}, {strip_right, strip_mid}, std::string(R"(stroke=")") + kCurve + R"(" stroke-width="0.3")");
  svg.text({strip_left - 1.0, strip_mid + 0.8}, "0", kSmallText, "end");
  for (size_t i = 0; i < readings.size(); ++i) {
    const double x = f.paper_x(readings[i].x);
    const double r_mm = fit.residuals[i] * 1000.0;
    const double y = strip_mid - std::clamp(r_mm * per_mm, -kStripHalf, kStripHalf);
    if (fit.used[i]) {
      const double bar = std::min(2.0 * fit.sigmas[i] * 1000.0 * per_mm, kStripHalf);
      svg.line({x, y - bar}, {x, y + bar}, R"(stroke="#b03a2e" stroke-width="0.15")");
    }
    svg.circle({x, y}, 0.7, fit.used[i] ? R"(fill="#b03a2e" stroke="none")"
                                        : R"(fill="#ffffff" stroke="#b03a2e" stroke-width="0.3")");
    if (std::abs(r_mm * per_mm) > kStripHalf)
      svg.text({x + 1.0, y + (r_mm > 0 ? 2.5 : -1.0)}, fixed_decimal(r_mm, 1), kSmallText, "start");
  }
  svg.close_group();

  // --- Legend and scale bar ------------------------------------------------
  svg.open_group("legend");
  const double lx = kMargin, ly = legend_top;
  svg.circle({lx + 1.5, ly}, 0.75, R"(fill="#b03a2e" stroke="#5e1d17" stroke-width="0.15")");
  svg.text({lx + 4.0, ly + 0.8}, "reading used by the fit (strip: bar = 2 sigma)", kSmallText, "start");
  svg.circle({lx + 1.5, ly + 4.5}, 0.75, R"(fill="#ffffff" stroke="#b03a2e" stroke-width="0.3")");
  svg.text({lx + 4.0, ly + 5.3}, "reading excluded or a check: kept, not fitted", kSmallText, "start");
  svg.line({lx, ly + 9.0}, {lx + 3.0, ly + 9.0}, std::string(R"(stroke=")") + kCurve + R"(" stroke-width="0.35")");
  svg.text({lx + 4.0, ly + 9.8}, "fitted intrados (" + std::string(fit.family->name()) + ")", kSmallText, "start");
  const double lx2 = lx + 85.0;
  svg.rect({lx2, ly - 1.2}, 3.0, 2.4, R"(fill="#3d7cc9" fill-opacity="0.45")");
  svg.text({lx2 + 4.0, ly + 0.8}, "95% band of the fitted curve (linearised, from the fit covariance)", kSmallText, "start");
  if (!model.extrados.empty()) {
    svg.rect({lx2, ly + 3.3}, 3.0, 2.4, R"(fill="#d8a58c" stroke="#8a4b32" stroke-width="0.2")");
    svg.text({lx2 + 4.0, ly + 5.3}, "ring: intrados offset normal by the given thickness", kSmallText, "start");
  }
  if (model.road_z && !model.extrados.empty()) {
    svg.rect({lx2, ly + 7.8}, 3.0, 2.4, R"(fill="#eadfc4" stroke="#b8a77f" stroke-width="0.2")");
    svg.text({lx2 + 4.0, ly + 9.8}, "fill to the given road level", kSmallText, "start");
  }
  // Scale bar: the longest round length within 50 mm of paper, in alternate blocks.
  double bar_m = 0.1;
  for (double step : {0.1, 0.2, 0.5, 1.0, 2.0, 5.0, 10.0, 20.0, 50.0, 100.0})
    if (step * k <= 50.0) bar_m = step;
  const double leading = bar_m / std::pow(10.0, std::floor(std::log10(bar_m) + 1e-9));
  const int blocks = std::abs(leading - 5.0) < 1e-9 ? 5 : 4;
  const double bar_x = lx, bar_y = ly + 16.0;
  for (int b = 0; b < blocks; ++b) {
    const double w = bar_m * k / blocks;
    svg.rect({bar_x + b * w, bar_y}, w, 1.6,
             std::string(b % 2 == 0 ? R"(fill="#222222")" : R"(fill="#ffffff")") + R"( stroke="#222222" stroke-width="0.15")");
  }
  svg.text({bar_x, bar_y - 1.0}, "0", kSmallText, "middle");
  svg.text({bar_x + bar_m * k, bar_y - 1.0}, fixed_decimal(bar_m, bar_m < 1.0 ? 1 : 0) + " m", kSmallText, "middle");
  svg.text({bar_x + bar_m * k + 4.0, bar_y + 1.5}, "scale 1:" + std::to_string(scale) + " (printed at 100%)",
           kSmallText, "start");
  svg.close_group();

  // --- Caution and provenance ----------------------------------------------
  svg.open_group("notes");
  for (size_t i = 0; i < footer.size(); ++i)
    svg.text({kMargin, footer_top + 3.4 * static_cast<double>(i)}, footer[i], kSmallText, "start",
             i < caution_lines ? R"(font-weight="bold")" : "");
  svg.close_group();
  return svg.finish();
}

}  // namespace soffit
