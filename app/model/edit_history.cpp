#include "app/model/edit_history.hpp"

namespace soffit::app {

void EditHistory::apply(Readings& readings, ReadingEdit edit) {
  if (edit.index >= readings.size()) return;
  readings[edit.index] = edit.after;
  done_.push_back(std::move(edit));
  undone_.clear();
}

const ReadingEdit* EditHistory::undo(Readings& readings) {
  if (done_.empty()) return nullptr;
  ReadingEdit edit = std::move(done_.back());
  done_.pop_back();
  if (edit.index < readings.size()) readings[edit.index] = edit.before;
  undone_.push_back(std::move(edit));
  return &undone_.back();
}

const ReadingEdit* EditHistory::redo(Readings& readings) {
  if (undone_.empty()) return nullptr;
  ReadingEdit edit = std::move(undone_.back());
  undone_.pop_back();
  if (edit.index < readings.size()) readings[edit.index] = edit.after;
  done_.push_back(std::move(edit));
  return &done_.back();
}

}  // namespace soffit::app
