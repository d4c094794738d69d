#include "app/gui/readings_grid.hpp"

#include <imgui.h>
#include <imgui_stdlib.h>

#include <algorithm>
#include <cfloat>
#include <cmath>
#include <cstdio>

#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"

namespace soffit::gui {
namespace {

// Tab inside a cell: the grid moves the focus itself (to the next typed
// cell, not to the row's buttons), so ImGui is told Tab is taken here.
int note_tab(ImGuiInputTextCallbackData* data) {
  if (data->EventFlag == ImGuiInputTextFlags_CallbackCompletion) *static_cast<bool*>(data->UserData) = true;
  return 0;
}

std::string trimmed(const std::string& s) {
  const auto a = s.find_first_not_of(" \t");
  if (a == std::string::npos) return {};
  return s.substr(a, s.find_last_not_of(" \t") - a + 1);
}

std::string column_title(const SheetColumn& c) {
  return c.unit.empty() ? c.quantity : c.quantity + " (" + c.unit + ")";
}

std::vector<size_t> typed_columns(const SurveySheet& sheet) {
  std::vector<size_t> cols;
  for (size_t c = 0; c < sheet.columns.size(); ++c)
    if (app::is_typed_column(sheet.columns[c])) cols.push_back(c);
  return cols;
}

std::string row_name(size_t row) { return std::to_string(row + 1); }

}  // namespace

void ReadingsGrid::refused() {
  if (!keypad_entry_ && last_commit_) focus_request_ = last_commit_;
}

void ReadingsGrid::reset() {
  last_commit_.reset();
  focus_request_.reset();
  editing_.reset();
  keypad_cell_.reset();
  excluding_.reset();
  open_keypad_ = open_exclude_ = false;
}

void ReadingsGrid::draw_entry_switch() {
  ImGui::AlignTextToFramePadding();
  ImGui::TextUnformatted("Entry:");
  ImGui::SameLine();
  // Two plain buttons, the active one marked: a finger can always see which is on.
  for (const bool keypad : {true, false}) {
    const bool on = keypad_entry_ == keypad;
    const bool pressed = choice_button(keypad ? (on ? "[Keypad]" : "Keypad") : (on ? "[Keyboard]" : "Keyboard"), on);
    probe(keypad ? "entry:keypad" : "entry:keyboard");
    if (pressed && !on) {
      keypad_entry_ = keypad;
      editing_.reset();
    }
    if (keypad) ImGui::SameLine();
  }
}

std::optional<ReadingsGrid::Cell> ReadingsGrid::next_cell(const SurveySheet& sheet, const Cell& from,
                                                          bool down) const {
  const std::vector<size_t> cols = typed_columns(sheet);
  if (cols.empty()) return std::nullopt;
  if (down) return Cell{from.row + 1, from.column};
  for (size_t k = 0; k + 1 < cols.size(); ++k)
    if (cols[k] == from.column) return Cell{from.row, cols[k + 1]};
  return Cell{from.row + 1, cols.front()};
}

void ReadingsGrid::commit(const SurveySheet& sheet, const Cell& cell, const std::string& typed,
                          std::vector<std::string>& draft, std::optional<app::RowEdit>& edit) {
  const std::string text = trimmed(typed);
  const size_t rows = sheet.readings.size();
  last_commit_ = cell;
  const std::string& column = sheet.columns[cell.column].name;
  if (cell.row < rows) {
    if (text == sheet.raw_rows[cell.row].cells[cell.column]) return;
    app::RowEdit e{cell.row, app::row_state(sheet, cell.row), app::row_state(sheet, cell.row),
                   "change " + column + " of reading " + row_name(cell.row)};
    e.after->cells[cell.column] = text;
    edit = std::move(e);
    return;
  }
  draft.resize(sheet.columns.size());
  draft[cell.column] = text;
  if (!app::row_ready(sheet, draft)) return;
  app::RowState added;
  added.cells = draft;
  added.line = app::next_line(sheet);
  edit = app::RowEdit{rows, std::nullopt, std::move(added), "add reading " + row_name(rows)};
}

void ReadingsGrid::open_keypad(const SurveySheet& sheet, const Cell& cell, const std::string& text) {
  keypad_cell_ = cell;
  const std::string which = cell.row < sheet.readings.size() ? "reading " + row_name(cell.row) : "new reading";
  keypad_.begin_text(column_title(sheet.columns[cell.column]) + ", " + which, text);
  // The rest of the row, so the person knows which station they are on. Nothing
  // from an earlier visit is shown: blind entry avoids anchoring (FIELD.md §3).
  std::string context;
  const std::vector<std::string>* cells =
      cell.row < sheet.raw_rows.size() ? &sheet.raw_rows[cell.row].cells : nullptr;
  for (size_t c = 0; cells && c < cells->size() && c < sheet.columns.size(); ++c)
    if (c != cell.column && !(*cells)[c].empty() && app::is_typed_column(sheet.columns[c]))
      context += (context.empty() ? "" : ", ") + column_title(sheet.columns[c]) + " " + (*cells)[c];
  if (!context.empty()) keypad_.set_context(context);
  open_keypad_ = true;
}

void ReadingsGrid::open_keypad_on(const SurveySheet& sheet, size_t row) {
  for (size_t c : typed_columns(sheet))
    if (app::is_numeric_column(sheet.columns[c]) && row < sheet.raw_rows.size()) {
      // The reading's height on a plain sheet, its offset or distance otherwise: the last numeric column typed.
      keypad_cell_ = Cell{row, c};
    }
  if (keypad_cell_) open_keypad(sheet, *keypad_cell_, sheet.raw_rows[row].cells[keypad_cell_->column]);
}

void ReadingsGrid::open_exclude_on(size_t row) {
  excluding_ = row;
  reason_[0] = '\0';
  open_exclude_ = true;
}

void ReadingsGrid::draw_cell(const SurveySheet& sheet, const Cell& cell, const std::string& text, bool numeric,
                             std::vector<std::string>& draft, std::optional<app::RowEdit>& edit) {
  const bool is_new = cell.row >= sheet.readings.size();
  const std::string name =
      (is_new ? std::string("new:") : "cell:" + row_name(cell.row) + ":") + sheet.columns[cell.column].name;
  ImGui::PushID(static_cast<int>(cell.column));
  if (numeric && keypad_entry_) {
    // Tablet: the cell is a large button that opens the keypad on it.
    const bool pressed = ImGui::Button(text.empty() ? "  +  " : text.c_str(), ImVec2(-FLT_MIN, 0));
    probe(name);
    if (pressed) open_keypad(sheet, cell, text);
    ImGui::PopID();
    return;
  }
  const bool is_editing = editing_ && *editing_ == cell;
  std::string scratch = text;
  std::string& buf = is_editing ? edit_text_ : scratch;
  if (focus_request_ && *focus_request_ == cell) {
    ImGui::SetKeyboardFocusHere();
    focus_request_.reset();
  }
  bool tab = false;
  ImGui::SetNextItemWidth(-FLT_MIN);
  const bool enter = ImGui::InputText("##cell", &buf,
                                      ImGuiInputTextFlags_EnterReturnsTrue | ImGuiInputTextFlags_CallbackCompletion |
                                          ImGuiInputTextFlags_AutoSelectAll,
                                      note_tab, &tab);
  probe(name);
  if (!ImGui::IsItemVisible() && ImGui::IsItemActive()) ImGui::SetScrollHereY(0.5f);  // follow the focus down
  if (ImGui::IsItemActivated()) {
    // Another cell still open (it scrolled away, or was drawn later): keep what was typed there.
    if (editing_ && !(*editing_ == cell)) commit(sheet, *editing_, edit_text_, draft, edit);
    editing_ = cell;
    edit_text_ = buf;
  } else if (enter || tab) {
    editing_.reset();
    commit(sheet, cell, buf, draft, edit);
    const bool adds = edit && !edit->before;
    // Enter goes down a column; in a new reading not yet complete it goes on along the row.
    focus_request_ = next_cell(sheet, cell, enter && !(is_new && !adds));
    if (adds && enter) focus_request_ = Cell{cell.row + 1, typed_columns(sheet).front()};
  } else if (is_editing && ImGui::IsItemDeactivated()) {
    editing_.reset();
    if (ImGui::IsItemDeactivatedAfterEdit()) commit(sheet, cell, edit_text_, draft, edit);
  }
  ImGui::PopID();
}

std::optional<app::RowEdit> ReadingsGrid::draw(const SurveySheet& sheet, bool typed, bool locked,
                                               const ShapeFit* fit, std::vector<std::string>& draft) {
  std::optional<app::RowEdit> edit;
  const Palette& c = palette();
  const std::vector<size_t> cols = typed ? typed_columns(sheet) : std::vector<size_t>{};
  const bool reduced_columns = !(typed && sheet.form == SheetForm::plain_xz);
  if (locked) typed = false;
  const size_t rows = sheet.readings.size();
  const bool residuals = fit && fit->residuals.size() == rows && fit->sigmas.size() == rows;
  draft.resize(sheet.columns.size());

  const int column_count = 1 + static_cast<int>(cols.size()) + (reduced_columns ? 2 : 0) + 2;
  // Widths in font units, so the grid scales with the text: numbers need a
  // few digits, notes and states more; the state column takes what is left.
  const float em = ImGui::GetFontSize();
  if (ImGui::BeginTable("readings", column_count,
                        ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg | ImGuiTableFlags_SizingFixedFit)) {
    ImGui::TableSetupColumn("#", ImGuiTableColumnFlags_WidthFixed, em * 1.8f);
    for (size_t col : cols) {
      const SheetColumn& sc = sheet.columns[col];
      const float wanted = app::is_numeric_column(sc) ? em * 4.5f
                           : sc.quantity == "id"        ? em * 2.5f
                           : sc.quantity == "note"      ? em * 6.5f
                                                        : em * 4.5f;
      // Never narrower than its heading: "station (m)" is read, not guessed.
      const float width = std::max(wanted, ImGui::CalcTextSize(column_title(sc).c_str()).x + em * 0.4f);
      // "offset (mm)" rather than the sheet's "offset_mm": the same column, in words a person reads.
      ImGui::TableSetupColumn(column_title(sc).c_str(), ImGuiTableColumnFlags_WidthFixed, width);
    }
    if (reduced_columns) {
      ImGui::TableSetupColumn("x (m)", ImGuiTableColumnFlags_WidthFixed, em * 3.5f);
      ImGui::TableSetupColumn("z (m)", ImGuiTableColumnFlags_WidthFixed, em * 3.5f);
    }
    ImGui::TableSetupColumn("off curve (mm)", ImGuiTableColumnFlags_WidthFixed,
                            ImGui::CalcTextSize("off curve (mm)").x + em * 0.4f);
    // Used readings show the button that excludes them; excluded ones their reason and the way back.
    ImGui::TableSetupColumn("use in fit", ImGuiTableColumnFlags_WidthStretch);
    ImGui::TableHeadersRow();
    // Only the rows on screen are built (a scan slice has 10⁵ readings); the
    // row taking the focus is built wherever it is, so the focus can land.
    ImGuiListClipper clipper;
    const size_t shown = rows + (typed && !cols.empty() ? 1 : 0);  // the new-reading row
    clipper.Begin(static_cast<int>(shown));
    if (focus_request_ && focus_request_->row < shown)
      clipper.ForceDisplayRangeByIndices(static_cast<int>(focus_request_->row),
                                         static_cast<int>(focus_request_->row) + 1);
    while (clipper.Step()) {
      for (int row = clipper.DisplayStart; row < clipper.DisplayEnd; ++row) {
        const size_t i = static_cast<size_t>(row);
        const bool is_new = i >= rows;
        ImGui::PushID(row);
        ImGui::TableNextRow();
        ImGui::TableNextColumn();
        ImGui::AlignTextToFramePadding();
        if (is_new)
          ImGui::TextUnformatted("new");
        else
          ImGui::Text("%zu", i + 1);
        for (size_t col : cols) {
          ImGui::TableNextColumn();
          const std::string& text = is_new ? draft[col] : sheet.raw_rows[i].cells[col];
          if (locked)
            ImGui::TextUnformatted(text.c_str());
          else
            draw_cell(sheet, Cell{i, col}, text, app::is_numeric_column(sheet.columns[col]), draft, edit);
        }
        if (is_new) {
          ImGui::TableNextColumn();
          if (reduced_columns) ImGui::TableNextColumn(), ImGui::TableNextColumn();
          ImGui::TextDisabled("type a new reading");
          ImGui::PopID();
          continue;
        }
        const Reading& r = sheet.readings[i];
        if (reduced_columns) {
          ImGui::TableNextColumn();
          ImGui::Text("%.3f", r.x);
          ImGui::TableNextColumn();
          ImGui::Text("%.3f", r.z);
        }
        ImGui::TableNextColumn();
        if (residuals) {
          // Beyond 2σ is shown in the departure colours: out of tolerance, look again.
          const double res = fit->residuals[i];
          const bool beyond = std::abs(res) > 2.0 * fit->sigmas[i];
          if (beyond)
            ImGui::PushStyleColor(ImGuiCol_Text,
                                  ImGui::ColorConvertU32ToFloat4(res < 0 ? c.residual_below : c.residual_above));
          ImGui::Text("%+.1f%s", res * 1000, beyond ? "  (> 2 sigma)" : "");
          if (beyond) ImGui::PopStyleColor();
        } else {
          ImGui::TextDisabled("...");
        }
        ImGui::TableNextColumn();
        if (r.excluded) ImGui::TextWrapped("excluded: %s", r.exclusion_reason.c_str());
        if (r.check) ImGui::TextUnformatted("closing check");
        if (!r.check && !locked) {
          if (r.excluded) {
            const bool pressed = ImGui::Button("Use again");
            probe("use again:" + row_name(i));
            if (pressed) {
              app::RowEdit e{i, app::row_state(sheet, i), app::row_state(sheet, i),
                             "use reading " + row_name(i) + " again"};
              e.after->excluded = false;
              e.after->reason.clear();
              edit = std::move(e);
            }
          } else {
            const bool pressed = ImGui::Button("Exclude...");
            probe("exclude:" + row_name(i));
            if (pressed) open_exclude_on(i);
          }
        }
        ImGui::PopID();
      }
    }
    ImGui::EndTable();
  }
  // Dialogs live outside the table so a row scrolled out of view cannot close them.
  draw_exclude_dialog(sheet, residuals ? fit : nullptr, edit);
  draw_keypad(sheet, draft, edit);
  return edit;
}

void ReadingsGrid::draw_keypad(const SurveySheet& sheet, std::vector<std::string>& draft,
                               std::optional<app::RowEdit>& edit) {
  if (open_keypad_) {
    ImGui::OpenPopup(keypad_.popup_id().c_str());
    open_keypad_ = false;
  }
  if (!keypad_cell_) return;
  if (keypad_.draw()) {
    const Cell cell = *keypad_cell_;
    keypad_cell_.reset();
    if (cell.column >= sheet.columns.size() || cell.row > sheet.readings.size()) return;
    const bool was_new = cell.row >= sheet.readings.size();
    commit(sheet, cell, keypad_.text(), draft, edit);
    if (!keypad_.next_pressed()) return;
    // Next: down the column for readings already taken; along a new reading
    // until it is complete, then on to the next new one.
    std::optional<Cell> next;
    if (!was_new) {
      if (cell.row + 1 < sheet.readings.size()) next = Cell{cell.row + 1, cell.column};
    } else {
      const bool adds = edit && !edit->before;
      for (size_t c : typed_columns(sheet))
        if (app::is_numeric_column(sheet.columns[c]) && (adds ? true : draft[c].empty())) {
          next = Cell{adds ? cell.row + 1 : cell.row, c};
          break;
        }
    }
    if (next) {
      const std::string text = next->row < sheet.readings.size() ? sheet.raw_rows[next->row].cells[next->column]
                                                                   : std::string();
      open_keypad(sheet, *next, text);
    }
  } else if (!ImGui::IsPopupOpen(keypad_.popup_id().c_str()) && !open_keypad_) {
    keypad_cell_.reset();
  }
}

void ReadingsGrid::draw_exclude_dialog(const SurveySheet& sheet, const ShapeFit* fit,
                                       std::optional<app::RowEdit>& edit) {
  if (open_exclude_) {
    ImGui::OpenPopup("Exclude reading");
    open_exclude_ = false;
  }
  if (!ImGui::BeginPopupModal("Exclude reading", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) return;
  const size_t i = excluding_.value_or(0);
  ImGui::Text("Exclude reading %zu from the fit? It stays in the data with its reason.", i + 1);
  // Which reading, in numbers: the person decides with the value in front of them.
  if (i < sheet.readings.size()) {
    const Reading& r = sheet.readings[i];
    if (fit)
      ImGui::Text("x %.3f m, z %.3f m, %+.1f mm off the fitted curve", r.x, r.z, fit->residuals[i] * 1000);
    else
      ImGui::Text("x %.3f m, z %.3f m", r.x, r.z);
  }
  // Reasons from the trade's common errors (FIELD.md §3.3), one tap each.
  for (const char* quick : {"protruding unit", "recessed joint", "deposit or vegetation", "blunder"}) {
    const bool pressed = ImGui::Button(quick);
    probe(std::string("reason:") + quick);
    if (pressed) std::snprintf(reason_, sizeof reason_, "%s", quick);
    ImGui::SameLine();
  }
  ImGui::NewLine();
  ImGui::SetNextItemWidth(ImGui::GetFontSize() * 24);
  ImGui::InputText("reason", reason_, sizeof reason_);
  const bool has_reason = trimmed(reason_).size() > 0;
  ImGui::BeginDisabled(!has_reason);
  const bool confirm = ImGui::Button("Exclude");
  probe("confirm exclude");
  if (confirm && has_reason && i < sheet.readings.size()) {
    app::RowEdit e{i, app::row_state(sheet, i), app::row_state(sheet, i), "exclude reading " + row_name(i)};
    e.after->excluded = true;
    e.after->reason = trimmed(reason_);
    edit = std::move(e);
    excluding_.reset();
    ImGui::CloseCurrentPopup();
  }
  ImGui::EndDisabled();
  ImGui::SameLine();
  if (ImGui::Button("Cancel")) {
    excluding_.reset();
    ImGui::CloseCurrentPopup();
  }
  ImGui::EndPopup();
}

}  // namespace soffit::gui
