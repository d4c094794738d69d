#pragma once
// The three EXIF facts a survey photo needs (FIELD.md §6.3): when it was
// taken, where, and which way up it is. A small reader of the JPEG APP1
// segment and its TIFF structure (EXIF 2.3, CIPA DC-008, from memory: IFD0
// tags 0x0112 Orientation, 0x8769 Exif IFD, 0x8825 GPS IFD; Exif IFD 0x9003
// DateTimeOriginal; GPS tags 1–4).
//
// Every offset in the file is checked against the bytes actually present
// before it is followed: a damaged or hostile file gives fewer facts and a
// warning, never a read outside the buffer.
#include <cstddef>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace soffit::storage {

struct ExifFacts {
  std::optional<std::string> taken_at;  // DateTimeOriginal as YYYY-MM-DDTHH:MM:SS (camera local time)
  std::optional<double> latitude_deg, longitude_deg;  // WGS84, north and east positive
  std::optional<int> orientation;                     // 1–8 (TIFF 6.0 Orientation)
  std::vector<std::string> warnings;                  // what was damaged and skipped
};

// `data` is a whole JPEG file. No EXIF segment gives empty facts, no warning.
ExifFacts read_jpeg_exif(const uint8_t* data, size_t size);

}  // namespace soffit::storage
