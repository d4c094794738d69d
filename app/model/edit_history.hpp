#pragma once
// Undo and redo for edits to a section's rows: a cell typed, a row added, an
// exclusion made. Each entry keeps the whole row before and after: rows are
// small, and a snapshot cannot drift out of step with the data the way an
// inverse operation can. Every step reduces the sheet again (sheet_rows.hpp).
#include <optional>
#include <string>
#include <vector>

#include "app/model/sheet_rows.hpp"

namespace soffit::app {

struct RowEdit {
  size_t index = 0;
  std::optional<RowState> before;  // none: the edit added this row
  std::optional<RowState> after;   // none: the edit removed it
  std::string label;               // "exclude reading 4", for the undo button
};

class EditHistory {
 public:
  // Applies `edit` to `sheet` and records it; clears what could be redone.
  // Throws InputError (naming file, line and field) when the edited sheet
  // cannot be reduced; then neither the sheet nor the history changes.
  void apply(SurveySheet& sheet, RowEdit edit);
  // Each returns the edit it moved over (null when there was none), so the
  // caller can carry the same change to wherever the sheet is kept.
  const RowEdit* undo(SurveySheet& sheet);
  const RowEdit* redo(SurveySheet& sheet);
  bool can_undo() const { return !done_.empty(); }
  bool can_redo() const { return !undone_.empty(); }
  const std::string& next_undo_label() const { return done_.back().label; }
  const std::string& next_redo_label() const { return undone_.back().label; }

 private:
  std::vector<RowEdit> done_, undone_;
};

}  // namespace soffit::app
