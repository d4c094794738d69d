#pragma once
// Decoding a photo (stb_image) only to learn its size and draw a thumbnail.
#include <cstdint>
#include <string>
#include <vector>

namespace soffit::storage {

struct RgbImage {
  int width = 0, height = 0;
  std::vector<uint8_t> rgb;  // row by row, 3 bytes a pixel
};

// Box-averages `image` down by a whole factor so neither side exceeds
// `max_side` (a 12 Mpx photo costs one pass; TOOLCHAIN.md "Photos").
RgbImage box_average_down(const RgbImage& image, int max_side);

// Turns the stored pixels the way EXIF orientation 1–8 says they are seen
// (TIFF 6.0 Orientation: 6 = rotate 90° clockwise to view, 8 = 90° anticlockwise…).
RgbImage apply_exif_orientation(const RgbImage& image, int orientation);

std::vector<uint8_t> encode_png(const RgbImage& image);

}  // namespace soffit::storage
