// Undo and redo of reading edits in the section view (issue: the field app
// needs undo; FIELD.md §3.3: never delete a reading silently).
#include <doctest/doctest.h>

#include "app/model/edit_history.hpp"

using namespace soffit;
using app::EditHistory;
using app::ReadingEdit;

namespace {
Readings three_readings() {
  Readings r(3);
  for (size_t i = 0; i < r.size(); ++i) r[i].z = 0.1 * static_cast<double>(i);
  return r;
}
ReadingEdit exclude(const Readings& r, size_t i, const std::string& reason) {
  ReadingEdit e{i, r[i], r[i], "exclude reading " + std::to_string(i + 1)};
  e.after.excluded = true;
  e.after.exclusion_reason = reason;
  return e;
}
}  // namespace

TEST_CASE("an exclusion is undone and redone exactly, reason included") {
  Readings r = three_readings();
  EditHistory h;
  h.apply(r, exclude(r, 1, "reading on a protruding voussoir"));
  CHECK(r[1].excluded);
  CHECK(r[1].exclusion_reason == "reading on a protruding voussoir");
  REQUIRE(h.can_undo());
  CHECK(h.next_undo_label() == "exclude reading 2");
  CHECK(h.undo(r) != nullptr);
  CHECK_FALSE(r[1].excluded);
  CHECK(r[1].exclusion_reason.empty());
  REQUIRE(h.can_redo());
  CHECK(h.redo(r) != nullptr);
  CHECK(r[1].excluded);
  CHECK(r[1].exclusion_reason == "reading on a protruding voussoir");
}

TEST_CASE("a new edit after an undo clears what could be redone") {
  Readings r = three_readings();
  EditHistory h;
  h.apply(r, exclude(r, 0, "a"));
  h.undo(r);
  h.apply(r, exclude(r, 2, "b"));
  CHECK_FALSE(h.can_redo());
  CHECK_FALSE(r[0].excluded);
  CHECK(r[2].excluded);
  CHECK(h.undo(r) != nullptr);
  CHECK(h.undo(r) == nullptr);  // nothing more: the first edit was undone and replaced
  CHECK_FALSE(r[2].excluded);
}

TEST_CASE("edits in sequence undo in reverse order back to the readings as taken") {
  const Readings original = three_readings();
  Readings r = original;
  EditHistory h;
  ReadingEdit change{1, r[1], r[1], "change reading 2"};
  change.after.z = 0.5;
  h.apply(r, change);
  h.apply(r, exclude(r, 1, "blunder"));
  CHECK(r[1].z == 0.5);
  CHECK(r[1].excluded);
  CHECK(h.undo(r) != nullptr);
  CHECK(h.undo(r) != nullptr);
  for (size_t i = 0; i < r.size(); ++i) {
    CHECK(r[i].z == original[i].z);
    CHECK(r[i].excluded == original[i].excluded);
  }
}
