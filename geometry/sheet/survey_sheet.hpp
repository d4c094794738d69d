#pragma once
// One section's survey sheet as read: metadata, the raw cells exactly as
// written (with their units), and the readings reduced to the section frame.
#include <optional>
#include <string>
#include <vector>

#include "geometry/core/reading.hpp"
#include "geometry/sheet/reduce_offsets.hpp"
#include "geometry/sheet/reduce_points.hpp"
#include "geometry/sheet/reduce_polar.hpp"
#include "geometry/sheet/survey_method.hpp"

namespace soffit {

enum class SheetForm { plain_xz, soffit_sheet };
enum class SectionDirection { skew, square };  // parallel to the faces, or square to them

struct SheetMetadata {
  std::optional<std::string> structure;       // structure reference, e.g. BVDC-ST-0417
  std::optional<std::string> structure_name;
  std::optional<std::string> span;            // e.g. S1
  std::optional<std::string> section;         // e.g. MW
  std::optional<double> position_m;           // across the width, from the reference face
  std::optional<std::string> reference_face;  // e.g. US
  std::optional<SectionDirection> direction;
  std::optional<std::string> date;            // as written; ISO 8601 expected
  std::optional<std::string> time;
  std::optional<std::string> datum;           // description, e.g. "laser level from TBM1"
  std::optional<std::string> instrument;      // instrument class key (sheet_defaults.hpp)
  std::optional<std::string> instrument_model;
  std::optional<double> sigma_m;              // the sheet's stated default precision
  std::optional<std::string> observer;
  std::optional<std::string> booker;
  std::optional<std::string> weather;
  std::optional<std::string> note;
};

// A metadata line as written: key and every value cell.
struct MetadataLine {
  int line = 0;
  std::string key;
  std::vector<std::string> values;
};

// A column of the readings table: "offset_mm" = quantity "offset", unit "mm".
struct SheetColumn {
  std::string name;      // as written in the header
  std::string quantity;  // lower case, without unit
  std::string unit;      // empty for text columns
};

// One data row as written: every cell's text, and its number in the column's
// own unit where the column is numeric and the cell is not empty.
struct RawRow {
  int line = 0;
  std::vector<std::string> cells;                 // one per column
  std::vector<std::optional<double>> values;      // one per column
};

struct CommentLine {
  int line = 0;
  std::string text;
};

struct SurveySheet {
  std::string source;               // file name used in messages
  SheetForm form = SheetForm::plain_xz;
  int format_version = 0;           // 0 for plain x,z files
  SurveyMethod method = SurveyMethod::xz_list;
  SheetMetadata metadata;

  // The set-up used for the reduction (only the one of `method` is set).
  std::optional<OffsetSetup> offsets;
  std::optional<PolarSetup> polar;
  std::optional<PointsSetup> points;
  std::optional<SectionPlane> plane;  // points: the plane used and the out-of-plane scatter

  Readings readings;                // reduced; readings[i] comes from raw_rows[i]

  // Exactly as read, so that the sheet can be written back.
  std::vector<MetadataLine> raw_metadata;
  std::vector<SheetColumn> columns;
  std::vector<RawRow> raw_rows;
  std::vector<CommentLine> comments;

  std::vector<std::string> warnings;  // each starts "file:line: "
};

}  // namespace soffit
