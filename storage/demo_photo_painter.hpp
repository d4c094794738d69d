#pragma once
// Procedural stand-ins for defect photographs in the demo project: a brick
// soffit with mortar joints, and the defect drawn on it. Nothing here is a
// photograph; the same seed always draws the same picture.
#include <cstdint>
#include <string>
#include <utility>
#include <vector>

#include "storage/image_thumbnail.hpp"

namespace soffit::storage {

enum class DemoMark {
  crack,     // a dark polyline (width in px from the crack width)
  patch,     // a darker, stained patch: seepage, spalling, scour, mortar loss
  missing,   // one brick gone: a deep shadow the size of a unit
  none,
};

struct DemoPicture {
  int width = 640, height = 480;
  uint32_t seed = 1;
  DemoMark mark = DemoMark::none;
  std::vector<std::pair<double, double>> path;  // crack polyline, 0–1 of width and height
  double crack_width_px = 2;
  double patch_cx = 0.5, patch_cy = 0.5, patch_rx = 0.2, patch_ry = 0.15;  // 0–1
};

RgbImage paint_demo_picture(const DemoPicture& p);

// Writes the picture as a JPEG (stb_image_write, quality 88); throws StorageError(io) on failure.
void write_demo_jpeg(const std::string& path, const RgbImage& image);

}  // namespace soffit::storage
