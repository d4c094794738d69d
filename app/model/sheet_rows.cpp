#include "app/model/sheet_rows.hpp"

#include <algorithm>
#include <cmath>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "storage/sheet_export.hpp"

namespace soffit::app {
namespace {

bool is_flag_column(const SheetColumn& column) {
  return column.quantity == "exclude" || column.quantity == "check";
}

// Exclusions made in the app win over an exclude cell: the app keeps them
// with their reasons, and the store writes them back beside the cells.
void apply_exclusion(Reading& reading, const RowState& state) {
  reading.excluded = state.excluded;
  reading.exclusion_reason = state.excluded ? state.reason : std::string();
}

// The sheet with these rows, reduced by the reader from text that keeps
// every row on its own line number.
SurveySheet reduce_states(const SurveySheet& sheet, const std::vector<RowState>& states) {
  SurveySheet edited = sheet;
  edited.raw_rows.clear();
  for (const RowState& s : states) {
    RawRow raw;
    raw.line = s.line;
    raw.cells = s.cells;
    // Trailing empty cells are what the reader drops; keep the text the same.
    while (!raw.cells.empty() && raw.cells.back().empty()) raw.cells.pop_back();
    edited.raw_rows.push_back(std::move(raw));
  }
  SheetOptions options;
  options.allow_few_readings = true;  // a section is keyed in one reading at a time
  SurveySheet out = parse_sheet(storage::write_sheet_text(edited, true), sheet.source, options);
  if (out.readings.size() != states.size())
    throw InputError(sheet.source, 0, "", "the edited sheet gave " + std::to_string(out.readings.size()) +
                                              " readings for " + std::to_string(states.size()) + " rows");
  for (size_t i = 0; i < states.size(); ++i) {
    apply_exclusion(out.readings[i], states[i]);
    out.raw_rows[i].cells.resize(sheet.columns.size());
  }
  return out;
}

}  // namespace

RowState row_state(const SurveySheet& sheet, size_t row) {
  RowState s;
  if (row < sheet.raw_rows.size()) {
    s.cells = sheet.raw_rows[row].cells;
    s.line = sheet.raw_rows[row].line;
  }
  s.cells.resize(sheet.columns.size());
  if (row < sheet.readings.size()) {
    s.excluded = sheet.readings[row].excluded;
    s.reason = sheet.readings[row].exclusion_reason;
  }
  return s;
}

int next_line(const SurveySheet& sheet) {
  int last = 0;
  for (const RawRow& r : sheet.raw_rows) last = std::max(last, r.line);
  for (const CommentLine& c : sheet.comments) last = std::max(last, c.line);
  for (const MetadataLine& m : sheet.raw_metadata) last = std::max(last, m.line);
  // A sheet with no rows yet: the row follows the keyword and header lines.
  if (sheet.raw_rows.empty()) last += sheet.form == SheetForm::soffit_sheet ? 2 : 1;
  return last + 1;
}

bool is_typed_column(const SheetColumn& column) { return !is_flag_column(column); }

bool is_numeric_column(const SheetColumn& column) { return !column.unit.empty(); }

bool row_ready(const SurveySheet& sheet, const std::vector<std::string>& cells) {
  bool any = false;
  for (size_t c = 0; c < sheet.columns.size(); ++c) {
    const SheetColumn& col = sheet.columns[c];
    const bool filled = c < cells.size() && !cells[c].empty();
    any = any || filled;
    if (is_numeric_column(col) && col.quantity != "sigma" && !filled) return false;
  }
  return any;
}

SurveySheet with_row(const SurveySheet& sheet, size_t index, const std::optional<RowState>& state) {
  const size_t rows = sheet.raw_rows.size();
  if (index > rows || (index == rows && !state))
    throw InputError(sheet.source, 0, "", "no reading " + std::to_string(index + 1) + " in the sheet");

  // Only the exclusion changed: nothing to reduce again (a scan has 10⁵ rows).
  if (index < rows && state && state->cells == row_state(sheet, index).cells && state->line == sheet.raw_rows[index].line) {
    SurveySheet out = sheet;
    apply_exclusion(out.readings[index], *state);
    return out;
  }

  std::vector<RowState> states;
  states.reserve(rows + 1);
  for (size_t i = 0; i < rows; ++i) states.push_back(row_state(sheet, i));
  if (index == rows)
    states.push_back(*state);
  else if (state)
    states[index] = *state;
  else
    states.erase(states.begin() + static_cast<std::ptrdiff_t>(index));

  return reduce_states(sheet, states);
}

bool rows_reduce_again(const SurveySheet& sheet, std::string& why) {
  if (sheet.raw_rows.size() != sheet.readings.size() || sheet.columns.empty()) {
    why = "this section's rows were not kept as typed, so they cannot be edited here";
    return false;
  }
  if (sheet.raw_rows.empty()) return true;
  try {
    std::vector<RowState> states;
    for (size_t i = 0; i < sheet.raw_rows.size(); ++i) states.push_back(row_state(sheet, i));
    const SurveySheet again = reduce_states(sheet, states);
    for (size_t i = 0; i < sheet.readings.size(); ++i) {
      const Reading &a = sheet.readings[i], &b = again.readings[i];
      if (std::abs(a.x - b.x) > 1e-9 || std::abs(a.z - b.z) > 1e-9) {
        why = "reading " + std::to_string(i + 1) + " does not reduce again to the stored point";
        return false;
      }
    }
    return true;
  } catch (const std::exception& e) {
    why = std::string("the rows cannot be reduced again: ") + e.what();
    return false;
  }
}

}  // namespace soffit::app
