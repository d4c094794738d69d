#include "storage/schema.hpp"

namespace soffit::storage {
namespace {

// Layout 1 → 2. Photos gain what add_photo learns from the image (format,
// size, a cached thumbnail); structures, inspections and defects gain
// full-text search.
//
// The search tables are FTS5 "external content" tables (sqlite.org/fts5.html
// §4.4.3): they index the register's own rows by rowid and store no second
// copy of the text; the triggers below keep them in step with every insert,
// update and delete, including those made by undo and redo (changeset apply
// fires triggers like any other write). Because the register tables have
// TEXT keys, their rowids are not stable across VACUUM: Soffit never runs
// VACUUM, and rebuild_search_index (register_search.hpp) repairs the index
// if anyone else does.
constexpr const char* kLayout2Step = R"SQL(
ALTER TABLE photo ADD COLUMN file_name TEXT;       -- in the media folder: content hash + extension
ALTER TABLE photo ADD COLUMN image_format TEXT CHECK (image_format IS NULL OR image_format IN ('jpeg', 'png'));
ALTER TABLE photo ADD COLUMN width_px INTEGER CHECK (width_px IS NULL OR width_px > 0);    -- as stored, before
ALTER TABLE photo ADD COLUMN height_px INTEGER CHECK (height_px IS NULL OR height_px > 0);  -- EXIF rotation
ALTER TABLE photo ADD COLUMN thumbnail_png BLOB;  -- at most 256 px, EXIF orientation applied

CREATE VIRTUAL TABLE structure_search USING fts5(
  ref, name, notes, content = 'structure', content_rowid = 'rowid',
  tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3');
CREATE VIRTUAL TABLE inspection_search USING fts5(
  notes, parts_not_inspected, content = 'inspection', content_rowid = 'rowid',
  tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3');
CREATE VIRTUAL TABLE defect_search USING fts5(
  ref, defect_type, element, notes, content = 'defect', content_rowid = 'rowid',
  tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3');

CREATE TRIGGER structure_search_insert AFTER INSERT ON structure BEGIN
  INSERT INTO structure_search (rowid, ref, name, notes) VALUES (NEW.rowid, NEW.ref, NEW.name, NEW.notes);
END;
CREATE TRIGGER structure_search_delete AFTER DELETE ON structure BEGIN
  INSERT INTO structure_search (structure_search, rowid, ref, name, notes)
  VALUES ('delete', OLD.rowid, OLD.ref, OLD.name, OLD.notes);
END;
CREATE TRIGGER structure_search_update AFTER UPDATE OF ref, name, notes ON structure BEGIN
  INSERT INTO structure_search (structure_search, rowid, ref, name, notes)
  VALUES ('delete', OLD.rowid, OLD.ref, OLD.name, OLD.notes);
  INSERT INTO structure_search (rowid, ref, name, notes) VALUES (NEW.rowid, NEW.ref, NEW.name, NEW.notes);
END;

CREATE TRIGGER inspection_search_insert AFTER INSERT ON inspection BEGIN
  INSERT INTO inspection_search (rowid, notes, parts_not_inspected)
  VALUES (NEW.rowid, NEW.notes, NEW.parts_not_inspected);
END;
CREATE TRIGGER inspection_search_delete AFTER DELETE ON inspection BEGIN
  INSERT INTO inspection_search (inspection_search, rowid, notes, parts_not_inspected)
  VALUES ('delete', OLD.rowid, OLD.notes, OLD.parts_not_inspected);
END;
CREATE TRIGGER inspection_search_update AFTER UPDATE OF notes, parts_not_inspected ON inspection BEGIN
  INSERT INTO inspection_search (inspection_search, rowid, notes, parts_not_inspected)
  VALUES ('delete', OLD.rowid, OLD.notes, OLD.parts_not_inspected);
  INSERT INTO inspection_search (rowid, notes, parts_not_inspected)
  VALUES (NEW.rowid, NEW.notes, NEW.parts_not_inspected);
END;

CREATE TRIGGER defect_search_insert AFTER INSERT ON defect BEGIN
  INSERT INTO defect_search (rowid, ref, defect_type, element, notes)
  VALUES (NEW.rowid, NEW.ref, NEW.defect_type, NEW.element, NEW.notes);
END;
CREATE TRIGGER defect_search_delete AFTER DELETE ON defect BEGIN
  INSERT INTO defect_search (defect_search, rowid, ref, defect_type, element, notes)
  VALUES ('delete', OLD.rowid, OLD.ref, OLD.defect_type, OLD.element, OLD.notes);
END;
CREATE TRIGGER defect_search_update AFTER UPDATE OF ref, defect_type, element, notes ON defect BEGIN
  INSERT INTO defect_search (defect_search, rowid, ref, defect_type, element, notes)
  VALUES ('delete', OLD.rowid, OLD.ref, OLD.defect_type, OLD.element, OLD.notes);
  INSERT INTO defect_search (rowid, ref, defect_type, element, notes)
  VALUES (NEW.rowid, NEW.ref, NEW.defect_type, NEW.element, NEW.notes);
END;

-- Rows already in a layout 1 file enter the index here.
INSERT INTO structure_search (structure_search) VALUES ('rebuild');
INSERT INTO inspection_search (inspection_search) VALUES ('rebuild');
INSERT INTO defect_search (defect_search) VALUES ('rebuild');

CREATE INDEX photo_defect_by_photo ON photo_defect(photo_id);
CREATE INDEX inspection_by_supersedes ON inspection(supersedes_id);
)SQL";

}  // namespace

const std::string& schema_v1_to_v2_sql() {
  static const std::string sql = kLayout2Step;
  return sql;
}

}  // namespace soffit::storage
