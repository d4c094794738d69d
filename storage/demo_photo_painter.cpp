#include "storage/demo_photo_painter.hpp"

#include <stb_image_write.h>

#include <algorithm>
#include <cmath>
#include <random>

#include "storage/storage_error.hpp"

namespace soffit::storage {
namespace {

// Handmade brick about 230 × 68 mm with 10 mm joints (FIELD.md §10), at
// 1 px ≈ 1.6 mm: a 640 px picture shows about a metre of soffit.
constexpr double kPxPerMm = 1.0 / 1.6;
constexpr double kBrickLength = 230 * kPxPerMm, kBrickHeight = 68 * kPxPerMm, kJoint = 10 * kPxPerMm;

void put(RgbImage& im, int x, int y, const double rgb[3], double alpha) {
  if (x < 0 || y < 0 || x >= im.width || y >= im.height) return;
  uint8_t* p = im.rgb.data() + (size_t(y) * size_t(im.width) + size_t(x)) * 3;
  for (int c = 0; c < 3; ++c) p[c] = static_cast<uint8_t>(std::clamp(p[c] * (1 - alpha) + rgb[c] * alpha, 0.0, 255.0));
}

void draw_bricks(RgbImage& im, std::mt19937& rng) {
  std::uniform_real_distribution<double> shade(-22, 22), grain(-9, 9);
  const double mortar[3] = {176, 168, 150};
  const int rows = int(im.height / (kBrickHeight + kJoint)) + 2;
  const int cols = int(im.width / (kBrickLength + kJoint)) + 2;
  std::vector<double> brick_shade(size_t(rows) * size_t(cols));
  for (auto& s : brick_shade) s = shade(rng);
  for (int y = 0; y < im.height; ++y) {
    const double course = y / (kBrickHeight + kJoint);
    const int row = int(course);
    const bool bed_joint = (course - row) * (kBrickHeight + kJoint) > kBrickHeight;
    // Stretcher bond: alternate courses start half a brick along.
    const double xoff = (row % 2) * (kBrickLength + kJoint) / 2;
    for (int x = 0; x < im.width; ++x) {
      const double along = (x + xoff) / (kBrickLength + kJoint);
      const int col = int(along);
      const bool perp_joint = (along - col) * (kBrickLength + kJoint) > kBrickLength;
      uint8_t* p = im.rgb.data() + (size_t(y) * size_t(im.width) + size_t(x)) * 3;
      if (bed_joint || perp_joint) {
        const double g = grain(rng);
        for (int c = 0; c < 3; ++c) p[c] = static_cast<uint8_t>(std::clamp(mortar[c] + g, 0.0, 255.0));
      } else {
        const double s = brick_shade[size_t(row % rows) * size_t(cols) + size_t(col % cols)] + grain(rng);
        const double red[3] = {150 + s, 72 + s * 0.6, 52 + s * 0.5};
        for (int c = 0; c < 3; ++c) p[c] = static_cast<uint8_t>(std::clamp(red[c], 0.0, 255.0));
      }
    }
  }
}

// A crack: each segment of the polyline wanders a little, as cracks follow joints and grains.
void draw_crack(RgbImage& im, const DemoPicture& p, std::mt19937& rng) {
  const double dark[3] = {28, 22, 20};
  std::normal_distribution<double> wander(0, 1.2);
  const double r = std::max(0.6, p.crack_width_px / 2);
  for (size_t i = 0; i + 1 < p.path.size(); ++i) {
    const double x0 = p.path[i].first * im.width, y0 = p.path[i].second * im.height;
    const double x1 = p.path[i + 1].first * im.width, y1 = p.path[i + 1].second * im.height;
    const int steps = int(std::hypot(x1 - x0, y1 - y0)) + 1;
    double drift = 0;
    for (int k = 0; k <= steps; ++k) {
      const double t = double(k) / steps;
      drift = std::clamp(drift + wander(rng) * 0.3, -6.0, 6.0);
      const double cx = x0 + (x1 - x0) * t + drift * 0.3;
      const double cy = y0 + (y1 - y0) * t + drift * 0.3;
      for (int dy = -int(r) - 1; dy <= int(r) + 1; ++dy)
        for (int dx = -int(r) - 1; dx <= int(r) + 1; ++dx) {
          const double d = std::hypot(dx, dy);
          if (d <= r + 0.5) put(im, int(cx) + dx, int(cy) + dy, dark, d <= r - 0.5 ? 0.9 : 0.5);
        }
    }
  }
}

void draw_patch(RgbImage& im, const DemoPicture& p, std::mt19937& rng) {
  const double stain[3] = {70, 62, 55};
  std::uniform_real_distribution<double> mottle(0.0, 0.15);
  const double cx = p.patch_cx * im.width, cy = p.patch_cy * im.height;
  const double rx = p.patch_rx * im.width, ry = p.patch_ry * im.height;
  for (int y = int(cy - ry); y <= int(cy + ry); ++y)
    for (int x = int(cx - rx); x <= int(cx + rx); ++x) {
      const double e = std::pow((x - cx) / rx, 2) + std::pow((y - cy) / ry, 2);
      if (e < 1) put(im, x, y, stain, (1 - e) * 0.55 + mottle(rng));
    }
}

void draw_missing_unit(RgbImage& im, const DemoPicture& p) {
  const double shadow[3] = {18, 14, 12};
  const int x0 = int(p.patch_cx * im.width - kBrickLength / 2), y0 = int(p.patch_cy * im.height - kBrickHeight / 2);
  for (int y = y0; y < y0 + int(kBrickHeight); ++y)
    for (int x = x0; x < x0 + int(kBrickLength); ++x) put(im, x, y, shadow, 0.92);
}

}  // namespace

RgbImage paint_demo_picture(const DemoPicture& p) {
  RgbImage im;
  im.width = p.width;
  im.height = p.height;
  im.rgb.assign(size_t(p.width) * size_t(p.height) * 3, 0);
  std::mt19937 rng(p.seed);
  draw_bricks(im, rng);
  switch (p.mark) {
    case DemoMark::crack: draw_crack(im, p, rng); break;
    case DemoMark::patch: draw_patch(im, p, rng); break;
    case DemoMark::missing: draw_missing_unit(im, p); break;
    case DemoMark::none: break;
  }
  return im;
}

void write_demo_jpeg(const std::string& path, const RgbImage& image) {
  if (!stbi_write_jpg(path.c_str(), image.width, image.height, 3, image.rgb.data(), 88))
    throw StorageError(ErrorKind::io, path, "cannot write the demo picture");
}

}  // namespace soffit::storage
