// Photos in the media folder (issue 3 "Photos"; "corrupt, huge and empty
// photos"): originals byte for byte under their SHA-256 name, size and
// thumbnail from the decoded image, EXIF facts from the file, refusals that
// leave no row and no file, and markers linking a photo to a defect.
#include <doctest/doctest.h>
#include <stb_image.h>
#include <stb_image_write.h>
#include <unistd.h>

#include <cmath>
#include <filesystem>
#include <exception>
#include <memory>
#include <thread>

#include "storage/observation_edits.hpp"
#include "storage/photo_store.hpp"
#include "storage/register_edits.hpp"
#include "storage/sha256.hpp"
#include "storage/sqlite_statement.hpp"
#include "tests/storage/exif_test_image.hpp"
#include "tests/storage/temp_project_dir.hpp"

using namespace soffit::storage;
using soffit::test::TempDir;
namespace fs = std::filesystem;

namespace {

// A 1-pixel checkerboard of black and white: every 2 × 2 box averages to
// 127.5, which rounds to 128.
std::vector<uint8_t> checkerboard(int w, int h) {
  std::vector<uint8_t> rgb(size_t(w) * size_t(h) * 3);
  for (int y = 0; y < h; ++y)
    for (int x = 0; x < w; ++x)
      for (int c = 0; c < 3; ++c) rgb[(size_t(y) * size_t(w) + size_t(x)) * 3 + size_t(c)] = ((x + y) % 2) ? 255 : 0;
  return rgb;
}

void append(void* ctx, void* data, int size) {
  auto* out = static_cast<std::vector<uint8_t>*>(ctx);
  out->insert(out->end(), static_cast<uint8_t*>(data), static_cast<uint8_t*>(data) + size);
}

std::vector<uint8_t> jpeg_bytes(int w, int h) {
  std::vector<uint8_t> rgb(size_t(w) * size_t(h) * 3);
  for (size_t i = 0; i < rgb.size(); ++i) rgb[i] = static_cast<uint8_t>(i * 7 % 251);
  std::vector<uint8_t> out;
  REQUIRE(stbi_write_jpg_to_func(append, &out, w, h, 3, rgb.data(), 90) != 0);
  return out;
}

void write_file(const std::string& path, const std::vector<uint8_t>& bytes) {
  soffit::test::write_bytes(path, std::string(bytes.begin(), bytes.end()));
}

struct Decoded {
  int w = 0, h = 0;
  std::vector<uint8_t> rgb;
};

Decoded decode_png(const std::vector<unsigned char>& png) {
  Decoded d;
  int comp = 0;
  std::unique_ptr<unsigned char, void (*)(void*)> p(
      stbi_load_from_memory(png.data(), static_cast<int>(png.size()), &d.w, &d.h, &comp, 3), stbi_image_free);
  REQUIRE(p != nullptr);
  d.rgb.assign(p.get(), p.get() + size_t(d.w) * size_t(d.h) * 3);
  return d;
}

long long photo_rows(Project& p) { return p.db().query_int("SELECT count(*) FROM photo"); }

size_t media_files(Project& p) {
  const std::string folder = media_folder(p.path());
  if (!fs::exists(folder)) return 0;
  return static_cast<size_t>(std::distance(fs::directory_iterator(folder), fs::directory_iterator()));
}

std::string refusal(Project& p, const std::string& path) {
  try {
    add_photo(p, path);
  } catch (const StorageError& e) {
    return e.what();
  }
  return "<accepted>";
}

}  // namespace

TEST_CASE("a PNG is copied byte for byte under its SHA-256 name with a box-averaged thumbnail") {
  TempDir dir;
  Project p = Project::create(dir.file("photos.soffit"), "J. Okafor");
  const std::string src = dir.file("IMG_0001.png");
  const auto pixels = checkerboard(600, 300);
  REQUIRE(stbi_write_png(src.c_str(), 600, 300, 3, pixels.data(), 600 * 3) != 0);
  const std::string original = soffit::test::read_bytes(src);

  const PhotoRecord r = add_photo(p, src, {"", "looking up, top = DS face"});
  CHECK(r.image_format == "png");
  CHECK(r.width_px == 600);
  CHECK(r.height_px == 300);
  CHECK(r.content_hash == sha256_hex(original.data(), original.size()));
  CHECK(r.file_name == r.content_hash + ".png");
  const std::string stored = photo_file_path(p.path(), r.file_name);
  CHECK(stored == dir.file("photos.soffit-media/") + r.file_name);
  CHECK(soffit::test::read_bytes(stored) == original);
  CHECK(soffit::test::read_bytes(src) == original);  // the source is left as it was

  Statement q(p.db(), "SELECT thumbnail_png, byte_size, caption, original_name FROM photo WHERE id = ?1");
  q.bind(1, r.id);
  REQUIRE(q.step());
  const Decoded t = decode_png(q.column_blob(0));
  // 600 px → a whole factor of 3 gives 200 × 100; 3 × 3 boxes of a checkerboard hold 4 or 5 white pixels.
  CHECK(t.w == 200);
  CHECK(t.h == 100);
  const int first = t.rgb[0];  // box at (0,0) holds 4 white of 9: 113.3 → 113
  CHECK(first == 113);
  CHECK(int(t.rgb[3]) == 142);  // box at (1,0) starts on white: 5 of 9 → 141.7 → 142
  CHECK(q.column_int64(1) == static_cast<long long>(original.size()));
  CHECK(q.column_text(2) == "looking up, top = DS face");
  CHECK(q.column_text(3) == "IMG_0001.png");

  // The same bytes again: the stored photo, not a second copy.
  const PhotoRecord again = add_photo(p, src);
  CHECK(again.already_present);
  CHECK(again.id == r.id);
  CHECK(photo_rows(p) == 1);
  CHECK(media_files(p) == 1);

  // Undo removes the row; the content-addressed file may stay and is reused.
  REQUIRE(p.undo());
  CHECK(photo_rows(p) == 0);
  const PhotoRecord back = add_photo(p, src);
  CHECK_FALSE(back.already_present);
  CHECK(media_files(p) == 1);
}

TEST_CASE("a JPEG from stb_image_write has no EXIF - with an APP1 segment its facts are stored and the thumbnail turned") {
  TempDir dir;
  Project p = Project::create(dir.file("jpeg.soffit"), "J. Okafor");
  const auto plain = jpeg_bytes(320, 200);
  write_file(dir.file("plain.jpg"), plain);
  const PhotoRecord a = add_photo(p, dir.file("plain.jpg"));
  CHECK(a.image_format == "jpeg");
  CHECK(a.file_name == a.content_hash + ".jpg");
  CHECK_FALSE(a.exif_taken_at.has_value());
  CHECK_FALSE(a.exif_orientation.has_value());

  const auto exif = soffit::test::with_app1(plain, soffit::test::app1_segment(soffit::test::exif_tiff({})));
  write_file(dir.file("exif.jpg"), exif);
  const PhotoRecord b = add_photo(p, dir.file("exif.jpg"));
  CHECK(b.width_px == 320);  // stb decodes through the APP1 segment
  Statement q(p.db(), "SELECT exif_taken_at, exif_latitude_deg, exif_longitude_deg, exif_orientation, thumbnail_png "
                      "FROM photo WHERE id = ?1");
  q.bind(1, b.id);
  REQUIRE(q.step());
  CHECK(q.column_text(0) == "2025-05-21T10:14:03");
  CHECK(std::abs(q.column_double(1) - 51.477811111) < 1e-8);  // 51° 28' 40.12" N
  CHECK(std::abs(q.column_double(2) - -2.084808333) < 1e-8);  // 2° 5' 5.31" W
  CHECK(q.column_int64(3) == 6);
  const Decoded t = decode_png(q.column_blob(4));
  // Orientation 6 is viewed turned a quarter clockwise: 320 × 200 → 2 × (100 × 160).
  CHECK(t.w == 100);
  CHECK(t.h == 160);
  CHECK(soffit::test::read_bytes(photo_file_path(p.path(), b.file_name)) == std::string(exif.begin(), exif.end()));
}

TEST_CASE("empty, corrupt, foreign, oversized and missing files are refused with no row and no file") {
  TempDir dir;
  Project p = Project::create(dir.file("refuse.soffit"), "J. Okafor");
  write_file(dir.file("empty.jpg"), {});
  CHECK(refusal(p, dir.file("empty.jpg")).find("empty.jpg: not added: the file is empty") != std::string::npos);

  auto corrupt = jpeg_bytes(64, 64);
  corrupt.resize(40);  // the header survives, the image does not
  write_file(dir.file("cut.jpg"), corrupt);
  CHECK(refusal(p, dir.file("cut.jpg")).find("damaged or unreadable") != std::string::npos);

  std::vector<uint8_t> png_garbage = {0x89, 'P', 'N', 'G', 0x0D, 0x0A, 0x1A, 0x0A};
  for (int i = 0; i < 500; ++i) png_garbage.push_back(static_cast<uint8_t>(i * 31));
  write_file(dir.file("garbage.png"), png_garbage);
  CHECK(refusal(p, dir.file("garbage.png")).find("damaged or unreadable") != std::string::npos);

  soffit::test::write_bytes(dir.file("notes.jpg"), "site notes, not a photo\n");
  CHECK(refusal(p, dir.file("notes.jpg")).find("not a JPEG or PNG photo") != std::string::npos);

  // A PNG header claiming 12000 × 9000 = 108 Mpx (PNG spec §11.2.2 IHDR), with no image data:
  // refused from the header alone, before any decoding.
  std::vector<uint8_t> huge = {0x89, 'P', 'N', 'G', 0x0D, 0x0A, 0x1A, 0x0A, 0, 0, 0, 13, 'I', 'H', 'D', 'R',
                               0, 0, 0x2E, 0xE0, 0, 0, 0x23, 0x28, 8, 2, 0, 0, 0, 0, 0, 0, 0};
  write_file(dir.file("huge_pixels.png"), huge);
  const std::string huge_refusal = refusal(p, dir.file("huge_pixels.png"));
  CHECK_MESSAGE(huge_refusal.find("12000 × 9000 pixels; photos are limited to 100 megapixels") != std::string::npos,
                huge_refusal);

  // 101 MB on disk (a sparse file: cheap to make).
  const std::string big = dir.file("huge.jpg");
  write_file(big, jpeg_bytes(16, 16));
  REQUIRE(::truncate(big.c_str(), 101LL * 1024 * 1024) == 0);
  CHECK(refusal(p, big).find("limited to 100 MB") != std::string::npos);

  try {
    add_photo(p, dir.file("absent.jpg"));
    FAIL("added a missing file");
  } catch (const StorageError& e) {
    CHECK(e.kind() == ErrorKind::not_found);
  }
  CHECK(photo_rows(p) == 0);
  CHECK(media_files(p) == 0);
  CHECK(p.undo_label() == "");
}

TEST_CASE("a photo is linked to a defect with a marker, in one undo step - a bad marker is refused") {
  TempDir dir;
  Project p = Project::create(dir.file("markers.soffit"), "J. Okafor");
  write_file(dir.file("d08.jpg"), jpeg_bytes(64, 48));
  std::string inspection, defect;
  p.edit("set up", [&](Connection& db) {
    StructureFields f;
    f.ref = "BVDC-ST-0417";
    const std::string s = insert_structure(db, p.author(), f);
    inspection = ensure_inspection(db, p.author(), s, "2025-05-21");
    DefectFields d;  // FIELD.md §10.4 D08
    d.inspection_id = inspection;
    d.ref = "D08";
    d.defect_type = "scour";
    d.element = "pier";
    d.frame = DefectFrame::elevation;
    d.frame_origin = "pier upstream nose, x from the nose, z from the footing top";
    d.geometry = DefectGeometry::area;
    d.points = {{-0.45, -0.25}, {0.45, -0.25}, {0.45, 0.0}, {-0.45, 0.0}};
    defect = add_defect(db, p.author(), d);
  });
  const PhotoRecord photo = add_photo(p, dir.file("d08.jpg"), {inspection, "from the upstream bank, looking N"});
  p.edit("mark", [&](Connection& db) { link_photo_to_defect(db, p.author(), photo.id, defect, PhotoMarker{0.4, 0.7}); });
  CHECK(p.db().query_text("SELECT marker_json FROM photo_defect") == "{\"x\":0.400000,\"y\":0.700000}");
  CHECK(p.db().query_text("SELECT inspection_id FROM photo") == inspection);
  REQUIRE(p.undo());
  CHECK(p.db().query_int("SELECT count(*) FROM photo_defect") == 0);
  CHECK_THROWS_AS(p.edit("bad", [&](Connection& db) {
    link_photo_to_defect(db, p.author(), photo.id, defect, PhotoMarker{1.5, 0.2});
  }), StorageError);
  p.edit("whole photo", [&](Connection& db) { link_photo_to_defect(db, p.author(), photo.id, defect, std::nullopt); });
  CHECK(p.db().query_int("SELECT count(*) FROM photo_defect WHERE marker_json IS NULL") == 1);
}

TEST_CASE("a project open for viewing refuses new photos without writing the media folder") {
  TempDir dir;
  const std::string path = dir.file("view.soffit");
  { Project::create(path, "J. Okafor"); }
  write_file(dir.file("a.jpg"), jpeg_bytes(32, 32));
  Project p = Project::open(path, "J. Okafor", Access::view);
  try {
    add_photo(p, dir.file("a.jpg"));
    FAIL("added a photo to a project open for viewing");
  } catch (const StorageError& e) {
    CHECK(e.kind() == ErrorKind::read_only);
  }
  CHECK_FALSE(fs::exists(media_folder(path)));
}

TEST_CASE("prepare_photo runs on a worker thread while the project is used on this one - the row comes after") {
  TempDir dir;
  Project p = Project::create(dir.file("worker.soffit"), "J. Okafor");
  const std::string src = dir.file("IMG_0002.png");
  const auto pixels = checkerboard(600, 300);
  REQUIRE(stbi_write_png(src.c_str(), 600, 300, 3, pixels.data(), 600 * 3) != 0);
  const std::string original = soffit::test::read_bytes(src);

  PreparedPhoto prepared;
  std::exception_ptr failure;
  std::thread worker([&, project_path = p.path()] {
    try {
      prepared = prepare_photo(project_path, src);  // paths only: the worker never sees the connection
    } catch (...) {
      failure = std::current_exception();
    }
  });
  // Meanwhile the project is edited here, on its own thread, as the UI does.
  p.edit("add structure", [&](Connection& db) {
    StructureFields f;
    f.ref = "BVDC-ST-0417";
    insert_structure(db, p.author(), f);
  });
  worker.join();
  REQUIRE_FALSE(failure);

  // Prepared: the copy is in the media folder, the project has no row yet.
  CHECK(prepared.created_media_file);
  CHECK(prepared.original_name == "IMG_0002.png");
  CHECK(prepared.record.id.empty());
  CHECK(prepared.record.content_hash == sha256_hex(original.data(), original.size()));
  CHECK(soffit::test::read_bytes(photo_file_path(p.path(), prepared.record.file_name)) == original);
  const Decoded t = decode_png(prepared.thumbnail_png);
  CHECK(t.w == 200);  // 600 × 300 in 3 × 3 boxes, as in the first test
  CHECK(t.h == 100);
  CHECK(photo_rows(p) == 0);
  CHECK(p.undo_label() == "add structure");

  const PhotoRecord r = insert_prepared_photo(p, prepared, {"", "looking up, top = DS face"});
  CHECK_FALSE(r.already_present);
  CHECK_FALSE(r.id.empty());
  CHECK(p.undo_label() == "add photo IMG_0002.png");  // one edit, its own undo step
  Statement q(p.db(), "SELECT original_name, caption, width_px, height_px, byte_size FROM photo WHERE id = ?1");
  q.bind(1, r.id);
  REQUIRE(q.step());
  CHECK(q.column_text(0) == "IMG_0002.png");
  CHECK(q.column_text(1) == "looking up, top = DS face");
  CHECK(q.column_int64(2) == 600);
  CHECK(q.column_int64(3) == 300);
  CHECK(q.column_int64(4) == static_cast<long long>(original.size()));
  REQUIRE(p.undo());
  CHECK(photo_rows(p) == 0);
  CHECK(p.db().query_int("SELECT count(*) FROM structure") == 1);  // the other edit stays
}

TEST_CASE("photo import: a refused file leaves no media file - a failed insert removes only the copy it made") {
  TempDir dir;
  Project p = Project::create(dir.file("prepare_refuse.soffit"), "J. Okafor");
  auto corrupt = jpeg_bytes(64, 64);
  corrupt.resize(40);
  write_file(dir.file("cut.jpg"), corrupt);
  try {
    prepare_photo(p.path(), dir.file("cut.jpg"));
    FAIL("prepared a damaged file");
  } catch (const StorageError& e) {
    CHECK(e.kind() == ErrorKind::invalid);
    CHECK(std::string(e.what()).find("cut.jpg: not added: the image is damaged or unreadable") != std::string::npos);
  }
  CHECK_FALSE(fs::exists(media_folder(p.path())));
  CHECK(photo_rows(p) == 0);

  // A visit that does not exist breaks the row's foreign key, so the insert
  // fails: the copy this preparation made goes with it.
  write_file(dir.file("d04.jpg"), jpeg_bytes(48, 32));
  const PreparedPhoto first = prepare_photo(p.path(), dir.file("d04.jpg"));
  REQUIRE(first.created_media_file);
  CHECK(media_files(p) == 1);
  CHECK_THROWS_AS(insert_prepared_photo(p, first, {"no-such-visit", ""}), StorageError);
  CHECK(media_files(p) == 0);
  CHECK(photo_rows(p) == 0);
  CHECK(p.undo_label() == "");

  // A copy that was there before (here: stored, then undone, so redo still
  // needs it) stays when a later insert of the same bytes fails.
  const PhotoRecord stored = add_photo(p, dir.file("d04.jpg"));
  REQUIRE(p.undo());
  const PreparedPhoto again = prepare_photo(p.path(), dir.file("d04.jpg"));
  CHECK_FALSE(again.created_media_file);
  CHECK_THROWS_AS(insert_prepared_photo(p, again, {"no-such-visit", ""}), StorageError);
  CHECK(fs::exists(photo_file_path(p.path(), stored.file_name)));
  REQUIRE(p.redo());
  CHECK(photo_rows(p) == 1);

  // A photo prepared for one project is not stored in another.
  Project other = Project::create(dir.file("other.soffit"), "J. Okafor");
  write_file(dir.file("d05.jpg"), jpeg_bytes(40, 40));
  const PreparedPhoto elsewhere = prepare_photo(p.path(), dir.file("d05.jpg"));
  CHECK_THROWS_AS(insert_prepared_photo(other, elsewhere), StorageError);
  CHECK(media_files(p) == 1);  // d04 only: the d05 copy went again
  CHECK(photo_rows(other) == 0);
}

TEST_CASE("photo import: the same bytes prepared twice are one file and one row - the second insert is already_present") {
  TempDir dir;
  Project p = Project::create(dir.file("twice.soffit"), "J. Okafor");
  write_file(dir.file("DSC_0101.jpg"), jpeg_bytes(64, 48));
  fs::copy_file(dir.file("DSC_0101.jpg"), dir.file("DSC_0101 (copy).jpg"));
  // Both prepared before either is stored, as two quick imports would be.
  const PreparedPhoto a = prepare_photo(p.path(), dir.file("DSC_0101.jpg"));
  const PreparedPhoto b = prepare_photo(p.path(), dir.file("DSC_0101 (copy).jpg"));
  CHECK(a.created_media_file);
  CHECK_FALSE(b.created_media_file);
  CHECK(a.record.file_name == b.record.file_name);
  const PhotoRecord first = insert_prepared_photo(p, a);
  const PhotoRecord second = insert_prepared_photo(p, b);
  CHECK_FALSE(first.already_present);
  CHECK(second.already_present);
  CHECK(second.id == first.id);
  CHECK(photo_rows(p) == 1);
  CHECK(media_files(p) == 1);
  CHECK(p.db().query_text("SELECT original_name FROM photo") == "DSC_0101.jpg");
  CHECK(p.undo_label() == "add photo DSC_0101.jpg");  // the second stored nothing, so no second undo step
}
