#pragma once
// A section started on site, before it has any reading: the inspector picks
// the span, the section's label and how it is booked, and the app writes an
// empty survey sheet of that form into the visit. Readings are then typed
// into the section view one at a time (sheet_rows.hpp).
#include <optional>
#include <string>

#include "geometry/sheet/survey_sheet.hpp"
#include "storage/project_file.hpp"

namespace soffit::app {

enum class NewSectionBooking {
  offsets,  // stations along a level datum line, offsets to the soffit in mm (FIELD.md §3.1)
  xz,       // points already reduced: x along the span, z up, in metres
};

struct NewSection {
  std::string structure_ref, date;  // the visit
  int span_index = 1;
  std::string label;                // MW, US, DS, a position…
  NewSectionBooking booking = NewSectionBooking::offsets;
  // Offsets: the datum line's level and the level that becomes z = 0 (the
  // springing line), both as reduced levels in metres; offsets up or down.
  std::optional<double> datum_rl_m, z_origin_rl_m;
  bool offsets_down = false;
  std::optional<double> sigma_mm;   // the instrument's precision, 1 sd
  std::string instrument;           // instrument class key (SHEET_FORMAT.md), may be empty
};

// The empty sheet's text; throws InputError naming the field ("label",
// "datum_rl_m"…) when something it needs is missing or not sensible.
std::string blank_sheet_text(const NewSection& section);

// Writes the empty section into the visit as one undoable edit and returns its
// key. Throws InputError for a bad field, StorageError when the project
// refuses (the label is taken in that span and visit, the visit is issued).
std::string add_blank_section(storage::Project& project, const NewSection& section);

}  // namespace soffit::app
