#pragma once
// Photos of a project (issue 3 "Photos"): the original file is copied byte for
// byte into the media folder beside the project under its SHA-256 name and
// never touched again; the register keeps its size, EXIF date, position and
// orientation, and a thumbnail. Markers link a photo to the defects in it.
#include <optional>
#include <cstdint>
#include <string>
#include <vector>

#include "storage/project_file.hpp"

namespace soffit::storage {

// Limits that keep one photo from filling a field laptop's memory: a 12 Mpx
// camera JPEG is 3–8 MB; 100 Mpx of RGB is 300 MB decoded.
inline constexpr long long kMaxPhotoBytes = 100LL * 1024 * 1024;
inline constexpr long long kMaxPhotoPixels = 100'000'000;
inline constexpr int kThumbnailSide = 256;

struct PhotoOptions {
  std::string inspection_id;  // empty: not yet given to a visit
  std::string caption;        // e.g. "looking up, top = DS face" (FIELD.md §6.3)
};

struct PhotoRecord {
  std::string id, content_hash, file_name, image_format;
  long long byte_size = 0;
  int width_px = 0, height_px = 0;
  std::optional<std::string> exif_taken_at;
  std::optional<double> exif_latitude_deg, exif_longitude_deg;
  std::optional<int> exif_orientation;
  bool already_present = false;  // the same bytes were added before; nothing new stored
};

// "<project path>-media", e.g. bridge.soffit-media beside bridge.soffit.
std::string media_folder(const std::string& project_path);
std::string photo_file_path(const std::string& project_path, const std::string& file_name);

// Adding a photo happens in two halves so that the slow half never touches
// the project's connection (which belongs to the UI thread, DEVELOPERS.md):
// prepare_photo reads, checks, decodes and hashes the file, reads its EXIF,
// makes the thumbnail and copies the original into the media folder;
// insert_prepared_photo then stores the row as one edit.
struct PreparedPhoto {
  std::string project_path;   // whose media folder holds the copy
  std::string original_name;  // the name it was added under, e.g. IMG_0001.JPG
  PhotoRecord record;         // every fact but the row's id
  std::vector<uint8_t> thumbnail_png;
  bool created_media_file = false;  // this preparation wrote the copy (it was not there before)
};

// Files only, no Connection: safe on a worker while the project stays open
// on the UI thread. Refuses, with StorageError(invalid) naming the file and
// writing nothing, a missing (not_found), empty, oversized,
// not-JPEG-or-PNG or undecodable file. The copy is written through a
// temporary file and renamed, so the media folder never holds half a photo.
PreparedPhoto prepare_photo(const std::string& project_path, const std::string& path);

// UI thread. If the same bytes are stored already, returns that photo
// (already_present) and stores nothing; else inserts the row as one edit
// (one undo step). If it fails, the media file is removed again, but only if
// prepare_photo created it: a copy that was there before may belong to a row.
PhotoRecord insert_prepared_photo(Project& project, const PreparedPhoto& prepared, const PhotoOptions& options = {});

// prepare_photo then insert_prepared_photo, for the command line and tests.
// A project open for viewing is refused before the media folder is written.
PhotoRecord add_photo(Project& project, const std::string& path, const PhotoOptions& options = {});

// Marks where on the photo the defect is: x, y from 0 to 1 across and down
// the photo as seen (EXIF orientation applied); no marker = the whole photo.
// Call inside Project::edit.
struct PhotoMarker {
  double x = 0.5, y = 0.5;
};
std::string link_photo_to_defect(Connection& db, const std::string& author, const std::string& photo_id,
                                 const std::string& defect_id, const std::optional<PhotoMarker>& marker);

}  // namespace soffit::storage
