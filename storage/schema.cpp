#include "storage/schema.hpp"

namespace soffit::storage {
namespace {

// Every row: a UUID key, created/modified stamps (UTC ISO 8601) and the author.
// Names follow FIELD.md (trade terms). Lengths in metres unless the column
// name says _mm; widths of cracks in mm (FIELD.md units paragraph).
constexpr const char* kSchemaV1 = R"SQL(
CREATE TABLE project_meta (
  key   TEXT PRIMARY KEY,
  value TEXT
) WITHOUT ROWID;

CREATE TABLE structure (
  id            TEXT PRIMARY KEY,
  ref           TEXT NOT NULL UNIQUE CHECK (length(trim(ref)) > 0),  -- the owner's reference
  name          TEXT,
  latitude_deg  REAL CHECK (latitude_deg BETWEEN -90 AND 90),        -- WGS84 (EPSG:4326)
  longitude_deg REAL CHECK (longitude_deg BETWEEN -180 AND 180),
  location_fictitious INTEGER NOT NULL DEFAULT 0 CHECK (location_fictitious IN (0, 1)),
  carries       TEXT,
  crosses       TEXT,
  span_count    INTEGER CHECK (span_count >= 1),
  notes         TEXT,
  created_at    TEXT NOT NULL,
  modified_at   TEXT NOT NULL,
  author        TEXT NOT NULL
);

CREATE TABLE span (
  id               TEXT PRIMARY KEY,
  structure_id     TEXT NOT NULL REFERENCES structure(id) ON DELETE CASCADE,
  span_index       INTEGER NOT NULL CHECK (span_index >= 1),  -- 1 = first from the named end
  label            TEXT,                                      -- e.g. S1
  nominal_shape    TEXT,                                      -- shape family key, e.g. segmental
  barrel_width_m   REAL CHECK (barrel_width_m > 0),
  skew_deg         REAL CHECK (skew_deg > -90 AND skew_deg < 90),
  ring_material    TEXT CHECK (ring_material IN ('brick', 'stone', 'mixed', 'other')),
  unit_depth_mm    REAL CHECK (unit_depth_mm > 0),
  joint_thickness_mm REAL CHECK (joint_thickness_mm >= 0),
  fill_material    TEXT,
  surfacing_depth_m REAL CHECK (surfacing_depth_m >= 0),
  haunch_backing_height_m REAL CHECK (haunch_backing_height_m >= 0),
  spandrel_walls_json TEXT CHECK (spandrel_walls_json IS NULL OR json_valid(spandrel_walls_json)),
  supports_json    TEXT CHECK (supports_json IS NULL OR json_valid(supports_json)),  -- piers, abutments
  notes            TEXT,
  created_at TEXT NOT NULL, modified_at TEXT NOT NULL, author TEXT NOT NULL,
  UNIQUE (structure_id, span_index)
);

-- An issued inspection is read-only (triggers below); a correction is a new
-- row that supersedes it, with who, when and why.
CREATE TABLE inspection (
  id              TEXT PRIMARY KEY,
  structure_id    TEXT NOT NULL REFERENCES structure(id) ON DELETE CASCADE,
  inspection_date TEXT NOT NULL CHECK (inspection_date GLOB '[0-9][0-9][0-9][0-9]-[0-1][0-9]-[0-3][0-9]'),
  kind            TEXT,            -- general, principal, special, for assessment…
  inspector       TEXT,
  weather         TEXT,
  air_temperature_c REAL,
  instruments_json TEXT CHECK (instruments_json IS NULL OR json_valid(instruments_json)),
  parts_not_inspected TEXT,
  status          TEXT NOT NULL DEFAULT 'draft' CHECK (status IN ('draft', 'checked', 'issued')),
  revision        INTEGER NOT NULL DEFAULT 1 CHECK (revision >= 1),
  supersedes_id   TEXT REFERENCES inspection(id),
  revision_author TEXT,
  revision_at     TEXT,
  revision_reason TEXT,
  notes           TEXT,
  created_at TEXT NOT NULL, modified_at TEXT NOT NULL, author TEXT NOT NULL,
  CHECK (supersedes_id IS NULL OR (coalesce(length(trim(revision_reason)), 0) > 0
                                   AND revision_author IS NOT NULL AND revision_at IS NOT NULL))
);

CREATE TABLE section_survey (
  id            TEXT PRIMARY KEY,
  inspection_id TEXT NOT NULL REFERENCES inspection(id) ON DELETE CASCADE,
  span_id       TEXT NOT NULL REFERENCES span(id),
  label         TEXT NOT NULL CHECK (length(trim(label)) > 0),  -- MW, US, DS…
  position_m    REAL,           -- across the width, from reference_face
  reference_face TEXT,
  direction     TEXT CHECK (direction IN ('skew', 'square')),
  method        TEXT NOT NULL CHECK (method IN ('xz_list', 'offsets', 'polar', 'points')),
  datum         TEXT,
  sheet_json    TEXT NOT NULL CHECK (json_valid(sheet_json)),  -- the sheet as read, for export
  notes         TEXT,
  created_at TEXT NOT NULL, modified_at TEXT NOT NULL, author TEXT NOT NULL,
  UNIQUE (inspection_id, span_id, label)
);

-- Readings are facts (STYLE.md item 5): exclusion is a flag with a reason.
CREATE TABLE reading (
  id            TEXT PRIMARY KEY,
  section_id    TEXT NOT NULL REFERENCES section_survey(id) ON DELETE CASCADE,
  seq           INTEGER NOT NULL CHECK (seq >= 0),
  x_m           REAL NOT NULL,
  z_m           REAL NOT NULL,
  sigma_m       REAL NOT NULL CHECK (sigma_m >= 0),  -- 0 = not stated
  excluded      INTEGER NOT NULL DEFAULT 0 CHECK (excluded IN (0, 1)),
  exclusion_reason TEXT,
  is_check      INTEGER NOT NULL DEFAULT 0 CHECK (is_check IN (0, 1)),
  source_line   INTEGER NOT NULL DEFAULT 0,
  raw_cells_json TEXT CHECK (raw_cells_json IS NULL OR json_valid(raw_cells_json)),
  note          TEXT,
  created_at TEXT NOT NULL, modified_at TEXT NOT NULL, author TEXT NOT NULL,
  UNIQUE (section_id, seq),
  CHECK (excluded = 0 OR coalesce(length(trim(exclusion_reason)), 0) > 0)  -- NULL would pass a bare CHECK
);

CREATE TABLE ring_count (
  id            TEXT PRIMARY KEY,
  inspection_id TEXT NOT NULL REFERENCES inspection(id) ON DELETE CASCADE,
  span_id       TEXT NOT NULL REFERENCES span(id),
  face          TEXT NOT NULL,       -- US, DS…
  position      TEXT NOT NULL,       -- W springing, crown, E springing, or s along the intrados
  rings         INTEGER NOT NULL CHECK (rings >= 1),
  unit_depth_mm REAL CHECK (unit_depth_mm > 0),
  thickness_mm  REAL CHECK (thickness_mm > 0),
  thickness_lower_mm REAL,
  thickness_upper_mm REAL,
  confidence    TEXT CHECK (confidence IN ('low', 'medium', 'high')),
  basis         TEXT,                -- "face count only", "core at…"
  notes         TEXT,
  created_at TEXT NOT NULL, modified_at TEXT NOT NULL, author TEXT NOT NULL
);

CREATE TABLE fill_depth (
  id            TEXT PRIMARY KEY,
  inspection_id TEXT NOT NULL REFERENCES inspection(id) ON DELETE CASCADE,
  span_id       TEXT NOT NULL REFERENCES span(id),
  chainage_m    REAL NOT NULL,       -- x along the span
  offset_y_m    REAL,                -- across the width from the reference face
  method        TEXT NOT NULL CHECK (method IN ('trial_pit', 'core', 'gpr', 'estimate')),
  depth_m       REAL NOT NULL CHECK (depth_m >= 0),
  uncertainty_m REAL CHECK (uncertainty_m >= 0),
  surfacing_m   REAL CHECK (surfacing_m >= 0),
  notes         TEXT,
  created_at TEXT NOT NULL, modified_at TEXT NOT NULL, author TEXT NOT NULL
);

-- Defect types follow FIELD.md §6.1. Severity: the measured facts (length,
-- width, area) stand apart from any grade; the grade's scale is named so an
-- owner's own scheme can replace the default 1–5 scale (defect_vocabulary.md).
CREATE TABLE defect (
  id            TEXT PRIMARY KEY,
  inspection_id TEXT NOT NULL REFERENCES inspection(id) ON DELETE CASCADE,
  span_id       TEXT REFERENCES span(id),
  ref           TEXT,                -- the inspector's label, e.g. D01
  defect_type   TEXT NOT NULL CHECK (defect_type IN (
                  'longitudinal_crack', 'transverse_crack', 'diagonal_crack', 'ring_separation',
                  'spalling', 'mortar_loss', 'missing_unit', 'dropped_voussoir', 'deformation',
                  'spandrel_bulge', 'spandrel_lean', 'spandrel_sliding', 'spandrel_separation',
                  'parapet_damage', 'impact_damage', 'seepage', 'efflorescence', 'vegetation',
                  'scour', 'previous_repair', 'other')),
  element       TEXT NOT NULL,       -- barrel, spandrel wall, pier, parapet…
  location_frame TEXT NOT NULL CHECK (location_frame IN ('soffit', 'elevation')),
  -- soffit: s from the named springing along the intrados, y from the named face;
  -- elevation: x along, z up on the named elevation.
  frame_origin  TEXT NOT NULL,       -- e.g. "W springing; US face" or "DS spandrel, W end"
  geometry_kind TEXT NOT NULL CHECK (geometry_kind IN ('point', 'line', 'area')),
  geometry_json TEXT NOT NULL CHECK (json_valid(geometry_json)),
  length_m      REAL CHECK (length_m >= 0),
  width_mm      REAL CHECK (width_mm >= 0),
  area_m2       REAL CHECK (area_m2 >= 0),
  severity_scale TEXT NOT NULL DEFAULT 'soffit-1-5',
  severity      INTEGER,
  notes         TEXT,
  created_at TEXT NOT NULL, modified_at TEXT NOT NULL, author TEXT NOT NULL,
  CHECK (severity_scale <> 'soffit-1-5' OR severity IS NULL OR severity BETWEEN 1 AND 5)
);

-- The original image stays untouched in the media folder under its content hash.
CREATE TABLE photo (
  id            TEXT PRIMARY KEY,
  inspection_id TEXT REFERENCES inspection(id) ON DELETE SET NULL,
  content_hash  TEXT NOT NULL UNIQUE,  -- file name in the media folder
  original_name TEXT,
  byte_size     INTEGER CHECK (byte_size >= 0),
  exif_taken_at TEXT,
  exif_latitude_deg  REAL,
  exif_longitude_deg REAL,
  exif_orientation   INTEGER CHECK (exif_orientation BETWEEN 1 AND 8),
  caption       TEXT,                -- e.g. "looking up, top = DS face"
  created_at TEXT NOT NULL, modified_at TEXT NOT NULL, author TEXT NOT NULL
);

CREATE TABLE photo_defect (
  id          TEXT PRIMARY KEY,
  photo_id    TEXT NOT NULL REFERENCES photo(id) ON DELETE CASCADE,
  defect_id   TEXT NOT NULL REFERENCES defect(id) ON DELETE CASCADE,
  marker_json TEXT CHECK (marker_json IS NULL OR json_valid(marker_json)),  -- position on the image
  created_at TEXT NOT NULL, modified_at TEXT NOT NULL, author TEXT NOT NULL,
  UNIQUE (photo_id, defect_id)
);

-- Derived, never journaled: cleared whenever a reading of its section changes.
CREATE TABLE fit_cache (
  id          TEXT PRIMARY KEY,
  section_id  TEXT NOT NULL REFERENCES section_survey(id) ON DELETE CASCADE,
  shape       TEXT NOT NULL,
  input_hash  TEXT NOT NULL,
  result_json TEXT NOT NULL CHECK (json_valid(result_json)),
  created_at TEXT NOT NULL, modified_at TEXT NOT NULL, author TEXT NOT NULL,
  UNIQUE (section_id, shape)
);

-- One row per edit: the SQLite session changeset that redoes it (undo applies
-- its inverse). Kept in the file, so undo survives closing the project.
CREATE TABLE edit_journal (
  seq        INTEGER PRIMARY KEY AUTOINCREMENT,
  label      TEXT NOT NULL,
  author     TEXT NOT NULL,
  at         TEXT NOT NULL,
  changeset  BLOB NOT NULL,
  undone     INTEGER NOT NULL DEFAULT 0 CHECK (undone IN (0, 1))
);

CREATE INDEX span_by_structure ON span(structure_id);
CREATE INDEX inspection_by_structure ON inspection(structure_id, inspection_date);
CREATE INDEX section_by_inspection ON section_survey(inspection_id);
CREATE INDEX ring_count_by_inspection ON ring_count(inspection_id);
CREATE INDEX fill_depth_by_inspection ON fill_depth(inspection_id);
CREATE INDEX defect_by_inspection ON defect(inspection_id);
CREATE INDEX photo_by_inspection ON photo(inspection_id);
CREATE INDEX photo_defect_by_defect ON photo_defect(defect_id);

CREATE TRIGGER fit_cache_stale_on_insert AFTER INSERT ON reading
BEGIN DELETE FROM fit_cache WHERE section_id = NEW.section_id; END;
CREATE TRIGGER fit_cache_stale_on_update AFTER UPDATE ON reading
BEGIN DELETE FROM fit_cache WHERE section_id IN (OLD.section_id, NEW.section_id); END;
CREATE TRIGGER fit_cache_stale_on_delete AFTER DELETE ON reading
BEGIN DELETE FROM fit_cache WHERE section_id = OLD.section_id; END;

CREATE TRIGGER inspection_issued_no_update BEFORE UPDATE ON inspection WHEN OLD.status = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; make a new revision to correct it'); END;
CREATE TRIGGER inspection_issued_no_delete BEFORE DELETE ON inspection WHEN OLD.status = 'issued'
BEGIN SELECT RAISE(ABORT, 'the inspection is issued and read-only; it cannot be deleted'); END;
)SQL";

// Rows that belong to an issued inspection are as read-only as the inspection.
std::string issued_guards() {
  const char* const owned[] = {"section_survey", "ring_count", "fill_depth", "defect"};
  const std::string message = "'the inspection is issued and read-only; make a new revision to correct it'";
  std::string sql;
  for (const char* t : owned) {
    const std::string table(t);
    const struct {
      const char* op;
      const char* row;
    } cases[] = {{"INSERT", "NEW"}, {"UPDATE", "OLD"}, {"DELETE", "OLD"}};
    for (const auto& c : cases) {
      sql += "CREATE TRIGGER " + table + "_issued_no_" + c.op + " BEFORE " + c.op + " ON " + table +
             " WHEN (SELECT status FROM inspection WHERE id = " + c.row + ".inspection_id) = 'issued'" +
             " BEGIN SELECT RAISE(ABORT, " + message + "); END;\n";
    }
  }
  for (const auto& [op, row] : {std::pair{"INSERT", "NEW"}, {"UPDATE", "OLD"}, {"DELETE", "OLD"}}) {
    sql += std::string("CREATE TRIGGER reading_issued_no_") + op + " BEFORE " + op + " ON reading" +
           " WHEN (SELECT i.status FROM section_survey s JOIN inspection i ON i.id = s.inspection_id" +
           " WHERE s.id = " + row + ".section_id) = 'issued'" + " BEGIN SELECT RAISE(ABORT, " + message +
           "); END;\n";
  }
  return sql;
}

}  // namespace

const std::string& schema_v1_sql() {
  static const std::string sql = std::string(kSchemaV1) + issued_guards();
  return sql;
}

const char* const* journaled_tables() {
  static const char* const tables[] = {"structure", "span", "inspection", "section_survey", "reading",
                                       "ring_count", "fill_depth", "defect", "photo", "photo_defect",
                                       nullptr};
  return tables;
}

}  // namespace soffit::storage
