#pragma once
// Undo and redo for edits to a section's readings. Each entry keeps the whole
// reading before and after: readings are small, and a snapshot cannot drift
// out of step with the data the way an inverse operation can.
#include <string>
#include <vector>

#include "geometry/core/reading.hpp"

namespace soffit::app {

struct ReadingEdit {
  size_t index = 0;
  Reading before, after;
  std::string label;  // "exclude reading 4", for the undo button
};

class EditHistory {
 public:
  // Applies `edit` to `readings` and records it; clears what could be redone.
  void apply(Readings& readings, ReadingEdit edit);
  // Each returns the edit it moved over (null when there was none), so the
  // caller can carry the same change to wherever the readings are kept.
  const ReadingEdit* undo(Readings& readings);
  const ReadingEdit* redo(Readings& readings);
  bool can_undo() const { return !done_.empty(); }
  bool can_redo() const { return !undone_.empty(); }
  const std::string& next_undo_label() const { return done_.back().label; }
  const std::string& next_redo_label() const { return undone_.back().label; }

 private:
  std::vector<ReadingEdit> done_, undone_;
};

}  // namespace soffit::app
