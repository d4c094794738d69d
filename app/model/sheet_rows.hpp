#pragma once
// A section's readings as the person types them: each row's cells in the
// sheet's own units (readings keep their units until reduced) plus the
// exclusion made in the app. An edited row is reduced again by the same
// reader that read the sheet, so a typed value meets every check a file
// would, and a refusal names the file, the line and the field.
#include <optional>
#include <string>
#include <vector>

#include "geometry/sheet/survey_sheet.hpp"

namespace soffit::app {

struct RowState {
  std::vector<std::string> cells;  // one per column, as typed
  int line = 0;                    // the row's line in the sheet
  bool excluded = false;
  std::string reason;
  bool operator==(const RowState&) const = default;
};

RowState row_state(const SurveySheet& sheet, size_t row);

// The line a row added after the last one takes.
int next_line(const SurveySheet& sheet);

// Whether a person types into this column: the exclude and check flags have
// their own buttons (an exclusion needs a reason), everything else is typed.
bool is_typed_column(const SheetColumn& column);
// Whether the column holds numbers in a unit (the keypad's columns).
bool is_numeric_column(const SheetColumn& column);
// Whether a new row's cells are enough to try it: every numeric column but a
// precision (sigma) filled. Trying earlier would only produce a refusal.
bool row_ready(const SurveySheet& sheet, const std::vector<std::string>& cells);

// The sheet with row `index` set to `state` (index == rows: a row added at
// the end; no state: the row removed), reduced again. Throws InputError when
// the edited sheet cannot be reduced; `sheet` is never changed.
SurveySheet with_row(const SurveySheet& sheet, size_t index, const std::optional<RowState>& state);

// Whether the sheet's rows reduce again to the readings it holds (a sheet
// imported through an odd mapping might not); if not, rows are shown but not
// typed into, and `why` says so.
bool rows_reduce_again(const SurveySheet& sheet, std::string& why);

}  // namespace soffit::app
