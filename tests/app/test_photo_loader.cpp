// PhotoLoader: decoding real PNG files written here with stb_image_write, on
// its worker thread; EXIF orientation, the fit to a texture side, damaged and
// missing files, and the cap on cached images.
#include <doctest/doctest.h>
#include <stb_image_write.h>

#include <chrono>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <string>
#include <thread>
#include <vector>

#include "app/model/photo_loader.hpp"

using namespace soffit;
namespace fs = std::filesystem;

namespace {

struct TempDir {
  fs::path dir;
  TempDir() {
    dir = fs::temp_directory_path() /
          ("soffit-photo-loader-" + std::to_string(std::chrono::steady_clock::now().time_since_epoch().count()));
    fs::create_directories(dir);
  }
  ~TempDir() {
    std::error_code ec;
    fs::remove_all(dir, ec);
  }
  std::string path(const std::string& name) const { return (dir / name).string(); }
};

struct Rgb {
  uint8_t r, g, b;
};

// A w x h PNG whose pixel (x, y) has the colour colour(x, y).
template <typename F>
std::string write_png(const TempDir& t, const std::string& name, int w, int h, F colour) {
  std::vector<uint8_t> px(size_t(w) * size_t(h) * 3);
  for (int y = 0; y < h; ++y)
    for (int x = 0; x < w; ++x) {
      const Rgb c = colour(x, y);
      uint8_t* p = px.data() + (size_t(y) * size_t(w) + size_t(x)) * 3;
      p[0] = c.r, p[1] = c.g, p[2] = c.b;
    }
  const std::string path = t.path(name);
  REQUIRE(stbi_write_png(path.c_str(), w, h, 3, px.data(), w * 3) != 0);
  return path;
}

Rgb pixel(const app::RgbaImage& im, int x, int y) {
  const uint8_t* p = im.rgba.data() + (size_t(y) * size_t(im.width) + size_t(x)) * 4;
  return {p[0], p[1], p[2]};
}

bool same(Rgb a, Rgb b) { return a.r == b.r && a.g == b.g && a.b == b.b; }

// Polls as the UI thread would, once a frame, until `count` results arrived or 10 s passed.
std::vector<app::LoadedPhoto> wait_for(app::PhotoLoader& loader, size_t count) {
  std::vector<app::LoadedPhoto> got;
  const auto until = std::chrono::steady_clock::now() + std::chrono::seconds(10);
  while (got.size() < count && std::chrono::steady_clock::now() < until) {
    for (auto& r : loader.poll()) got.push_back(std::move(r));
    if (got.size() < count) std::this_thread::sleep_for(std::chrono::milliseconds(2));
  }
  return got;
}

// Four corners in four colours, so any turn or mirror shows.
const Rgb kRed{255, 0, 0}, kGreen{0, 255, 0}, kBlue{0, 0, 255}, kWhite{255, 255, 255}, kGrey{128, 128, 128};
Rgb corners(int x, int y, int w, int h) {
  if (x == 0 && y == 0) return kRed;
  if (x == w - 1 && y == 0) return kGreen;
  if (x == 0 && y == h - 1) return kBlue;
  if (x == w - 1 && y == h - 1) return kWhite;
  return kGrey;
}

}  // namespace

TEST_CASE("photo loader: a PNG decodes to RGBA8 as stored when no turn is needed") {
  TempDir t;
  const std::string path = write_png(t, "plain.png", 4, 3, [](int x, int y) { return corners(x, y, 4, 3); });
  const app::LoadedPhoto r = app::decode_photo_file("k", path, 2048, 1);
  REQUIRE(r.image);
  CHECK(r.error.empty());
  CHECK(r.image->width == 4);
  CHECK(r.image->height == 3);
  CHECK(r.image->rgba.size() == 4u * 3u * 4u);
  CHECK(same(pixel(*r.image, 0, 0), kRed));
  CHECK(same(pixel(*r.image, 3, 0), kGreen));
  CHECK(same(pixel(*r.image, 0, 2), kBlue));
  CHECK(same(pixel(*r.image, 3, 2), kWhite));
  CHECK(r.image->rgba[3] == 255);  // opaque: the texture shows no background through it
}

TEST_CASE("photo loader: EXIF orientation 6 turns the photo a quarter clockwise to be seen upright") {
  // TIFF 6.0 / EXIF 2.3 Orientation tag, value 6 (quoted from memory): "the 0th row represents the
  // visual right-hand side of the image, and the 0th column represents the visual top". So a 4 x 2
  // stored image is seen 2 x 4; stored row 0 becomes the right column, stored column 0 the top row.
  TempDir t;
  const std::string path = write_png(t, "turned.png", 4, 2, [](int x, int y) { return corners(x, y, 4, 2); });
  const app::LoadedPhoto r = app::decode_photo_file("k", path, 2048, 6);
  REQUIRE(r.image);
  CHECK(r.image->width == 2);
  CHECK(r.image->height == 4);
  CHECK(same(pixel(*r.image, 1, 0), kRed));    // stored (0, 0): row 0 → right, column 0 → top
  CHECK(same(pixel(*r.image, 1, 3), kGreen));  // stored (3, 0): row 0 → right, last column → bottom
  CHECK(same(pixel(*r.image, 0, 0), kBlue));   // stored (0, 1): last row → left, column 0 → top
  CHECK(same(pixel(*r.image, 0, 3), kWhite));
}

TEST_CASE("photo loader: a photo larger than the texture side is shrunk to fit it, keeping its shape and colour") {
  TempDir t;
  const Rgb brick{178, 84, 52};
  const std::string path = write_png(t, "wide.png", 3000, 1000, [&](int, int) { return brick; });
  const app::LoadedPhoto r = app::decode_photo_file("k", path, 2048, 1);
  REQUIRE(r.image);
  CHECK(r.image->width == 2048);
  CHECK(r.image->height == 683);  // 1000 x 2048 / 3000 = 682.67, rounded
  // A flat colour stays flat through any normalised resampling filter.
  for (const auto& [x, y] : {std::pair{0, 0}, {1024, 341}, {2047, 682}}) {
    const Rgb c = pixel(*r.image, x, y);
    CHECK(std::abs(c.r - brick.r) <= 1);
    CHECK(std::abs(c.g - brick.g) <= 1);
    CHECK(std::abs(c.b - brick.b) <= 1);
  }
  // Turned after shrinking: orientation 8 (a quarter anticlockwise) swaps the sides.
  const app::LoadedPhoto turned = app::decode_photo_file("k8", path, 2048, 8);
  REQUIRE(turned.image);
  CHECK(turned.image->width == 683);
  CHECK(turned.image->height == 2048);
}

TEST_CASE("photo loader: damaged, missing and non-image files give a message naming the file, not a crash") {
  TempDir t;
  const std::string good = write_png(t, "good.png", 16, 16, [](int x, int) { return Rgb{uint8_t(x * 10), 0, 0}; });
  // A PNG cut off after 60 bytes: the header promises pixels that never come.
  std::vector<char> bytes(static_cast<size_t>(fs::file_size(good)));
  std::ifstream(good, std::ios::binary).read(bytes.data(), static_cast<std::streamsize>(bytes.size()));
  const std::string cut = t.path("cut.png");
  std::ofstream(cut, std::ios::binary).write(bytes.data(), 60);
  const std::string text = t.path("notes.jpg");
  std::ofstream(text) << "not a photo at all\n";
  const std::string empty = t.path("empty.png");
  std::ofstream(empty).close();
  const std::string missing = t.path("gone.jpg");

  for (const std::string& path : {cut, text, empty, missing}) {
    CAPTURE(path);
    const app::LoadedPhoto r = app::decode_photo_file("k", path, 2048, 1);
    CHECK_FALSE(r.image);
    CHECK(r.error.find(path) != std::string::npos);
  }
  // Bytes from the register (a thumbnail) are named by what the caller calls them.
  const app::LoadedPhoto r = app::decode_photo_bytes("k", "thumbnail of P25-011.jpg", {0x89, 'P', 'N', 'G'}, 256, 1);
  CHECK_FALSE(r.image);
  CHECK(r.error.rfind("thumbnail of P25-011.jpg: ", 0) == 0);
}

TEST_CASE("photo loader: the worker decodes requests and poll() hands them over, errors included") {
  TempDir t;
  const std::string a = write_png(t, "a.png", 40, 30, [](int x, int y) { return corners(x, y, 40, 30); });
  const std::string bad = t.path("bad.png");
  std::ofstream(bad) << "garbage";
  app::PhotoLoader loader(4);
  loader.request("a", a, 2048, 1);
  loader.request("a", a, 2048, 1);  // asked twice while queued: decoded once
  loader.request("bad", bad, 2048, 1);
  auto got = wait_for(loader, 2);
  REQUIRE(got.size() == 2);
  CHECK(got[0].key == "a");
  REQUIRE(got[0].image);
  CHECK(got[0].image->width == 40);
  CHECK(got[1].key == "bad");
  CHECK_FALSE(got[1].image);
  CHECK(got[1].error.find("bad.png") != std::string::npos);
  CHECK(loader.poll().empty());  // nothing more came: the second request of "a" was dropped
  CHECK_FALSE(loader.busy());

  // A cached photo asked again is handed back by the next poll without decoding: the same pixels.
  loader.request("a", a, 2048, 1);
  got = wait_for(loader, 1);
  REQUIRE(got.size() == 1);
  CHECK(got[0].image == loader.cached("a"));
}

TEST_CASE("photo loader: at most `keep` decoded photos stay cached, the most recent ones") {
  TempDir t;
  app::PhotoLoader loader(2);
  for (int i = 0; i < 4; ++i) {
    const std::string key = "p" + std::to_string(i);
    loader.request(key, write_png(t, key + ".png", 64, 48, [&](int, int) { return Rgb{uint8_t(i * 60), 0, 0}; }),
                   2048, 1);
  }
  const auto got = wait_for(loader, 4);
  REQUIRE(got.size() == 4);
  CHECK(loader.cached_count() == 2);
  CHECK_FALSE(loader.cached("p0"));
  CHECK_FALSE(loader.cached("p1"));
  REQUIRE(loader.cached("p3"));
  CHECK(pixel(*loader.cached("p3"), 10, 10).r == 180);
  loader.clear();
  CHECK(loader.cached_count() == 0);
}

TEST_CASE("photo loader: a thumbnail's PNG bytes decode on the worker and are not cached") {
  TempDir t;
  const std::string path = write_png(t, "thumb.png", 8, 6, [](int x, int y) { return corners(x, y, 8, 6); });
  std::vector<uint8_t> bytes(static_cast<size_t>(fs::file_size(path)));
  std::ifstream(path, std::ios::binary).read(reinterpret_cast<char*>(bytes.data()), static_cast<std::streamsize>(bytes.size()));
  app::PhotoLoader loader(2);
  loader.request_bytes("thumb", "thumbnail of x.jpg", bytes, 256, 1);
  const auto got = wait_for(loader, 1);
  REQUIRE(got.size() == 1);
  REQUIRE(got[0].image);
  CHECK(got[0].image->width == 8);
  CHECK(same(pixel(*got[0].image, 7, 5), kWhite));
  CHECK(loader.cached_count() == 0);
}
