#pragma once
// The section survey view: pick a sheet, see its readings, the fitted intrados
// and the residuals. Fits run on a worker thread; a frame never waits for one.
#include <functional>
#include <future>
#include <optional>
#include <string>
#include <vector>

#include "app/gui/numeric_keypad.hpp"
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
  void select(size_t index);
  // Collects a finished fit, if any. Call once per frame, on the UI thread.
  void poll();
  bool busy() const { return pending_.valid(); }
  void draw();

  // Opens a dialog on the middle reading once results are shown, so that a
  // headless screenshot can show it: "keypad" or "exclude".
  void show_dialog_for_screenshot(const std::string& dialog) { screenshot_dialog_ = dialog; }

  // What the view shows, for tests that drive it through ImGui's input.
  const std::optional<ProfileAnalysis>& analysis() const { return analysis_; }
  const Readings* readings() const {
    return entries_.empty() || !entries_[selected_].sheet ? nullptr : &entries_[selected_].sheet->readings;
  }

 private:
  struct Entry {
    std::string path, label, error;
    std::optional<SurveySheet> sheet;
    app::EditHistory history;  // flags and exclusions made in this view
  };
  void start_fit();
  void apply_edit(app::ReadingEdit edit);
  // Carries a change of exclusion to the store; false (and a message) if refused.
  bool store_exclusion(const Reading& before, const Reading& after, size_t reading);
  void undo();
  void redo();
  void draw_sheet_list();
  void draw_results();
  void draw_edit_bar();
  void draw_readings_table();
  void draw_exclude_dialog();
  void request_keypad(size_t reading);
  void request_exclude(size_t reading);

  std::vector<Entry> entries_;
  size_t selected_ = 0;
  std::string shape_ = "auto";
  std::future<ProfileAnalysis> pending_;
  bool refit_wanted_ = false;  // the readings changed while a fit was running
  std::optional<ProfileAnalysis> analysis_;
  std::optional<IntradosBand> band_;  // of analysis_, computed when it arrives
  std::optional<size_t> excluding_;  // reading whose exclusion is being confirmed
  std::optional<size_t> correcting_;  // reading whose height is being corrected on the keypad
  NumericKeypad keypad_;
  bool open_keypad_ = false, open_exclude_ = false;  // popups opened after the table
  std::string screenshot_dialog_;
  ExclusionStore store_;
  std::string save_state_;  // shown beside Undo/Redo: where the last change went
  char reason_[160] = {};
};

}  // namespace soffit::gui
