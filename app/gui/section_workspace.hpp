#pragma once
// The section survey view: pick a sheet, type or correct its readings, see the
// fitted intrados and the residuals. Fits run on a worker thread; a frame
// never waits for one. Every edit is one undo step, stored as it is made.
#include <functional>
#include <future>
#include <optional>
#include <string>
#include <vector>

#include "app/gui/readings_grid.hpp"
#include "exports/intrados_band.hpp"
#include "app/model/edit_history.hpp"
#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/sheet/survey_sheet.hpp"

namespace soffit::gui {

class SectionWorkspace {
 public:
  // Loads every sheet in `folder` (unreadable ones are listed with their error).
  void load_folder(const std::string& folder);
  // Shows these sections (label, sheet), replacing what was shown.
  void load_sheets(std::vector<std::pair<std::string, SurveySheet>> sheets);
  bool empty() const { return entries_.empty(); }

  // Where exclusions are written as they are made (the open project): called
  // with the section's position in load_sheets, the reading and the reason
  // (empty: use it again). Throws when the store refuses; the view then undoes
  // the change in memory and says why. Without a store, edits stay in the session.
  using ExclusionStore = std::function<void(size_t section, size_t reading, const std::string& reason)>;
  void set_exclusion_store(ExclusionStore store) { store_ = std::move(store); }
  // Where typed cells and new readings are written (the open project): called
  // with the section's position and the whole edited sheet, as one undoable
  // edit named `label`. Throws when the store refuses (an issued visit…); the
  // view then undoes the change in memory and says why. Exclusions alone still
  // go through the exclusion store when there is one (a scan has 10⁵ rows).
  using RowsStore = std::function<void(size_t section, const SurveySheet& sheet, const std::string& label)>;
  void set_rows_store(RowsStore store) { rows_store_ = std::move(store); }
  // What the sections are of (the visit), shown above them and their results.
  void set_heading(std::string heading) { heading_ = std::move(heading); }
  // Why nothing shown may change (an issued visit); empty: edits allowed.
  void set_locked(std::string why) { locked_ = std::move(why); }
  void select(size_t index);
  // Collects a finished fit, if any. Call once per frame, on the UI thread.
  void poll();
  bool busy() const { return pending_.valid(); }
  void draw();

  // Opens a dialog on the middle reading once results are shown, so that a
  // headless screenshot can show it: "keypad", "exclude" or "keyboard" (the
  // grid in keyboard entry).
  void show_dialog_for_screenshot(const std::string& dialog) { screenshot_dialog_ = dialog; }

  // What the view shows, for tests that drive it through ImGui's input.
  const std::optional<ProfileAnalysis>& analysis() const { return analysis_; }
  const Readings* readings() const {
    return entries_.empty() || !entries_[selected_].sheet ? nullptr : &entries_[selected_].sheet->readings;
  }
  const SurveySheet* sheet() const {
    return entries_.empty() || !entries_[selected_].sheet ? nullptr : &*entries_[selected_].sheet;
  }
  // The cells of the new reading being typed in the shown section.
  const std::vector<std::string>* draft() const {
    return entries_.empty() ? nullptr : &entries_[selected_].draft;
  }
  // The last refusal of a typed value or of the store, for the person.
  const std::string& message() const { return message_; }
  ReadingsGrid& grid() { return grid_; }

 private:
  struct Entry {
    std::string path, label, error;
    std::optional<SurveySheet> sheet;
    app::EditHistory history;  // cells typed, readings added, exclusions made in this view
    bool typed = false;        // rows may be typed into (they reduce again as stored)
    std::string typed_note;    // why not, when they may not
    std::vector<std::string> draft;  // the new reading being typed
  };
  static void check_typed(Entry& entry);
  void start_fit();
  void apply_edit(app::RowEdit edit);
  // Carries an edit (or its undoing, `forward` false) to the store; false (and a message) if refused.
  bool store_edit(const app::RowEdit& edit, bool forward);
  void undo();
  void redo();
  void draw_sheet_list();
  void draw_results();
  void draw_edit_bar();
  void draw_readings_table();

  std::vector<Entry> entries_;
  size_t selected_ = 0;
  std::string shape_ = "auto";
  std::future<ProfileAnalysis> pending_;
  bool refit_wanted_ = false;  // the readings changed while a fit was running
  std::optional<ProfileAnalysis> analysis_;
  std::optional<IntradosBand> band_;  // of analysis_, computed when it arrives
  ReadingsGrid grid_;
  std::string screenshot_dialog_;
  ExclusionStore store_;
  RowsStore rows_store_;
  std::string save_state_;  // shown beside Undo/Redo: where the last change went
  std::string message_;     // a typed value refused, and why
  std::string locked_;      // why the sections shown are read-only
  std::string heading_ = "Sections";
};

}  // namespace soffit::gui
