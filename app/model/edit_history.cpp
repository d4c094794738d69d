#include "app/model/edit_history.hpp"

namespace soffit::app {

void EditHistory::apply(SurveySheet& sheet, RowEdit edit) {
  sheet = with_row(sheet, edit.index, edit.after);  // throws before anything is recorded
  done_.push_back(std::move(edit));
  undone_.clear();
}

// Undo and redo go back to states the sheet has been in, so they reduce; if a
// reduction is refused all the same, the step stays where it was.
const RowEdit* EditHistory::undo(SurveySheet& sheet) {
  if (done_.empty()) return nullptr;
  sheet = with_row(sheet, done_.back().index, done_.back().before);
  undone_.push_back(std::move(done_.back()));
  done_.pop_back();
  return &undone_.back();
}

const RowEdit* EditHistory::redo(SurveySheet& sheet) {
  if (undone_.empty()) return nullptr;
  sheet = with_row(sheet, undone_.back().index, undone_.back().after);
  done_.push_back(std::move(undone_.back()));
  undone_.pop_back();
  return &done_.back();
}

}  // namespace soffit::app
