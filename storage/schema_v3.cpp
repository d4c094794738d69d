#include "storage/schema.hpp"

namespace soffit::storage {
namespace {

// Layout 2 → 3. Layout 1 made the rows of an issued inspection read-only
// (sections, readings, ring counts, fill depths, defects) but left its
// photos and the links that place its defects on photos open to change.
// These guards close that: a link whose defect belongs to an issued
// inspection cannot be added, changed or removed, and a photo given to an
// issued inspection cannot be added, changed or removed. Each UPDATE guard looks at
// the row before and after, so a row cannot be moved into an issued
// inspection either.
//
// A revision (inspection_revision.cpp) copies the links onto the defects of
// the new draft inspection and leaves the photos where they are: the copies
// are links of a draft, so they pass, and the photos are not written.
//
// A new photo row given to an issued inspection is refused as well. And the
// layout 1 UPDATE guards looked only at the row before the change: a draft
// row could be moved into an issued inspection. The "move_in" guards close that.
// The message is the one the layout 1 guards give (schema.cpp).
constexpr const char* kLayout3Step = R"SQL(
CREATE TRIGGER photo_defect_issued_no_INSERT BEFORE INSERT ON photo_defect
WHEN (SELECT i.status FROM defect d JOIN inspection i ON i.id = d.inspection_id WHERE d.id = NEW.defect_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;
CREATE TRIGGER photo_defect_issued_no_UPDATE BEFORE UPDATE ON photo_defect
WHEN (SELECT i.status FROM defect d JOIN inspection i ON i.id = d.inspection_id WHERE d.id = OLD.defect_id) = 'issued'
  OR (SELECT i.status FROM defect d JOIN inspection i ON i.id = d.inspection_id WHERE d.id = NEW.defect_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;
CREATE TRIGGER photo_defect_issued_no_DELETE BEFORE DELETE ON photo_defect
WHEN (SELECT i.status FROM defect d JOIN inspection i ON i.id = d.inspection_id WHERE d.id = OLD.defect_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;

CREATE TRIGGER photo_issued_no_INSERT BEFORE INSERT ON photo
WHEN (SELECT status FROM inspection WHERE id = NEW.inspection_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;
CREATE TRIGGER photo_issued_no_UPDATE BEFORE UPDATE ON photo
WHEN (SELECT status FROM inspection WHERE id = OLD.inspection_id) = 'issued'
  OR (SELECT status FROM inspection WHERE id = NEW.inspection_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;
CREATE TRIGGER section_survey_issued_no_move_in BEFORE UPDATE ON section_survey
WHEN (SELECT status FROM inspection WHERE id = NEW.inspection_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;
CREATE TRIGGER ring_count_issued_no_move_in BEFORE UPDATE ON ring_count
WHEN (SELECT status FROM inspection WHERE id = NEW.inspection_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;
CREATE TRIGGER fill_depth_issued_no_move_in BEFORE UPDATE ON fill_depth
WHEN (SELECT status FROM inspection WHERE id = NEW.inspection_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;
CREATE TRIGGER defect_issued_no_move_in BEFORE UPDATE ON defect
WHEN (SELECT status FROM inspection WHERE id = NEW.inspection_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;
CREATE TRIGGER reading_issued_no_move_in BEFORE UPDATE ON reading
WHEN (SELECT i.status FROM section_survey s JOIN inspection i ON i.id = s.inspection_id WHERE s.id = NEW.section_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;

CREATE TRIGGER photo_issued_no_DELETE BEFORE DELETE ON photo
WHEN (SELECT status FROM inspection WHERE id = OLD.inspection_id) = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;
)SQL";

}  // namespace

const std::string& schema_v2_to_v3_sql() {
  static const std::string sql = kLayout3Step;
  return sql;
}

}  // namespace soffit::storage
