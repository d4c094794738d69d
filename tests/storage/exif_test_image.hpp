#pragma once
// Builds the small JPEG APP1 EXIF segments the photo tests read: a TIFF
// block with IFD0 (Orientation, Exif and GPS pointers), an Exif IFD with
// DateTimeOriginal and a GPS IFD, laid out as the EXIF 2.3 standard says
// (from memory: tag numbers in storage/exif_reader.hpp).
#include <cstdint>
#include <string>
#include <vector>

namespace soffit::test {

struct ExifSpec {
  bool little_endian = true;
  int orientation = 6;
  std::string taken = "2025:05:21 10:14:03";
  char lat_ref = 'N', lon_ref = 'W';
  uint32_t lat[6] = {51, 1, 28, 1, 4012, 100};  // 51° 28' 40.12"
  uint32_t lon[6] = {2, 1, 5, 1, 531, 100};     // 2° 5' 5.31"
};

class TiffBytes {
 public:
  explicit TiffBytes(bool le) : le_(le) {}
  std::vector<uint8_t> b;
  void u16(size_t at, uint16_t v) {
    grow(at + 2);
    b[at] = uint8_t(le_ ? v : v >> 8);
    b[at + 1] = uint8_t(le_ ? v >> 8 : v);
  }
  void u32(size_t at, uint32_t v) {
    grow(at + 4);
    for (int i = 0; i < 4; ++i) b[at + size_t(i)] = uint8_t(v >> (le_ ? 8 * i : 24 - 8 * i));
  }
  void entry(size_t at, uint16_t tag, uint16_t type, uint32_t count, uint32_t value) {
    u16(at, tag);
    u16(at + 2, type);
    u32(at + 4, count);
    u32(at + 8, value);
  }
  void grow(size_t n) {
    if (b.size() < n) b.resize(n, 0);
  }

 private:
  bool le_;
};

// The TIFF block: IFD0 at 8, Exif IFD at 50, date at 68, GPS IFD at 88, rationals at 142 and 166.
inline std::vector<uint8_t> exif_tiff(const ExifSpec& s) {
  TiffBytes t(s.little_endian);
  t.grow(8);
  t.b[0] = t.b[1] = s.little_endian ? 'I' : 'M';
  t.u16(2, 42);
  t.u32(4, 8);
  t.u16(8, 3);
  t.entry(10, 0x0112, 3, 1, 0);
  t.u16(18, static_cast<uint16_t>(s.orientation));  // a SHORT sits in the first two value bytes
  t.entry(22, 0x8769, 4, 1, 50);
  t.entry(34, 0x8825, 4, 1, 88);
  t.u32(46, 0);
  t.u16(50, 1);
  t.entry(52, 0x9003, 2, 20, 68);
  t.u32(64, 0);
  t.grow(88);
  for (size_t i = 0; i < s.taken.size() && i < 19; ++i) t.b[68 + i] = static_cast<uint8_t>(s.taken[i]);
  t.u16(88, 4);
  t.entry(90, 1, 2, 2, 0);
  t.b[98] = static_cast<uint8_t>(s.lat_ref);
  t.entry(102, 2, 5, 3, 142);
  t.entry(114, 3, 2, 2, 0);
  t.b[122] = static_cast<uint8_t>(s.lon_ref);
  t.entry(126, 4, 5, 3, 166);
  t.u32(138, 0);
  for (int i = 0; i < 6; ++i) t.u32(142 + 4 * size_t(i), s.lat[i]);
  for (int i = 0; i < 6; ++i) t.u32(166 + 4 * size_t(i), s.lon[i]);
  return t.b;
}

// FF E1, length, "Exif\0\0", TIFF block.
inline std::vector<uint8_t> app1_segment(const std::vector<uint8_t>& tiff) {
  const size_t length = 2 + 6 + tiff.size();
  const uint8_t head[10] = {0xFF, 0xE1, uint8_t(length >> 8), uint8_t(length & 0xFF), 'E', 'x', 'i', 'f', 0, 0};
  std::vector<uint8_t> seg;
  seg.reserve(10 + tiff.size());
  for (const uint8_t b : head) seg.push_back(b);
  for (const uint8_t b : tiff) seg.push_back(b);
  return seg;
}

// A JPEG with the segment right after its start-of-image marker.
inline std::vector<uint8_t> with_app1(const std::vector<uint8_t>& jpeg, const std::vector<uint8_t>& app1) {
  std::vector<uint8_t> out;
  out.reserve(jpeg.size() + app1.size());
  for (size_t i = 0; i < jpeg.size() + app1.size(); ++i)
    out.push_back(i < 2 ? jpeg[i] : i < 2 + app1.size() ? app1[i - 2] : jpeg[i - app1.size()]);
  return out;
}

// The smallest stream the reader walks: SOI, the segment, EOI (no image data).
inline std::vector<uint8_t> bare_jpeg_with(const std::vector<uint8_t>& app1) {
  return with_app1({0xFF, 0xD8, 0xFF, 0xD9}, app1);
}

}  // namespace soffit::test
