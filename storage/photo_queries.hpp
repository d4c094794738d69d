#pragma once
// The photos of one visit as the photo viewer shows them: each photo's facts,
// its cached thumbnail and the markers that place this visit's defects on it;
// and the visit's defects a photo can be linked to. Also the edits the viewer
// makes beside link_photo_to_defect (photo_store.hpp). Edits take a Connection
// and are meant to run inside Project::edit (one undo step).
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "storage/photo_store.hpp"
#include "storage/sqlite_connection.hpp"

namespace soffit::storage {

struct PhotoDefectLink {
  std::string link_id, defect_id, defect_ref;
  // Where on the photo as seen (EXIF orientation applied), 0–1 across and
  // down; nullopt: the link names the whole photo, or its marker_json has no
  // usable x and y (marker_problem says which).
  std::optional<PhotoMarker> marker;
  std::string marker_problem;
};

struct VisitPhoto {
  std::string id, file_name, original_name, caption, image_format;
  std::optional<std::string> exif_taken_at;
  long long byte_size = 0;
  int width_px = 0, height_px = 0;  // as stored, before EXIF rotation
  int orientation = 1;              // EXIF 1–8; 1 when the file has none
  std::vector<uint8_t> thumbnail_png;
  std::vector<PhotoDefectLink> links;  // to defects of this visit, by defect reference
};

struct VisitDefectChoice {
  std::string id, ref, defect_type, element;
};

struct VisitPhotos {
  std::string inspection_id, date, status;  // status: draft, checked or issued
  std::vector<VisitPhoto> photos;           // by EXIF date, then the order they were added
  std::vector<VisitDefectChoice> defects;   // by reference
};

// Photos given to the visit, and photos linked to its defects (a revision's
// defects keep the photos of the visit they correct). Throws
// StorageError(not_found) when there is no such inspection.
VisitPhotos load_visit_photos(Connection& db, const std::string& inspection_id);

// Removes the link between a photo and a defect (its marker with it); throws
// StorageError(not_found) when there is none.
void unlink_photo_from_defect(Connection& db, const std::string& photo_id, const std::string& defect_id);

// Gives a photo that belongs to no visit to `inspection_id` (add_photo of
// bytes already stored keeps the first row as it is); false when it already
// belongs to a visit.
bool give_photo_to_visit(Connection& db, const std::string& author, const std::string& photo_id,
                         const std::string& inspection_id);

}  // namespace soffit::storage
