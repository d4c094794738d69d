#include "storage/image_thumbnail.hpp"

#include <stb_image_write.h>

#include <algorithm>

namespace soffit::storage {

RgbImage box_average_down(const RgbImage& image, int max_side) {
  const int longest = std::max(image.width, image.height);
  const int k = std::max(1, (longest + max_side - 1) / max_side);
  RgbImage out;
  out.width = (image.width + k - 1) / k;
  out.height = (image.height + k - 1) / k;
  out.rgb.resize(size_t(out.width) * size_t(out.height) * 3);
  for (int oy = 0; oy < out.height; ++oy) {
    const int y0 = oy * k, y1 = std::min(image.height, y0 + k);
    for (int ox = 0; ox < out.width; ++ox) {
      const int x0 = ox * k, x1 = std::min(image.width, x0 + k);
      unsigned sum[3] = {0, 0, 0};
      for (int y = y0; y < y1; ++y) {
        const uint8_t* row = image.rgb.data() + (size_t(y) * size_t(image.width) + size_t(x0)) * 3;
        for (int x = x0; x < x1; ++x, row += 3) {
          sum[0] += row[0];
          sum[1] += row[1];
          sum[2] += row[2];
        }
      }
      // Edge blocks hold fewer pixels: divide by the count actually summed.
      const unsigned n = unsigned((y1 - y0) * (x1 - x0));
      uint8_t* o = out.rgb.data() + (size_t(oy) * size_t(out.width) + size_t(ox)) * 3;
      for (int c = 0; c < 3; ++c) o[c] = static_cast<uint8_t>((sum[c] + n / 2) / n);
    }
  }
  return out;
}

RgbImage apply_exif_orientation(const RgbImage& image, int orientation) {
  if (orientation < 2 || orientation > 8) return image;
  const int w = image.width, h = image.height;
  const bool swaps = orientation >= 5;
  RgbImage out;
  out.width = swaps ? h : w;
  out.height = swaps ? w : h;
  out.rgb.resize(image.rgb.size());
  for (int y = 0; y < out.height; ++y) {
    for (int x = 0; x < out.width; ++x) {
      int sx = x, sy = y;  // the stored pixel shown at (x, y)
      switch (orientation) {
        case 2: sx = w - 1 - x; break;
        case 3: sx = w - 1 - x; sy = h - 1 - y; break;
        case 4: sy = h - 1 - y; break;
        case 5: sx = y; sy = x; break;
        case 6: sx = y; sy = h - 1 - x; break;
        case 7: sx = w - 1 - y; sy = h - 1 - x; break;
        case 8: sx = w - 1 - y; sy = x; break;
      }
      const uint8_t* s = image.rgb.data() + (size_t(sy) * size_t(w) + size_t(sx)) * 3;
      uint8_t* o = out.rgb.data() + (size_t(y) * size_t(out.width) + size_t(x)) * 3;
      o[0] = s[0];
      o[1] = s[1];
      o[2] = s[2];
    }
  }
  return out;
}

std::vector<uint8_t> encode_png(const RgbImage& image) {
  std::vector<uint8_t> png;
  stbi_write_png_to_func(
      [](void* ctx, void* data, int size) {
        auto* out = static_cast<std::vector<uint8_t>*>(ctx);
        const auto* p = static_cast<const uint8_t*>(data);
        out->insert(out->end(), p, p + size);
      },
      &png, image.width, image.height, 3, image.rgb.data(), image.width * 3);
  return png;
}

}  // namespace soffit::storage
