#include "app/gui/profile_plot.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <vector>

#include "app/gui/ui_theme.hpp"
#include "geometry/shapes/outline.hpp"
#include "geometry/shapes/shape_family.hpp"

namespace soffit::gui {

namespace {
constexpr float kResidualExaggeration = 50.0f;  // 1 mm drawn as 50 mm
// Above this many readings (a scan slice) points are decimated for drawing,
// never for fitting: one mark per 2-pixel cell, and at most kMaxDrawnMarks
// marks so one draw list stays far below ImGui 1.86's 65,535-vertex limit.
constexpr size_t kDenseReadings = 1500;
constexpr size_t kMaxDrawnMarks = 8000;
constexpr float kCellPixels = 2.0f;
}

void draw_profile_plot(const Readings& readings, const ProfileAnalysis& analysis, const IntradosBand* band,
                       float height) {
  const Palette& c = palette();
  ImDrawList* draw = ImGui::GetWindowDrawList();
  const ImVec2 origin = ImGui::GetCursorScreenPos();
  const float width = ImGui::GetContentRegionAvail().x;
  const float pad = ImGui::GetFontSize() * 1.5f;
  draw->AddRectFilled(origin, ImVec2(origin.x + width, origin.y + height), c.paper);
  draw->AddRect(origin, ImVec2(origin.x + width, origin.y + height), c.faint_ink);
  draw->PushClipRect(origin, ImVec2(origin.x + width, origin.y + height), true);  // the band may reach past the frame

  const ShapeFit& fit = *analysis.fit;
  const std::vector<Point2> curve = sample_outline(fit.outline, 96);
  double x0 = fit.outline.x_left(), x1 = fit.outline.x_right();
  double z0 = fit.outline.z_springing, z1 = z0;
  for (const Point2& p : curve) z1 = std::max(z1, p.z);
  for (const Reading& r : readings) {
    x0 = std::min(x0, r.x), x1 = std::max(x1, r.x);
    z0 = std::min(z0, r.z), z1 = std::max(z1, r.z);
  }
  // One scale for both axes: a profile must not look flatter or taller than it is.
  const double scale = std::min((width - 2 * pad) / std::max(x1 - x0, 1e-3),
                                (height - 2 * pad) / std::max(z1 - z0, 1e-3));
  const float left = origin.x + pad + static_cast<float>(((width - 2 * pad) - (x1 - x0) * scale) / 2);
  const float bottom = origin.y + height - pad;
  auto at = [&](double x, double z) {
    return ImVec2(left + static_cast<float>((x - x0) * scale), bottom - static_cast<float>((z - z0) * scale));
  };

  // Half-metre grid.
  for (double gx = std::ceil(x0 * 2) / 2; gx <= x1; gx += 0.5)
    draw->AddLine(at(gx, z0), at(gx, z1), c.grid);
  for (double gz = std::ceil(z0 * 2) / 2; gz <= z1; gz += 0.5)
    draw->AddLine(at(x0, gz), at(x1, gz), c.grid);
  draw->AddLine(at(x0, fit.outline.z_springing), at(x1, fit.outline.z_springing), c.faint_ink, 1.5f);

  // The 95% band of the curve's position, exaggerated like the residual bars so
  // that a bar reaching beyond it marks a reading the fit cannot explain.
  if (band) {
    const auto& st = band->stations;
    for (size_t i = 1; i < st.size(); ++i) {
      const double e0 = st[i - 1].half_width_95_m * kResidualExaggeration, e1 = st[i].half_width_95_m * kResidualExaggeration;
      const ImVec2 a_out = at(st[i - 1].at.x + st[i - 1].normal.x * e0, st[i - 1].at.z + st[i - 1].normal.z * e0);
      const ImVec2 a_in = at(st[i - 1].at.x - st[i - 1].normal.x * e0, st[i - 1].at.z - st[i - 1].normal.z * e0);
      const ImVec2 b_out = at(st[i].at.x + st[i].normal.x * e1, st[i].at.z + st[i].normal.z * e1);
      const ImVec2 b_in = at(st[i].at.x - st[i].normal.x * e1, st[i].at.z - st[i].normal.z * e1);
      draw->AddQuadFilled(a_out, b_out, b_in, a_in, c.band);
    }
  }
  for (size_t i = 1; i < curve.size(); ++i)
    draw->AddLine(at(curve[i - 1].x, curve[i - 1].z), at(curve[i].x, curve[i].z), c.fitted_curve, 3.0f);

  const float dot = ImGui::GetFontSize() * 0.28f;
  const bool dense = readings.size() > kDenseReadings;
  const int cells_x = static_cast<int>(width / kCellPixels) + 1, cells_y = static_cast<int>(height / kCellPixels) + 1;
  std::vector<bool> occupied(dense ? static_cast<size_t>(cells_x) * static_cast<size_t>(cells_y) : 0);
  size_t drawn = 0;
  for (size_t i = 0; i < readings.size(); ++i) {
    const Reading& r = readings[i];
    const ImVec2 p = at(r.x, r.z);
    if (dense) {
      const int cx = static_cast<int>((p.x - origin.x) / kCellPixels), cy = static_cast<int>((p.y - origin.y) / kCellPixels);
      if (cx < 0 || cy < 0 || cx >= cells_x || cy >= cells_y) continue;
      const size_t cell = static_cast<size_t>(cy) * static_cast<size_t>(cells_x) + static_cast<size_t>(cx);
      if (occupied[cell] || drawn >= kMaxDrawnMarks) continue;
      occupied[cell] = true;
      ++drawn;
      const unsigned int colour = fit.used[i] ? c.reading : c.excluded;
      draw->AddRectFilled(ImVec2(p.x - 1.5f, p.y - 1.5f), ImVec2(p.x + 1.5f, p.y + 1.5f), colour);
      continue;
    }
    ++drawn;
    if (!fit.used[i]) {
      draw->AddCircle(p, dot, c.excluded, 0, 2.0f);  // hollow: not used in the fit
      continue;
    }
    // Residual bar along the curve's normal (the gradient of the signed
    // distance with respect to the point), pointing back towards the curve.
    const double res = fit.residuals[i];
    const double len = res * kResidualExaggeration * scale;
    const Point2 normal = distance_gradient_at_point(*fit.family, fit.params, {r.x, r.z});
    const ImVec2 tip(p.x - static_cast<float>(normal.x * len), p.y + static_cast<float>(normal.z * len));
    draw->AddLine(p, tip, res < 0 ? c.residual_below : c.residual_above, 3.0f);
    draw->AddCircleFilled(p, dot, c.reading);
  }
  draw->PopClipRect();
  char label[160];
  if (dense)
    std::snprintf(label, sizeof label, "grid 0.5 m; %zu of %zu readings drawn (all are fitted)", drawn,
                  readings.size());
  else
    std::snprintf(label, sizeof label,
                  "grid 0.5 m; residual bars and the 95%% band exaggerated %.0f times (the curve is to scale)",
                  kResidualExaggeration);
  draw->AddText(ImVec2(origin.x + pad * 0.5f, origin.y + pad * 0.3f), c.faint_ink, label);
  ImGui::Dummy(ImVec2(width, height));
}

}  // namespace soffit::gui
