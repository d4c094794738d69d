// The EXIF reader (storage/exif_reader.hpp) on hand-built APP1 segments:
// both byte orders, the DMS-to-degrees conversion of GPS rationals (EXIF 2.3
// GPSLatitude = degrees, minutes, seconds), and damaged segments that must
// give warnings, never a read past the buffer.
#include <doctest/doctest.h>

#include <cmath>
#include <random>

#include "storage/exif_reader.hpp"
#include "tests/storage/exif_test_image.hpp"

using namespace soffit::storage;
using namespace soffit::test;

namespace {
ExifFacts read(const std::vector<uint8_t>& jpeg) { return read_jpeg_exif(jpeg.data(), jpeg.size()); }
}  // namespace

TEST_CASE("EXIF date, GPS and orientation are read in both byte orders") {
  for (const bool le : {true, false}) {
    CAPTURE(le);
    ExifSpec spec;
    spec.little_endian = le;
    const ExifFacts f = read(bare_jpeg_with(app1_segment(exif_tiff(spec))));
    CHECK(f.warnings.empty());
    REQUIRE(f.taken_at.has_value());
    CHECK(*f.taken_at == "2025-05-21T10:14:03");
    REQUIRE(f.orientation.has_value());
    CHECK(*f.orientation == 6);
    REQUIRE(f.latitude_deg.has_value());
    REQUIRE(f.longitude_deg.has_value());
    // 51 + 28/60 + 40.12/3600 and −(2 + 5/60 + 5.31/3600), by hand.
    CHECK(std::abs(*f.latitude_deg - 51.477811111) < 1e-8);
    CHECK(std::abs(*f.longitude_deg - -2.084808333) < 1e-8);
  }
}

TEST_CASE("a JPEG without EXIF, or not a JPEG at all, gives no facts and no warning") {
  const std::vector<uint8_t> plain = {0xFF, 0xD8, 0xFF, 0xE0, 0x00, 0x04, 'J', 'F', 0xFF, 0xD9};
  const ExifFacts f = read(plain);
  CHECK_FALSE(f.taken_at.has_value());
  CHECK_FALSE(f.orientation.has_value());
  CHECK(f.warnings.empty());
  CHECK(read({0x89, 'P', 'N', 'G'}).warnings.empty());
  CHECK(read({}).warnings.empty());
}

TEST_CASE("a truncated EXIF segment gives a warning and whatever was whole") {
  const auto app1 = app1_segment(exif_tiff({}));
  // The segment's length says more bytes than the file holds.
  std::vector<uint8_t> cut = bare_jpeg_with(app1);
  cut.resize(2 + app1.size() / 2);
  ExifFacts f = read(cut);
  CHECK_FALSE(f.warnings.empty());
  CHECK_FALSE(f.taken_at.has_value());

  // A whole segment whose TIFF block ends inside the GPS rationals: the
  // orientation and date before them are still read, the position is not.
  auto tiff = exif_tiff({});
  tiff.resize(150);
  f = read(bare_jpeg_with(app1_segment(tiff)));
  CHECK(f.orientation == 6);
  CHECK(f.taken_at == "2025-05-21T10:14:03");
  CHECK_FALSE(f.latitude_deg.has_value());
  CHECK_FALSE(f.warnings.empty());

  // An Exif IFD pointer far outside the segment.
  tiff = exif_tiff({});
  TiffBytes t(true);
  t.b = tiff;
  t.u32(30, 0xFFFFFFF0u);
  f = read(bare_jpeg_with(app1_segment(t.b)));
  CHECK_FALSE(f.taken_at.has_value());
  CHECK(f.orientation == 6);
  CHECK_FALSE(f.warnings.empty());
}

TEST_CASE("bad values are ignored with a warning: orientation 9, a zero denominator, a clock never set") {
  ExifSpec spec;
  spec.orientation = 9;
  spec.lat[5] = 0;
  spec.taken = "0000:00:00 00:00:00";
  const ExifFacts f = read(bare_jpeg_with(app1_segment(exif_tiff(spec))));
  CHECK_FALSE(f.orientation.has_value());
  CHECK_FALSE(f.latitude_deg.has_value());
  CHECK_FALSE(f.taken_at.has_value());
  CHECK(f.warnings.size() == 3);
}

TEST_CASE("every truncation and 3000 random byte changes of an EXIF JPEG are read without fault") {
  const auto jpeg = bare_jpeg_with(app1_segment(exif_tiff({})));
  size_t with_orientation = 0;
  for (size_t n = 0; n <= jpeg.size(); ++n) {
    // A copy of exactly n bytes, so a read past the end lands outside the allocation.
    const std::vector<uint8_t> cut(jpeg.begin(), jpeg.begin() + static_cast<long>(n));
    const ExifFacts f = read(cut);
    if (f.orientation) ++with_orientation;
    if (f.latitude_deg) CHECK(std::abs(*f.latitude_deg) <= 90.0);
  }
  CHECK(with_orientation >= 1);  // the whole file at least
  std::mt19937 rng(417);
  for (int i = 0; i < 3000; ++i) {
    std::vector<uint8_t> bad = jpeg;
    for (int k = 0; k < 4; ++k) bad[rng() % bad.size()] = static_cast<uint8_t>(rng());
    const ExifFacts f = read(bad);
    if (f.orientation) CHECK((*f.orientation >= 1 && *f.orientation <= 8));
    if (f.longitude_deg) CHECK(std::abs(*f.longitude_deg) <= 180.0);
  }
}
