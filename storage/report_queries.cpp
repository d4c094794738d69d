#include "storage/report_queries.hpp"

#include "storage/sqlite_statement.hpp"

namespace soffit::storage {

std::vector<std::vector<DefectThumbnail>> load_defect_thumbnails(Connection& db, const InspectionExportData& data) {
  // Same ORDER BY as defects_of in export_queries.cpp, so row k is data.defects[k].
  Statement defects(db, "SELECT id FROM defect WHERE inspection_id = ?1 ORDER BY ref, rowid");
  defects.bind(1, data.inspection.id);
  std::vector<std::string> ids;
  while (defects.step()) ids.push_back(defects.column_text(0));

  std::vector<std::vector<DefectThumbnail>> out(data.defects.size());
  if (ids.size() != data.defects.size()) return out;  // changed under us: show no photos rather than wrong ones
  Statement photos(db,
                   "SELECT p.caption, p.thumbnail_png FROM photo_defect l JOIN photo p ON p.id = l.photo_id "
                   "WHERE l.defect_id = ?1 ORDER BY l.rowid");
  for (size_t k = 0; k < ids.size(); ++k) {
    photos.reset();
    photos.bind(1, ids[k]);
    while (photos.step()) {
      const std::vector<unsigned char> blob = photos.column_blob(1);
      out[k].push_back({photos.column_text(0), std::string(blob.begin(), blob.end())});
    }
  }
  return out;
}

}  // namespace soffit::storage
