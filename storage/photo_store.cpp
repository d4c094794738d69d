#include "storage/photo_store.hpp"

#include <fcntl.h>
#include <stb_image.h>
#include <unistd.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <memory>
#include <vector>

#include "storage/exif_reader.hpp"
#include "storage/image_thumbnail.hpp"
#include "storage/row_stamp.hpp"
#include "storage/sha256.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

namespace fs = std::filesystem;

[[noreturn]] void refuse(const std::string& path, const std::string& why) {
  throw StorageError(ErrorKind::invalid, path, "not added: " + why);
}

std::vector<uint8_t> read_photo_bytes(const std::string& path) {
  std::error_code ec;
  const auto status = fs::status(path, ec);
  if (ec || !fs::exists(status)) throw StorageError(ErrorKind::not_found, path, "no such photo file");
  if (!fs::is_regular_file(status)) refuse(path, "not a file");
  const auto size = fs::file_size(path, ec);
  if (ec) refuse(path, "cannot read its size (" + ec.message() + ")");
  if (size == 0) refuse(path, "the file is empty");
  if (size > static_cast<uintmax_t>(kMaxPhotoBytes))
    refuse(path, "the file is " + std::to_string(size / (1024 * 1024)) + " MB; photos are limited to " +
                     std::to_string(kMaxPhotoBytes / (1024 * 1024)) + " MB");
  std::ifstream in(path, std::ios::binary);
  std::vector<uint8_t> bytes(static_cast<size_t>(size));
  if (!in.read(reinterpret_cast<char*>(bytes.data()), static_cast<std::streamsize>(size)))
    refuse(path, "the file could not be read to its end");
  return bytes;
}

std::string format_of(const std::vector<uint8_t>& b) {
  static const uint8_t png[8] = {0x89, 'P', 'N', 'G', 0x0D, 0x0A, 0x1A, 0x0A};
  if (b.size() >= 3 && b[0] == 0xFF && b[1] == 0xD8 && b[2] == 0xFF) return "jpeg";
  if (b.size() >= 8 && std::equal(png, png + 8, b.begin())) return "png";
  return {};
}

struct StbFree {
  void operator()(unsigned char* p) const { stbi_image_free(p); }
};

RgbImage decode(const std::string& path, const std::vector<uint8_t>& bytes) {
  int w = 0, h = 0, comp = 0;
  const int n = static_cast<int>(bytes.size());
  if (!stbi_info_from_memory(bytes.data(), n, &w, &h, &comp))
    refuse(path, std::string("the image is damaged or unreadable (") + stbi_failure_reason() + ")");
  if (w <= 0 || h <= 0 || static_cast<long long>(w) * h > kMaxPhotoPixels)
    refuse(path, "the image is " + std::to_string(w) + " × " + std::to_string(h) + " pixels; photos are limited to " +
                     std::to_string(kMaxPhotoPixels / 1'000'000) + " megapixels");
  std::unique_ptr<unsigned char, StbFree> pixels(stbi_load_from_memory(bytes.data(), n, &w, &h, &comp, 3));
  if (!pixels) refuse(path, std::string("the image is damaged or unreadable (") + stbi_failure_reason() + ")");
  RgbImage image;
  image.width = w;
  image.height = h;
  image.rgb.assign(pixels.get(), pixels.get() + size_t(w) * size_t(h) * 3);
  return image;
}

// Writes the original under its final name through a temporary file, so a
// crash leaves either nothing or the whole file (rename is atomic in POSIX).
bool store_original(const std::string& folder, const std::string& name, const std::vector<uint8_t>& bytes) {
  fs::create_directories(folder);
  const std::string final_path = folder + "/" + name;
  if (fs::exists(final_path) && fs::file_size(final_path) == bytes.size()) return false;  // content-addressed
  const std::string temp = final_path + ".part-" + new_uuid();
  const int fd = ::open(temp.c_str(), O_WRONLY | O_CREAT | O_EXCL, 0644);
  if (fd < 0) throw StorageError(ErrorKind::io, temp, "cannot write into the media folder");
  size_t done = 0;
  while (done < bytes.size()) {
    const ssize_t w = ::write(fd, bytes.data() + done, bytes.size() - done);
    if (w <= 0) {
      ::close(fd);
      ::unlink(temp.c_str());
      throw StorageError(errno == ENOSPC ? ErrorKind::disk_full : ErrorKind::io, temp,
                         "cannot write the photo into the media folder");
    }
    done += static_cast<size_t>(w);
  }
  const bool synced = ::fsync(fd) == 0;
  ::close(fd);
  if (!synced || ::rename(temp.c_str(), final_path.c_str()) != 0) {
    ::unlink(temp.c_str());
    throw StorageError(ErrorKind::io, final_path, "cannot store the photo in the media folder");
  }
  if (const int dir = ::open(folder.c_str(), O_RDONLY | O_DIRECTORY); dir >= 0) {
    ::fsync(dir);  // the new name itself survives a power cut
    ::close(dir);
  }
  return true;
}

std::optional<PhotoRecord> stored_photo(Connection& db, const std::string& hash) {
  Statement q(db, "SELECT id, file_name, image_format, byte_size, width_px, height_px, exif_taken_at, "
                  "exif_latitude_deg, exif_longitude_deg, exif_orientation FROM photo WHERE content_hash = ?1");
  q.bind(1, hash);
  if (!q.step()) return std::nullopt;
  PhotoRecord r;
  r.id = q.column_text(0);
  r.content_hash = hash;
  r.file_name = q.column_text(1);
  r.image_format = q.column_text(2);
  r.byte_size = q.column_int64(3);
  r.width_px = static_cast<int>(q.column_int64(4));
  r.height_px = static_cast<int>(q.column_int64(5));
  r.exif_taken_at = q.column_text_or_null(6);
  r.exif_latitude_deg = q.column_double_or_null(7);
  r.exif_longitude_deg = q.column_double_or_null(8);
  if (auto o = q.column_int_or_null(9)) r.exif_orientation = static_cast<int>(*o);
  r.already_present = true;
  return r;
}

}  // namespace

std::string media_folder(const std::string& project_path) { return project_path + "-media"; }

std::string photo_file_path(const std::string& project_path, const std::string& file_name) {
  return media_folder(project_path) + "/" + file_name;
}

PreparedPhoto prepare_photo(const std::string& project_path, const std::string& path) {
  PreparedPhoto prepared;
  prepared.project_path = project_path;
  prepared.original_name = fs::path(path).filename().string();
  PhotoRecord& r = prepared.record;
  const std::vector<uint8_t> bytes = read_photo_bytes(path);
  r.image_format = format_of(bytes);
  if (r.image_format.empty()) refuse(path, "not a JPEG or PNG photo");
  const RgbImage image = decode(path, bytes);
  r.width_px = image.width;
  r.height_px = image.height;
  r.byte_size = static_cast<long long>(bytes.size());
  r.content_hash = sha256_hex(bytes.data(), bytes.size());
  if (r.image_format == "jpeg") {
    const ExifFacts exif = read_jpeg_exif(bytes.data(), bytes.size());
    r.exif_taken_at = exif.taken_at;
    r.exif_latitude_deg = exif.latitude_deg;
    r.exif_longitude_deg = exif.longitude_deg;
    r.exif_orientation = exif.orientation;
  }
  prepared.thumbnail_png =
      encode_png(apply_exif_orientation(box_average_down(image, kThumbnailSide), r.exif_orientation.value_or(1)));
  r.file_name = r.content_hash + (r.image_format == "jpeg" ? ".jpg" : ".png");
  // Content-addressed: the same bytes added before are already there and are not written again.
  prepared.created_media_file = store_original(media_folder(project_path), r.file_name, bytes);
  return prepared;
}

PhotoRecord insert_prepared_photo(Project& project, const PreparedPhoto& prepared, const PhotoOptions& options) {
  PhotoRecord r = prepared.record;
  try {
    if (prepared.project_path != project.path())
      throw StorageError(ErrorKind::invalid, project.path(),
                         "photo " + prepared.original_name + " was prepared for another project (" +
                             prepared.project_path + ")");
    if (project.access() != Access::edit)
      throw StorageError(ErrorKind::read_only, project.path(), "the project is open for viewing only");
    // A copy made now for a row that exists restores that row's file: it stays.
    if (auto existing = stored_photo(project.db(), r.content_hash)) return *existing;
    r.id = new_uuid();
    r.already_present = false;
    project.edit("add photo " + prepared.original_name, [&](Connection& db) {
      const std::string now = utc_now();
      Statement ins(db,
                    "INSERT INTO photo (id, inspection_id, content_hash, original_name, byte_size, exif_taken_at, "
                    "exif_latitude_deg, exif_longitude_deg, exif_orientation, caption, file_name, image_format, "
                    "width_px, height_px, thumbnail_png, created_at, modified_at, author) "
                    "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?14, ?15, ?16, ?16, ?17)");
      ins.bind_all(r.id, options.inspection_id.empty() ? std::nullopt : std::optional(options.inspection_id),
                   r.content_hash, prepared.original_name, r.byte_size, r.exif_taken_at, r.exif_latitude_deg,
                   r.exif_longitude_deg, r.exif_orientation,
                   options.caption.empty() ? std::nullopt : std::optional(options.caption), r.file_name,
                   r.image_format, r.width_px, r.height_px);
      ins.bind_blob(15, prepared.thumbnail_png.data(), static_cast<int>(prepared.thumbnail_png.size()));
      ins.bind(16, now).bind(17, project.author());
      ins.run();
    });
  } catch (...) {
    // No row refers to a file this import created: take it away again. A
    // file that was there before is left alone.
    if (prepared.created_media_file) {
      std::error_code ec;
      fs::remove(photo_file_path(prepared.project_path, r.file_name), ec);
    }
    throw;
  }
  return r;
}

PhotoRecord add_photo(Project& project, const std::string& path, const PhotoOptions& options) {
  // Checked first so that a project open for viewing gets no media folder.
  if (project.access() != Access::edit)
    throw StorageError(ErrorKind::read_only, project.path(), "the project is open for viewing only");
  return insert_prepared_photo(project, prepare_photo(project.path(), path), options);
}

std::string link_photo_to_defect(Connection& db, const std::string& author, const std::string& photo_id,
                                 const std::string& defect_id, const std::optional<PhotoMarker>& marker) {
  std::optional<std::string> marker_json;
  if (marker) {
    if (!std::isfinite(marker->x) || !std::isfinite(marker->y) || marker->x < 0 || marker->x > 1 || marker->y < 0 ||
        marker->y > 1)
      throw StorageError(ErrorKind::invalid, db.path(), "photo marker: fields 'x' and 'y' must be from 0 to 1");
    char buf[96];
    std::snprintf(buf, sizeof buf, "{\"x\":%.6f,\"y\":%.6f}", marker->x, marker->y);
    marker_json = buf;
  }
  const std::string id = new_uuid();
  Statement(db,
            "INSERT INTO photo_defect (id, photo_id, defect_id, marker_json, created_at, modified_at, author) "
            "VALUES (?1, ?2, ?3, ?4, ?5, ?5, ?6)")
      .bind_all(id, photo_id, defect_id, marker_json, utc_now(), author)
      .run();
  return id;
}

}  // namespace soffit::storage
