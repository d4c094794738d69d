#pragma once
// The readings of one section as a grid to type into: the sheet's own
// columns in its own units, then the reduced x and z, the distance off the
// fitted curve and the reading's state. A last, empty row takes a new reading.
// Two ways in: on a tablet a numeric cell opens a large keypad (Next walks
// down the column); on a laptop the cells are text fields where Tab moves
// right and Enter moves down, as in a spreadsheet. The grid only proposes
// edits; its owner applies them, stores them and reports back.
#include <optional>
#include <string>
#include <vector>

#include "app/gui/numeric_keypad.hpp"
#include "app/model/edit_history.hpp"
#include "geometry/analysis/profile_fit.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit::gui {

class ReadingsGrid {
 public:
  // Draws the grid. `typed`: whether rows may be typed into (else shown only).
  // `fit`: the fit of these readings, for the distances off the curve (may be
  // null, or stale while a refit runs: then that column waits). `draft`: the
  // cells of the new reading being typed, kept by the owner per section.
  // Returns the edit the person asked for this frame, if any.
  // `locked`: nothing may change (an issued visit): no cells, no buttons.
  std::optional<app::RowEdit> draw(const SurveySheet& sheet, bool typed, bool locked, const ShapeFit* fit,
                                   std::vector<std::string>& draft);

  bool keypad_entry() const { return keypad_entry_; }
  void set_keypad_entry(bool on) { keypad_entry_ = on; }
  // The entry-mode switch, drawn by the owner where it fits.
  void draw_entry_switch();
  // The owner refused the last edit (the reader would not take the value):
  // on a keyboard the focus goes back to that cell to type it again.
  void refused();
  // Forgets focus and dialogs (another section was chosen).
  void reset();

  // Opens a dialog on a reading (for a headless screenshot): the keypad on
  // its first numeric column, or the exclusion dialog.
  void open_keypad_on(const SurveySheet& sheet, size_t row);
  void open_exclude_on(size_t row);

 private:
  struct Cell {
    size_t row = 0, column = 0;
    bool operator==(const Cell&) const = default;
  };
  void draw_cell(const SurveySheet& sheet, const Cell& cell, const std::string& text, bool numeric,
                 std::vector<std::string>& draft, std::optional<app::RowEdit>& edit);
  void commit(const SurveySheet& sheet, const Cell& cell, const std::string& text, std::vector<std::string>& draft,
              std::optional<app::RowEdit>& edit);
  std::optional<Cell> next_cell(const SurveySheet& sheet, const Cell& from, bool down) const;
  void draw_keypad(const SurveySheet& sheet, std::vector<std::string>& draft, std::optional<app::RowEdit>& edit);
  void draw_exclude_dialog(const SurveySheet& sheet, const ShapeFit* fit, std::optional<app::RowEdit>& edit);
  void open_keypad(const SurveySheet& sheet, const Cell& cell, const std::string& text);

  bool keypad_entry_ = true;
  std::optional<Cell> focus_request_;  // keyboard: the cell that takes the focus next frame
  std::optional<Cell> editing_;        // keyboard: the cell being typed into
  std::string edit_text_;
  std::optional<Cell> last_commit_;    // the cell whose value was last proposed
  std::optional<Cell> keypad_cell_;    // tablet: the cell the keypad is writing
  NumericKeypad keypad_;
  bool open_keypad_ = false;
  std::optional<size_t> excluding_;
  bool open_exclude_ = false;
  char reason_[160] = {};
};

}  // namespace soffit::gui
