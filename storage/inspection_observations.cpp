#include "storage/inspection_observations.hpp"

#include "storage/sqlite_statement.hpp"

namespace soffit::storage {

InspectionObservations inspection_observations(Connection& db, const std::string& inspection_id) {
  InspectionObservations o;
  {
    Statement q(db,
                "SELECT coalesce(p.label, 'S' || p.span_index), r.face, r.position, r.rings, r.unit_depth_mm, "
                "r.thickness_mm, r.confidence FROM ring_count r JOIN span p ON p.id = r.span_id "
                "WHERE r.inspection_id = ?1 ORDER BY p.span_index, r.face, r.position");
    q.bind(1, inspection_id);
    while (q.step()) {
      o.ring_counts.push_back({q.column_text(0), q.column_text(1), q.column_text(2),
                               static_cast<int>(q.column_int64(3)), q.column_double_or_null(4),
                               q.column_double_or_null(5), q.column_text(6)});
    }
  }
  {
    Statement q(db,
                "SELECT coalesce(p.label, 'S' || p.span_index), f.chainage_m, f.method, f.depth_m, f.uncertainty_m "
                "FROM fill_depth f JOIN span p ON p.id = f.span_id WHERE f.inspection_id = ?1 "
                "ORDER BY p.span_index, f.chainage_m");
    q.bind(1, inspection_id);
    while (q.step()) {
      o.fill_depths.push_back(
          {q.column_text(0), q.column_double(1), q.column_text(2), q.column_double(3), q.column_double_or_null(4)});
    }
  }
  Statement q(db,
              "SELECT coalesce(d.ref, ''), coalesce(p.label, ''), d.defect_type, d.element, d.severity_scale, "
              "d.severity, d.length_m, d.width_mm, d.area_m2, "
              "(SELECT count(*) FROM photo_defect pd WHERE pd.defect_id = d.id) "
              "FROM defect d LEFT JOIN span p ON p.id = d.span_id WHERE d.inspection_id = ?1 "
              "ORDER BY d.ref, d.defect_type");
  q.bind(1, inspection_id);
  while (q.step()) {
    DefectRow d;
    d.ref = q.column_text(0);
    d.span_label = q.column_text(1);
    d.defect_type = q.column_text(2);
    d.element = q.column_text(3);
    d.severity_scale = q.column_text(4);
    d.severity = q.column_int_or_null(5);
    d.length_m = q.column_double_or_null(6);
    d.width_mm = q.column_double_or_null(7);
    d.area_m2 = q.column_double_or_null(8);
    d.photo_count = static_cast<int>(q.column_int64(9));
    o.defects.push_back(std::move(d));
  }
  return o;
}

}  // namespace soffit::storage
